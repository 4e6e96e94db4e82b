import { msg } from '../errors.js';
import type { HitCoordinates } from '../io/hitCoordinates.js';
import type { TrackTable } from './measureTracks.js';

/** One track's hits in travel order, as views into the track table's hits (do not modify). */
export interface OneTrackHits extends HitCoordinates {
  readonly event: number;
  readonly track: number;
  /** Row of each hit in the hit table the track table was measured from. */
  readonly rows: Int32Array;
}

/**
 * The hits of track k of a track table (row k, as `measureTracks` numbered them), without
 * searching or regrouping: the table keeps its grouping.
 * @example const t = trackHits(tracks, 0); t.x.length === tracks.nhits[0]
 */
export function trackHits(tracks: TrackTable, k: number): OneTrackHits {
  if (!Number.isInteger(k) || k < 0 || k >= tracks.count) throw msg.badArgument('k', k, `a track row 0…${tracks.count - 1}`);
  const a = tracks.offsets[k], b = tracks.offsets[k + 1];
  const h = tracks.hits;
  const view = (c: Float64Array | undefined) => c?.subarray(a, b);
  return Object.freeze({
    event: tracks.event[k],
    track: tracks.track[k],
    x: h.x.subarray(a, b),
    y: h.y.subarray(a, b),
    z: view(h.z),
    sigmaX: view(h.sigmaX),
    sigmaY: view(h.sigmaY),
    sigmaZ: view(h.sigmaZ),
    rows: tracks.hitRows.subarray(a, b),
  });
}

import { msg } from '../errors.js';
import type { TrackTable } from './measureTracks.js';

export interface LinkStopDecaysOptions {
  /** Largest distance [m] from a stopped track's last hit to a daughter's first hit; default 1.5 cm. */
  readonly maxDistanceM?: number;
}

export const LINK_STOP_DECAYS_DEFAULTS = Object.freeze({ maxDistanceM: 0.015 });

/** Decays at the end of stopping tracks, one row per track of the table. */
export interface StopDecayLinks {
  /** Row of the stopped track this track starts from, or −1. */
  readonly parentRow: Int32Array;
  /** Distance [m] from the parent's last hit to this track's first hit (NaN without a parent). */
  readonly distanceM: Float64Array;
  /** Rows that are linked daughters, in table order. */
  readonly daughters: Int32Array;
}

/**
 * Links decays at rest to the track that stopped: a track whose first hit lies within
 * `maxDistanceM` of the last hit of a stopping track of the same event is taken as its daughter
 * (μ → e, or π → μ → e when the 4 MeV muon of π⁺ → μ⁺ν, about 4 mm in a liquid, leaves no
 * track); each daughter takes the nearest stopped track, and a track is never its own parent.
 * The distance covers the stop lying up to a hit spacing beyond the last hit and the daughter's
 * first hit up to one spacing after its start, so about two spacings (default 1.5 cm for 5 mm).
 * `stops` is the stop flag per track (e.g. `identifyTracks(...).stops`).
 * @example linkStopDecays(tracks, ids.stops).parentRow
 */
export function linkStopDecays(tracks: TrackTable, stops: ArrayLike<number | boolean>, options: LinkStopDecaysOptions = {}): StopDecayLinks {
  const maxD = options.maxDistanceM ?? LINK_STOP_DECAYS_DEFAULTS.maxDistanceM;
  if (!(maxD > 0)) throw msg.badArgument('maxDistanceM', maxD, 'a positive distance in metres');
  if (stops.length !== tracks.count) throw msg.badArgument('stops.length', stops.length, `${tracks.count} (one flag per track)`);
  const n = tracks.count, h = tracks.hits, o = tracks.offsets;
  const parentRow = new Int32Array(n).fill(-1);
  const distanceM = new Float64Array(n).fill(NaN);
  const z = (i: number) => (h.z ? h.z[i] : 0);
  for (let a = 0; a < n;) {
    let b = a;
    while (b < n && tracks.event[b] === tracks.event[a]) b++;
    for (let d = a; d < b; d++) {
      const f = o[d];
      for (let s = a; s < b; s++) {
        if (s === d || !stops[s]) continue;
        const l = o[s + 1] - 1;
        const dist = Math.hypot(h.x[f] - h.x[l], h.y[f] - h.y[l], z(f) - z(l));
        if (dist <= maxD && !(dist >= distanceM[d])) { parentRow[d] = s; distanceM[d] = dist; }
      }
    }
    a = b;
  }
  const daughters = Int32Array.from({ length: n }, (_, k) => k).filter((k) => parentRow[k] >= 0);
  return Object.freeze({ parentRow, distanceM, daughters });
}

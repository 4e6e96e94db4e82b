import { msg } from '../errors.js';
import type { FoundTracks } from './findTracks.js';

/** What counts as found, as fake, and which true tracks are counted. */
export interface MatchOptions {
  /** A found track is pure when at least this fraction of its hits come from one true track. Default 0.9. */
  readonly purity?: number;
  /** … and finds that true track when it holds at least this fraction of the true track's hits. Default 0.7. */
  readonly completeness?: number;
  /** True tracks with fewer hits are not counted (not reconstructable). Default 10. */
  readonly minTrueHits?: number;
}

export const MATCH_DEFAULTS = Object.freeze({ purity: 0.9, completeness: 0.7, minTrueHits: 10 });

/**
 * Found tracks compared with the truth, per true track and per found track.
 * - A true track (event, id ≥ 0, at least `minTrueHits` hits) is *found* when some found track
 *   is pure (≥ `purity` of its hits from it) and holds ≥ `completeness` of its hits.
 * - A found track is *fake* when no true track gives it `purity` of its hits (a mixture, or noise).
 * - A pure found track that does not reach `completeness` is a *piece* (a track found in parts);
 *   two or more pure found tracks on one true track make it *split*.
 * These are the usual definitions of tracking efficiency and fake rate (common practice).
 */
export interface TrackMatch {
  /** Per true track (index into trueEvent/trueId): counted, found, best completeness, found tracks on it. */
  readonly trueEvent: Float64Array;
  readonly trueId: Float64Array;
  readonly trueHits: Int32Array;
  readonly counted: Uint8Array;
  readonly found: Uint8Array;
  /** Largest fraction of the true track's hits held by one pure found track. */
  readonly completeness: Float64Array;
  /** Pure found tracks whose main true track this is. */
  readonly pieces: Int32Array;
  /** Per found track: the true track giving most of its hits (index, −1 for noise), and that fraction. */
  readonly mainTrue: Int32Array;
  readonly purity: Float64Array;
  readonly fake: Uint8Array;
  /** Totals. */
  readonly countedTracks: number;
  readonly foundTracks: number;
  readonly fakeTracks: number;
  readonly splitTracks: number;
  readonly efficiency: number;
  readonly fakeRate: number;
}

/**
 * Matches `found` (from findTracks on the same rows) to the true labels: `trueTrack[i]` is the
 * true track id of row i (negative: a noise hit), `event[i]` its event.
 * @example matchFoundTracks(hits.event, truthLabels, findTracks(hits)).efficiency
 */
export function matchFoundTracks(event: Float64Array, trueTrack: Float64Array, found: FoundTracks, options: MatchOptions = {}): TrackMatch {
  const o = { ...MATCH_DEFAULTS, ...options };
  const n = event.length;
  if (trueTrack.length !== n || found.track.length !== n) throw msg.badArgument('trueTrack.length', trueTrack.length, `${n} (one label per hit, as found.track)`);
  // Index the true tracks by (event, id).
  const key = (e: number, t: number) => `${e}\u0000${t}`;
  const index = new Map<string, number>();
  const tEvent: number[] = [], tId: number[] = [], tHits: number[] = [];
  const trueOf = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    if (!(trueTrack[i] >= 0)) continue;
    const k = key(event[i], trueTrack[i]);
    let t = index.get(k);
    if (t === undefined) { t = tEvent.length; index.set(k, t); tEvent.push(event[i]); tId.push(trueTrack[i]); tHits.push(0); }
    tHits[t]++;
    trueOf[i] = t;
  }
  const T = tEvent.length, F = found.count;
  const completeness = new Float64Array(T), pieces = new Int32Array(T), foundFlag = new Uint8Array(T), counted = new Uint8Array(T);
  const mainTrue = new Int32Array(F).fill(-1), purity = new Float64Array(F), fake = new Uint8Array(F);
  const tally = new Map<number, number>();
  for (let f = 0; f < F; f++) {
    tally.clear();
    const a = found.offsets[f], b = found.offsets[f + 1];
    for (let q = a; q < b; q++) {
      const t = trueOf[found.rows[q]];
      tally.set(t, (tally.get(t) ?? 0) + 1);
    }
    let best = -1, bestCount = 0;
    for (const [t, c] of tally) if (c > bestCount || (c === bestCount && t < best)) { best = t; bestCount = c; }
    mainTrue[f] = best;
    purity[f] = b > a ? bestCount / (b - a) : 0;
    if (best < 0 || purity[f] < o.purity) { fake[f] = 1; continue; }
    pieces[best]++;
    completeness[best] = Math.max(completeness[best], bestCount / tHits[best]);
  }
  let countedTracks = 0, foundTracks = 0, splitTracks = 0, fakeTracks = 0;
  for (let t = 0; t < T; t++) {
    counted[t] = tHits[t] >= o.minTrueHits ? 1 : 0;
    foundFlag[t] = completeness[t] >= o.completeness ? 1 : 0;
    if (!counted[t]) continue;
    countedTracks++;
    if (foundFlag[t]) foundTracks++;
    if (pieces[t] >= 2) splitTracks++;
  }
  for (let f = 0; f < F; f++) fakeTracks += fake[f];
  return {
    trueEvent: Float64Array.from(tEvent), trueId: Float64Array.from(tId), trueHits: Int32Array.from(tHits),
    counted, found: foundFlag, completeness, pieces, mainTrue, purity, fake,
    countedTracks, foundTracks, fakeTracks, splitTracks,
    efficiency: countedTracks > 0 ? foundTracks / countedTracks : NaN,
    fakeRate: F > 0 ? fakeTracks / F : NaN,
  };
}

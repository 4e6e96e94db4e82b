import { arcLengthsAndSlopes, newArcLengthSlopes } from '../fit/arcLengths.js';
import { warn } from '../warnings.js';
import type { TrackTable } from './measureTracks.js';

/** Share of a track's extent along its arc that the hits may run back before the order is called mixed. */
export const BACKWARDS_SHARE = 0.2;

/**
 * Finds fitted tracks whose hits do not run one way along the fitted circle: somewhere the arc
 * length goes back by more than `BACKWARDS_SHARE` of the track's whole extent (hits sorted by
 * another key, two half-tracks joined head to head). The turning sense, and so the charge, is
 * read from the hit order, so such a charge is not to be trusted; one HIT_ORDER warning names how
 * many tracks and the first of them. Returns the indices of those tracks.
 * Geometry only (arc lengths along the fit, lib/fit/arcLengths.ts); noise along the track is far
 * below the 20 % share for any track whose hits are spaced more than their errors (common practice).
 * Tracks sampled coarser than 60° of turn per hit, loopers of 0.9 turns or more (curl-ups) and tracks not
 * fitted `ok` are not judged.
 * @example const mixed = checkHitOrder(measureTracks(hits, { fieldT: 1.5 }));
 */
export function checkHitOrder(tracks: TrackTable): number[] {
  const { hits, offsets } = tracks;
  let longest = 0;
  for (let k = 0; k < tracks.count; k++) longest = Math.max(longest, offsets[k + 1] - offsets[k]);
  const scratch = newArcLengthSlopes(longest);
  const steps: MedianScratch = { square: new Float64Array(longest), step: new Int32Array(longest) };
  const rows = { x: hits.x, y: hits.y, from: 0, to: 0 };
  const circle = { kappa: 0, phi: 0, d: 0, xRef: 0, yRef: 0 };
  const mixed: number[] = [];
  const arcs = tracks.arcLengthM?.length === hits.length ? tracks.arcLengthM : undefined;
  for (let k = 0; k < tracks.count; k++) {
    const n = offsets[k + 1] - offsets[k];
    if (tracks.status[k] !== 'ok' || n < 4) continue;
    rows.from = offsets[k];
    rows.to = offsets[k + 1];
    circle.kappa = tracks.kappa[k];
    circle.phi = tracks.phi0[k];
    circle.d = tracks.d0[k];
    circle.xRef = tracks.xRef[k];
    circle.yRef = tracks.yRef[k];
    if (!Number.isFinite(circle.kappa) || !Number.isFinite(circle.phi)) continue;
    // A circle sampled more coarsely than a sixth of a turn per hit (a small curl-up) cannot tell order from geometry.
    if (coarselySampled(hits.x, hits.y, rows.from, rows.to, Math.abs(circle.kappa), steps)) continue;
    // The helix fit kept the arc lengths it measured along this very circle: the same numbers.
    if (arcs !== undefined) {
      if (runsBack(arcs, rows.from, n, Math.abs(circle.kappa))) mixed.push(k);
      continue;
    }
    arcLengthsAndSlopes(rows, circle, scratch);
    if (runsBack(scratch.s, 0, n, Math.abs(circle.kappa))) mixed.push(k);
  }
  if (mixed.length > 0) {
    const first = mixed[0];
    warn(
      'HIT_ORDER',
      `${mixed.length} track${mixed.length === 1 ? '' : 's'} (first: event ${tracks.event[first]}, track ${tracks.track[first]}) ` +
        'have hits that run backwards part of the way; their charge is read from the hit order and may be wrong — put each track\'s hits in the order the particle travelled',
      'checkHitOrder',
    );
  }
  return mixed;
}

/** Largest median turning angle per hit [rad] (chord × κ) at which the order is judged: 60°. */
const MAX_STEP_ANGLE = Math.PI / 3;

/** Relative margin around the step limit inside which the median is taken exactly. */
const NEAR_LIMIT = 1e-6;

/**
 * True when the median step between consecutive hits of rows [from, to), times |κ|, exceeds
 * MAX_STEP_ANGLE. Usually decided by counting the squared steps clearly below and clearly above
 * the limit (one pass, no sort); when the median lies within NEAR_LIMIT of it, by the median
 * itself — so the verdict is always the exact one.
 */
function coarselySampled(x: Float64Array, y: Float64Array, from: number, to: number, absKappa: number, scratch: MedianScratch): boolean {
  const n = to - from - 1;
  const limit = MAX_STEP_ANGLE / absKappa;
  const below = (limit * (1 - NEAR_LIMIT)) ** 2, above = (limit * (1 + NEAR_LIMIT)) ** 2;
  let under = 0, over = 0;
  for (let i = from; i < to - 1; i++) {
    const dx = x[i + 1] - x[i], dy = y[i + 1] - y[i];
    const q = dx * dx + dy * dy;
    if (q < below) under++;
    else if (q > above) over++;
  }
  // The median is the (m + 1)-th smallest step, m = ⌊n/2⌋.
  const m = n >> 1;
  if (under >= m + 1) return false;
  if (over >= n - m) return true;
  return medianStep(x, y, from, to, scratch) * absKappa > MAX_STEP_ANGLE;
}

/**
 * Median distance [m] between consecutive hits of rows [from, to). The squared steps are
 * insertion-sorted with the index of their step (a track has tens of hits: far quicker than a
 * typed-array sort per track), and only the median step takes Math.hypot — the same value as
 * sorting the hypot of every step, since the square is monotonic.
 */
function medianStep(x: Float64Array, y: Float64Array, from: number, to: number, scratch: MedianScratch): number {
  const n = to - from - 1;
  const { square, step } = scratch;
  for (let i = 0; i < n; i++) {
    const dx = x[from + i + 1] - x[from + i], dy = y[from + i + 1] - y[from + i];
    const v = dx * dx + dy * dy;
    let j = i;
    while (j > 0 && square[j - 1] > v) {
      square[j] = square[j - 1];
      step[j] = step[j - 1];
      j--;
    }
    square[j] = v;
    step[j] = i;
  }
  const m = from + step[n >> 1];
  return Math.hypot(x[m + 1] - x[m], y[m + 1] - y[m]);
}

/** Scratch of `medianStep` for tracks of up to n hits. */
interface MedianScratch {
  readonly square: Float64Array;
  readonly step: Int32Array;
}

/** True when the largest step back (in either sense of travel) in s[from, from + n) exceeds the share of the extent. */
function runsBack(s: Float64Array, from: number, n: number, absKappa: number): boolean {
  let lo = s[from], hi = s[from];
  let backForward = 0, backReverse = 0;
  let maxSoFar = s[from], minSoFar = s[from];
  for (let i = from + 1; i < from + n; i++) {
    const v = s[i];
    if (v < lo) lo = v;
    if (v > hi) hi = v;
    if (v > maxSoFar) maxSoFar = v;
    if (v < minSoFar) minSoFar = v;
    backForward = Math.max(backForward, maxSoFar - v);
    backReverse = Math.max(backReverse, v - minSoFar);
  }
  const extent = hi - lo;
  // A looper of nearly a turn or more (a curl-up whose radius shrinks) is not one circle: not judged.
  if (!(extent > 0) || extent * absKappa > 0.9 * 2 * Math.PI) return false;
  // The dominant sense is the one with the smaller largest step back.
  return Math.min(backForward, backReverse) > BACKWARDS_SHARE * extent;
}

import { createRoadState, fitRoadWindow, type RoadState } from './roadWindow.js';

/** How the direction of travel of a found track was decided. */
export type DirectionRule = 'curvature' | 'origin';
export const DIRECTION_RULES: readonly DirectionRule[] = ['curvature', 'origin'];

/** Scratch of `travelDirection` (explicit, reused across tracks). */
export interface DirectionScratch {
  readonly state: RoadState;
  sArc: Float64Array;
}

export function createDirectionScratch(): DirectionScratch {
  return { state: createRoadState(), sArc: new Float64Array(64) };
}

export interface DirectionSettings {
  /** Point the tracks come from [m] (x, y, z). */
  readonly originM: readonly [number, number, number];
  /** Hit error in the bending plane [m], for the curvature errors. */
  readonly sigmaM: number;
  /** Curvature change needed, in standard deviations of the difference. */
  readonly significance: number;
  /** … and as a fraction of the mean curvature. */
  readonly minRelativeChange: number;
}

/**
 * Decides which end of a found track is its start. Hits ids[from … to) are in the order the
 * road was followed; returns true when that order must be reversed, and the rule used.
 *
 * 1. Curvature change: a charged particle slowing down in matter curls up, so |κ| grows along
 *    the direction of travel (common practice). |κ| is fitted on the first and the last third
 *    of the hits (a circle through each third's end hit, roadWindow.ts) with the error of
 *    Gluckstern, NIM 24 (1963) 381, σκ = σ/L²·√(720/(N + 4)) (N hits over arc length L). When
 *    the two differ by more than `significance` σ and `minRelativeChange`, the end with the
 *    smaller |κ| is first.
 * 2. Otherwise the origin: the end nearer `originM` is first (3-D when z is measured) — tracks
 *    from a common region leave it.
 * Tracks that start elsewhere and do not slow measurably (cosmic rays crossing a gas chamber)
 * cannot be oriented from hits alone; they get the origin rule, stated in the output.
 */
export function travelDirection(
  x: Float64Array, y: Float64Array, z: Float64Array, hasZ: boolean,
  ids: Int32Array, from: number, to: number, o: DirectionSettings, scratch: DirectionScratch,
): { reverse: boolean; rule: DirectionRule } {
  const n = to - from;
  const third = Math.floor(n / 3);
  if (third >= 5) {
    if (scratch.sArc.length < third) scratch.sArc = new Float64Array(2 * third);
    const st = scratch.state;
    fitRoadWindow(x, y, z, hasZ, ids, from, 1, third, scratch.sArc, st);
    const k1 = Math.abs(st.kappa), l1 = st.lengthM;
    fitRoadWindow(x, y, z, hasZ, ids, to - 1, -1, third, scratch.sArc, st);
    const k2 = Math.abs(st.kappa), l2 = st.lengthM;
    const spread = Math.sqrt(720 / (third + 4)) * o.sigmaM;
    const s1 = spread / (l1 * l1), s2 = spread / (l2 * l2);
    const diff = k2 - k1;
    if (Math.abs(diff) > o.significance * Math.hypot(s1, s2) && Math.abs(diff) > o.minRelativeChange * 0.5 * (k1 + k2)) {
      return { reverse: diff < 0, rule: 'curvature' };
    }
  }
  const [ox, oy, oz] = o.originM;
  const a = ids[from], b = ids[to - 1];
  const da = (x[a] - ox) ** 2 + (y[a] - oy) ** 2 + (hasZ ? (z[a] - oz) ** 2 : 0);
  const db = (x[b] - ox) ** 2 + (y[b] - oy) ** 2 + (hasZ ? (z[b] - oz) ** 2 : 0);
  return { reverse: db < da, rule: 'origin' };
}

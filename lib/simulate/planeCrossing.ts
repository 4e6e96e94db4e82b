import { helixStep, type HelixMotion } from './helixStep.js';

/**
 * Path length within [0, sMax] [m] where the helix from `begin` crosses coordinate `plane` [m]
 * on `axis` (0 = x, 1 = y, 2 = z); leaves the crossing state in `out`. Newton from the
 * straight-line guess, bisection on the sign change as fallback (60 halvings: below 1e-15 of
 * the step). Always returns a length in [0, sMax]; the caller has checked that the step spans the plane.
 */
export function planeCrossing(begin: Float64Array, out: Float64Array, sMax: number, motion: HelixMotion, axis: number, plane: number): number {
  const a0 = begin[axis];
  const u0 = begin[3 + axis];
  let s = u0 !== 0 ? (plane - a0) / u0 : 0.5 * sMax;
  if (!(s >= 0 && s <= sMax)) s = 0.5 * sMax;
  for (let k = 0; k < 8; k++) {
    out.set(begin);
    helixStep(out, s, motion);
    const f = out[axis] - plane;
    if (Math.abs(f) < 1e-13) return s;
    const d = out[3 + axis];
    if (d === 0) break;
    const next = s - f / d;
    if (!(next >= 0 && next <= sMax)) break;
    s = next;
  }
  let lo = 0, hi = sMax;
  const sign0 = a0 - plane;
  for (let k = 0; k < 60; k++) {
    const mid = 0.5 * (lo + hi);
    out.set(begin);
    helixStep(out, mid, motion);
    if ((out[axis] - plane) * sign0 > 0) lo = mid; else hi = mid;
  }
  out.set(begin);
  helixStep(out, hi, motion);
  return hi;
}

import { arcLengthNear, helixCentre, helixPoint, type HelixParameters } from './helixParameters.js';

/** Where two helices come closest. Lengths [m]. */
export interface ClosestApproach {
  /** Arc lengths on the first and second helix. */
  s1: number;
  s2: number;
  /** 3-D distance between the two points (the distance of closest approach, DCA). */
  distanceM: number;
  /** 'ok', 'not-converged' (Newton did not settle in the iterations allowed), 'no-start'. */
  status: 'ok' | 'not-converged' | 'no-start';
}

export const CLOSEST_APPROACH_DEFAULTS = Object.freeze({
  maxIterations: 30,
  /** Stop when both arc-length steps are below this [m]. */
  toleranceM: 1e-9,
});

/** Scratch of `closestApproach`: nothing is allocated per call. */
export interface ClosestApproachScratch {
  readonly p1: Float64Array;
  readonly p2: Float64Array;
  readonly starts: Float64Array;
}

export function newClosestApproachScratch(): ClosestApproachScratch {
  return { p1: new Float64Array(3), p2: new Float64Array(3), starts: new Float64Array(4) };
}

/**
 * Starting arc lengths for two tracks from their circles in the bending plane: the two
 * intersection points when the circles cross; the nearest points on the line of centres when
 * they miss or nest (then one start). Straight tracks (|κ| < 1e-12 /m) meet as lines.
 * Writes pairs (s1, s2) into `out` and returns how many (0, 1 or 2).
 */
export function circleCrossings(a: HelixParameters, b: HelixParameters, out: Float64Array): number {
  const lineA = Math.abs(a.kappa) < 1e-12, lineB = Math.abs(b.kappa) < 1e-12;
  let n = 0;
  if (lineA || lineB) {
    const [l, c] = lineA ? [a, b] : [b, a];
    const ux = Math.cos(l.phi0), uy = Math.sin(l.phi0);
    const px = l.xRef + l.d0 * uy, py = l.yRef - l.d0 * ux;
    if (lineA && lineB) {
      const den = ux * Math.sin(c.phi0) - uy * Math.cos(c.phi0);
      if (Math.abs(den) < 1e-15) return 0;
      const qx = c.xRef + c.d0 * Math.sin(c.phi0), qy = c.yRef - c.d0 * Math.cos(c.phi0);
      const t = ((qx - px) * Math.sin(c.phi0) - (qy - py) * Math.cos(c.phi0)) / den;
      n = pushStart(a, b, out, n, px + t * ux, py + t * uy);
      return n;
    }
    const [cx, cy] = helixCentre(c);
    const r = 1 / Math.abs(c.kappa);
    const t0 = (cx - px) * ux + (cy - py) * uy;
    const fx = px + t0 * ux - cx, fy = py + t0 * uy - cy;
    const d2 = fx * fx + fy * fy;
    if (d2 >= r * r) { n = pushStart(a, b, out, n, px + t0 * ux, py + t0 * uy); return n; }
    const h = Math.sqrt(r * r - d2);
    n = pushStart(a, b, out, n, px + (t0 - h) * ux, py + (t0 - h) * uy);
    n = pushStart(a, b, out, n, px + (t0 + h) * ux, py + (t0 + h) * uy);
    return n;
  }
  const arm1 = 1 / a.kappa - a.d0, arm2 = 1 / b.kappa - b.d0;
  const x1 = a.xRef - arm1 * Math.sin(a.phi0), y1 = a.yRef + arm1 * Math.cos(a.phi0);
  const x2 = b.xRef - arm2 * Math.sin(b.phi0), y2 = b.yRef + arm2 * Math.cos(b.phi0);
  const r1 = 1 / Math.abs(a.kappa), r2 = 1 / Math.abs(b.kappa);
  const dx = x2 - x1, dy = y2 - y1;
  const d = Math.hypot(dx, dy);
  if (!(d > 0)) return 0;
  const ex = dx / d, ey = dy / d;
  if (d >= r1 + r2 || d <= Math.abs(r1 - r2)) {
    // No crossing: the points of each circle nearest the other lie on the line of centres.
    const sa = d >= r1 + r2 ? 1 : r1 > r2 ? 1 : -1;
    const sb = d >= r1 + r2 ? -1 : r1 > r2 ? 1 : -1;
    const ax = x1 + sa * r1 * ex, ay = y1 + sa * r1 * ey;
    const bx = x2 + sb * r2 * ex, by = y2 + sb * r2 * ey;
    out[0] = arcOnCircle(a, x1, y1, ax, ay);
    out[1] = arcOnCircle(b, x2, y2, bx, by);
    return 1;
  }
  const along = (d * d + r1 * r1 - r2 * r2) / (2 * d);
  const h = Math.sqrt(Math.max(0, r1 * r1 - along * along));
  const mx = x1 + along * ex, my = y1 + along * ey;
  out[0] = arcOnCircle(a, x1, y1, mx - h * ey, my + h * ex);
  out[1] = arcOnCircle(b, x2, y2, mx - h * ey, my + h * ex);
  out[2] = arcOnCircle(a, x1, y1, mx + h * ey, my - h * ex);
  out[3] = arcOnCircle(b, x2, y2, mx + h * ey, my - h * ex);
  return 2;
}

/** Arc length of the point (x, y) of the circle of `h` with centre (cx, cy), on the branch |κs| ≤ π (as arcLengthNear). */
function arcOnCircle(h: HelixParameters, cx: number, cy: number, x: number, y: number): number {
  let d = Math.atan2(h.kappa * (x - cx), -h.kappa * (y - cy)) - h.phi0;
  d -= 2 * Math.PI * Math.round(d / (2 * Math.PI));
  return d / h.kappa;
}

/** Stores the arc lengths of the point (x, y) on both circles as start n; returns n + 1. */
function pushStart(a: HelixParameters, b: HelixParameters, out: Float64Array, n: number, x: number, y: number): number {
  out[2 * n] = arcLengthNear(a, x, y);
  out[2 * n + 1] = arcLengthNear(b, x, y);
  return n + 1;
}

/**
 * 3-D closest approach of two helices from the start (s1, s2): Newton's method on
 * f = ½|P₁(s₁) − P₂(s₂)|² with the exact second derivatives of the helices, steps limited to
 * a quarter turn. Writes into `out`; returns it.
 */
export function refineClosestApproach(
  a: HelixParameters, b: HelixParameters, s1: number, s2: number,
  out: ClosestApproach, scratch: ClosestApproachScratch, maxIterations: number = CLOSEST_APPROACH_DEFAULTS.maxIterations,
): ClosestApproach {
  const { p1, p2 } = scratch;
  const maxStep1 = Math.min(1, 0.25 * Math.PI / Math.max(Math.abs(a.kappa), 1e-9));
  const maxStep2 = Math.min(1, 0.25 * Math.PI / Math.max(Math.abs(b.kappa), 1e-9));
  let converged = false;
  for (let it = 0; it < maxIterations; it++) {
    helixPoint(a, s1, p1);
    helixPoint(b, s2, p2);
    const f1 = a.phi0 + a.kappa * s1, f2 = b.phi0 + b.kappa * s2;
    const t1x = Math.cos(f1), t1y = Math.sin(f1), t1z = a.tanLambda;
    const t2x = Math.cos(f2), t2y = Math.sin(f2), t2z = b.tanLambda;
    const dx = p1[0] - p2[0], dy = p1[1] - p2[1], dz = p1[2] - p2[2];
    const g1 = dx * t1x + dy * t1y + dz * t1z;
    const g2 = -(dx * t2x + dy * t2y + dz * t2z);
    // Second derivatives of the positions: κ (−sin φ, cos φ, 0).
    const h11 = t1x * t1x + t1y * t1y + t1z * t1z + a.kappa * (-dx * t1y + dy * t1x);
    const h22 = t2x * t2x + t2y * t2y + t2z * t2z - b.kappa * (-dx * t2y + dy * t2x);
    const h12 = -(t1x * t2x + t1y * t2y + t1z * t2z);
    const det = h11 * h22 - h12 * h12;
    let d1: number, d2: number;
    if (det > 1e-12 * (h11 * h22) && h11 > 0) {
      d1 = -(h22 * g1 - h12 * g2) / det;
      d2 = -(h11 * g2 - h12 * g1) / det;
    } else {
      // Nearly parallel directions: fall back to a gradient step, half on each track. For
      // parallel lines the full step on both overshoots by exactly the offset along them, so
      // the pair bounced between ± that offset for every iteration (found by mutation testing);
      // halved, one step closes the offset along the lines.
      d1 = -g1 / (2 * Math.max(h11, 1));
      d2 = -g2 / (2 * Math.max(h22, 1));
    }
    d1 = Math.max(-maxStep1, Math.min(maxStep1, d1));
    d2 = Math.max(-maxStep2, Math.min(maxStep2, d2));
    s1 += d1;
    s2 += d2;
    if (Math.abs(d1) < CLOSEST_APPROACH_DEFAULTS.toleranceM && Math.abs(d2) < CLOSEST_APPROACH_DEFAULTS.toleranceM) { converged = true; break; }
  }
  helixPoint(a, s1, p1);
  helixPoint(b, s2, p2);
  out.s1 = s1;
  out.s2 = s2;
  out.distanceM = Math.hypot(p1[0] - p2[0], p1[1] - p2[1], p1[2] - p2[2]);
  out.status = converged ? 'ok' : 'not-converged';
  return out;
}

/**
 * Closest approach in 3-D of two helices (two tracks' trajectories): starts from the crossings
 * of their circles in the bending plane (`circleCrossings`), refines each in 3-D and keeps the
 * one with the smaller distance. `prefer` may veto starts (e.g. a V⁰ finder wants the vertex
 * upstream of both first hits); vetoed starts are skipped, and with none left the status is
 * 'no-start'. Exact for helices (no straight-line approximation).
 * @example closestApproach(h1, h2).distanceM // 0 for helices built to cross
 */
export function closestApproach(
  a: HelixParameters, b: HelixParameters,
  options: { readonly prefer?: (s1: number, s2: number) => boolean; readonly out?: ClosestApproach; readonly scratch?: ClosestApproachScratch } = {},
): ClosestApproach {
  const out = options.out ?? { s1: NaN, s2: NaN, distanceM: NaN, status: 'no-start' };
  const scratch = options.scratch ?? newClosestApproachScratch();
  const n = circleCrossings(a, b, scratch.starts);
  let best1 = NaN, best2 = NaN, bestD = Infinity;
  let bestStatus: ClosestApproach['status'] = 'no-start';
  const s0 = scratch.starts[0], s1 = scratch.starts[1], s2 = scratch.starts[2], s3 = scratch.starts[3];
  for (let i = 0; i < n; i++) {
    const u = i === 0 ? s0 : s2, v = i === 0 ? s1 : s3;
    if (options.prefer && !options.prefer(u, v)) continue;
    refineClosestApproach(a, b, u, v, out, scratch);
    if (options.prefer && !options.prefer(out.s1, out.s2)) continue;
    if (out.distanceM < bestD) { bestD = out.distanceM; best1 = out.s1; best2 = out.s2; bestStatus = out.status; }
  }
  out.s1 = best1;
  out.s2 = best2;
  out.distanceM = bestD === Infinity ? NaN : bestD;
  out.status = bestStatus;
  return out;
}

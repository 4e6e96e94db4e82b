/**
 * Geometry of the (κ, φ, d) circle parametrisation shared by all circle fits (internal; see
 * circleFit.ts for the convention).
 *
 * Signed residual of a point Q, with Δ = Q − ref, a = Δ·t, b = Δ·n, t = (cos φ, sin φ),
 * n = (−sin φ, cos φ), B = b + d:
 *     P = κ(a² + B²) − 2B,   S = √(1 + κP),   r = P / (1 + S)
 * r equals sign(κ)·(|Q − C| − R), and tends to −B (the signed distance to a line) as κ → 0, with
 * no division by κ anywhere (Karimäki, NIM A305 (1991) 187, eq. 6–8 in our sign convention).
 * Derivatives, derived by hand and checked against finite differences in the tests:
 *     ∂r/∂κ = (a² + B² − r²)/(2S),  ∂r/∂φ = a(1 − κd)/S,  ∂r/∂d = (κB − 1)/S
 *     ∂r/∂Q = (κa·t + (κB − 1)·n)/S   (a unit vector: the direction of the residual)
 */

import type { TrackSpan } from './trackSpan.js';

/** Output slot for (κ, φ, d). */
export interface TrackParams {
  kappa: number;
  phi: number;
  d: number;
}

/**
 * Converts a circle (centre, radius) and a turning sense (+1 ccw, −1 cw) into (κ, φ, d) at
 * the reference point (xr, yr).
 */
export function paramsFromCentre(xc: number, yc: number, radius: number, sense: number, xr: number, yr: number, out: TrackParams): void {
  const ux0 = xr - xc, uy0 = yr - yc;
  const dist = Math.sqrt(ux0 * ux0 + uy0 * uy0);
  // Reference at the centre: any direction is as good as another.
  const ux = dist > 0 ? ux0 / dist : 1, uy = dist > 0 ? uy0 / dist : 0;
  // Travel direction t = ẑ × u for counter-clockwise motion, −ẑ × u for clockwise.
  const tx = sense > 0 ? -uy : uy, ty = sense > 0 ? ux : -ux;
  out.kappa = sense / radius;
  out.phi = Math.atan2(ty, tx);
  out.d = -sense * (dist - radius);
}

/** Straight-line start: direction from the first to the last hit, through the first hit. */
export function paramsFromLine(x: Float64Array, y: Float64Array, from: number, to: number, out: TrackParams): void {
  out.kappa = 0;
  out.phi = Math.atan2(y[to - 1] - y[from], x[to - 1] - x[from]);
  out.d = 0;
}

/** Largest distance of a hit from the reference point: the track's length scale [m]. */
export function extent(x: Float64Array, y: Float64Array, from: number, to: number, xr: number, yr: number): number {
  let m = 0;
  for (let i = from; i < to; i++) {
    const dx = x[i] - xr, dy = y[i] - yr;
    const d2 = dx * dx + dy * dy;
    if (d2 > m) m = d2;
  }
  return Math.sqrt(m);
}

/** Scratch of `normalEquations`: the parameters it is evaluated at and what it fills. */
export interface NormalScratch {
  readonly params: TrackParams;
  /** Upper triangle of JᵀWJ (6 numbers). */
  readonly normal: Float64Array;
  /** JᵀWr (3 numbers). */
  readonly gradient: Float64Array;
}

export function newNormalScratch(): NormalScratch {
  return { params: { kappa: 0, phi: 0, d: 0 }, normal: new Float64Array(6), gradient: new Float64Array(3) };
}

/**
 * Normal equations of the geometric fit of one track at (κ, φ, d) about the reference point
 * (xr, yr): fills `A` (6 numbers, upper triangle of JᵀWJ: κκ, κφ, κd, φφ, φd, dd) and `g`
 * (JᵀWr, 3 numbers) and returns χ² = Σ w r².
 * Weights: the prepared per-hit weights (1/σ² for round errors, 1 when the errors are unknown)
 * or, when some hit has σx ≠ σy, the error along the residual direction ∂r/∂Q of each hit.
 */
export function normalEquations(span: TrackSpan, xr: number, yr: number, p: TrackParams, A: Float64Array, g: Float64Array): number {
  const { x, y, weights: w } = span.hits;
  const sx = span.hits.anisotropic ? span.hits.sigmaX : undefined;
  const sy = span.hits.sigmaY;
  const { from, to } = span;
  const { kappa, phi, d } = p;
  const c = Math.cos(phi), s = Math.sin(phi);
  const oneMinusKd = 1 - kappa * d;
  let a00 = 0, a01 = 0, a02 = 0, a11 = 0, a12 = 0, a22 = 0, g0 = 0, g1 = 0, g2 = 0, chi2 = 0;
  for (let i = from; i < to; i++) {
    const dx = x[i] - xr, dy = y[i] - yr;
    const a = dx * c + dy * s;
    const B = -dx * s + dy * c + d;
    const P = kappa * (a * a + B * B) - 2 * B;
    const S = Math.sqrt(1 + kappa * P);
    const r = P / (1 + S);
    const iS = 1 / S;
    const jk = 0.5 * (a * a + B * B - r * r) * iS;
    const jp = a * oneMinusKd * iS;
    const kB1 = kappa * B - 1;
    const jd = kB1 * iS;
    let wi = 1;
    if (sx !== undefined) {
      // Residual direction ∂r/∂Q in x, y components.
      const gx = (kappa * a * c - kB1 * s) * iS, gy = (kappa * a * s + kB1 * c) * iS;
      const ex = sx[i], ey = sy![i];
      wi = 1 / (ex * ex * gx * gx + ey * ey * gy * gy);
    } else {
      wi = w[i];
    }
    const wjk = wi * jk, wjp = wi * jp, wjd = wi * jd;
    a00 += wjk * jk; a01 += wjk * jp; a02 += wjk * jd;
    a11 += wjp * jp; a12 += wjp * jd; a22 += wjd * jd;
    g0 += wjk * r; g1 += wjp * r; g2 += wjd * r;
    chi2 += wi * r * r;
  }
  A[0] = a00; A[1] = a01; A[2] = a02; A[3] = a11; A[4] = a12; A[5] = a22;
  g[0] = g0; g[1] = g1; g[2] = g2;
  return chi2;
}

/**
 * Inverts a symmetric 3×3 matrix given as its upper triangle (6 numbers) into `out` (same
 * layout). Returns false when it is singular or not positive definite to working precision.
 */
export function invertSym3(m: Float64Array, out: Float64Array, offset = 0): boolean {
  const a = m[0], b = m[1], c = m[2], d = m[3], e = m[4], f = m[5];
  const c00 = d * f - e * e, c01 = c * e - b * f, c02 = b * e - c * d;
  const det = a * c00 + b * c01 + c * c02;
  const scale = Math.abs(a * d * f) + Math.abs(b * e * c) + Math.abs(c * c * d) + Math.abs(a * e * e) + Math.abs(b * b * f);
  if (!(det > 1e-14 * scale) || !Number.isFinite(det)) return false;
  const id = 1 / det;
  out[offset] = c00 * id;
  out[offset + 1] = c01 * id;
  out[offset + 2] = c02 * id;
  out[offset + 3] = (a * f - c * c) * id;
  out[offset + 4] = (b * c - a * e) * id;
  out[offset + 5] = (a * d - b * b) * id;
  return true;
}

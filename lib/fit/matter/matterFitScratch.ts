/**
 * Working space of the fit with material, sized for tracks of up to `capacity` hits; one per
 * caller (the columnar fit keeps one for all its tracks), never shared between concurrent fits.
 * Per hit i: the reference trajectory at the point closest to hit i, the step from hit i−1
 * (3×3 bending-plane Jacobian F and process noise Q, row-major; the (z, tan λ) noise Qz as
 * zz, zt, tt), the residuals of the hits to the reference and their variances, and the
 * backward-filtered states kept for the smoothed residuals.
 */
export interface MatterFitScratch {
  capacity: number;
  x: Float64Array; y: Float64Array; phi: Float64Array; kappa: Float64Array; z: Float64Array;
  /** Residual CSDA range [g/cm²] and momentum [GeV/c] on the reference at each hit. */
  range: Float64Array; p: Float64Array;
  /** Transverse arc length from hit i−1 [m], 3-D path from hit 0 [m]. */
  ds: Float64Array; path: Float64Array;
  F: Float64Array; Q: Float64Array; Qz: Float64Array;
  mr: Float64Array; mv: Float64Array; zr: Float64Array; zv: Float64Array;
  /** Backward-filtered (u, ψ, δκ) + upper 3×3 cov (6) and (z, t) + cov (3) per hit. */
  bs: Float64Array; bz: Float64Array;
  residual: Float64Array; residualZ: Float64Array;
  /** Small fixed buffers: the current propagation state and scratch numbers. */
  cur: Float64Array; tmp: Float64Array;
  /** The iterations' start, last good start, move, profile estimate (x, y, φ, κ, z, tan λ) and prior variances (5). */
  start: Float64Array; good: Float64Array; delta: Float64Array; est: Float64Array; prior: Float64Array;
  /** Filter outputs: state (3) + cov (9) bending, state (2) + cov (4) z, at the first and last hit. */
  firstB: Float64Array; firstZ: Float64Array; lastB: Float64Array; lastZ: Float64Array;
  /** The stop constraint of the current reference (`stopConstraint`): its hit, the measured δκ there [1/m] and its variance. */
  stop: Float64Array;
}

export function matterFitScratch(capacity: number): MatterFitScratch {
  const c = Math.max(4, capacity | 0);
  const f = (k: number) => new Float64Array(k * c);
  return {
    capacity: c,
    x: f(1), y: f(1), phi: f(1), kappa: f(1), z: f(1), range: f(1), p: f(1), ds: f(1), path: f(1),
    F: f(9), Q: f(9), Qz: f(3), mr: f(1), mv: f(1), zr: f(1), zv: f(1), bs: f(9), bz: f(5),
    residual: f(1), residualZ: f(1),
    cur: new Float64Array(17), tmp: new Float64Array(16),
    start: new Float64Array(6), good: new Float64Array(6), delta: new Float64Array(6), est: new Float64Array(6), prior: new Float64Array(5),
    firstB: new Float64Array(12), firstZ: new Float64Array(6), lastB: new Float64Array(12), lastZ: new Float64Array(6),
    stop: new Float64Array(3),
  };
}

/** `s` if it holds `n` hits, else a larger one. */
export function ensureScratch(s: MatterFitScratch | undefined, n: number): MatterFitScratch {
  return s !== undefined && s.capacity >= n ? s : matterFitScratch(Math.max(n, 2 * (s?.capacity ?? 0)));
}

import { choleskyDecompose, choleskyInverse } from './cholesky.js';
import { levenbergMarquardt, type MinimiserStatus } from './levenbergMarquardt.js';
import { numericalHessian } from './numericalHessian.js';
import { minimizeQuasiNewton } from './quasiNewton.js';

/**
 * What a fit minimises, on the full parameter vector, in χ² units: a sum of squared residuals
 * (least squares, χ² methods, the Poisson deviance as signed deviance residuals), or a scalar
 * such as −2 ln L. Fixed parameters keep their values in the vector; only free ones move.
 */
export type FitObjective =
  | { readonly kind: 'residuals'; readonly count: number; residuals(full: Float64Array, out: Float64Array): void }
  | { readonly kind: 'scalar'; value(full: Float64Array): number };

/** A minimum of a FitObjective over its free parameters. */
export interface FitMinimum {
  /** All parameters (fixed ones at their given values). */
  readonly full: Float64Array;
  /** The objective at the minimum (χ² units). */
  readonly value: number;
  readonly iterations: number;
  readonly status: MinimiserStatus;
  /** First covariance estimate of the free parameters in χ² units (Δ = 1): (JᵀJ)⁻¹ or 2·(BFGS inverse Hessian); undefined if singular. */
  readonly roughCovariance: Float64Array | undefined;
  /** Per free parameter: 1 if it ended on a bound, pushing outwards. */
  readonly atBound: Uint8Array;
}

/** Value of a FitObjective at `full` (Σr² for residual objectives). */
export function objectiveValue(objective: FitObjective, full: Float64Array, scratch?: Float64Array): number {
  if (objective.kind === 'scalar') return objective.value(full);
  const r = scratch ?? new Float64Array(objective.count);
  objective.residuals(full, r);
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i] * r[i];
  return s;
}

/** Settings shared by the fit minimisations. */
export interface MinimiseSettings {
  readonly maxIterations?: number;
  /** Residual objectives in χ² units: stop once a step gains less than this (see levenbergMarquardt). */
  readonly absoluteTolerance?: number;
  /** Residual objectives: polish and Richardson JᵀJ (default true). */
  readonly precise?: boolean;
}

/**
 * Minimises over the free parameters `free` from `start` (full vector): Levenberg–Marquardt for
 * residual objectives, BFGS for scalar ones.
 */
export function minimiseObjective(objective: FitObjective, start: Float64Array, free: Int32Array, lower: ArrayLike<number>, upper: ArrayLike<number>, settings: MinimiseSettings = {}): FitMinimum {
  const full = Float64Array.from(start);
  const p = free.length;
  const put = (theta: Float64Array) => { for (let j = 0; j < p; j++) full[free[j]] = theta[j]; return full; };
  const initial = Float64Array.from(free, (i) => start[i]);
  if (p === 0) {
    return { full, value: objectiveValue(objective, full), iterations: 0, status: 'converged', roughCovariance: new Float64Array(0), atBound: new Uint8Array(0) };
  }
  if (objective.kind === 'residuals') {
    const r = levenbergMarquardt(
      { residualCount: objective.count, parameterCount: p, residuals: (theta, out) => objective.residuals(put(theta), out) },
      initial,
      {
        lower, upper,
        ...(settings.maxIterations ? { maxIterations: settings.maxIterations } : {}),
        ...(settings.absoluteTolerance !== undefined ? { absoluteTolerance: settings.absoluteTolerance } : {}),
        ...(settings.precise !== undefined ? { precise: settings.precise } : {}),
      },
    );
    put(r.theta);
    return { full, value: r.sumOfSquares, iterations: r.iterations, status: r.status, roughCovariance: inverse(r.normalMatrix, p, 1), atBound: r.atBound };
  }
  const q = minimizeQuasiNewton(
    { parameterCount: p, value: (theta) => objective.value(put(theta)) },
    initial,
    { lower, upper, ...(settings.maxIterations ? { maxIterations: settings.maxIterations } : {}) },
  );
  put(q.theta);
  const atBound = new Uint8Array(p);
  for (let j = 0; j < p; j++) atBound[j] = q.theta[j] <= lower[j] || q.theta[j] >= upper[j] ? 1 : 0;
  const rough = q.inverseHessian.map((v) => 2 * v);
  return { full, value: q.value, iterations: q.iterations, status: q.status, roughCovariance: rough, atBound };
}

/** c·A⁻¹ of a symmetric positive-definite p×p matrix, or undefined if it is not one. */
export function inverse(a: Float64Array, p: number, c: number): Float64Array | undefined {
  const l = Float64Array.from(a);
  if (!choleskyDecompose(l, p)) return undefined;
  const out = new Float64Array(p * p);
  choleskyInverse(l, p, out);
  for (let i = 0; i < out.length; i++) out[i] *= c;
  return out;
}

/**
 * The covariance of the free parameters from the curvature of the objective at its minimum:
 * 2·H⁻¹, with H the numerical Hessian of F (χ² units, so Δχ² = 1 ↔ 1σ), steps 0.02 of the
 * rough errors (F rises by 4e-4 over a step, far above its rounding; the truncation error of
 * the curvature is ~4e-4 of its non-quadratic part), or 1e-4 of the value when those are not known. Undefined when H is not
 * positive definite (a parameter not determined by the data).
 */
export function hessianCovariance(objective: FitObjective, minimum: FitMinimum, free: Int32Array): Float64Array | undefined {
  const p = free.length;
  if (p === 0) return new Float64Array(0);
  const full = Float64Array.from(minimum.full);
  const scratch = objective.kind === 'residuals' ? new Float64Array(objective.count) : undefined;
  const theta = Float64Array.from(free, (i) => full[i]);
  const steps = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    const rough = minimum.roughCovariance ? Math.sqrt(minimum.roughCovariance[j * p + j]) : NaN;
    steps[j] = rough > 0 && Number.isFinite(rough) ? 0.02 * rough : 1e-4 * Math.max(Math.abs(theta[j]), 1e-8);
  }
  const h = new Float64Array(p * p);
  const ok = numericalHessian((t) => { for (let j = 0; j < p; j++) full[free[j]] = t[j]; return objectiveValue(objective, full, scratch); }, theta, steps, h);
  return ok ? inverse(h, p, 2) : undefined;
}

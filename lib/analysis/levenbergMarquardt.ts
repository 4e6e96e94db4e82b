import { choleskyDecompose, choleskySolve } from './cholesky.js';
import { jacobianScratch, numericalJacobian } from './numericalJacobian.js';

/** A least-squares problem: minimise Σ r_i(θ)² over θ. */
export interface ResidualProblem {
  readonly residualCount: number;
  readonly parameterCount: number;
  /** Writes the residuals at θ into `out` (length residualCount). */
  residuals(theta: Float64Array, out: Float64Array): void;
  /** Optional analytic Jacobian ∂r_i/∂θ_j, row-major residualCount × parameterCount. */
  jacobian?(theta: Float64Array, out: Float64Array): void;
}

export interface LevenbergMarquardtSettings {
  readonly maxIterations?: number;
  /** Converged when a step changes no parameter by more than this, relative to its size. */
  readonly stepTolerance?: number;
  /** Converged when actual and predicted relative reductions of Σr² are both below this. */
  readonly reductionTolerance?: number;
  readonly lower?: ArrayLike<number>;
  readonly upper?: ArrayLike<number>;
  /** Smallest magnitude each parameter's finite-difference step and step test are relative to (matters near θ_j = 0); default 1e-6 · |start_j|, or 1e-6. */
  readonly scale?: ArrayLike<number>;
  /**
   * Converged once an accepted step lowers Σr² by less than this, absolutely (with the
   * predicted reduction as small) — for objectives in χ² units, where 1e-9 places the minimum
   * within ~3e-5 of each error. Replaces `reductionTolerance`.
   */
  readonly absoluteTolerance?: number;
  /**
   * Polish the end point with undamped Gauss–Newton steps (central differences) and compute
   * JᵀJ there by Richardson-extrapolated differences — the 8–11 digits of the NIST checks.
   * Default true; a fit that takes its errors from elsewhere (a Hessian) may switch it off.
   */
  readonly precise?: boolean;
}

export const LEVENBERG_MARQUARDT_DEFAULTS = Object.freeze({ maxIterations: 10_000, stepTolerance: 1e-13, reductionTolerance: 1e-16 });

/** How a minimisation ended. */
export type MinimiserStatus = 'converged' | 'max-iterations' | 'not-finite';

export interface LevenbergMarquardtResult {
  readonly theta: Float64Array;
  /** Σ r² at θ. */
  readonly sumOfSquares: number;
  readonly iterations: number;
  readonly evaluations: number;
  readonly status: MinimiserStatus;
  /** JᵀJ at θ (row-major p×p, Jacobian by Richardson-extrapolated differences): ½ the Gauss–Newton Hessian of Σr². */
  readonly normalMatrix: Float64Array;
  /** 1 where θ_j sits on a bound with the gradient pushing outwards. */
  readonly atBound: Uint8Array;
}

/** Fraction of the step at which the second directional derivative is sampled (geodesic acceleration). */
const ACCEL_H = 0.1;
/** Largest accepted |acceleration| / |velocity| in the scaled metric (Transtrum & Sethna's 0.75). */
const ACCEL_RATIO = 0.75;

/**
 * Levenberg–Marquardt minimisation of Σ r(θ)² (K. Levenberg, Q. Appl. Math. 2 (1944) 164;
 * D. W. Marquardt, SIAM J. Appl. Math. 11 (1963) 431) as in K. Madsen, H. B. Nielsen &
 * O. Tingleff, "Methods for non-linear least squares problems", 2nd ed. (DTU, 2004), Alg. 3.16:
 * steps solve (JᵀJ + μD) δ = −Jᵀr with Marquardt's scaling D = diag(JᵀJ) kept at its running
 * maximum (J. J. Moré, Numerical Analysis (Dundee 1977), Springer LNM 630 (1978) 105), μ follows Nielsen's gain-ratio
 * rule. If that run does not converge to a point with a regular JᵀJ, a second run from the same
 * start adds geodesic acceleration (M. K. Transtrum & J. P. Sethna, arXiv:1201.5885), which
 * refuses steps that curve sharply (it rescues BoxBOD from NIST's first start, where plain
 * steps leap onto a plateau), and the better end point is kept. The end point is polished by
 * undamped Gauss–Newton steps, and JᵀJ there uses Richardson-extrapolated differences
 * (`precise`, the default). Jacobians while iterating are forward differences (p evaluations).
 * Bounds are honoured by projection; a parameter on a bound whose gradient points outwards is
 * held for that step. Without an analytic Jacobian, central differences (2p evaluations).
 *
 * Written here rather than taken from the registry: ml-levenberg-marquardt 5.1.0 failed 6 of the
 * 10 NIST StRD nonlinear problems from their first start (and reached < 6 digits on others), and
 * gives no covariance (test/analysis/nistNonlinear.test.ts holds the checks).
 * @example levenbergMarquardt({ residualCount: 2, parameterCount: 1, residuals: (t, r) => { r[0] = t[0] - 1; r[1] = t[0] - 3; } }, [0]).theta // [2]
 */
export function levenbergMarquardt(problem: ResidualProblem, start: ArrayLike<number>, settings: LevenbergMarquardtSettings = {}): LevenbergMarquardtResult {
  const s = { ...LEVENBERG_MARQUARDT_DEFAULTS, ...settings };
  const w = workspace(problem, start, settings);
  let best = run(w, start, false, s);
  if (best.status !== 'converged' || !regular(best.a, w.p)) {
    const second = run(w, start, true, s);
    const better = second.status === 'converged' && (best.status !== 'converged' || second.f < best.f || !regular(best.a, w.p));
    if (better) best = second;
  }
  const precise = settings.precise ?? true;
  const polished = precise ? polish(w, best, s) : { theta: best.theta, f: best.f, iterations: 0 };
  if (!precise) evaluate(w, polished.theta, w.r);
  const a = normalMatrix(w, polished.theta, precise);
  const g = gradient(w);
  const atBound = new Uint8Array(w.p);
  for (let j = 0; j < w.p; j++) atBound[j] = outward(w, polished.theta, g, j) ? 1 : 0;
  return { theta: polished.theta, sumOfSquares: polished.f, iterations: best.iterations + polished.iterations, evaluations: w.evaluations, status: best.status, normalMatrix: a, atBound };
}

interface Workspace {
  readonly problem: ResidualProblem;
  readonly m: number;
  readonly p: number;
  readonly lower?: ArrayLike<number>;
  readonly upper?: ArrayLike<number>;
  readonly scale: Float64Array;
  readonly r: Float64Array;
  readonly rTrial: Float64Array;
  readonly rProbe: Float64Array;
  readonly jac: Float64Array;
  readonly scratch: ReturnType<typeof jacobianScratch>;
  evaluations: number;
}

interface RunResult { theta: Float64Array; f: number; a: Float64Array; iterations: number; status: MinimiserStatus }

function workspace(problem: ResidualProblem, start: ArrayLike<number>, settings: LevenbergMarquardtSettings): Workspace {
  const m = problem.residualCount, p = problem.parameterCount;
  const scale = new Float64Array(p);
  for (let j = 0; j < p; j++) scale[j] = settings.scale ? Math.abs(settings.scale[j]) : 1e-6 * (Math.abs(start[j]) || 1);
  return {
    problem, m, p, lower: settings.lower, upper: settings.upper, scale,
    r: new Float64Array(m), rTrial: new Float64Array(m), rProbe: new Float64Array(m), jac: new Float64Array(m * p),
    scratch: jacobianScratch(m), evaluations: 0,
  };
}

const clampTo = (w: Workspace, v: number, j: number) => Math.min(w.upper ? w.upper[j] : Infinity, Math.max(w.lower ? w.lower[j] : -Infinity, v));

function evaluate(w: Workspace, theta: Float64Array, out: Float64Array): number {
  w.evaluations++;
  w.problem.residuals(theta, out);
  let t = 0;
  for (let i = 0; i < w.m; i++) t += out[i] * out[i];
  return t;
}

/**
 * Jacobian at θ into w.jac, and JᵀJ (returned, p×p); NaN entries when not finite. `accuracy`:
 * forward differences from w.r (which must hold r(θ)), central, or Richardson-extrapolated.
 */
function normalMatrix(w: Workspace, theta: Float64Array, accuracy: 'forward' | 'central' | boolean, into?: Float64Array): Float64Array {
  const { m, p, jac } = w;
  const richardson = accuracy === true;
  const base = accuracy === 'forward' ? w.r : undefined;
  if (w.problem.jacobian) w.problem.jacobian(theta, jac);
  else numericalJacobian((t, o) => { w.evaluations++; w.problem.residuals(t, o); }, theta, m, jac, w.scratch, { scale: w.scale, lower: w.lower, upper: w.upper, richardson, base });
  const a = into ?? new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    for (let k = 0; k <= j; k++) {
      let s = 0;
      for (let i = 0; i < m; i++) s += jac[i * p + j] * jac[i * p + k];
      a[j * p + k] = a[k * p + j] = s;
    }
  }
  return a;
}

/** Jᵀr from w.jac and w.r. */
function gradient(w: Workspace, into?: Float64Array): Float64Array {
  const { m, p, jac, r } = w;
  const g = into ?? new Float64Array(p);
  for (let j = 0; j < p; j++) {
    let s = 0;
    for (let i = 0; i < m; i++) s += jac[i * p + j] * r[i];
    g[j] = s;
  }
  return g;
}

function outward(w: Workspace, theta: Float64Array, g: Float64Array, j: number): boolean {
  const lo = w.lower ? w.lower[j] : -Infinity, hi = w.upper ? w.upper[j] : Infinity;
  return (theta[j] <= lo && g[j] > 0) || (theta[j] >= hi && g[j] < 0);
}

function regular(a: Float64Array, p: number): boolean {
  return choleskyDecompose(Float64Array.from(a), p);
}

const finiteAll = (v: Float64Array) => v.every(Number.isFinite);

type RunSettings = Required<Pick<LevenbergMarquardtSettings, 'maxIterations' | 'stepTolerance' | 'reductionTolerance'>> & { readonly absoluteTolerance?: number };

function run(w: Workspace, start: ArrayLike<number>, acceleration: boolean, s: RunSettings): RunResult {
  const { m, p, r, rTrial, rProbe, jac, scale } = w;
  const theta = new Float64Array(p), trial = new Float64Array(p), probe = new Float64Array(p);
  for (let j = 0; j < p; j++) theta[j] = clampTo(w, start[j], j);
  const a = new Float64Array(p * p), g = new Float64Array(p), d = new Float64Array(p);
  const damped = new Float64Array(p * p), step = new Float64Array(p), accel = new Float64Array(p);
  const free = new Uint8Array(p);
  const linearise = (): boolean => {
    normalMatrix(w, theta, 'forward', a);
    gradient(w, g);
    for (let j = 0; j < p; j++) d[j] = Math.max(d[j], a[j * p + j], 1e-300);
    return finiteAll(a) && finiteAll(g);
  };
  let f = evaluate(w, theta, r);
  if (!Number.isFinite(f) || !linearise()) return { theta, f, a, iterations: 0, status: 'not-finite' };
  let mu = 1e-3, nu = 2;
  for (let it = 1; it <= s.maxIterations; it++) {
    if (f === 0) return { theta, f, a, iterations: it - 1, status: 'converged' };
    let nFree = 0;
    for (let j = 0; j < p; j++) { free[j] = outward(w, theta, g, j) ? 0 : 1; nFree += free[j]; }
    if (nFree === 0) return { theta, f, a, iterations: it - 1, status: 'converged' };
    for (let j = 0, row = 0; j < p; j++) {
      if (!free[j]) continue;
      for (let k = 0, col = 0; k < p; k++) if (free[k]) damped[row * nFree + col++] = a[j * p + k] + (j === k ? mu * d[j] : 0);
      step[row++] = -g[j];
    }
    if (!choleskyDecompose(damped, nFree)) { mu *= nu; nu *= 2; continue; }
    choleskySolve(damped, nFree, step);
    let small = true;
    for (let j = 0, q = 0; j < p; j++) {
      trial[j] = clampTo(w, theta[j] + (free[j] ? step[q++] : 0), j);
      if (Math.abs(trial[j] - theta[j]) > s.stepTolerance * (Math.abs(theta[j]) + scale[j])) small = false;
    }
    if (small) return { theta, f, a, iterations: it, status: 'converged' };
    if (acceleration) {
      // r''_v from one more evaluation; a = −(A + μD)⁻¹ Jᵀ r''_v; refuse if |a| > 0.75 |v|.
      for (let j = 0; j < p; j++) probe[j] = clampTo(w, theta[j] + ACCEL_H * (trial[j] - theta[j]), j);
      evaluate(w, probe, rProbe);
      for (let i = 0; i < m; i++) {
        let jv = 0;
        for (let j = 0; j < p; j++) jv += jac[i * p + j] * (probe[j] - theta[j]);
        rProbe[i] = (2 / (ACCEL_H * ACCEL_H)) * (rProbe[i] - r[i] - jv);
      }
      let vNorm = 0, aNorm = 0;
      for (let j = 0, q = 0; j < p; j++) {
        if (!free[j]) continue;
        let gj = 0;
        for (let i = 0; i < m; i++) gj += jac[i * p + j] * rProbe[i];
        accel[q++] = -gj;
      }
      choleskySolve(damped, nFree, accel);
      for (let j = 0, q = 0; j < p; j++) if (free[j]) { vNorm += d[j] * step[q] * step[q]; aNorm += d[j] * accel[q] * accel[q]; q++; }
      if (!(aNorm <= ACCEL_RATIO * ACCEL_RATIO * vNorm)) { mu *= nu; nu *= 2; continue; }
      for (let j = 0, q = 0; j < p; j++) if (free[j]) { trial[j] = clampTo(w, theta[j] + step[q] + 0.5 * accel[q], j); q++; }
    }
    let gd = 0, dad = 0; // predicted reduction −(2gᵀδ + δᵀAδ)
    for (let j = 0; j < p; j++) {
      const dj = trial[j] - theta[j];
      gd += g[j] * dj;
      for (let k = 0; k < p; k++) dad += dj * a[j * p + k] * (trial[k] - theta[k]);
    }
    const predicted = -(2 * gd + dad);
    const fTrial = evaluate(w, trial, rTrial);
    const rho = predicted > 0 ? (f - fTrial) / predicted : -1;
    if (Number.isFinite(fTrial) && fTrial < f && rho > 0) {
      const actual = f - fTrial;
      theta.set(trial);
      r.set(rTrial);
      f = fTrial;
      if (!linearise()) return { theta, f, a, iterations: it, status: 'not-finite' };
      mu *= Math.max(1 / 3, 1 - Math.pow(2 * rho - 1, 3));
      nu = 2;
      const tolerance = s.absoluteTolerance ?? s.reductionTolerance * (f + actual);
      if (actual <= tolerance && predicted <= tolerance) return { theta, f, a, iterations: it, status: 'converged' };
    } else {
      mu *= nu;
      nu *= 2;
      if (!(mu < 1e300)) return { theta, f, a, iterations: it, status: 'converged' }; // no step reduces Σr²
    }
  }
  return { theta, f, a, iterations: s.maxIterations, status: 'max-iterations' };
}

/**
 * Up to 8 undamped Gauss–Newton steps from a converged point. Near the minimum Σr² changes by
 * less than its own rounding (residuals y − f lose digits to cancellation: ~1e-13 relative on
 * NIST MGH17) while the parameters can still move by ~1e-7 of themselves, so a step is kept
 * unless Σr² grows by more than 1e-10 relative — a change far below any statistical meaning.
 */
function polish(w: Workspace, from: RunResult, s: { stepTolerance: number }): { theta: Float64Array; f: number; iterations: number } {
  const { p } = w;
  const theta = Float64Array.from(from.theta), trial = new Float64Array(p), step = new Float64Array(p);
  let f = evaluate(w, theta, w.r);
  let iterations = 0;
  if (from.status !== 'converged' || !Number.isFinite(f)) return { theta, f, iterations };
  for (let it = 0; it < 8; it++) {
    const a = normalMatrix(w, theta, 'central');
    const g = gradient(w);
    let held = false;
    for (let j = 0; j < p; j++) if (outward(w, theta, g, j)) held = true;
    if (held || !choleskyDecompose(a, p)) break;
    for (let j = 0; j < p; j++) step[j] = -g[j];
    choleskySolve(a, p, step);
    let small = true;
    for (let j = 0; j < p; j++) {
      trial[j] = clampTo(w, theta[j] + step[j], j);
      if (Math.abs(trial[j] - theta[j]) > 1e-3 * s.stepTolerance * (Math.abs(theta[j]) + w.scale[j])) small = false;
    }
    const fTrial = evaluate(w, trial, w.rTrial);
    if (!(fTrial <= f * (1 + 1e-10))) break;
    theta.set(trial);
    w.r.set(w.rTrial);
    f = fTrial;
    iterations++;
    if (small) break;
  }
  evaluate(w, theta, w.r);
  return { theta, f, iterations };
}

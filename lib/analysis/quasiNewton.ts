import { CENTRAL_STEP } from './numericalJacobian.js';
import type { MinimiserStatus } from './levenbergMarquardt.js';

/** A smooth scalar objective to minimise, e.g. −2 ln L. */
export interface ScalarProblem {
  readonly parameterCount: number;
  value(theta: Float64Array): number;
}

export interface QuasiNewtonSettings {
  readonly maxIterations?: number;
  /** Converged when an iteration lowers F by less than this (absolute; in χ² units 1e-9 is far below any meaning). */
  readonly tolerance?: number;
  readonly lower?: ArrayLike<number>;
  readonly upper?: ArrayLike<number>;
  /** Smallest magnitude each parameter's gradient step is relative to (matters near θ_j = 0); default 1e-6 · |start_j|, or 1e-6. */
  readonly scale?: ArrayLike<number>;
}

export const QUASI_NEWTON_DEFAULTS = Object.freeze({ maxIterations: 2000, tolerance: 1e-9 });

export interface QuasiNewtonResult {
  readonly theta: Float64Array;
  readonly value: number;
  readonly iterations: number;
  readonly evaluations: number;
  readonly status: MinimiserStatus;
  /** The BFGS approximation to the inverse Hessian of F at θ (row-major p×p): a first error estimate. */
  readonly inverseHessian: Float64Array;
}

/**
 * Minimises a smooth scalar function by the BFGS quasi-Newton method with a backtracking
 * (Armijo) line search (J. Nocedal & S. J. Wright, Numerical Optimization, 2nd ed., Alg. 6.1 and
 * §3.1), gradients by central differences (2p evaluations each). The first inverse Hessian is
 * diagonal, from the second differences of F along each axis, so parameters of very different
 * scales start well conditioned. Bounds by projection; the approximation restarts from the
 * diagonal whenever a step is projected or the curvature condition fails. For likelihoods
 * written in χ² units (−2 ln L), the default tolerance 1e-9 means the minimum is located to
 * ~3e-5 of each error.
 *
 * Written here rather than taken from the registry: the small scalar minimisers there are
 * unconstrained (fmin 0.0.4 says so in its description; numeric 1.2.6's uncmin likewise, from
 * its documentation (memory)), while every fit here takes bounds, and none returns the inverse
 * Hessian the first error estimate comes from.
 * @example minimizeQuasiNewton({ parameterCount: 1, value: (t) => (t[0] - 2) ** 2 }, [0]).theta // ≈ [2]
 */
export function minimizeQuasiNewton(problem: ScalarProblem, start: ArrayLike<number>, settings: QuasiNewtonSettings = {}): QuasiNewtonResult {
  const s = { ...QUASI_NEWTON_DEFAULTS, ...settings };
  const p = problem.parameterCount;
  const lower = settings.lower, upper = settings.upper;
  const clamp = (v: number, j: number) => Math.min(upper ? upper[j] : Infinity, Math.max(lower ? lower[j] : -Infinity, v));
  const floor = Float64Array.from({ length: p }, (_, j) => (settings.scale ? Math.abs(settings.scale[j]) : 1e-6 * (Math.abs(start[j]) || 1)));
  let evaluations = 0;
  const value = (t: Float64Array) => { evaluations++; return problem.value(t); };
  const x = Float64Array.from({ length: p }, (_, j) => clamp(start[j], j));
  const xNew = new Float64Array(p), g = new Float64Array(p), gNew = new Float64Array(p), d = new Float64Array(p);
  const h = new Float64Array(p * p), sv = new Float64Array(p), yv = new Float64Array(p), hy = new Float64Array(p);

  const gradient = (at: Float64Array, fAt: number, out: Float64Array) => {
    for (let j = 0; j < p; j++) {
      const t = at[j], step = CENTRAL_STEP * Math.max(Math.abs(t), floor[j], 1e-300);
      const up = clamp(t + step, j), dn = clamp(t - step, j);
      at[j] = up; const fu = up === t ? fAt : value(at);
      at[j] = dn; const fd = dn === t ? fAt : value(at);
      at[j] = t;
      out[j] = (fu - fd) / (up - dn);
    }
  };
  // Diagonal inverse Hessian from second differences along each axis. The step grows ×10 until F
  // changes by more than its rounding allows (1e-10 of |F| + 1), and is then kept as that
  // parameter's floor for gradient steps, so a parameter started at 0 finds its own scale.
  const resetDiagonal = (at: Float64Array, fAt: number) => {
    h.fill(0);
    for (let j = 0; j < p; j++) {
      const t = at[j];
      let step = 1e-4 * Math.max(Math.abs(t), floor[j], 1e-300), curvature = NaN;
      for (let grow = 0; grow < 24; grow++) {
        at[j] = clamp(t + step, j); const fu = value(at);
        at[j] = clamp(t - step, j); const fd = value(at);
        at[j] = t;
        const rise = 0.5 * (fu + fd) - fAt;
        if (Number.isFinite(rise) && Math.abs(rise) > 1e-10 * (Math.abs(fAt) + 1)) { curvature = (2 * rise) / (step * step); break; }
        step *= 10;
      }
      floor[j] = Math.max(floor[j], 1e-2 * step);
      h[j * p + j] = curvature > 0 ? 1 / curvature : step * step;
    }
  };
  const outward = (j: number, dir: number) => (lower && x[j] <= lower[j] && dir < 0) || (upper && x[j] >= upper[j] && dir > 0);

  let f = value(x);
  if (!Number.isFinite(f)) return { theta: x, value: f, iterations: 0, evaluations, status: 'not-finite', inverseHessian: h };
  gradient(x, f, g);
  resetDiagonal(x, f);
  let fresh = true;
  for (let it = 1; it <= s.maxIterations; it++) {
    let slope = 0;
    for (let j = 0; j < p; j++) {
      let dj = 0;
      for (let k = 0; k < p; k++) dj -= h[j * p + k] * g[k];
      d[j] = outward(j, dj) ? 0 : dj;
      slope += g[j] * d[j];
    }
    if (!(slope < 0)) {
      if (fresh) return { theta: x, value: f, iterations: it - 1, evaluations, status: 'converged', inverseHessian: h };
      resetDiagonal(x, f); fresh = true; continue;
    }
    // Backtracking line search with the Armijo condition (c₁ = 1e-4), quadratic interpolation of α.
    let alpha = 1, fNew = NaN, projected = false, accepted = false;
    for (let ls = 0; ls < 50; ls++) {
      projected = false;
      let moved = 0;
      for (let j = 0; j < p; j++) {
        xNew[j] = clamp(x[j] + alpha * d[j], j);
        if (xNew[j] !== x[j] + alpha * d[j]) projected = true;
        moved += g[j] * (xNew[j] - x[j]);
      }
      fNew = value(xNew);
      if (Number.isFinite(fNew) && fNew <= f + 1e-4 * moved) { accepted = true; break; }
      const quad = Number.isFinite(fNew) ? (-slope * alpha * alpha) / (2 * (fNew - f - slope * alpha)) : 0.1 * alpha;
      alpha = Math.min(0.5 * alpha, Math.max(0.1 * alpha, quad));
    }
    if (!accepted) {
      if (fresh) return { theta: x, value: f, iterations: it, evaluations, status: 'converged', inverseHessian: h };
      resetDiagonal(x, f); fresh = true; continue;
    }
    gradient(xNew, fNew, gNew);
    let sy = 0;
    for (let j = 0; j < p; j++) { sv[j] = xNew[j] - x[j]; yv[j] = gNew[j] - g[j]; sy += sv[j] * yv[j]; }
    const decrease = f - fNew;
    x.set(xNew); g.set(gNew); f = fNew;
    if (decrease < s.tolerance && -slope < 10 * s.tolerance) return { theta: x, value: f, iterations: it, evaluations, status: 'converged', inverseHessian: h };
    if (projected || !(sy > 1e-300)) { resetDiagonal(x, f); fresh = true; continue; }
    // BFGS update of the inverse Hessian: H ← (I − ρsyᵀ) H (I − ρysᵀ) + ρssᵀ, ρ = 1/sᵀy.
    const rho = 1 / sy;
    let yhy = 0;
    for (let j = 0; j < p; j++) { let t = 0; for (let k = 0; k < p; k++) t += h[j * p + k] * yv[k]; hy[j] = t; yhy += yv[j] * t; }
    for (let j = 0; j < p; j++) {
      for (let k = 0; k < p; k++) {
        h[j * p + k] += -rho * (hy[j] * sv[k] + sv[j] * hy[k]) + (rho * rho * yhy + rho) * sv[j] * sv[k];
      }
    }
    fresh = false;
  }
  return { theta: x, value: f, iterations: s.maxIterations, evaluations, status: 'max-iterations', inverseHessian: h };
}

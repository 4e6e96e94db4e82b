import { msg } from '../errors.js';
import { hessianCovariance, minimiseObjective, type FitObjective } from './fitObjective.js';
import { modelEvaluator, resolveParameters, type ParameterOptions, type ParameterStart } from './fitParameters.js';
import { buildFitResult, type FitResult } from './fitResult.js';
import { CENTRAL_STEP } from './numericalJacobian.js';
import { profileErrors } from './profileErrors.js';
import type { Model } from './shapes/shape.js';

/** Points to fit: y measured at x, with optional 1σ errors on y (`sigma`) and on x (`xSigma`), each per point or one for all. */
export interface FitData {
  readonly x: ArrayLike<number>;
  readonly y: ArrayLike<number>;
  readonly sigma?: ArrayLike<number> | number;
  readonly xSigma?: ArrayLike<number> | number;
}

export interface FitModelOptions extends ParameterOptions {
  /**
   * Scale the errors by √(χ²/ndf) (the residual standard deviation): default true without
   * `sigma` — as NIST StRD certify their standard deviations — and false with it.
   */
  readonly scaleErrors?: boolean;
  /** Also scan the χ² for Δχ² = 1 on each side of every free parameter (asymmetric errors). */
  readonly asymmetricErrors?: boolean;
  readonly maxIterations?: number;
}

/**
 * Least-squares fit of `model(x, p)` to points (x, y): minimises χ² = Σ((y − f(x))/σ)² by
 * Levenberg–Marquardt (`levenbergMarquardt`; central-difference Jacobian, geodesic-acceleration
 * rescue), from `start` (an array in parameter order, or values by name).
 *
 * Errors are the linearised covariance (JᵀJ)⁻¹ at the minimum — with the residual variance
 * χ²/ndf as scale when no `sigma` is given, which is how NIST certifies the standard deviations
 * of its StRD problems (reproduced to ≥ 8 digits on 10 of them, both starts: test/analysis/
 * nistNonlinear.test.ts). With `asymmetricErrors`, Δχ² = 1 profile scans as well.
 *
 * Errors on x (`xSigma`) are treated by effective variance: σ_eff² = σ² + (∂f/∂x · σ_x)², with the
 * slope at the current parameters inside the minimisation (J. Orear, Am. J. Phys. 50 (1982) 912;
 * for a straight line this is the exact Gaussian maximum likelihood with both errors, D. York,
 * Can. J. Phys. 44 (1966) 1079). Orthogonal-distance regression is not offered. `sigma` is
 * required with `xSigma`. A fit through the origin is a model without a constant term, e.g.
 * (x, p) => p[0] * x, or `fitStraightLine(…, { throughOrigin: true })`.
 *
 * Parameters may be fixed or bounded (options.fixed, options.bounds); a bounded parameter that
 * ends on its bound is flagged (`parameters[name].atBound`) and its error is that of the
 * unconstrained curvature. Numerical trouble is the result's `status`; a bad call throws.
 * @example fitModel({ x, y, sigma: 0.1 }, (x, p) => p[0] * Math.exp(-p[1] * x), { amplitude: 10, rate: 0.5 })
 */
export function fitModel(data: FitData, model: Model, start: ParameterStart, options: FitModelOptions = {}): FitResult {
  const n = data.x.length;
  if (data.y.length !== n) throw msg.badArgument('y', `${data.y.length} values`, `as many values as x (${n})`);
  const sigma = perPoint(data.sigma, n, 'sigma');
  const xSigma = perPoint(data.xSigma, n, 'xSigma');
  if (xSigma && !sigma) throw msg.badArgument('sigma', undefined, 'errors on y as well when xSigma is given (the effective variance needs both)');
  const pars = resolveParameters(model, start, options);
  const f = modelEvaluator(model);
  const used: number[] = [];
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(data.x[i]) || !Number.isFinite(data.y[i])) continue; // left out, counted in `excluded`
    if (sigma && !(sigma[i] > 0 && Number.isFinite(sigma[i]))) throw msg.badArgument(`sigma[${i}]`, sigma[i], 'a finite error > 0 for every point');
    if (xSigma && !(xSigma[i] >= 0 && Number.isFinite(xSigma[i]))) throw msg.badArgument(`xSigma[${i}]`, xSigma[i], 'a finite error ≥ 0 for every point');
    used.push(i);
  }
  const m = used.length;
  const objective: FitObjective = {
    kind: 'residuals',
    count: m,
    residuals(p: Float64Array, out: Float64Array) {
      for (let q = 0; q < m; q++) {
        const i = used[q], x = data.x[i];
        const r = data.y[i] - f(x, p);
        if (!sigma) { out[q] = r; continue; }
        let variance = sigma[i] * sigma[i];
        if (xSigma && xSigma[i] > 0) {
          const h = CENTRAL_STEP * Math.max(Math.abs(x), xSigma[i]);
          const slope = (f(x + h, p) - f(x - h, p)) / (2 * h);
          variance += slope * slope * xSigma[i] * xSigma[i];
        }
        out[q] = r / Math.sqrt(variance);
      }
    },
  };
  const minimum = minimiseObjective(objective, pars.start, pars.free, pars.lower, pars.upper, { maxIterations: options.maxIterations });
  const ndf = m - pars.free.length;
  const scaled = options.scaleErrors ?? !sigma;
  const errorScale = scaled ? (ndf > 0 ? Math.sqrt(minimum.value / ndf) : NaN) : 1;
  // Effective variance makes the weights depend on the parameters: the curvature of the actual
  // objective is then the honest error, not the Gauss–Newton product.
  const covariance = xSigma ? hessianCovariance(objective, minimum, pars.free) : minimum.roughCovariance;
  const asymmetric = options.asymmetricErrors && covariance && minimum.status === 'converged'
    ? profileErrors(objective, minimum, pars.free, pars.lower, pars.upper, covariance, scaled && errorScale > 0 ? errorScale * errorScale : 1)
    : undefined;
  return buildFitResult({
    method: 'least-squares', names: pars.names, full: minimum.full, free: pars.free, covariance,
    chi2: minimum.value, ndf, chi2HasDistribution: sigma !== undefined, minimiser: minimum.status,
    iterations: minimum.iterations, minimum: minimum.value, atBound: minimum.atBound, errorScale,
    excluded: n - m,
    asymmetric: asymmetric && scaled ? { lower: asymmetric.lower.map((v) => v / errorScale), upper: asymmetric.upper.map((v) => v / errorScale) } : asymmetric,
  });
}

function perPoint(v: ArrayLike<number> | number | undefined, n: number, name: string): ArrayLike<number> | undefined {
  if (v === undefined) return undefined;
  if (typeof v === 'number') {
    if (!(v >= 0) || !Number.isFinite(v)) throw msg.badArgument(name, v, 'a finite error ≥ 0, in the unit of the data');
    return new Float64Array(n).fill(v);
  }
  if (v.length !== n) throw msg.badArgument(name, `${v.length} values`, `one error per point (${n})`);
  return v;
}

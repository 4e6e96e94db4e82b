import { msg } from '../errors.js';
import { rangeIntegrator } from './binIntegral.js';
import { hessianCovariance, minimiseObjective, type FitObjective } from './fitObjective.js';
import { modelEvaluator, resolveParameters, type ParameterOptions, type ParameterStart } from './fitParameters.js';
import { buildFitResult, type FitResult } from './fitResult.js';
import { profileErrors } from './profileErrors.js';
import type { Model } from './shapes/shape.js';

export interface FitUnbinnedOptions extends ParameterOptions {
  /** The range [low, high] the model is normalised over and values are taken from (required: the acceptance of the sample). */
  readonly range: readonly [number, number];
  /**
   * Extended likelihood: the model is a density in entries per unit x and its integral over the
   * range is the expected number of values, fitted too (−2 ln L = 2ν − 2 Σ ln f). Default false:
   * the model is normalised over the range and only its shape is fitted.
   */
  readonly extended?: boolean;
  /** Also scan −2 ln L for a rise of 1 on each side of every free parameter (asymmetric errors). */
  readonly asymmetricErrors?: boolean;
  readonly maxIterations?: number;
}

/**
 * Unbinned maximum-likelihood fit of `model` to individual values (small samples, lifetimes,
 * anything where binning would lose information): minimises −2 ln L = −2 Σ ln[f(xᵢ)/∫f] over
 * the free parameters by BFGS (`minimizeQuasiNewton`), or the extended form 2∫f − 2 Σ ln f(xᵢ)
 * (R. Barlow, NIM A 297 (1990) 496). The normalisation ∫f over `range` is exact for shapes with
 * an integral, else composite Gauss–Legendre. Errors from the curvature of −2 ln L at the
 * minimum (observed information; Δ(−2 ln L) = 1 ↔ 1σ); `asymmetricErrors` adds profile scans,
 * which matter for samples of a few tens of values. Values outside `range` or not finite are
 * left out and counted (`excluded`). There is no goodness of fit (chi2 and pValue are NaN);
 * `minimum` holds −2 ln L.
 * @example fitUnbinned(decayTimesNs, (t, p) => Math.exp(-t / p[0]), { tauNs: 2 }, { range: [0.5, 20] })
 */
export function fitUnbinned(values: ArrayLike<number>, model: Model, start: ParameterStart, options: FitUnbinnedOptions): FitResult {
  const range = options?.range;
  if (!range || !(range[0] < range[1]) || !Number.isFinite(range[0]) || !Number.isFinite(range[1])) throw msg.badArgument('range', range, 'finite [low, high] with low < high: the range the sample was selected in');
  const pars = resolveParameters(model, start, options);
  const inside: number[] = [];
  for (let i = 0; i < values.length; i++) { const v = values[i]; if (Number.isFinite(v) && v >= range[0] && v <= range[1]) inside.push(v); }
  if (inside.length === 0) throw msg.badArgument('values', `${values.length} values`, `at least one finite value inside the range [${range[0]}, ${range[1]}]`);
  const x = Float64Array.from(inside);
  const f = modelEvaluator(model);
  const norm = rangeIntegrator(model);
  const extended = options.extended === true;
  const objective: FitObjective = {
    kind: 'scalar',
    value(p: Float64Array): number {
      const total = norm(range[0], range[1], p);
      if (!(total > 0) || !Number.isFinite(total)) return Infinity;
      let s = 0;
      for (let i = 0; i < x.length; i++) {
        const v = f(x[i], p);
        if (!(v > 0)) return Infinity;
        s += Math.log(v);
      }
      return extended ? 2 * total - 2 * s : -2 * (s - x.length * Math.log(total));
    },
  };
  const minimum = minimiseObjective(objective, pars.start, pars.free, pars.lower, pars.upper, { maxIterations: options.maxIterations });
  const covariance = hessianCovariance(objective, minimum, pars.free);
  const asymmetric = options.asymmetricErrors && covariance && minimum.status === 'converged'
    ? profileErrors(objective, minimum, pars.free, pars.lower, pars.upper, covariance)
    : undefined;
  return buildFitResult({
    method: extended ? 'unbinned-extended' : 'unbinned', names: pars.names, full: minimum.full, free: pars.free, covariance,
    chi2: NaN, ndf: x.length - pars.free.length, chi2HasDistribution: false, minimiser: minimum.status,
    iterations: minimum.iterations, minimum: minimum.value, atBound: minimum.atBound,
    excluded: values.length - x.length, asymmetric,
  });
}

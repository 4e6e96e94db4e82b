import { msg } from '../errors.js';
import { circleFitAt, type CircleFit, type CircleFitColumns } from './circleFit.js';
import type { FitContext, FitMethod } from './fitMethod.js';
import { fitMethod } from './fitMethods.js';
import { GEOMETRIC_FIT_DEFAULTS } from './geometricCircle.js';
import { preparePlaneHits, type PlaneHits } from './preparePlaneHits.js';

export type { PlaneHits } from './preparePlaneHits.js';

export interface CircleFitOptions extends FitContext {
  /** A registered method name (`fitMethods()`) or a method object; default 'geometric'. */
  readonly method?: string | FitMethod;
}

export const CIRCLE_FIT_DEFAULTS = Object.freeze({ method: 'geometric', covariance: true, ...GEOMETRIC_FIT_DEFAULTS });

/**
 * Fits a circle to every track of a hit table: track k is rows [offsets[k], offsets[k+1]), with
 * the registered method `options.method`. Never throws on bad numbers: a track with fewer than 3
 * hits, non-finite coordinates or errors, or all hits on one point gets a status and NaN
 * parameters (STYLE.md §6). Plain hits are prepared first (weights, one screen of all numbers);
 * pass hits from `preparePlaneHits` to fit the same hits repeatedly without redoing that.
 * @example fitCircles(hits, index.offsets, { method: 'taubin' }).kappa
 */
export function fitCircles(hits: PlaneHits, offsets: Int32Array, options: CircleFitOptions = {}): CircleFitColumns {
  const method = fitMethod(options.method ?? CIRCLE_FIT_DEFAULTS.method);
  if (method.measures !== 'circle') throw msg.badArgument('method', method.name, 'a circle method here (it fits whole helices: call fitHelices with z)');
  return method.fitTracks(preparePlaneHits(hits), offsets, options);
}

/** Per-hit errors as the fit columns want them: a number means the same error on every hit. */
export function sigmaColumn(sigma: Float64Array | number | undefined, n: number, name = 'sigma'): Float64Array | undefined {
  if (sigma === undefined) return undefined;
  if (typeof sigma === 'number') {
    if (!(sigma > 0)) throw msg.badArgument(name, sigma, 'a positive error in metres');
    return new Float64Array(n).fill(sigma);
  }
  if (sigma.length !== n) throw msg.badArgument(`${name}.length`, sigma.length, `${n} (one error per hit)`);
  return sigma;
}

/**
 * Fits one track's hits (in travel order) with the chosen method.
 * @param x, y hit coordinates [m]
 * @param options.sigma per-hit error [m] (array or one number); omitted → estimated from the residuals
 * @example fitCircle(x, y, { method: 'geometric' }).kappa // signed curvature [1/m]
 */
export function fitCircle(x: Float64Array, y: Float64Array, options: CircleFitOptions & { sigma?: Float64Array | number; sigmaY?: Float64Array } = {}): CircleFit {
  if (x.length !== y.length) throw msg.badArgument('y.length', y.length, `${x.length} (same as x)`);
  const sigmaX = sigmaColumn(options.sigma, x.length);
  const sigmaY = options.sigmaY !== undefined ? sigmaColumn(options.sigmaY, x.length, 'sigmaY') : sigmaX;
  const fits = fitCircles({ x, y, sigmaX, sigmaY }, Int32Array.of(0, x.length), options);
  return circleFitAt(fits, 0);
}

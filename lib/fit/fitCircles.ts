import { msg } from '../errors.js';
import { allocateCircleFits, circleFitAt, STATUS_CODE, type CircleFit, type CircleFitColumns } from './circleFit.js';
import { kasaCircle, storeCircle, taubinCircle, type Circle } from './algebraicCircle.js';
import { geometricCircleInto, GEOMETRIC_FIT_DEFAULTS } from './geometricCircle.js';
import { preparePlaneHits, type PlaneHits } from './preparePlaneHits.js';

export type CircleMethod = 'kasa' | 'taubin' | 'geometric';
export const CIRCLE_METHODS: readonly CircleMethod[] = ['kasa', 'taubin', 'geometric'];

export type { PlaneHits } from './preparePlaneHits.js';

export interface CircleFitOptions {
  /** Default 'geometric'. */
  readonly method?: CircleMethod;
  /** Compute χ² and covariance for the algebraic fits (always done by the geometric fit). Default true. */
  readonly covariance?: boolean;
  readonly maxIterations?: number;
  readonly tolerance?: number;
  readonly chi2Tolerance?: number;
}

export const CIRCLE_FIT_DEFAULTS = Object.freeze({ method: 'geometric' as CircleMethod, covariance: true, ...GEOMETRIC_FIT_DEFAULTS });

const CIRCLE: Circle = { xc: 0, yc: 0, radius: 0, sense: 1 };

/**
 * Fits a circle to every track of a hit table: track k is rows [offsets[k], offsets[k+1]).
 * Never throws on bad numbers: a track with fewer than 3 hits, non-finite coordinates or
 * errors, or all hits on one point gets a status and NaN parameters (STYLE.md §6).
 * Plain hits are prepared first (weights, one screen of all numbers); pass hits from
 * `preparePlaneHits` to fit the same hits repeatedly without redoing that.
 * @example fitCircles(hits, index.offsets, { method: 'taubin' }).kappa
 */
export function fitCircles(hits: PlaneHits, offsets: Int32Array, options: CircleFitOptions = {}): CircleFitColumns {
  const method = options.method ?? CIRCLE_FIT_DEFAULTS.method;
  if (!CIRCLE_METHODS.includes(method)) throw msg.badArgument('method', method, CIRCLE_METHODS.join(' | '));
  const covariance = options.covariance ?? CIRCLE_FIT_DEFAULTS.covariance;
  const maxIterations = options.maxIterations ?? CIRCLE_FIT_DEFAULTS.maxIterations;
  const tolerance = options.tolerance ?? CIRCLE_FIT_DEFAULTS.tolerance;
  const chi2Tolerance = options.chi2Tolerance ?? CIRCLE_FIT_DEFAULTS.chi2Tolerance;
  const prepared = preparePlaneHits(hits);
  const { x, y, sigmaX: sx, sigmaY: sy, weights: w, anisotropic, allUsable: clean } = prepared;
  const count = offsets.length - 1;
  const out = allocateCircleFits(count);
  const asx = anisotropic ? sx : undefined, asy = anisotropic ? sy : undefined;
  for (let k = 0; k < count; k++) {
    const from = offsets[k], to = offsets[k + 1];
    const problem = to - from < 3 ? STATUS_CODE['too-few-hits'] : clean ? STATUS_CODE.ok : checkTrack(x, y, sx, sy, from, to);
    if (problem !== STATUS_CODE.ok) {
      markFailed(out, k, problem, to - from);
      continue;
    }
    if (method === 'geometric') {
      geometricCircleInto(x, y, w, asx, asy, from, to, out, k, maxIterations, tolerance, chi2Tolerance);
    } else {
      const ok = method === 'kasa' ? kasaCircle(x, y, w, from, to, CIRCLE) : taubinCircle(x, y, w, from, to, CIRCLE);
      if (ok) storeCircle(CIRCLE, x, y, w, asx, asy, from, to, out, k, covariance);
      else markFailed(out, k, STATUS_CODE.degenerate, to - from);
    }
  }
  return out;
}

/**
 * Screen of one track (used only when the table-wide screen found a bad number): enough hits,
 * finite coordinates, positive finite errors. (Hits all on one point are caught by the fits
 * themselves, which find no circle.)
 */
function checkTrack(x: Float64Array, y: Float64Array, sx: Float64Array | undefined, sy: Float64Array | undefined, from: number, to: number): number {
  if (to - from < 3) return STATUS_CODE['too-few-hits'];
  // v·0 is 0 for finite v and NaN for ±Infinity or NaN, so one sum screens them all.
  let acc = 0;
  for (let i = from; i < to; i++) acc += x[i] * 0 + y[i] * 0;
  if (acc !== 0) return STATUS_CODE['bad-input'];
  if (sx !== undefined) {
    let bad = false;
    for (let i = from; i < to; i++) {
      const ex = sx[i], ey = sy![i];
      bad = bad || !(ex > 0 && ey > 0 && ex < Infinity && ey < Infinity);
    }
    if (bad) return STATUS_CODE['bad-input'];
  }
  return STATUS_CODE.ok;
}

function markFailed(out: CircleFitColumns, k: number, status: number, nhits: number): void {
  out.kappa[k] = NaN;
  out.phi0[k] = NaN;
  out.d0[k] = NaN;
  out.xRef[k] = NaN;
  out.yRef[k] = NaN;
  out.chi2[k] = NaN;
  out.ndf[k] = Math.max(0, nhits - 3);
  out.status[k] = status;
  out.cov.fill(NaN, 6 * k, 6 * k + 6);
}

/** Per-hit errors as the fit columns want them: a number means the same error on every hit. */
function sigmaColumn(sigma: Float64Array | number | undefined, n: number): Float64Array | undefined {
  if (sigma === undefined) return undefined;
  if (typeof sigma === 'number') {
    if (!(sigma > 0)) throw msg.badArgument('sigma', sigma, 'a positive hit error in metres');
    return new Float64Array(n).fill(sigma);
  }
  if (sigma.length !== n) throw msg.badArgument('sigma.length', sigma.length, `${n} (one error per hit)`);
  return sigma;
}

/**
 * Fits one track's hits (in travel order) with the chosen method.
 * @param x, y hit coordinates [m]
 * @param sigma per-hit error [m] (array or one number); omitted → estimated from the residuals
 * @example fitCircle(x, y, { method: 'geometric' }).kappa // signed curvature [1/m]
 */
export function fitCircle(x: Float64Array, y: Float64Array, options: CircleFitOptions & { sigma?: Float64Array | number; sigmaY?: Float64Array } = {}): CircleFit {
  if (x.length !== y.length) throw msg.badArgument('y.length', y.length, `${x.length} (same as x)`);
  const sigmaX = sigmaColumn(options.sigma, x.length);
  const sigmaY = options.sigmaY !== undefined ? sigmaColumn(options.sigmaY, x.length) : sigmaX;
  const fits = fitCircles({ x, y, sigmaX, sigmaY }, Int32Array.of(0, x.length), options);
  return circleFitAt(fits, 0);
}

/** Kåsa algebraic fit of one track. See fitCircle. */
export const fitCircleKasa = (x: Float64Array, y: Float64Array, sigma?: Float64Array | number): CircleFit =>
  fitCircle(x, y, { method: 'kasa', sigma });
/** Taubin algebraic fit of one track. See fitCircle. */
export const fitCircleTaubin = (x: Float64Array, y: Float64Array, sigma?: Float64Array | number): CircleFit =>
  fitCircle(x, y, { method: 'taubin', sigma });
/** Geometric least-squares fit of one track. See fitCircle. */
export const fitCircleGeometric = (x: Float64Array, y: Float64Array, sigma?: Float64Array | number): CircleFit =>
  fitCircle(x, y, { method: 'geometric', sigma });

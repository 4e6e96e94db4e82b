/**
 * Results of circle fits in the bending plane.
 *
 * Track parametrisation (κ, φ0, d0) at a reference point (x_ref, y_ref), by default the track's
 * first hit (common practice: "parameters at the first measured point"):
 * - κ [1/m]: signed curvature, κ > 0 when the track turns counter-clockwise seen from +z
 *   (to its left), κ = 0 for a straight track — so a straight track has a finite parameter,
 *   not R = ∞.
 * - φ0 [rad]: direction of travel at the point of the track closest to the reference point.
 * - d0 [m]: signed distance from the reference point to the track; the point of closest
 *   approach is P0 = ref − d0·n with n = (−sin φ0, cos φ0) the left-hand normal.
 * The centre is C = ref + (1/κ − d0)·n; radius R = 1/|κ|.
 * This is the curvature form of Karimäki, NIM A305 (1991) 187, with the sign of d0 chosen so
 * that d0 ≈ −(signed residual of the reference point).
 */
/**
 * `method-error`: a method written with `defineFitMethod` threw or gave no curvature on this track.
 * `poor-fit`: converged, but the χ² probability is below 1e-3 (`POOR_FIT_PROBABILITY`; set by the
 * track table, not by circle fits). `cannot-reach` and `diverged`: the fit with material (lib/fit/matter).
 */
export type FitStatus = 'ok' | 'too-few-hits' | 'degenerate' | 'not-converged' | 'bad-input' | 'method-error' | 'poor-fit' | 'cannot-reach' | 'diverged';

export const FIT_STATUS: readonly FitStatus[] = ['ok', 'too-few-hits', 'degenerate', 'not-converged', 'bad-input', 'method-error', 'poor-fit', 'cannot-reach', 'diverged'];

export interface CircleFit {
  readonly kappa: number;
  readonly phi0: number;
  readonly d0: number;
  readonly xRef: number;
  readonly yRef: number;
  /** Centre [m] (±Infinity/NaN when κ = 0). */
  readonly xc: number;
  readonly yc: number;
  /** Radius [m] = 1/|κ|. */
  readonly radius: number;
  /**
   * Covariance of (κ, φ0, d0), row-major 3×3 [1/m², rad², m² …]. When hits carry no errors the
   * hit error is estimated from the residuals (χ²/ndf scaling; `errorsEstimated` is true).
   */
  readonly cov: Float64Array;
  readonly chi2: number;
  readonly ndf: number;
  readonly iterations: number;
  readonly converged: boolean;
  readonly status: FitStatus;
  readonly errorsEstimated: boolean;
}

/** Many circle fits at once, struct-of-arrays (what the batch fitters write into). */
export interface CircleFitColumns {
  readonly count: number;
  readonly kappa: Float64Array;
  readonly phi0: Float64Array;
  readonly d0: Float64Array;
  readonly xRef: Float64Array;
  readonly yRef: Float64Array;
  /** 6 numbers per fit: κκ, κφ, κd, φφ, φd, dd. */
  readonly cov: Float64Array;
  readonly chi2: Float64Array;
  readonly ndf: Int32Array;
  readonly iterations: Int32Array;
  /** Index into FIT_STATUS. */
  readonly status: Uint8Array;
  /** 1 where the hit errors were estimated from the residuals. */
  readonly errorsEstimated: Uint8Array;
}

export function allocateCircleFits(count: number): CircleFitColumns {
  return {
    count,
    kappa: new Float64Array(count),
    phi0: new Float64Array(count),
    d0: new Float64Array(count),
    xRef: new Float64Array(count),
    yRef: new Float64Array(count),
    // NaN until a fit writes them: a lean algebraic fit leaves them so.
    cov: new Float64Array(6 * count).fill(NaN),
    chi2: new Float64Array(count).fill(NaN),
    ndf: new Int32Array(count),
    iterations: new Int32Array(count),
    status: new Uint8Array(count),
    errorsEstimated: new Uint8Array(count),
  };
}

export const STATUS_CODE: Readonly<Record<FitStatus, number>> = Object.freeze({
  ok: 0, 'too-few-hits': 1, degenerate: 2, 'not-converged': 3, 'bad-input': 4, 'method-error': 5, 'poor-fit': 6, 'cannot-reach': 7, 'diverged': 8,
});

/** Reads fit k out of the columns as a CircleFit object. */
export function circleFitAt(fits: CircleFitColumns, k: number): CircleFit {
  const kappa = fits.kappa[k], phi0 = fits.phi0[k], d0 = fits.d0[k];
  const xRef = fits.xRef[k], yRef = fits.yRef[k];
  const arm = 1 / kappa - d0;
  const c = fits.cov.subarray(6 * k, 6 * k + 6);
  const cov = Float64Array.of(c[0], c[1], c[2], c[1], c[3], c[4], c[2], c[4], c[5]);
  const status = FIT_STATUS[fits.status[k]];
  return Object.freeze({
    kappa, phi0, d0, xRef, yRef,
    xc: xRef - arm * Math.sin(phi0),
    yc: yRef + arm * Math.cos(phi0),
    radius: 1 / Math.abs(kappa),
    cov,
    chi2: fits.chi2[k],
    ndf: fits.ndf[k],
    iterations: fits.iterations[k],
    converged: status === 'ok',
    status,
    errorsEstimated: fits.errorsEstimated[k] === 1,
  });
}

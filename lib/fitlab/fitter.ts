import { fitCircleGeometric, fitCircleKasa, fitCircleTaubin } from '../fit/fitCircles.js';
import { fitHelix } from '../fit/fitHelices.js';
import type { CircleFit } from '../fit/circleFit.js';

/**
 * What a fit method gives back to the lab. Only `kappa` is required, so a method written in a
 * notebook cell can be compared as soon as it returns a curvature; the pull and χ² columns of
 * the comparison fill in when it also returns `sigmaKappa` and `chi2`/`ndf`.
 * Sign convention of lib/fit: κ > 0 when the track turns counter-clockwise seen from +z.
 */
export interface FitterOutcome {
  /** Signed curvature κ [1/m]. */
  readonly kappa: number;
  /** Its standard error [1/m] from the method's covariance, if it gives one. */
  readonly sigmaKappa?: number;
  readonly chi2?: number;
  readonly ndf?: number;
  /** False when the method reports a failure (not converged, degenerate, …); default true. */
  readonly ok?: boolean;
  /** Dip tan λ = dz/ds, for methods that also fit the coordinate along the field. */
  readonly tanLambda?: number;
  readonly sigmaTanLambda?: number;
}

/**
 * A track-fit method under test: hits of one track in travel order — bending-plane x, y [m] with
 * per-hit errors `sigma` [m], and the coordinate along the field z [m] with errors `sigmaZ` for
 * methods that use it — → curvature. Must not keep references to the arrays (they are views).
 * @example const mine: Fitter = { name: 'three-point', fit: (x, y) => ({ kappa: threePointKappa(x, y) }) };
 */
export interface Fitter {
  readonly name: string;
  fit(x: Float64Array, y: Float64Array, sigma: Float64Array, z: Float64Array, sigmaZ: Float64Array): FitterOutcome;
}

/** Reads a lib/fit circle result as a lab outcome (σ(κ) = √cov[κκ]). */
export function outcomeOfCircleFit(f: CircleFit): FitterOutcome {
  return { kappa: f.kappa, sigmaKappa: Math.sqrt(f.cov[0]), chi2: f.chi2, ndf: f.ndf, ok: f.converged };
}

/** Kåsa algebraic circle fit of lib/fit (Kåsa, IEEE Trans. Instrum. Meas. 25 (1976) 8). */
export const KASA_FITTER: Fitter = Object.freeze({ name: 'kasa', fit: (x: Float64Array, y: Float64Array, s: Float64Array) => outcomeOfCircleFit(fitCircleKasa(x, y, s)) });
/** Taubin algebraic circle fit of lib/fit (Taubin, IEEE PAMI 13 (1991) 1115). */
export const TAUBIN_FITTER: Fitter = Object.freeze({ name: 'taubin', fit: (x: Float64Array, y: Float64Array, s: Float64Array) => outcomeOfCircleFit(fitCircleTaubin(x, y, s)) });
/** Geometric least-squares circle fit of lib/fit (Karimäki parametrisation, Gauss–Newton/LM). */
export const GEOMETRIC_FITTER: Fitter = Object.freeze({ name: 'geometric', fit: (x: Float64Array, y: Float64Array, s: Float64Array) => outcomeOfCircleFit(fitCircleGeometric(x, y, s)) });

/** Helix fit of lib/fit: geometric circle fit plus the straight line z(s); reports κ and tan λ. */
export const HELIX_FITTER: Fitter = Object.freeze({
  name: 'helix',
  fit: (x: Float64Array, y: Float64Array, s: Float64Array, z: Float64Array, sz: Float64Array): FitterOutcome => {
    const h = fitHelix(x, y, z, { sigma: s, sigmaZ: sz });
    return { ...outcomeOfCircleFit(h.circle), ok: h.status === 'ok', tanLambda: h.tanLambda, sigmaTanLambda: Math.sqrt(h.cov[24]) };
  },
});

/** The built-in fits, in the order the lab reports them. */
export const BUILTIN_FITTERS: readonly Fitter[] = Object.freeze([KASA_FITTER, TAUBIN_FITTER, GEOMETRIC_FITTER, HELIX_FITTER]);

import { STATUS_CODE, type CircleFitColumns } from './circleFit.js';
import { taubinCircle, finishCovariance, type Circle } from './algebraicCircle.js';
import { extent, invertSym3, normalEquations, paramsFromCentre, paramsFromLine, type TrackParams } from './curvatureResidual.js';

/** Options of the geometric fit. */
export interface GeometricFitOptions {
  /** Iteration limit. */
  readonly maxIterations?: number;
  /** Stop when a step moves the track by less than this fraction of its length… */
  readonly tolerance?: number;
  /** …or when an undamped step would lower χ² by less than this, in units of max(1, χ²/ndf): a
   *  Δχ² of 1 is one standard error, so 1e-9 stops far below anything statistically visible while
   *  still reproducing published optima to their last digit. */
  readonly chi2Tolerance?: number;
}

export const GEOMETRIC_FIT_DEFAULTS = Object.freeze({ maxIterations: 100, tolerance: 1e-12, chi2Tolerance: 1e-9 });

const A = new Float64Array(6);
const G = new Float64Array(3);
const Aprev = new Float64Array(6);
const Gprev = new Float64Array(3);
const INV = new Float64Array(6);
const DAMPED = new Float64Array(6);
const P: TrackParams = { kappa: 0, phi: 0, d: 0 };
const PREV: TrackParams = { kappa: 0, phi: 0, d: 0 };
const START: Circle = { xc: 0, yc: 0, radius: 0, sense: 1 };

/**
 * Geometric (orthogonal-distance) least-squares circle fit in the (κ, φ, d) parametrisation,
 * minimising χ² = Σ r_i²/σ_i² over the signed distances r_i of the hits to the circle.
 * Started from the Taubin fit (or a straight line when the hits are collinear) and iterated by
 * Gauss–Newton with Levenberg–Marquardt damping when a step raises χ² (Marquardt, J. SIAM 11
 * (1963) 431). The covariance is (JᵀWJ)⁻¹ at the minimum, the standard large-sample estimate;
 * unknown hit errors are estimated from the residuals.
 * Works for straight tracks (κ → 0) and for spirals of several turns.
 */
export function geometricCircleInto(
  x: Float64Array, y: Float64Array, w: Float64Array | undefined, sx: Float64Array | undefined, sy: Float64Array | undefined,
  from: number, to: number, out: CircleFitColumns, k: number,
  maxIterations: number = GEOMETRIC_FIT_DEFAULTS.maxIterations, tolerance: number = GEOMETRIC_FIT_DEFAULTS.tolerance,
  chi2Tolerance: number = GEOMETRIC_FIT_DEFAULTS.chi2Tolerance,
): void {
  const xr = x[from], yr = y[from];
  const errorsUnknown = w === undefined && sx === undefined;
  const scale = extent(x, y, from, to, xr, yr);
  if (!(scale > 0)) {
    // Every hit on one point: no circle to fit.
    out.status[k] = STATUS_CODE.degenerate;
    out.kappa[k] = out.phi0[k] = out.d0[k] = out.chi2[k] = NaN;
    out.xRef[k] = xr;
    out.yRef[k] = yr;
    out.ndf[k] = to - from - 3;
    out.cov.fill(NaN, 6 * k, 6 * k + 6);
    return;
  }
  if (taubinCircle(x, y, w, from, to, START) && START.radius < 1e6 * scale) {
    paramsFromCentre(START.xc, START.yc, START.radius, START.sense, xr, yr, P);
  } else {
    paramsFromLine(x, y, from, to, P);
  }
  let chi2 = normalEquations(x, y, w, sx, sy, from, to, xr, yr, P, A, G);
  let lambda = 0;
  let iterations = 0;
  let converged = false;
  for (; iterations < maxIterations; iterations++) {
    // Solve (A + λ·diag A) δ = −g.
    DAMPED.set(A);
    if (lambda > 0) {
      DAMPED[0] *= 1 + lambda;
      DAMPED[3] *= 1 + lambda;
      DAMPED[5] *= 1 + lambda;
    }
    if (!invertSym3(DAMPED, INV)) break;
    const dk = -(INV[0] * G[0] + INV[1] * G[1] + INV[2] * G[2]);
    const dp = -(INV[1] * G[0] + INV[3] * G[1] + INV[4] * G[2]);
    const dd = -(INV[2] * G[0] + INV[4] * G[1] + INV[5] * G[2]);
    // Expected χ² decrease of this step (δᵀAδ for an undamped step); in units of the hit
    // variance when the errors are unknown.
    // Measured in units of the scatter actually seen (χ²/ndf when that exceeds 1): a track the
    // circle does not describe well — a spiral that tightens as it loses energy — must still stop.
    const perDof = chi2 / Math.max(1, to - from - 3);
    const gain = -(dk * G[0] + dp * G[1] + dd * G[2]) / (errorsUnknown ? Math.max(perDof, 1e-300) : Math.max(perDof, 1));
    PREV.kappa = P.kappa; PREV.phi = P.phi; PREV.d = P.d;
    Aprev.set(A);
    Gprev.set(G);
    P.kappa += dk;
    P.phi += dp;
    P.d += dd;
    if (lambda === 0 && gain < chi2Tolerance) {
      // Converged: the full Gauss–Newton step changes χ² by less than the tolerance. Take it and
      // evaluate the normal matrix there for the covariance.
      chi2 = normalEquations(x, y, w, sx, sy, from, to, xr, yr, P, A, G);
      converged = true;
      iterations++;
      break;
    }
    const trial = normalEquations(x, y, w, sx, sy, from, to, xr, yr, P, A, G);
    const movement = Math.abs(dk) * scale * scale * 0.5 + Math.abs(dp) * scale + Math.abs(dd);
    if (trial <= chi2 || !(chi2 > 0)) {
      chi2 = trial;
      lambda = lambda > 0 ? lambda * 0.1 : 0;
      if (lambda < 1e-6) lambda = 0;
      if (movement <= tolerance * scale) {
        converged = true;
        iterations++;
        break;
      }
    } else {
      // Step raised χ²: undo it and damp harder.
      P.kappa = PREV.kappa; P.phi = PREV.phi; P.d = PREV.d;
      A.set(Aprev);
      G.set(Gprev);
      lambda = lambda > 0 ? lambda * 10 : 1e-3;
      // Rounding floor: χ² cannot be lowered at working precision.
      if (movement <= tolerance * scale || lambda > 1e12 || trial - chi2 <= 1e-13 * chi2) {
        converged = movement <= tolerance * scale * 1e3 || trial - chi2 <= 1e-13 * chi2;
        iterations++;
        break;
      }
    }
  }
  out.kappa[k] = P.kappa;
  out.phi0[k] = Math.atan2(Math.sin(P.phi), Math.cos(P.phi));
  out.d0[k] = P.d;
  out.xRef[k] = xr;
  out.yRef[k] = yr;
  out.chi2[k] = chi2;
  out.ndf[k] = to - from - 3;
  out.iterations[k] = iterations;
  out.status[k] = converged && Number.isFinite(chi2) ? STATUS_CODE.ok : STATUS_CODE['not-converged'];
  finishCovariance(out, k, errorsUnknown, A);
}

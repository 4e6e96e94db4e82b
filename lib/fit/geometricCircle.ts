import { STATUS_CODE, type CircleFitColumns } from './circleFit.js';
import { newCircle, type Circle } from './algebraicCircle.js';
import { fitCircleBatch } from './circleBatch.js';
import { finishCovariance } from './circleCovariance.js';
import { newCircleMoments, type CircleMoments } from './circleMoments.js';
import { extent, invertSym3, normalEquations, paramsFromCentre, paramsFromLine, type TrackParams } from './curvatureResidual.js';
import type { CircleFitMethod } from './fitMethod.js';
import { taubinCircle } from './taubinCircle.js';
import type { TrackSpan } from './trackSpan.js';

/** Settings of the geometric fit. */
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

/** Working storage of one geometric fit (allocate once per batch with `newGeometricScratch`). */
export interface GeometricScratch {
  readonly A: Float64Array; readonly G: Float64Array;
  readonly Aprev: Float64Array; readonly Gprev: Float64Array;
  readonly inverse: Float64Array; readonly damped: Float64Array;
  readonly p: TrackParams; readonly prev: TrackParams;
  readonly start: Circle; readonly moments: CircleMoments;
}

export function newGeometricScratch(): GeometricScratch {
  return {
    A: new Float64Array(6), G: new Float64Array(3), Aprev: new Float64Array(6), Gprev: new Float64Array(3),
    inverse: new Float64Array(6), damped: new Float64Array(6),
    p: { kappa: 0, phi: 0, d: 0 }, prev: { kappa: 0, phi: 0, d: 0 }, start: newCircle(), moments: newCircleMoments(),
  };
}

/**
 * Geometric (orthogonal-distance) least-squares circle fit in the (κ, φ, d) parametrisation,
 * minimising χ² = Σ r_i²/σ_i² over the signed distances r_i of the hits to the circle.
 * Started from the Taubin fit (or a straight line when the hits are collinear) and iterated by
 * Gauss–Newton with Levenberg–Marquardt damping when a step raises χ² (Marquardt, J. SIAM 11
 * (1963) 431). The covariance is (JᵀWJ)⁻¹ at the minimum, the standard large-sample estimate;
 * unknown hit errors are estimated from the residuals.
 * Works for straight tracks (κ → 0) and for spirals of several turns.
 */
export function geometricCircle(
  span: TrackSpan, out: CircleFitColumns, k: number, scratch: GeometricScratch, settings: Required<GeometricFitOptions>,
): void {
  const { x, y } = span.hits;
  const { from, to } = span;
  const { maxIterations, tolerance, chi2Tolerance } = settings;
  const { A, G, Aprev, Gprev, inverse: INV, damped: DAMPED, p: P, prev: PREV, start: START } = scratch;
  const xr = x[from], yr = y[from];
  const errorsUnknown = !span.hits.errorsKnown;
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
  if (taubinCircle(span, START, scratch.moments) && START.radius < 1e6 * scale) {
    paramsFromCentre(START.xc, START.yc, START.radius, START.sense, xr, yr, P);
  } else {
    paramsFromLine(x, y, from, to, P);
  }
  let chi2 = normalEquations(span, xr, yr, P, A, G);
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
      chi2 = normalEquations(span, xr, yr, P, A, G);
      converged = true;
      iterations++;
      break;
    }
    const trial = normalEquations(span, xr, yr, P, A, G);
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

/** The geometric fit as a registry method. */
export const GEOMETRIC_METHOD: CircleFitMethod = Object.freeze<CircleFitMethod>({
  name: 'geometric',
  summary: 'orthogonal-distance least squares in (κ, φ0, d0), iterated from Taubin (Karimäki 1991; Marquardt damping)',
  measures: 'circle' as const,
  fitTracks(hits, offsets, context) {
    const scratch = newGeometricScratch();
    const settings = {
      maxIterations: context.maxIterations ?? GEOMETRIC_FIT_DEFAULTS.maxIterations,
      tolerance: context.tolerance ?? GEOMETRIC_FIT_DEFAULTS.tolerance,
      chi2Tolerance: context.chi2Tolerance ?? GEOMETRIC_FIT_DEFAULTS.chi2Tolerance,
    };
    return fitCircleBatch(hits, offsets, (span, out, k) => geometricCircle(span, out, k, scratch, settings));
  },
});

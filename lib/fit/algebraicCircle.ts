import { STATUS_CODE, type CircleFitColumns } from './circleFit.js';
import { finishCovariance } from './circleCovariance.js';
import { normalEquations, paramsFromCentre, type NormalScratch } from './curvatureResidual.js';
import type { TrackSpan } from './trackSpan.js';

/**
 * A circle from an algebraic fit (Kåsa, Taubin), in the coordinates of the hits. Both fits work
 * on weighted moments of one track and give a centre and radius without iteration; weights are
 * per hit, w = 2/(σx² + σy²), prepared once per table (`preparePlaneHits`).
 */
export interface Circle {
  xc: number;
  yc: number;
  radius: number;
  /** Turning sense of the hits in order: +1 counter-clockwise, −1 clockwise (seen from +z). */
  sense: number;
}

export function newCircle(): Circle {
  return { xc: 0, yc: 0, radius: 0, sense: 1 };
}

/**
 * Writes an algebraic circle into fit slot k: (κ, φ, d) at the first hit, turning sense from
 * the hit order, and — when `covariance` is set — χ² of the geometric residuals and the
 * covariance (JᵀWJ)⁻¹ evaluated at the algebraic solution (the usual first-order estimate: an
 * algebraic fit on small errors is a geometric fit to first order). Without `covariance`, χ²
 * and the covariance stay NaN (the lean mode the speed benchmark measures separately).
 */
export function storeCircle(circle: Circle, span: TrackSpan, out: CircleFitColumns, k: number, covariance: boolean, scratch: NormalScratch): void {
  const { hits, from, to } = span;
  const xr = hits.x[from], yr = hits.y[from];
  const p = scratch.params;
  paramsFromCentre(circle.xc, circle.yc, circle.radius, circle.sense, xr, yr, p);
  out.kappa[k] = p.kappa;
  out.phi0[k] = p.phi;
  out.d0[k] = p.d;
  out.xRef[k] = xr;
  out.yRef[k] = yr;
  out.ndf[k] = to - from - 3;
  out.iterations[k] = 0;
  out.status[k] = STATUS_CODE.ok;
  if (!covariance) return;
  out.chi2[k] = normalEquations(span, xr, yr, p, scratch.normal, scratch.gradient);
  finishCovariance(out, k, !hits.errorsKnown, scratch.normal);
}

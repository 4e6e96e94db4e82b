import { newCircle, storeCircle, type Circle } from './algebraicCircle.js';
import { fitCircleBatch, markFailed } from './circleBatch.js';
import { STATUS_CODE } from './circleFit.js';
import { centredMoments, newCircleMoments, turningSenseAbout, type CircleMoments } from './circleMoments.js';
import { newNormalScratch } from './curvatureResidual.js';
import type { CircleFitMethod } from './fitMethod.js';
import type { TrackSpan } from './trackSpan.js';

/**
 * Taubin fit (Taubin, IEEE TPAMI 13 (1991) 1115), solved by Newton's method on its
 * characteristic polynomial as in Chernov & Lesort, J. Math. Imaging Vision 23 (2005) 239 and
 * Chernov, "Circular and Linear Regression" (CRC 2010), §5.10. Essentially unbiased in the
 * radius to first order, where Kåsa is biased on short arcs. `moments` is scratch.
 * Returns false when no finite circle fits (collinear or coincident hits).
 */
export function taubinCircle(span: TrackSpan, out: Circle, moments: CircleMoments): boolean {
  const m = centredMoments(span, moments);
  const mz = m.mz;
  const covXY = m.xx * m.yy - m.xy * m.xy;
  const varZ = m.zz - mz * mz;
  const a3 = 4 * mz;
  const a2 = -3 * mz * mz - m.zz;
  const a1 = varZ * mz + 4 * covXY * mz - m.xz * m.xz - m.yz * m.yz;
  const a0 = m.xz * (m.xz * m.yy - m.yz * m.xy) + m.yz * (m.yz * m.xx - m.xz * m.xy) - varZ * covXY;
  const a22 = a2 + a2, a33 = a3 + a3 + a3;
  let xn = 0, yn = a0;
  for (let iter = 0; iter < 99; iter++) {
    const dy = a1 + xn * (a22 + a33 * xn);
    const xnew = xn - yn / dy;
    if (xnew === xn || !Number.isFinite(xnew)) break;
    const ynew = a0 + xnew * (a1 + xnew * (a2 + xnew * a3));
    if (Math.abs(ynew) >= Math.abs(yn)) break;
    xn = xnew;
    yn = ynew;
  }
  const det = xn * xn - xn * mz + covXY;
  if (!(Math.abs(det) > 1e-30 * (mz * mz)) || !Number.isFinite(det)) return false;
  const a = (m.xz * (m.yy - xn) - m.yz * m.xy) / det / 2;
  const b = (m.yz * (m.xx - xn) - m.xz * m.xy) / det / 2;
  out.xc = a + m.mx;
  out.yc = b + m.my;
  out.radius = Math.sqrt(a * a + b * b + mz);
  out.sense = turningSenseAbout(m, out.xc, out.yc);
  return Number.isFinite(out.radius) && Number.isFinite(out.xc) && Number.isFinite(out.yc);
}

/** The Taubin fit as a registry method (covariance at the algebraic solution unless `covariance: false`). */
export const TAUBIN_METHOD: CircleFitMethod = Object.freeze<CircleFitMethod>({
  name: 'taubin',
  summary: 'algebraic, one pass (Taubin 1991, Chernov\'s Newton form); nearly unbiased radius',
  measures: 'circle' as const,
  fitTracks(hits, offsets, context) {
    const circle = newCircle(), moments = newCircleMoments(), scratch = newNormalScratch(), covariance = context.covariance ?? true;
    return fitCircleBatch(hits, offsets, (span, out, k) => {
      if (taubinCircle(span, circle, moments)) storeCircle(circle, span, out, k, covariance, scratch);
      else markFailed(out, k, STATUS_CODE.degenerate, span.to - span.from);
    });
  },
});

import type { CircleFitColumns } from './circleFit.js';
import { invertSym3 } from './curvatureResidual.js';

/**
 * Inverts the normal matrix JᵀWJ (upper triangle, 6 numbers) into the covariance of slot k;
 * scales it by χ²/ndf when the hit errors are unknown (estimated from the residuals, the usual
 * large-sample estimate) and says so in `errorsEstimated`.
 */
export function finishCovariance(out: CircleFitColumns, k: number, estimateErrors: boolean, normal: Float64Array): void {
  const c = 6 * k;
  if (!invertSym3(normal, out.cov, c)) {
    out.cov.fill(NaN, c, c + 6);
    return;
  }
  out.errorsEstimated[k] = estimateErrors ? 1 : 0;
  if (estimateErrors) {
    const ndf = out.ndf[k];
    const s2 = ndf > 0 ? out.chi2[k] / ndf : NaN;
    for (let j = c; j < c + 6; j++) out.cov[j] *= s2;
  }
}

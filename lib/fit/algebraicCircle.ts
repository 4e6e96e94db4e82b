import { STATUS_CODE, type CircleFitColumns } from './circleFit';
import { invertSym3, normalEquations, paramsFromCentre, turningSense, type TrackParams } from './curvatureResidual';

/**
 * The two algebraic circle fits (internal kernels; public wrappers in kasa.ts / taubin.ts).
 * Both work on weighted, centred moments of one track's hits [from, to) and give a centre and
 * radius in one pass, no iteration.
 */

/** A circle from an algebraic fit, in the coordinates of the hits. */
export interface Circle {
  xc: number;
  yc: number;
  radius: number;
}

/** Weighted centred moments of one track. */
interface Moments {
  n: number;
  mx: number; my: number;
  xx: number; yy: number; xy: number;
  xz: number; yz: number; zz: number;
  /** Mean of z = x'² + y'² (centred). */
  mz: number;
}

const M: Moments = { n: 0, mx: 0, my: 0, xx: 0, yy: 0, xy: 0, xz: 0, yz: 0, zz: 0, mz: 0 };

/**
 * Weighted centred moments, two passes (mean, then moments about it) for accuracy when the
 * track sits far from the origin. Weight w = 2/(σx² + σy²), or 1 without errors.
 */
function moments(x: Float64Array, y: Float64Array, sx: Float64Array | undefined, sy: Float64Array | undefined, from: number, to: number): Moments {
  let sw = 0, sxw = 0, syw = 0;
  if (sx === undefined) {
    for (let i = from; i < to; i++) { sxw += x[i]; syw += y[i]; }
    sw = to - from;
  } else {
    for (let i = from; i < to; i++) {
      const ex = sx[i], ey = sy![i];
      const w = 2 / (ex * ex + ey * ey);
      sw += w; sxw += w * x[i]; syw += w * y[i];
    }
  }
  const mx = sxw / sw, my = syw / sw;
  let xx = 0, yy = 0, xy = 0, xz = 0, yz = 0, zz = 0;
  for (let i = from; i < to; i++) {
    let w = 1;
    if (sx !== undefined) {
      const ex = sx[i], ey = sy![i];
      w = 2 / (ex * ex + ey * ey);
    }
    const u = x[i] - mx, v = y[i] - my;
    const z = u * u + v * v;
    const wu = w * u, wv = w * v, wz = w * z;
    xx += wu * u; yy += wv * v; xy += wu * v;
    xz += wu * z; yz += wv * z; zz += wz * z;
  }
  const iw = 1 / sw;
  M.n = to - from; M.mx = mx; M.my = my;
  M.xx = xx * iw; M.yy = yy * iw; M.xy = xy * iw;
  M.xz = xz * iw; M.yz = yz * iw; M.zz = zz * iw;
  M.mz = M.xx + M.yy;
  return M;
}

/**
 * Kåsa fit: minimises Σ w (x² + y² + Dx + Ey + F)² (Kåsa, IEEE Trans. Instrum. Meas. IM-25
 * (1976) 8). Fast and exact on exact points, but biased towards small radii on short, noisy
 * arcs (Chernov, "Circular and Linear Regression", CRC 2010, ch. 5).
 * In centred coordinates the F equation decouples: F = −mean(z), and (D, E) solve a 2×2 system.
 */
export function kasaCircle(x: Float64Array, y: Float64Array, sx: Float64Array | undefined, sy: Float64Array | undefined, from: number, to: number, out: Circle): boolean {
  const m = moments(x, y, sx, sy, from, to);
  const det = m.xx * m.yy - m.xy * m.xy;
  if (!(det > 1e-30 * (m.xx + m.yy) ** 2)) return false;
  // [xx xy; xy yy][D; E] = −[xz; yz]; centre = (−D/2, −E/2).
  const D = -(m.xz * m.yy - m.yz * m.xy) / det;
  const E = -(m.yz * m.xx - m.xz * m.xy) / det;
  const a = -D / 2, b = -E / 2;
  out.xc = a + m.mx;
  out.yc = b + m.my;
  out.radius = Math.sqrt(a * a + b * b + m.mz);
  return Number.isFinite(out.radius);
}

/**
 * Taubin fit (Taubin, IEEE TPAMI 13 (1991) 1115), solved by Newton's method on its
 * characteristic polynomial as in Chernov & Lesort, J. Math. Imaging Vision 23 (2005) 239 and
 * Chernov, "Circular and Linear Regression" (CRC 2010), §5.10. Essentially unbiased in the
 * radius to first order, where Kåsa is biased on short arcs.
 */
export function taubinCircle(x: Float64Array, y: Float64Array, sx: Float64Array | undefined, sy: Float64Array | undefined, from: number, to: number, out: Circle): boolean {
  const m = moments(x, y, sx, sy, from, to);
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
  return Number.isFinite(out.radius) && Number.isFinite(out.xc) && Number.isFinite(out.yc);
}

const A = new Float64Array(6);
const G = new Float64Array(3);
const P: TrackParams = { kappa: 0, phi: 0, d: 0 };

/**
 * Writes an algebraic circle into fit slot k: (κ, φ, d) at the first hit, turning sense from
 * the hit order, and — when `covariance` is set — χ² of the geometric residuals and the
 * covariance (JᵀWJ)⁻¹ evaluated at the algebraic solution (the usual first-order estimate: an
 * algebraic fit on small errors is a geometric fit to first order). Without `covariance`, χ²
 * and the covariance are NaN (the lean mode the speed benchmark measures separately).
 */
export function storeCircle(
  circle: Circle, x: Float64Array, y: Float64Array, sx: Float64Array | undefined, sy: Float64Array | undefined,
  from: number, to: number, out: CircleFitColumns, k: number, covariance: boolean,
): void {
  const xr = x[from], yr = y[from];
  const sense = turningSense(x, y, from, to, circle.xc, circle.yc);
  paramsFromCentre(circle.xc, circle.yc, circle.radius, sense, xr, yr, P);
  out.kappa[k] = P.kappa;
  out.phi0[k] = P.phi;
  out.d0[k] = P.d;
  out.xRef[k] = xr;
  out.yRef[k] = yr;
  out.ndf[k] = to - from - 3;
  out.iterations[k] = 0;
  out.status[k] = STATUS_CODE.ok;
  const c = 6 * k;
  if (!covariance) {
    out.chi2[k] = NaN;
    const cov = out.cov;
    cov[c] = NaN; cov[c + 1] = NaN; cov[c + 2] = NaN; cov[c + 3] = NaN; cov[c + 4] = NaN; cov[c + 5] = NaN;
    return;
  }
  out.chi2[k] = normalEquations(x, y, sx, sy, from, to, xr, yr, P, A, G);
  finishCovariance(out, k, sx === undefined);
}

/**
 * Inverts the normal matrix in module scratch `A` into slot k; scales by χ²/ndf when the hit
 * errors are unknown (estimated from the residuals).
 */
export function finishCovariance(out: CircleFitColumns, k: number, estimateErrors: boolean, normal: Float64Array = A): void {
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

import { STATUS_CODE, type CircleFitColumns } from './circleFit.js';
import { invertSym3, normalEquations, paramsFromCentre, type TrackParams } from './curvatureResidual.js';

/**
 * The two algebraic circle fits (internal kernels; the public entry is fitCircles.ts).
 * Both work on weighted, centred moments of one track's hits [from, to) and give a centre and
 * radius without iteration. Weights are per hit, w = 2/(σx² + σy²), computed once per table by
 * the caller (undefined: unit weights).
 */

/** A circle from an algebraic fit, in the coordinates of the hits. */
export interface Circle {
  xc: number;
  yc: number;
  radius: number;
  /** Turning sense of the hits in order: +1 counter-clockwise, −1 clockwise (seen from +z). */
  sense: number;
}

/** Weighted centred moments of one track. */
interface Moments {
  n: number;
  mx: number; my: number;
  xx: number; yy: number; xy: number;
  xz: number; yz: number; zz: number;
  /** Mean of z = x'² + y'² (centred). */
  mz: number;
  /** Σ p_i × p_{i+1} over consecutive hits, about the origin (ox, oy) = the first hit. */
  swept: number;
  ox: number; oy: number;
  /** Last minus first hit. */
  dx: number; dy: number;
}

const M: Moments = { n: 0, mx: 0, my: 0, xx: 0, yy: 0, xy: 0, xz: 0, yz: 0, zz: 0, mz: 0, swept: 0, ox: 0, oy: 0, dx: 0, dy: 0 };

let ONES = new Float64Array(0);
/** A shared array of at least n ones (unit weights), grown on demand. */
function ones(n: number): Float64Array {
  if (ONES.length < n) ONES = new Float64Array(Math.max(n, 2 * ONES.length, 1024)).fill(1);
  return ONES;
}

/**
 * Weighted centred moments in one pass. The sums are taken on coordinates relative to the first
 * hit, so they are of the order of the track's size wherever it sits, and turned into moments
 * about the weighted mean afterwards (z' = (u−ū)² + (v−v̄)², expanded in raw sums up to fourth
 * order). The same pass sums the cross products of consecutive hits, from which `senseAbout`
 * gets the turning sense.
 */
function moments(x: Float64Array, y: Float64Array, w: Float64Array | undefined, from: number, to: number): Moments {
  const x0 = x[from], y0 = y[from];
  const ww = w ?? ones(to);
  let sw = 0, su = 0, sv = 0, suu = 0, svv = 0, suv = 0, suz = 0, svz = 0, sz = 0, szz = 0, swept = 0;
  let pu = 0, pv = 0;
  for (let i = from; i < to; i++) {
    const wi = ww[i];
    const u = x[i] - x0, v = y[i] - y0;
    const z = u * u + v * v;
    const wu = wi * u, wv = wi * v, wz = wi * z;
    sw += wi; su += wu; sv += wv;
    suu += wu * u; svv += wv * v; suv += wu * v;
    suz += wu * z; svz += wv * z; sz += wz; szz += wz * z;
    swept += pu * v - pv * u;
    pu = u; pv = v;
  }
  const iw = 1 / sw;
  const mu = su * iw, mv = sv * iw;
  const Euu = suu * iw, Evv = svv * iw, Euv = suv * iw, Euz = suz * iw, Evz = svz * iw, Ez = sz * iw, Ezz = szz * iw;
  const c = mu * mu + mv * mv;
  M.n = to - from;
  M.mx = x0 + mu; M.my = y0 + mv;
  M.xx = Euu - mu * mu; M.yy = Evv - mv * mv; M.xy = Euv - mu * mv;
  M.mz = M.xx + M.yy;
  // E[(u−ū) z'] with z' = z − 2ūu − 2v̄v + c.
  M.xz = Euz - 2 * mu * Euu - 2 * mv * Euv + c * mu - mu * M.mz;
  M.yz = Evz - 2 * mu * Euv - 2 * mv * Evv + c * mv - mv * M.mz;
  M.zz = Ezz + 4 * mu * mu * Euu + 4 * mv * mv * Evv + 8 * mu * mv * Euv - 4 * mu * Euz - 4 * mv * Evz + 2 * c * Ez - 3 * c * c;
  M.swept = swept;
  M.ox = x0; M.oy = y0;
  M.dx = pu; M.dy = pv;
  return M;
}

/**
 * Turning sense (+1 counter-clockwise, −1 clockwise) of the hits of the last `moments` call
 * about the centre (xc, yc): Σ (p_i − c) × (p_{i+1} − c) = Σ p_i × p_{i+1} + (p_last − p_first) × c,
 * twice the signed area swept (here with the first hit as origin, so p_first = 0) — right for
 * arcs and for spirals of several turns.
 */
function senseAbout(xc: number, yc: number): number {
  const cu = xc - M.ox, cv = yc - M.oy;
  return M.swept + (M.dx * cv - M.dy * cu) >= 0 ? 1 : -1;
}

/**
 * Kåsa fit: minimises Σ w (x² + y² + Dx + Ey + F)² (Kåsa, IEEE Trans. Instrum. Meas. IM-25
 * (1976) 8). Fast and exact on exact points, but biased towards small radii on short, noisy
 * arcs (Chernov, "Circular and Linear Regression", CRC 2010, ch. 5).
 * The fit is translation-covariant, so it runs in one pass on coordinates relative to the first
 * hit (which keeps the sums of the order of the track's size); eliminating F leaves a 2×2
 * system in the centred sums.
 */
export function kasaCircle(x: Float64Array, y: Float64Array, w: Float64Array | undefined, from: number, to: number, out: Circle): boolean {
  const x0 = x[from], y0 = y[from];
  let sw = 0, su = 0, sv = 0, suu = 0, svv = 0, suv = 0, suz = 0, svz = 0, sz = 0, swept = 0;
  let pu = 0, pv = 0;
  // Unit weights read from a shared array of ones, so one loop body serves both cases.
  const ww = w ?? ones(to);
  for (let i = from; i < to; i++) {
    const wi = ww[i];
    const u = x[i] - x0, v = y[i] - y0;
    const z = u * u + v * v;
    const wu = wi * u, wv = wi * v;
    sw += wi; su += wu; sv += wv;
    suu += wu * u; svv += wv * v; suv += wu * v;
    suz += wu * z; svz += wv * z; sz += wi * z;
    swept += pu * v - pv * u;
    pu = u; pv = v;
  }
  const mu = su / sw, mv = sv / sw, mz = sz / sw;
  const xx = suu / sw - mu * mu, yy = svv / sw - mv * mv, xy = suv / sw - mu * mv;
  const xz = suz / sw - mu * mz, yz = svz / sw - mv * mz;
  const det = xx * yy - xy * xy;
  if (!(det > 1e-30 * (xx + yy) ** 2)) return false;
  // [xx xy; xy yy][D; E] = −[xz; yz]; F = −(mean z + D·mean u + E·mean v); centre = (−D/2, −E/2).
  const D = -(xz * yy - yz * xy) / det;
  const E = -(yz * xx - xz * xy) / det;
  const F = -(mz + D * mu + E * mv);
  const a = -D / 2, b = -E / 2;
  out.xc = a + x0;
  out.yc = b + y0;
  out.radius = Math.sqrt(a * a + b * b - F);
  // Σ (p_i − c) × (p_{i+1} − c) = Σ p_i × p_{i+1} + (p_last − p_first) × c, here with p_first = 0.
  out.sense = swept + (pu * b - pv * a) >= 0 ? 1 : -1;
  return Number.isFinite(out.radius);
}

/**
 * Taubin fit (Taubin, IEEE TPAMI 13 (1991) 1115), solved by Newton's method on its
 * characteristic polynomial as in Chernov & Lesort, J. Math. Imaging Vision 23 (2005) 239 and
 * Chernov, "Circular and Linear Regression" (CRC 2010), §5.10. Essentially unbiased in the
 * radius to first order, where Kåsa is biased on short arcs.
 */
export function taubinCircle(x: Float64Array, y: Float64Array, w: Float64Array | undefined, from: number, to: number, out: Circle): boolean {
  const m = moments(x, y, w, from, to);
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
  out.sense = senseAbout(out.xc, out.yc);
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
  circle: Circle, x: Float64Array, y: Float64Array, w: Float64Array | undefined,
  sx: Float64Array | undefined, sy: Float64Array | undefined,
  from: number, to: number, out: CircleFitColumns, k: number, covariance: boolean,
): void {
  const xr = x[from], yr = y[from];
  paramsFromCentre(circle.xc, circle.yc, circle.radius, circle.sense, xr, yr, P);
  out.kappa[k] = P.kappa;
  out.phi0[k] = P.phi;
  out.d0[k] = P.d;
  out.xRef[k] = xr;
  out.yRef[k] = yr;
  out.ndf[k] = to - from - 3;
  out.iterations[k] = 0;
  out.status[k] = STATUS_CODE.ok;
  // Lean mode: χ² and covariance stay NaN as allocated.
  if (!covariance) return;
  out.chi2[k] = normalEquations(x, y, w, sx, sy, from, to, xr, yr, P, A, G);
  finishCovariance(out, k, w === undefined);
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

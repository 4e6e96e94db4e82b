import type { Circle } from './algebraicCircle.js';
import { newCircle, storeCircle } from './algebraicCircle.js';
import { fitCircleBatch, markFailed } from './circleBatch.js';
import { STATUS_CODE } from './circleFit.js';
import { newNormalScratch } from './curvatureResidual.js';
import type { CircleFitMethod } from './fitMethod.js';
import type { TrackSpan } from './trackSpan.js';

/**
 * Kåsa fit: minimises Σ w (x² + y² + Dx + Ey + F)² (Kåsa, IEEE Trans. Instrum. Meas. IM-25
 * (1976) 8). Fast and exact on exact points, but biased towards small radii on short, noisy
 * arcs (Chernov, "Circular and Linear Regression", CRC 2010, ch. 5).
 * The fit is translation-covariant, so it runs in one pass on coordinates relative to the first
 * hit (which keeps the sums of the order of the track's size); eliminating F leaves a 2×2
 * system in the centred sums. Returns false when the hits do not spread in two dimensions.
 */
export function kasaCircle(span: TrackSpan, out: Circle): boolean {
  const { x, y, weights: ww } = span.hits;
  const { from, to } = span;
  const x0 = x[from], y0 = y[from];
  let sw = 0, su = 0, sv = 0, suu = 0, svv = 0, suv = 0, suz = 0, svz = 0, sz = 0, swept = 0;
  let pu = 0, pv = 0;
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

/** The Kåsa fit as a registry method (covariance at the algebraic solution unless `covariance: false`). */
export const KASA_METHOD: CircleFitMethod = Object.freeze<CircleFitMethod>({
  name: 'kasa',
  summary: 'algebraic, one pass (Kåsa 1976); fast, biased to small radii on short noisy arcs',
  measures: 'circle' as const,
  fitTracks(hits, offsets, context) {
    const circle = newCircle(), scratch = newNormalScratch(), covariance = context.covariance ?? true;
    return fitCircleBatch(hits, offsets, (span, out, k) => {
      if (kasaCircle(span, circle)) storeCircle(circle, span, out, k, covariance, scratch);
      else markFailed(out, k, STATUS_CODE.degenerate, span.to - span.from);
    });
  },
});

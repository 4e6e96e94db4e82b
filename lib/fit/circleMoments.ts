import type { TrackSpan } from './trackSpan.js';

/** Weighted centred moments of one track (the input of the algebraic circle fits). */
export interface CircleMoments {
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

export function newCircleMoments(): CircleMoments {
  return { n: 0, mx: 0, my: 0, xx: 0, yy: 0, xy: 0, xz: 0, yz: 0, zz: 0, mz: 0, swept: 0, ox: 0, oy: 0, dx: 0, dy: 0 };
}

/**
 * Weighted centred moments of one track in one pass, written into `m`. The sums are taken on
 * coordinates relative to the first hit, so they are of the order of the track's size wherever
 * it sits, and turned into moments about the weighted mean afterwards (z' = (u−ū)² + (v−v̄)²,
 * expanded in raw sums up to fourth order). The same pass sums the cross products of consecutive
 * hits, from which `turningSenseAbout` gets the turning sense.
 */
export function centredMoments(span: TrackSpan, m: CircleMoments): CircleMoments {
  const { x, y, weights: ww } = span.hits;
  const { from, to } = span;
  const x0 = x[from], y0 = y[from];
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
  m.n = to - from;
  m.mx = x0 + mu; m.my = y0 + mv;
  m.xx = Euu - mu * mu; m.yy = Evv - mv * mv; m.xy = Euv - mu * mv;
  m.mz = m.xx + m.yy;
  // E[(u−ū) z'] with z' = z − 2ūu − 2v̄v + c.
  m.xz = Euz - 2 * mu * Euu - 2 * mv * Euv + c * mu - mu * m.mz;
  m.yz = Evz - 2 * mu * Euv - 2 * mv * Evv + c * mv - mv * m.mz;
  m.zz = Ezz + 4 * mu * mu * Euu + 4 * mv * mv * Evv + 8 * mu * mv * Euv - 4 * mu * Euz - 4 * mv * Evz + 2 * c * Ez - 3 * c * c;
  m.swept = swept;
  m.ox = x0; m.oy = y0;
  m.dx = pu; m.dy = pv;
  return m;
}

/**
 * Turning sense (+1 counter-clockwise, −1 clockwise) of the hits whose moments are `m` about the
 * centre (xc, yc): Σ (p_i − c) × (p_{i+1} − c) = Σ p_i × p_{i+1} + (p_last − p_first) × c,
 * twice the signed area swept (here with the first hit as origin, so p_first = 0) — right for
 * arcs and for spirals of several turns.
 */
export function turningSenseAbout(m: CircleMoments, xc: number, yc: number): number {
  const cu = xc - m.ox, cv = yc - m.oy;
  return m.swept + (m.dx * cv - m.dy * cu) >= 0 ? 1 : -1;
}

import { GEV_PER_TESLA_METRE } from '../constants.js';

/** What a helix step needs besides the state: momentum [GeV/c], signed charge number, field [T]. */
export interface HelixMotion {
  momentumGeV: number;
  charge: number;
  /** [Bx, By, Bz] in tesla. */
  readonly fieldT: Float64Array;
}

/**
 * Exact step of a charged particle along a helix in a uniform field (no loss, no scattering).
 *
 * Equation of motion with path length s as parameter: dt̂/ds = k · t̂ × B, k = 0.299792458·z/p
 * [1/(T·m)], p in GeV/c (F = q v × B with exact c; common practice). With b̂ = B/|B| and
 * a = k|B| the solution, split into parts along and across b̂ (t∥ = (t̂·b̂)b̂, t⊥ = t̂ − t∥,
 * w = t⊥ × b̂), is
 *   r(s) = r₀ + t∥ s + t⊥ sin(as)/a + w (1 − cos(as))/a,   t̂(s) = t∥ + t⊥ cos(as) + w sin(as).
 * (1 − cos) is written 2 sin²(as/2) so that short steps keep full precision.
 *
 * `state` holds [x, y, z, ux, uy, uz] (metres, unit direction) and is overwritten with the state
 * after `stepM` metres. Field components in tesla, momentum in GeV/c, charge number signed.
 * Valid for any |B| ≥ 0 and any step; a neutral particle or zero field gives a straight line.
 * @example const st = Float64Array.of(0,0,0, 1,0,0); helixStep(st, 0.1, { momentumGeV: 1, charge: 1, fieldT: Float64Array.of(0, 0, 1.5) }) // bends to −y
 */
export function helixStep(state: Float64Array, stepM: number, motion: HelixMotion): void {
  const { momentumGeV, charge } = motion;
  const bxT = motion.fieldT[0], byT = motion.fieldT[1], bzT = motion.fieldT[2];
  const x = state[0], y = state[1], z = state[2];
  const ux = state[3], uy = state[4], uz = state[5];
  const bMag = Math.sqrt(bxT * bxT + byT * byT + bzT * bzT);
  const a = charge === 0 || bMag === 0 ? 0 : (GEV_PER_TESLA_METRE * charge * bMag) / momentumGeV;
  if (a === 0) {
    state[0] = x + ux * stepM;
    state[1] = y + uy * stepM;
    state[2] = z + uz * stepM;
    return;
  }
  const hx = bxT / bMag, hy = byT / bMag, hz = bzT / bMag;
  const along = ux * hx + uy * hy + uz * hz;
  const px = along * hx, py = along * hy, pz = along * hz;
  const qx = ux - px, qy = uy - py, qz = uz - pz;
  // w = t⊥ × b̂
  const wx = qy * hz - qz * hy;
  const wy = qz * hx - qx * hz;
  const wz = qx * hy - qy * hx;
  const phase = a * stepM;
  const sn = Math.sin(phase);
  const cs = Math.cos(phase);
  const half = Math.sin(0.5 * phase);
  const fs = sn / a;
  const fc = (2 * half * half) / a;
  state[0] = x + px * stepM + qx * fs + wx * fc;
  state[1] = y + py * stepM + qy * fs + wy * fc;
  state[2] = z + pz * stepM + qz * fs + wz * fc;
  let nx = px + qx * cs + wx * sn;
  let ny = py + qy * cs + wy * sn;
  let nz = pz + qz * cs + wz * sn;
  // Renormalise so that rounding does not accumulate over thousands of steps.
  const n = 1 / Math.sqrt(nx * nx + ny * ny + nz * nz);
  nx *= n; ny *= n; nz *= n;
  state[3] = nx;
  state[4] = ny;
  state[5] = nz;
}

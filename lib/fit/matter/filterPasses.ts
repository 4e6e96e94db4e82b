import type { MatterFitScratch } from './matterFitScratch.js';

/**
 * The two Kalman filter passes of the fit with material, on the deviations from the reference
 * trajectory (a linear problem: the linearised, iterated Kalman filter). The bending plane has
 * the state (u, ψ, δκ) — offset across the track, direction, curvature — and one measurement
 * per hit (the hit's offset across the reference); (z, tan λ) is a second, two-state filter with
 * z measured. Both start from a wide prior centred on the reference (`prior`: variances of u,
 * ψ, δκ, z, tan λ), so at convergence (deviations → 0) the prior pulls nowhere.
 * - `backwardPass` runs from the last hit to the first: its filtered state at the first hit uses
 *   every hit (it equals the smoothed state there), and (with `keepFiltered`) it keeps the
 *   filtered state at each hit for the smoothed residuals.
 * - `forwardPass` runs from the first hit to the last (the smoothed state at the last hit) and
 *   (with `residuals`), combining at each hit its prediction with the backward pass's filtered state (two-filter
 *   smoother, equivalent to Rauch–Tung–Striebel; Fraser & Potter, IEEE TAC 14 (1969) 387), gives
 *   the smoothed residuals.
 * With `stopAt` ≥ 0 both take the stop constraint in sc.stop (`stopConstraint`) as a measurement
 * of δκ at that hit, after the hit's own (so the smoother's two halves never both hold it).
 * Each returns the χ² of its predicted residuals (the fit χ² of the linear problem); the
 * backward pass with `withLogDet` also leaves Σ ln(variance of each predicted residual) in sc.tmp[14], so that
 * χ² + that sum is −2 ln L up to a constant when the noise itself depends on the state.
 */
export function backwardPass(sc: MatterFitScratch, n: number, hasZ: boolean, prior: Float64Array, keepFiltered: boolean, withLogDet = false, stopAt = -1): number {
  let x0 = 0, x1 = 0, x2 = 0;
  let c00 = prior[0], c01 = 0, c02 = 0, c11 = prior[1], c12 = 0, c22 = prior[2];
  let z0 = 0, z1 = 0, d00 = prior[3], d01 = 0, d11 = prior[4];
  let chi2 = 0, lnDet = 0;
  const F = sc.F, Q = sc.Q, Qz = sc.Qz, ds = sc.ds, mr = sc.mr, mv = sc.mv, zr = sc.zr, zv = sc.zv, bs = sc.bs, bz = sc.bz;
  for (let i = n - 1; i >= 0; i--) {
    if (i < n - 1) {
      // Back through step i+1: x_i = F⁻¹ (x_{i+1} − w), C_i = F⁻¹ (C + Q) F⁻ᵀ.
      const o = 9 * (i + 1);
      c00 += Q[o]; c01 += Q[o + 1]; c02 += Q[o + 2]; c11 += Q[o + 4]; c12 += Q[o + 5]; c22 += Q[o + 8];
      const a00 = F[o], a01 = F[o + 1], b0 = F[o + 2], a10 = F[o + 3], a11 = F[o + 4], b1 = F[o + 5], g = F[o + 8];
      const det = a00 * a11 - a01 * a10;
      const idet = 1 / det;
      const i00 = a11 * idet, i01 = -a01 * idet, i10 = -a10 * idet, i11 = a00 * idet;
      const ig = 1 / g;
      const i02 = -(i00 * b0 + i01 * b1) * ig, i12 = -(i10 * b0 + i11 * b1) * ig;
      const y0 = i00 * x0 + i01 * x1 + i02 * x2, y1 = i10 * x0 + i11 * x1 + i12 * x2, y2 = ig * x2;
      x0 = y0; x1 = y1; x2 = y2;
      // C ← M C Mᵀ with M = [[i00, i01, i02], [i10, i11, i12], [0, 0, ig]].
      const m00 = i00 * c00 + i01 * c01 + i02 * c02, m01 = i00 * c01 + i01 * c11 + i02 * c12, m02 = i00 * c02 + i01 * c12 + i02 * c22;
      const m10 = i10 * c00 + i11 * c01 + i12 * c02, m11 = i10 * c01 + i11 * c11 + i12 * c12, m12 = i10 * c02 + i11 * c12 + i12 * c22;
      const m22 = ig * c22;
      c00 = m00 * i00 + m01 * i01 + m02 * i02;
      c01 = m00 * i10 + m01 * i11 + m02 * i12;
      c02 = m02 * ig;
      c11 = m10 * i10 + m11 * i11 + m12 * i12;
      c12 = m12 * ig;
      c22 = m22 * ig;
      if (hasZ) {
        const qz = 3 * (i + 1), dsi = ds[i + 1];
        d00 += Qz[qz]; d01 += Qz[qz + 1]; d11 += Qz[qz + 2];
        z0 -= dsi * z1;
        const e00 = d00 - 2 * dsi * d01 + dsi * dsi * d11, e01 = d01 - dsi * d11;
        d00 = e00; d01 = e01;
      }
    }
    // Update with hit i.
    const r = mr[i] - x0, sv = c00 + mv[i], iv = 1 / sv;
    chi2 += r * r * iv;
    if (withLogDet) lnDet += Math.log(sv);
    const k0 = c00 * iv, k1 = c01 * iv, k2 = c02 * iv;
    x0 += k0 * r; x1 += k1 * r; x2 += k2 * r;
    c22 -= k2 * c02; c12 -= k1 * c02; c11 -= k1 * c01; c02 -= k0 * c02; c01 -= k0 * c01; c00 -= k0 * c00;
    if (i === stopAt) {
      // The stop constraint (sc.stop, `stopConstraint`): a measurement of δκ after the hit's own.
      const y = sc.stop[1] - x2, sk = c22 + sc.stop[2];
      const g0 = c02 / sk, g1 = c12 / sk, g2 = c22 / sk;
      chi2 += (y * y) / sk;
      if (withLogDet) lnDet += Math.log(sk);
      x0 += g0 * y; x1 += g1 * y; x2 += g2 * y;
      c00 -= g0 * c02; c01 -= g0 * c12; c11 -= g1 * c12; c02 -= g0 * c22; c12 -= g1 * c22; c22 -= g2 * c22;
    }
    if (keepFiltered) {
      const b = 9 * i;
      bs[b] = x0; bs[b + 1] = x1; bs[b + 2] = x2; bs[b + 3] = c00; bs[b + 4] = c01; bs[b + 5] = c02; bs[b + 6] = c11; bs[b + 7] = c12; bs[b + 8] = c22;
    }
    if (hasZ) {
      const rz = zr[i] - z0, svz = d00 + zv[i], ivz = 1 / svz;
      chi2 += rz * rz * ivz;
      if (withLogDet) lnDet += Math.log(svz);
      const kz0 = d00 * ivz, kz1 = d01 * ivz;
      z0 += kz0 * rz; z1 += kz1 * rz;
      d11 -= kz1 * d01; d01 -= kz0 * d01; d00 -= kz0 * d00;
      if (keepFiltered) {
        const q = 5 * i;
        bz[q] = z0; bz[q + 1] = z1; bz[q + 2] = d00; bz[q + 3] = d01; bz[q + 4] = d11;
      }
    }
  }
  writeEnd(sc.firstB, sc.firstZ, x0, x1, x2, c00, c01, c02, c11, c12, c22, z0, z1, d00, d01, d11);
  sc.tmp[14] = lnDet;
  return chi2;
}

export function forwardPass(sc: MatterFitScratch, n: number, hasZ: boolean, prior: Float64Array, residuals: boolean, stopAt = -1): number {
  let x0 = 0, x1 = 0, x2 = 0;
  let c00 = prior[0], c01 = 0, c02 = 0, c11 = prior[1], c12 = 0, c22 = prior[2];
  let z0 = 0, z1 = 0, d00 = prior[3], d01 = 0, d11 = prior[4];
  let chi2 = 0;
  const F = sc.F, Q = sc.Q, Qz = sc.Qz, ds = sc.ds, mr = sc.mr, mv = sc.mv, zr = sc.zr, zv = sc.zv, bs = sc.bs, bz = sc.bz;
  for (let i = 0; i < n; i++) {
    if (i > 0) {
      const o = 9 * i;
      const a00 = F[o], a01 = F[o + 1], a02 = F[o + 2], a10 = F[o + 3], a11 = F[o + 4], a12 = F[o + 5], g = F[o + 8];
      const y0 = a00 * x0 + a01 * x1 + a02 * x2, y1 = a10 * x0 + a11 * x1 + a12 * x2;
      x0 = y0; x1 = y1; x2 = g * x2;
      const m00 = a00 * c00 + a01 * c01 + a02 * c02, m01 = a00 * c01 + a01 * c11 + a02 * c12, m02 = a00 * c02 + a01 * c12 + a02 * c22;
      const m10 = a10 * c00 + a11 * c01 + a12 * c02, m11 = a10 * c01 + a11 * c11 + a12 * c12, m12 = a10 * c02 + a11 * c12 + a12 * c22;
      const m22 = g * c22;
      c00 = m00 * a00 + m01 * a01 + m02 * a02 + Q[o];
      c01 = m00 * a10 + m01 * a11 + m02 * a12 + Q[o + 1];
      c02 = m02 * g + Q[o + 2];
      c11 = m10 * a10 + m11 * a11 + m12 * a12 + Q[o + 4];
      c12 = m12 * g + Q[o + 5];
      c22 = m22 * g + Q[o + 8];
      if (hasZ) {
        const dsi = ds[i], qz = 3 * i;
        z0 += dsi * z1;
        d00 = d00 + 2 * dsi * d01 + dsi * dsi * d11 + Qz[qz];
        d01 = d01 + dsi * d11 + Qz[qz + 1];
        d11 = d11 + Qz[qz + 2];
      }
    }
    if (residuals) {
      // Smoothed residual: prediction (without hit i) combined with the backward filtered state (with it).
      const b = 9 * i;
      const e0 = bs[b] - x0, e1 = bs[b + 1] - x1, e2 = bs[b + 2] - x2;
      const s00 = c00 + bs[b + 3], s01 = c01 + bs[b + 4], s02 = c02 + bs[b + 5], s11 = c11 + bs[b + 6], s12 = c12 + bs[b + 7], s22 = c22 + bs[b + 8];
      const w00 = s11 * s22 - s12 * s12, w01 = s02 * s12 - s01 * s22, w02 = s01 * s12 - s02 * s11;
      const det = s00 * w00 + s01 * w01 + s02 * w02;
      const w11 = s00 * s22 - s02 * s02, w12 = s01 * s02 - s00 * s12, w22 = s00 * s11 - s01 * s01;
      const v0 = (w00 * e0 + w01 * e1 + w02 * e2) / det, v1 = (w01 * e0 + w11 * e1 + w12 * e2) / det, v2 = (w02 * e0 + w12 * e1 + w22 * e2) / det;
      sc.residual[i] = mr[i] - (x0 + c00 * v0 + c01 * v1 + c02 * v2);
    }
    const r = mr[i] - x0, sv = c00 + mv[i];
    chi2 += (r * r) / sv;
    const k0 = c00 / sv, k1 = c01 / sv, k2 = c02 / sv;
    x0 += k0 * r; x1 += k1 * r; x2 += k2 * r;
    c22 -= k2 * c02; c12 -= k1 * c02; c11 -= k1 * c01; c02 -= k0 * c02; c01 -= k0 * c01; c00 -= k0 * c00;
    if (i === stopAt) {
      // The stop constraint (sc.stop, `stopConstraint`): a measurement of δκ after the hit's own.
      const y = sc.stop[1] - x2, sk = c22 + sc.stop[2];
      const g0 = c02 / sk, g1 = c12 / sk, g2 = c22 / sk;
      chi2 += (y * y) / sk;
      x0 += g0 * y; x1 += g1 * y; x2 += g2 * y;
      c00 -= g0 * c02; c01 -= g0 * c12; c11 -= g1 * c12; c02 -= g0 * c22; c12 -= g1 * c22; c22 -= g2 * c22;
    }
    if (hasZ) {
      if (residuals) {
        const q = 5 * i;
        const f0 = bz[q] - z0, f1 = bz[q + 1] - z1;
        const t00 = d00 + bz[q + 2], t01 = d01 + bz[q + 3], t11 = d11 + bz[q + 4];
        const dt = t00 * t11 - t01 * t01;
        const u0 = (t11 * f0 - t01 * f1) / dt, u1 = (t00 * f1 - t01 * f0) / dt;
        sc.residualZ[i] = zr[i] - (z0 + d00 * u0 + d01 * u1);
      }
      const rz = zr[i] - z0, svz = d00 + zv[i];
      chi2 += (rz * rz) / svz;
      const kz0 = d00 / svz, kz1 = d01 / svz;
      z0 += kz0 * rz; z1 += kz1 * rz;
      d11 -= kz1 * d01; d01 -= kz0 * d01; d00 -= kz0 * d00;
    } else sc.residualZ[i] = NaN;
  }
  writeEnd(sc.lastB, sc.lastZ, x0, x1, x2, c00, c01, c02, c11, c12, c22, z0, z1, d00, d01, d11);
  return chi2;
}

/** State (3) + full 3×3 cov, state (2) + full 2×2 cov. */
function writeEnd(
  b: Float64Array, z: Float64Array, x0: number, x1: number, x2: number, c00: number, c01: number, c02: number, c11: number, c12: number, c22: number,
  z0: number, z1: number, d00: number, d01: number, d11: number,
): void {
  b[0] = x0; b[1] = x1; b[2] = x2;
  b[3] = c00; b[4] = c01; b[5] = c02; b[6] = c01; b[7] = c11; b[8] = c12; b[9] = c02; b[10] = c12; b[11] = c22;
  z[0] = z0; z[1] = z1; z[2] = d00; z[3] = d01; z[4] = d01; z[5] = d11;
}

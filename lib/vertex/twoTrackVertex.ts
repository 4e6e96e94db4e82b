import { helixPoint, helixPointJacobian, type HelixParameters } from './helixParameters.js';

/** A two-track vertex. Position [m], covariance [m²], χ² with one degree of freedom. */
export interface TwoTrackVertex {
  xM: number;
  yM: number;
  zM: number;
  /** Upper triangle of the 3×3 covariance of (x, y, z): xx, xy, xz, yy, yz, zz [m²]. */
  readonly cov: Float64Array;
  /** Σ over both tracks of the weighted squared distance of the track from the vertex (ndf = 1). */
  chi2: number;
  /** Arc length of each track at its point nearest the vertex [m]. */
  s1: number;
  s2: number;
  status: 'ok' | 'singular';
}

export function newTwoTrackVertex(): TwoTrackVertex {
  return { xM: NaN, yM: NaN, zM: NaN, cov: new Float64Array(6), chi2: NaN, s1: NaN, s2: NaN, status: 'singular' };
}

/** Scratch for `fitTwoTrackVertex` (no allocation per call). */
export interface VertexScratch {
  readonly jac: Float64Array;
  readonly point: Float64Array;
  readonly weight: Float64Array;
  readonly sumW: Float64Array;
  readonly sumWP: Float64Array;
  readonly w1: Float64Array;
  readonly w2: Float64Array;
  readonly p1: Float64Array;
  readonly p2: Float64Array;
  readonly c3: Float64Array;
}

export function newVertexScratch(): VertexScratch {
  return {
    c3: new Float64Array(9),
    jac: new Float64Array(15), point: new Float64Array(3), weight: new Float64Array(9), sumW: new Float64Array(9),
    sumWP: new Float64Array(3), w1: new Float64Array(9), w2: new Float64Array(9), p1: new Float64Array(3), p2: new Float64Array(3),
  };
}

/**
 * Weight matrix W (3×3, rank 2) of a track at arc length s: the inverse of its position
 * covariance J C Jᵀ restricted to the plane across the track (a point may slide along the
 * track freely, so only the two transverse directions carry information). Writes W into
 * `out` and the point into `point`.
 */
function trackWeight(h: HelixParameters, s: number, out: Float64Array, point: Float64Array, jac: Float64Array, scratchC3: Float64Array): boolean {
  helixPoint(h, s, point);
  helixPointJacobian(h, s, jac);
  const c = h.cov;
  // C3 = J C Jᵀ (3×3).
  const c3 = scratchC3;
  for (let r = 0; r < 3; r++) for (let q = r; q < 3; q++) {
    let v = 0;
    for (let i = 0; i < 5; i++) {
      const ji = jac[5 * r + i];
      if (ji === 0) continue;
      for (let k = 0; k < 5; k++) v += ji * c[5 * i + k] * jac[5 * q + k];
    }
    c3[3 * r + q] = c3[3 * q + r] = v;
  }
  // Orthonormal u, v across the direction t.
  const phi = h.phi0 + h.kappa * s;
  const norm = Math.hypot(1, h.tanLambda);
  const tx = Math.cos(phi) / norm, ty = Math.sin(phi) / norm, tz = h.tanLambda / norm;
  const ux = -Math.sin(phi), uy = Math.cos(phi), uz = 0;
  const vx = ty * uz - tz * uy, vy = tz * ux - tx * uz, vz = tx * uy - ty * ux;
  const cuu = quadratic(c3, ux, uy, uz, ux, uy, uz), cuv = quadratic(c3, ux, uy, uz, vx, vy, vz), cvv = quadratic(c3, vx, vy, vz, vx, vy, vz);
  const det = cuu * cvv - cuv * cuv;
  if (!(det > 0)) return false;
  const wuu = cvv / det, wuv = -cuv / det, wvv = cuu / det;
  for (let r = 0; r < 3; r++) for (let k = 0; k < 3; k++) {
    const ur = r === 0 ? ux : r === 1 ? uy : uz, vr = r === 0 ? vx : r === 1 ? vy : vz;
    const uk = k === 0 ? ux : k === 1 ? uy : uz, vk = k === 0 ? vx : k === 1 ? vy : vz;
    out[3 * r + k] = ur * wuu * uk + ur * wuv * vk + vr * wuv * uk + vr * wvv * vk;
  }
  return true;
}

/** aᵀ C b for a row-major 3×3 C. */
function quadratic(c: ArrayLike<number>, ax: number, ay: number, az: number, bx: number, by: number, bz: number): number {
  return ax * (c[0] * bx + c[1] * by + c[2] * bz) + ay * (c[3] * bx + c[4] * by + c[5] * bz) + az * (c[6] * bx + c[7] * by + c[8] * bz);
}

/** Arc length on `h` of the point nearest `(x, y, z)`, by Newton from `s`. */
export function nearestArcLength(h: HelixParameters, xM: number, yM: number, zM: number, s: number, point: Float64Array): number {
  const maxStep = Math.min(1, 0.25 * Math.PI / Math.max(Math.abs(h.kappa), 1e-9));
  for (let it = 0; it < 20; it++) {
    helixPoint(h, s, point);
    const phi = h.phi0 + h.kappa * s;
    const tx = Math.cos(phi), ty = Math.sin(phi), tz = h.tanLambda;
    const dx = point[0] - xM, dy = point[1] - yM, dz = point[2] - zM;
    const g = dx * tx + dy * ty + dz * tz;
    const hh = tx * tx + ty * ty + tz * tz + h.kappa * (-dx * ty + dy * tx);
    const step = Math.max(-maxStep, Math.min(maxStep, -g / (hh > 0.1 ? hh : 1)));
    s += step;
    if (Math.abs(step) < 1e-9) break;
  }
  return s;
}

function invert3(m: Float64Array, out: Float64Array): boolean {
  const [a, b, c, d, e, f, g, h, i] = m;
  const A = e * i - f * h, B = -(d * i - f * g), C = d * h - e * g;
  const det = a * A + b * B + c * C;
  if (!(Math.abs(det) > 0) || !Number.isFinite(det)) return false;
  out[0] = A / det; out[1] = -(b * i - c * h) / det; out[2] = (b * f - c * e) / det;
  out[3] = B / det; out[4] = (a * i - c * g) / det; out[5] = -(a * f - c * d) / det;
  out[6] = C / det; out[7] = -(a * h - b * g) / det; out[8] = (a * e - b * d) / det;
  return true;
}

/**
 * Fits the common vertex of two tracks from their closest approach (s1, s2): each track is
 * linearised at its point nearest the vertex, with the weight of its position covariance across
 * the track (`trackWeight`), and the vertex V minimises χ² = Σᵢ (V − Pᵢ)ᵀ Wᵢ (V − Pᵢ); then the
 * points are moved to the tracks' nearest points to V and the fit repeated once (two passes; the
 * linearised "perigee" vertex fit of common practice, e.g. Billoir & Qian, NIM A311 (1992)
 * 139). cov(V) = (ΣWᵢ)⁻¹, ndf = 2·2 − 3 = 1. The track covariances are the fit's: multiple
 * scattering between the vertex and the first hit is not in them.
 * @example fitTwoTrackVertex(h1, h2, ca.s1, ca.s2).chi2
 */
export function fitTwoTrackVertex(
  a: HelixParameters, b: HelixParameters, s1: number, s2: number,
  out: TwoTrackVertex = newTwoTrackVertex(), scratch: VertexScratch = newVertexScratch(),
): TwoTrackVertex {
  const { jac, sumW, sumWP, w1, w2, p1, p2 } = scratch;
  out.status = 'singular';
  for (let pass = 0; pass < 2; pass++) {
    if (!trackWeight(a, s1, w1, p1, jac, scratch.c3) || !trackWeight(b, s2, w2, p2, jac, scratch.c3)) return fail(out);
    for (let i = 0; i < 9; i++) sumW[i] = w1[i] + w2[i];
    for (let r = 0; r < 3; r++) {
      sumWP[r] = w1[3 * r] * p1[0] + w1[3 * r + 1] * p1[1] + w1[3 * r + 2] * p1[2]
        + w2[3 * r] * p2[0] + w2[3 * r + 1] * p2[1] + w2[3 * r + 2] * p2[2];
    }
    const inv = scratch.weight;
    if (!invert3(sumW, inv)) return fail(out);
    out.xM = inv[0] * sumWP[0] + inv[1] * sumWP[1] + inv[2] * sumWP[2];
    out.yM = inv[3] * sumWP[0] + inv[4] * sumWP[1] + inv[5] * sumWP[2];
    out.zM = inv[6] * sumWP[0] + inv[7] * sumWP[1] + inv[8] * sumWP[2];
    out.cov[0] = inv[0]; out.cov[1] = inv[1]; out.cov[2] = inv[2]; out.cov[3] = inv[4]; out.cov[4] = inv[5]; out.cov[5] = inv[8];
    if (pass < 1) {
      s1 = nearestArcLength(a, out.xM, out.yM, out.zM, s1, scratch.point);
      s2 = nearestArcLength(b, out.xM, out.yM, out.zM, s2, scratch.point);
    }
  }
  out.chi2 = quadratic(w1, out.xM - p1[0], out.yM - p1[1], out.zM - p1[2], out.xM - p1[0], out.yM - p1[1], out.zM - p1[2])
    + quadratic(w2, out.xM - p2[0], out.yM - p2[1], out.zM - p2[2], out.xM - p2[0], out.yM - p2[1], out.zM - p2[2]);
  out.s1 = s1;
  out.s2 = s2;
  out.status = 'ok';
  return out;
}

function fail(out: TwoTrackVertex): TwoTrackVertex {
  out.xM = out.yM = out.zM = out.chi2 = out.s1 = out.s2 = NaN;
  out.cov.fill(NaN);
  out.status = 'singular';
  return out;
}

import { circleFitAt, FIT_STATUS, type CircleFit, type CircleFitColumns } from './circleFit';
import { fitCircles, type CircleFitOptions, type PlaneHits } from './fitCircles';
import { fitLine } from './fitLine';
import { msg } from '../errors';

/** Hits with the coordinate along the field. */
export interface SpaceHits extends PlaneHits {
  readonly z: Float64Array;
  readonly sigmaZ?: Float64Array;
}

/**
 * Helix fits, struct-of-arrays: the circle columns plus the line in (s, z).
 * Helix parameters (κ, φ0, d0, z0, tan λ) at the reference point (first hit): z0 is z at the
 * point of closest approach, tan λ = dz/ds with s the arc length in the bending plane.
 */
export interface HelixFitColumns {
  readonly circle: CircleFitColumns;
  readonly z0: Float64Array;
  readonly tanLambda: Float64Array;
  /** 15 numbers per fit: upper triangle of the 5×5 covariance of (κ, φ0, d0, z0, tanλ), row by row. */
  readonly cov: Float64Array;
  readonly chi2Z: Float64Array;
  readonly ndfZ: Int32Array;
}

export interface HelixFit {
  readonly circle: CircleFit;
  readonly z0: number;
  readonly tanLambda: number;
  /** Full 5×5 covariance of (κ, φ0, d0, z0, tanλ), row-major. */
  readonly cov: Float64Array;
  readonly chi2Z: number;
  readonly ndfZ: number;
  readonly status: CircleFit['status'];
}

/**
 * Arc length [m] of each hit along the fitted circle from the point of closest approach to the
 * reference point, unwrapped in hit order so spirals of several turns are measured in full.
 * Turning angle ψ = atan2(κa, 1 − κB) (a, B as in curvatureResidual.ts), s = ψ/κ (s = a at κ = 0).
 */
export function arcLengths(x: Float64Array, y: Float64Array, from: number, to: number, kappa: number, phi: number, d: number, xr: number, yr: number, out: Float64Array): void {
  const c = Math.cos(phi), s = Math.sin(phi);
  let prev = 0;
  let turns = 0;
  for (let i = from; i < to; i++) {
    const dx = x[i] - xr, dy = y[i] - yr;
    const a = dx * c + dy * s;
    const B = -dx * s + dy * c + d;
    if (kappa === 0) {
      out[i - from] = a;
      continue;
    }
    let psi = Math.atan2(kappa * a, 1 - kappa * B) * Math.sign(kappa) + turns;
    // Unwrap: consecutive hits are less than half a turn apart.
    while (psi - prev > Math.PI) { psi -= 2 * Math.PI; turns -= 2 * Math.PI; }
    while (psi - prev < -Math.PI) { psi += 2 * Math.PI; turns += 2 * Math.PI; }
    prev = psi;
    out[i - from] = psi / Math.abs(kappa);
  }
}

const SYM5 = [0, 1, 2, 3, 4, 1, 5, 6, 7, 8, 2, 6, 9, 10, 11, 3, 7, 10, 12, 13, 4, 8, 11, 13, 14];

/**
 * Helix fit of every track: the circle in x–y (method as in fitCircles), then a straight line
 * z = z0 + tanλ·s in arc length (the two-step helix fit; common practice in gas trackers).
 * The joint covariance propagates the circle's covariance into (z0, tanλ) through ∂s/∂(κ,φ,d)
 * (central finite differences of the line solution), plus the line fit's own covariance:
 *     C = [[Cc, Cc Gᵀ], [G Cc, G Cc Gᵀ + Cl]],  G = ∂(z0, tanλ)/∂(κ, φ0, d0).
 * x–y and z measurements are taken as independent.
 */
export function fitHelices(hits: SpaceHits, offsets: Int32Array, options: CircleFitOptions = {}): HelixFitColumns {
  if (hits.z.length !== hits.x.length) throw msg.badArgument('z.length', hits.z.length, `${hits.x.length} (one z per hit)`);
  const circle = fitCircles(hits, offsets, options);
  const count = circle.count;
  const z0 = new Float64Array(count).fill(NaN);
  const tanLambda = new Float64Array(count).fill(NaN);
  const cov = new Float64Array(15 * count).fill(NaN);
  const chi2Z = new Float64Array(count).fill(NaN);
  const ndfZ = new Int32Array(count);
  let s = new Float64Array(64);
  const G = new Float64Array(6);
  for (let k = 0; k < count; k++) {
    const from = offsets[k], to = offsets[k + 1];
    const n = to - from;
    ndfZ[k] = Math.max(0, n - 2);
    if (FIT_STATUS[circle.status[k]] !== 'ok' && FIT_STATUS[circle.status[k]] !== 'not-converged') continue;
    if (s.length < n) s = new Float64Array(2 * n);
    const kap = circle.kappa[k], phi = circle.phi0[k], d = circle.d0[k], xr = circle.xRef[k], yr = circle.yRef[k];
    const zs = hits.z.subarray(from, to);
    const szMeasured = hits.sigmaZ?.subarray(from, to);
    let sz = szMeasured;
    const lineAt = (dk: number, dp: number, dd: number) => {
      arcLengths(hits.x, hits.y, from, to, kap + dk, phi + dp, d + dd, xr, yr, s);
      return fitLine(s.subarray(0, n), zs, sz);
    };
    let line = lineAt(0, 0, 0);
    if (szMeasured && hits.sigmaX && Number.isFinite(line.slope)) {
      // Effective variance (Orear, Am. J. Phys. 50 (1982) 912): the x–y error of a hit along the
      // track moves its arc length, which a slope tan λ turns into a z error. One refit with
      // σ_eff² = σ_z² + tan²λ·σ_xy² is enough (the slope changes little).
      const eff = new Float64Array(n);
      const t2 = line.slope * line.slope;
      for (let i = 0; i < n; i++) {
        const ex = hits.sigmaX[from + i], ey = (hits.sigmaY ?? hits.sigmaX)[from + i];
        eff[i] = Math.sqrt(szMeasured[i] * szMeasured[i] + t2 * 0.5 * (ex * ex + ey * ey));
      }
      sz = eff;
      line = lineAt(0, 0, 0);
    }
    z0[k] = line.intercept;
    tanLambda[k] = line.slope;
    chi2Z[k] = line.chi2;
    ndfZ[k] = line.ndf;
    // G by central differences, steps small against the parameters' own scale.
    let len = 0;
    for (let i = 0; i < n; i++) len = Math.max(len, Math.abs(s[i]));
    const steps = [1e-6 * Math.max(Math.abs(kap), 1 / Math.max(len, 1e-9)), 1e-6, 1e-6 * Math.max(len, 1e-9)];
    for (let j = 0; j < 3; j++) {
      const h = steps[j];
      const up = lineAt(j === 0 ? h : 0, j === 1 ? h : 0, j === 2 ? h : 0);
      const dn = lineAt(j === 0 ? -h : 0, j === 1 ? -h : 0, j === 2 ? -h : 0);
      G[j] = (up.intercept - dn.intercept) / (2 * h);
      G[3 + j] = (up.slope - dn.slope) / (2 * h);
    }
    const c6 = circle.cov.subarray(6 * k, 6 * k + 6);
    const Cc = [c6[0], c6[1], c6[2], c6[1], c6[3], c6[4], c6[2], c6[4], c6[5]];
    // GC = G·Cc (2×3)
    const GC = new Float64Array(6);
    for (let r = 0; r < 2; r++) for (let c = 0; c < 3; c++) {
      GC[3 * r + c] = G[3 * r] * Cc[c] + G[3 * r + 1] * Cc[3 + c] + G[3 * r + 2] * Cc[6 + c];
    }
    const full = new Float64Array(25);
    for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) full[5 * r + c] = Cc[3 * r + c];
    for (let r = 0; r < 2; r++) for (let c = 0; c < 3; c++) {
      full[5 * (3 + r) + c] = GC[3 * r + c];
      full[5 * c + 3 + r] = GC[3 * r + c];
    }
    const lineCov = [line.cov[0], line.cov[1], line.cov[1], line.cov[2]];
    for (let r = 0; r < 2; r++) for (let c = 0; c < 2; c++) {
      full[5 * (3 + r) + 3 + c] = GC[3 * r] * G[3 * c] + GC[3 * r + 1] * G[3 * c + 1] + GC[3 * r + 2] * G[3 * c + 2] + lineCov[2 * r + c];
    }
    for (let r = 0, q = 0; r < 5; r++) for (let c = r; c < 5; c++) cov[15 * k + q++] = full[5 * r + c];
  }
  return { circle, z0, tanLambda, cov, chi2Z, ndfZ };
}

/** Reads helix fit k as an object with the full 5×5 covariance. */
export function helixFitAt(fits: HelixFitColumns, k: number): HelixFit {
  const circle = circleFitAt(fits.circle, k);
  const cov = new Float64Array(25);
  for (let i = 0; i < 25; i++) cov[i] = fits.cov[15 * k + SYM5[i]];
  return Object.freeze({
    circle,
    z0: fits.z0[k],
    tanLambda: fits.tanLambda[k],
    cov,
    chi2Z: fits.chi2Z[k],
    ndfZ: fits.ndfZ[k],
    status: circle.status,
  });
}

/**
 * Helix fit of one track (hits in travel order; lengths in metres).
 * @example fitHelix(x, y, z, { sigma: 2e-4 }).tanLambda
 */
export function fitHelix(
  x: Float64Array, y: Float64Array, z: Float64Array,
  options: CircleFitOptions & { sigma?: Float64Array | number; sigmaZ?: Float64Array | number } = {},
): HelixFit {
  const n = x.length;
  const col = (v: Float64Array | number | undefined, name: string): Float64Array | undefined => {
    if (v === undefined) return undefined;
    if (typeof v === 'number') {
      if (!(v > 0)) throw msg.badArgument(name, v, 'a positive error in metres');
      return new Float64Array(n).fill(v);
    }
    if (v.length !== n) throw msg.badArgument(`${name}.length`, v.length, `${n} (one per hit)`);
    return v;
  };
  const sigma = col(options.sigma, 'sigma');
  const fits = fitHelices({ x, y, z, sigmaX: sigma, sigmaY: sigma, sigmaZ: col(options.sigmaZ, 'sigmaZ') }, Int32Array.of(0, n), options);
  return helixFitAt(fits, 0);
}

import { circleFitAt, FIT_STATUS, type CircleFit, type CircleFitColumns } from './circleFit.js';
import { CIRCLE_FIT_DEFAULTS, fitCircles, sigmaColumn, type CircleFitOptions, type PlaneHits } from './fitCircles.js';
import { fitMethod } from './fitMethods.js';
import { arcLengthsAndSlopes, newArcLengthSlopes, type CircleAt, type PointRows } from './arcLengths.js';
import { lineFitInto, newLineScratch } from './fitLine.js';
import { preparePlaneHits } from './preparePlaneHits.js';
import { msg } from '../errors.js';

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
  /**
   * Arc length s [m] of every hit along its track's fitted circle, the s the line in (s, z) was
   * fitted to (arcLengthsAndSlopes at κ, φ0, d0 from the reference point); NaN on tracks not
   * fitted. Given by the two-step fit; absent from methods that fit whole helices.
   */
  readonly arcLengthM?: Float64Array;
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

const SYM5 = [0, 1, 2, 3, 4, 1, 5, 6, 7, 8, 2, 6, 9, 10, 11, 3, 7, 10, 12, 13, 4, 8, 11, 13, 14];

/**
 * Helix fit of every track. A circle method (`options.method`, as in fitCircles) fits x–y, then a
 * straight line z = z0 + tanλ·s in arc length follows (the two-step helix fit; common practice
 * in gas trackers); a method that fits whole helices (e.g. with material effects) does it all.
 * The joint covariance propagates the circle's covariance into (z0, tanλ) through ∂s/∂(κ,φ,d),
 * plus the line fit's own covariance (z weights by effective variance, see below):
 *     C = [[Cc, Cc Gᵀ], [G Cc, G Cc Gᵀ + Cl]],  G = ∂(z0, tanλ)/∂(κ, φ0, d0).
 * x–y and z measurements are taken as independent.
 */
export function fitHelices(hits: SpaceHits, offsets: Int32Array, options: CircleFitOptions = {}): HelixFitColumns {
  if (hits.z.length !== hits.x.length) throw msg.badArgument('z.length', hits.z.length, `${hits.x.length} (one z per hit)`);
  const method = fitMethod(options.method ?? CIRCLE_FIT_DEFAULTS.method);
  const prepared = preparePlaneHits(hits);
  if (method.measures === 'helix') return method.fitTracks({ ...hits, prepared }, offsets, options);
  const circle = fitCircles(prepared, offsets, options);
  const count = circle.count;
  const z0 = new Float64Array(count).fill(NaN);
  const tanLambda = new Float64Array(count).fill(NaN);
  const cov = new Float64Array(15 * count).fill(NaN);
  const chi2Z = new Float64Array(count).fill(NaN);
  const ndfZ = new Int32Array(count);
  const arcLengthM = new Float64Array(hits.x.length).fill(NaN);
  // Scratch, grown as needed; nothing is allocated per track.
  let w = new Float64Array(64);
  let zs = new Float64Array(64);
  let arcs = newArcLengthSlopes(64);
  const rows: PointRows = { x: hits.x, y: hits.y, from: 0, to: 0 };
  const at: CircleAt = { kappa: 0, phi: 0, d: 0, xRef: 0, yRef: 0 };
  const line = newLineScratch();
  const G = new Float64Array(6);
  const GC = new Float64Array(6);
  const full = new Float64Array(25);
  const { z } = hits;
  for (let k = 0; k < count; k++) {
    const from = offsets[k], to = offsets[k + 1];
    const n = to - from;
    ndfZ[k] = Math.max(0, n - 2);
    const st = FIT_STATUS[circle.status[k]];
    if (st !== 'ok' && st !== 'not-converged') continue;
    if (w.length < n) {
      w = new Float64Array(2 * n);
      zs = new Float64Array(2 * n);
      arcs = newArcLengthSlopes(2 * n);
    }
    rows.from = from; rows.to = to;
    at.kappa = circle.kappa[k]; at.phi = circle.phi0[k]; at.d = circle.d0[k]; at.xRef = circle.xRef[k]; at.yRef = circle.yRef[k];
    for (let i = 0; i < n; i++) zs[i] = z[from + i];
    arcLengthsAndSlopes(rows, at, arcs);
    const { s, dsK, dsP, dsD } = arcs;
    for (let i = 0; i < n; i++) arcLengthM[from + i] = s[i];
    let weights: Float64Array | undefined;
    if (hits.sigmaZ) {
      for (let i = 0; i < n; i++) { const e = hits.sigmaZ[from + i]; w[i] = 1 / (e * e); }
      weights = w;
      lineFitInto(s, zs, weights, n, line);
      if (hits.sigmaX && Number.isFinite(line.slope)) {
        // Effective variance (Orear, Am. J. Phys. 50 (1982) 912): the x–y error of a hit along
        // the track moves its arc length, which the slope tan λ turns into a z error. One refit
        // with σ_eff² = σ_z² + tan²λ·σ_xy² is enough (the slope changes little).
        const t2 = line.slope * line.slope;
        const sy = hits.sigmaY ?? hits.sigmaX;
        for (let i = 0; i < n; i++) {
          const ez = hits.sigmaZ[from + i], ex = hits.sigmaX[from + i], ey = sy[from + i];
          w[i] = 1 / (ez * ez + t2 * 0.5 * (ex * ex + ey * ey));
        }
      }
    }
    lineFitInto(s, zs, weights, n, line);
    const t = line.slope, zz0 = line.intercept;
    z0[k] = zz0;
    tanLambda[k] = t;
    chi2Z[k] = line.chi2;
    ndfZ[k] = n - 2;
    // G = ∂(z0, tanλ)/∂(κ, φ0, d0) by the chain rule: analytic ∂(z0, t)/∂s_i of the linear fit
    //   ∂t/∂s_i = w_i (r_i − t (s_i − s̄)) / S_uu,   ∂z0/∂s_i = −s̄ ∂t/∂s_i − t w_i / S_w
    // times the analytic ∂s_i/∂p of arcLengthsAndSlopes.
    const sbar = line.meanU, suu = line.suu, sw = line.sumW;
    let gzK = 0, gzP = 0, gzD = 0, gtK = 0, gtP = 0, gtD = 0;
    for (let i = 0; i < n; i++) {
      const wi = weights ? weights[i] : 1;
      const r = zs[i] - zz0 - t * s[i];
      const dt = (wi * (r - t * (s[i] - sbar))) / suu;
      const dz = -sbar * dt - (t * wi) / sw;
      gtK += dt * dsK[i]; gtP += dt * dsP[i]; gtD += dt * dsD[i];
      gzK += dz * dsK[i]; gzP += dz * dsP[i]; gzD += dz * dsD[i];
    }
    G[0] = gzK; G[1] = gzP; G[2] = gzD;
    G[3] = gtK; G[4] = gtP; G[5] = gtD;
    // Cc as a full 3×3 (row-major) from its upper triangle.
    const cc = circle.cov, c6 = 6 * k;
    const c00 = cc[c6], c01 = cc[c6 + 1], c02 = cc[c6 + 2], c11 = cc[c6 + 3], c12 = cc[c6 + 4], c22 = cc[c6 + 5];
    for (let r = 0; r < 2; r++) {
      const g0 = G[3 * r], g1 = G[3 * r + 1], g2 = G[3 * r + 2];
      GC[3 * r] = g0 * c00 + g1 * c01 + g2 * c02;
      GC[3 * r + 1] = g0 * c01 + g1 * c11 + g2 * c12;
      GC[3 * r + 2] = g0 * c02 + g1 * c12 + g2 * c22;
    }
    full[0] = c00; full[1] = c01; full[2] = c02; full[6] = c11; full[7] = c12; full[12] = c22;
    for (let r = 0; r < 2; r++) for (let c = 0; c < 3; c++) full[5 * c + 3 + r] = GC[3 * r + c];
    for (let r = 0; r < 2; r++) for (let c = r; c < 2; c++) {
      const lineCov = r === 0 ? (c === 0 ? line.varIntercept : line.covIS) : line.varSlope;
      full[5 * (3 + r) + 3 + c] = GC[3 * r] * G[3 * c] + GC[3 * r + 1] * G[3 * c + 1] + GC[3 * r + 2] * G[3 * c + 2] + lineCov;
    }
    for (let r = 0, q = 0; r < 5; r++) for (let c = r; c < 5; c++) cov[15 * k + q++] = full[5 * r + c];
  }
  return { circle, z0, tanLambda, cov, chi2Z, ndfZ, arcLengthM };
}

/** Reads helix fit k as an object with the full 5×5 covariance. */
function helixFitAt(fits: HelixFitColumns, k: number): HelixFit {
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
  const sigma = sigmaColumn(options.sigma, n);
  const fits = fitHelices({ x, y, z, sigmaX: sigma, sigmaY: sigma, sigmaZ: sigmaColumn(options.sigmaZ, n, 'sigmaZ') }, Int32Array.of(0, n), options);
  return helixFitAt(fits, 0);
}

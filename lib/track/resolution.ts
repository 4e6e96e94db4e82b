import { GEV_PER_TESLA_METRE } from '../constants.js';
import { msg } from '../errors.js';
import { warn } from '../warnings.js';
import type { Material } from '../matter/materials.js';
import { radiationLengthM } from '../matter/highland.js';

/**
 * Momentum-resolution terms of a curvature measurement in a uniform field.
 *
 * Curvature κ = 1/R [1/m]; with p_T [GeV/c] = 0.299792458 |z| B [T] R [m] (common practice,
 * from exact c), σ(p_T)/p_T = σ(κ)/κ = σ(κ) · p_T / (0.299792458 |z| B). The measurement term
 * grows ∝ p and ∝ L⁻² (halving the track length quadruples σ(κ), a fact of the trade); the
 * multiple-scattering term is independent of p for β → 1.
 */

/**
 * Curvature error [1/m] of a parabola fit to N ≥ 10 equally spaced points of error σ [m] over a
 * projected length L [m], Gluckstern's asymptotic form (R.L. Gluckstern, Nucl. Instrum. Meth. 24
 * (1963) 381; PDG RPP detector review):  σ(κ) = (σ/L²) √(720/(N+4)).
 * Below N = 10: NaN + warning (use `curvatureSigmaEquallySpaced`, exact for any N ≥ 3).
 * @example glucksternCurvatureSigma({ nPoints: 10, sigmaM: 1e-4, lengthM: 1 }) // ≈ 7.17e-4
 */
export function glucksternCurvatureSigma(input: { readonly nPoints: number; readonly sigmaM: number; readonly lengthM: number }): number {
  const { nPoints: n, sigmaM, lengthM } = input;
  checkGeometry(n, sigmaM, lengthM);
  if (n < 10) {
    warn('OUTSIDE_VALIDITY', `glucksternCurvatureSigma: N = ${n} < 10 where the (N+4) form holds; use curvatureSigmaEquallySpaced; result is NaN`, 'glucksternCurvatureSigma');
    return NaN;
  }
  return (sigmaM / (lengthM * lengthM)) * Math.sqrt(720 / (n + 4));
}

/**
 * Exact curvature error [1/m] of the least-squares parabola y = a + b s + κ s²/2 through N ≥ 3
 * equally spaced points with common error σ over length L (derived from the design matrix;
 * Gluckstern 1963 gives the same closed form):
 *   σ(κ)² = (σ²/L⁴) · 720 (N−1)³ / ((N−2) N (N+1) (N+2)),
 * which tends to Gluckstern's 720/(N+4) form for large N (within 3.5 % at N = 10).
 */
export function curvatureSigmaEquallySpaced(input: { readonly nPoints: number; readonly sigmaM: number; readonly lengthM: number }): number {
  const { nPoints: n, sigmaM, lengthM } = input;
  checkGeometry(n, sigmaM, lengthM);
  const f = (720 * (n - 1) ** 3) / ((n - 2) * n * (n + 1) * (n + 2));
  return (sigmaM / (lengthM * lengthM)) * Math.sqrt(f);
}

/**
 * Exact curvature error [1/m] for arbitrary point positions: the (κ, κ) element of the inverse of
 * the weighted normal matrix AᵀWA of the parabola fit y = a + b s + κ s²/2, where s [m] are the
 * positions along the chord and σ [m] the point errors (one number or one per point). Exact for
 * the linearised (small-sagitta) fit; any N ≥ 3 distinct positions. Common practice (weighted
 * least squares; e.g. PDG RPP "Statistics").
 */
export function curvatureSigmaLeastSquares(positionsM: Float64Array, sigmaM: number | Float64Array): number {
  const n = positionsM.length;
  if (n < 3) throw msg.badArgument('positionsM', n, 'at least 3 measured points');
  if (typeof sigmaM !== 'number' && sigmaM.length !== n) throw msg.badArgument('sigmaM', sigmaM.length, `one error per point (${n})`);
  // Centre s for conditioning; κ is invariant under the shift.
  let mean = 0;
  for (let i = 0; i < n; i++) mean += positionsM[i];
  mean /= n;
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0;
  for (let i = 0; i < n; i++) {
    const sg = typeof sigmaM === 'number' ? sigmaM : sigmaM[i];
    if (!(sg > 0)) throw msg.badArgument('sigmaM', sg, 'positive point errors in metres');
    const w = 1 / (sg * sg);
    const s = positionsM[i] - mean;
    const q = 0.5 * s * s; // column for κ: ∂y/∂κ = s²/2
    s0 += w; s1 += w * s; s2 += w * s * s; s3 += w * s * q; s4 += w * q * q;
  }
  // Normal matrix [[s0, s1, sq],[s1, s2, s3],[sq, s3, s4]] with sq = Σ w s²/2 = s2/2.
  const sq = 0.5 * s2;
  const det = s0 * (s2 * s4 - s3 * s3) - s1 * (s1 * s4 - s3 * sq) + sq * (s1 * s3 - s2 * sq);
  const cofKK = s0 * s2 - s1 * s1;
  const varK = cofKK / det;
  return varK > 0 && Number.isFinite(varK) ? Math.sqrt(varK) : NaN;
}

/** C_N in the multiple-scattering term for many equally spaced points (Gluckstern 1963; PDG 0.016 ≈ 0.0136 √1.43). */
export const MS_GLUCKSTERN_FACTOR = 1.43;

/**
 * Curvature error [1/m] from multiple scattering in the tracking volume, Gluckstern 1963 as
 * carried by the PDG detector review:
 *   σ(κ)_MS = (0.0136 GeV/c · |z| / (β p cos²λ)) · √(C_N / (L X₀)),  C_N = 1.43,
 * i.e. the PDG's 0.016 GeV/c · |z| √(L/X₀) / (L β p cos²λ) (constant 0.016 recalled, (memory)).
 * Uses the Highland constant without its logarithmic term (common practice for this estimate,
 * ≈ 10 %). p [GeV/c], L and X₀ [m], dip angle λ [rad].
 */
export function multipleScatteringCurvatureSigma(input: {
  readonly momentumGeV: number; readonly beta: number; readonly charge?: number;
  readonly lengthM: number; readonly radiationLengthM: number; readonly dipAngleRad?: number;
}): number {
  const { momentumGeV, beta, lengthM, radiationLengthM: x0 } = input;
  const z = Math.abs(input.charge ?? 1);
  const c = Math.cos(input.dipAngleRad ?? 0);
  if (!(momentumGeV > 0 && beta > 0 && beta <= 1 && lengthM > 0 && x0 > 0)) {
    throw msg.badArgument('momentumGeV/beta/lengthM/radiationLengthM', [momentumGeV, beta, lengthM, x0], 'positive values with β ≤ 1');
  }
  return ((0.0136 * z) / (beta * momentumGeV * c * c)) * Math.sqrt(MS_GLUCKSTERN_FACTOR / (lengthM * x0));
}

export interface MomentumResolutionInput {
  /** Momentum p [GeV/c] (transverse to B for the bend; p = p_T when λ = 0). */
  readonly momentumGeV: number;
  /** β of the particle; defaults to 1. */
  readonly beta?: number;
  readonly charge?: number;
  /** B_z [T], signed along +z as everywhere in Sagitta (only |B| matters here). */
  readonly fieldT: number;
  /** Projected track length L [m]. */
  readonly lengthM: number;
  /** Point error σ [m]. */
  readonly sigmaM: number;
  /** Number of equally spaced points (ignored when positionsM is given). */
  readonly nPoints?: number;
  /** Point positions along the chord [m] for uneven spacing: exact least-squares term. */
  readonly positionsM?: Float64Array;
  /** Material the track crosses over its length; omit for vacuum (no MS term). */
  readonly material?: Material;
}

export interface MomentumResolution {
  /** σ(p)/p from the point errors. */
  readonly measurement: number;
  /** σ(p)/p from multiple scattering. */
  readonly multipleScattering: number;
  /** Quadrature sum. */
  readonly total: number;
}

/**
 * Fractional momentum resolution σ(p)/p split into its measurement and multiple-scattering
 * terms (PDG RPP detector review; Gluckstern 1963). The measurement term uses the exact
 * least-squares curvature error (`curvatureSigmaLeastSquares` for given positions, else
 * `curvatureSigmaEquallySpaced`), the MS term `multipleScatteringCurvatureSigma` with the
 * material's X₀ as a length. Valid for small sagitta (L ≪ R); total = √(meas² + ms²).
 * @example momentumResolution({ momentumGeV: 1, fieldT: 1, lengthM: 1, sigmaM: 1e-4, nPoints: 10, material: material('argon-gas') })
 */
export function momentumResolution(input: MomentumResolutionInput): MomentumResolution {
  const { momentumGeV, fieldT, lengthM, sigmaM } = input;
  const z = Math.abs(input.charge ?? 1);
  const beta = input.beta ?? 1;
  if (!Number.isFinite(fieldT) || fieldT === 0) throw msg.badArgument('fieldT', fieldT, 'a non-zero magnetic field in tesla (signed along +z)');
  if (!(momentumGeV > 0)) throw msg.badArgument('momentumGeV', momentumGeV, 'a positive momentum in GeV/c');
  const sigmaKMeas = input.positionsM
    ? curvatureSigmaLeastSquares(input.positionsM, sigmaM)
    : curvatureSigmaEquallySpaced({ nPoints: input.nPoints ?? 10, sigmaM, lengthM });
  const toFraction = momentumGeV / (GEV_PER_TESLA_METRE * z * Math.abs(fieldT));
  const measurement = sigmaKMeas * toFraction;
  const multipleScattering = input.material
    ? multipleScatteringCurvatureSigma({ momentumGeV, beta, charge: z, lengthM, radiationLengthM: radiationLengthM(input.material) }) * toFraction
    : 0;
  return Object.freeze({ measurement, multipleScattering, total: Math.hypot(measurement, multipleScattering) });
}

function checkGeometry(n: number, sigmaM: number, lengthM: number): void {
  if (!Number.isInteger(n) || n < 3) throw msg.badArgument('nPoints', n, 'an integer ≥ 3');
  if (!(sigmaM > 0)) throw msg.badArgument('sigmaM', sigmaM, 'a positive point error in metres');
  if (!(lengthM > 0)) throw msg.badArgument('lengthM', lengthM, 'a positive track length in metres');
}

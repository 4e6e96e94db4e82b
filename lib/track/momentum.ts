import { GEV_PER_TESLA_METRE } from '../constants.js';
import { msg } from '../errors.js';
import type { CircleFitColumns } from '../fit/circleFit.js';
import type { HelixFitColumns } from '../fit/fitHelices.js';

/**
 * Momentum and charge from curvature, with errors from the fit covariance.
 *
 * Transverse momentum: p_T [GeV/c] = 0.299792458 · |z| · B [T] · R [m] (from F = q v × B with
 * exact c; common practice). Total momentum p = p_T / cos λ = p_T·√(1 + tan²λ); components at
 * the reference point p_x = p_T cos φ0, p_y = p_T sin φ0, p_z = p_T tan λ.
 *
 * Charge sign convention: with B along +z, a positive particle turns clockwise seen from +z
 * (F = q v × B: v = x̂, B = ẑ gives a force along −ŷ, to the right of travel). Our κ is positive
 * for counter-clockwise turning, so sign(q) = −sign(κ)·sign(B_z). It relies on the hits of a
 * track being in travel order.
 *
 * Errors: σ(p_T)/p_T = σ(κ)/|κ|; σ(p) from κ and tan λ with their correlation (first order).
 * These are the fit's statistical errors; the measurement/multiple-scattering budget for a
 * chamber medium comes from `lib/track/resolution`.
 */
export interface MomentumColumns {
  readonly count: number;
  /** Charge in units of e: ±|z|, NaN where the fit failed. */
  readonly charge: Float64Array;
  readonly radiusM: Float64Array;
  readonly ptGeV: Float64Array;
  readonly pGeV: Float64Array;
  readonly pxGeV: Float64Array;
  readonly pyGeV: Float64Array;
  readonly pzGeV: Float64Array;
  readonly tanLambda: Float64Array;
  readonly sigmaPtGeV: Float64Array;
  readonly sigmaPGeV: Float64Array;
  /** |κ|/σ(κ): below ~3 the charge sign is not established. */
  readonly curvatureSignificance: Float64Array;
}

export interface MomentumOptions {
  /** |z| of the particle, default 1. */
  readonly chargeMagnitude?: number;
}

/** One track's momentum, as `momentumAt` returns it. */
export type TrackMomentum = { readonly [K in Exclude<keyof MomentumColumns, 'count'>]: number };

function isHelix(f: CircleFitColumns | HelixFitColumns): f is HelixFitColumns {
  return (f as HelixFitColumns).circle !== undefined;
}

/**
 * Momenta of all fitted tracks in a field B_z = `fieldT` [T] (signed: negative when the field
 * points along −z). Circle-only fits measure p_T alone: p, p_z, tan λ and σ(p) are NaN then
 * (never p = p_T, which would claim a dip of zero).
 * Valid wherever the track is a helix in a uniform field; no energy-loss correction.
 * @example momenta(fits, 1.5).ptGeV[0] // for R = 2 m: 0.8994 GeV/c
 */
export function momenta(fits: CircleFitColumns | HelixFitColumns, fieldT: number, options: MomentumOptions = {}): MomentumColumns {
  if (!Number.isFinite(fieldT) || fieldT === 0) throw msg.badArgument('fieldT', fieldT, 'a non-zero magnetic field in tesla (signed along +z)');
  const z = options.chargeMagnitude ?? 1;
  if (!(z > 0)) throw msg.badArgument('chargeMagnitude', z, 'a positive charge number |z|');
  const circle = isHelix(fits) ? fits.circle : fits;
  const helix = isHelix(fits) ? fits : undefined;
  const n = circle.count;
  const out: MomentumColumns = {
    count: n,
    charge: new Float64Array(n), radiusM: new Float64Array(n), ptGeV: new Float64Array(n), pGeV: new Float64Array(n),
    pxGeV: new Float64Array(n), pyGeV: new Float64Array(n), pzGeV: new Float64Array(n), tanLambda: new Float64Array(n),
    sigmaPtGeV: new Float64Array(n), sigmaPGeV: new Float64Array(n), curvatureSignificance: new Float64Array(n),
  };
  const k0 = GEV_PER_TESLA_METRE * z * Math.abs(fieldT);
  const bSign = Math.sign(fieldT);
  for (let k = 0; k < n; k++) {
    const kappa = circle.kappa[k];
    const vkk = circle.cov[6 * k];
    const t = helix ? helix.tanLambda[k] : 0;
    const absK = Math.abs(kappa);
    const pt = k0 / absK;
    const sec = Math.sqrt(1 + t * t);
    const p = pt * sec;
    const phi = circle.phi0[k];
    out.charge[k] = Number.isFinite(kappa) ? (kappa === 0 ? 0 : -Math.sign(kappa) * bSign * z) : NaN;
    out.radiusM[k] = 1 / absK;
    out.ptGeV[k] = pt;
    out.pGeV[k] = helix ? p : NaN;
    out.pxGeV[k] = pt * Math.cos(phi);
    out.pyGeV[k] = pt * Math.sin(phi);
    out.pzGeV[k] = helix ? pt * t : NaN;
    out.tanLambda[k] = helix ? t : NaN;
    out.sigmaPtGeV[k] = (pt * Math.sqrt(vkk)) / absK;
    if (helix) {
      // Covariance entries of (κ, tanλ): upper-triangle indices 0 (κκ), 4 (κ·tanλ), 14 (tanλ·tanλ).
      const c = 15 * k;
      const vtt = helix.cov[c + 14], vkt = helix.cov[c + 4];
      const dk = -p / kappa, dt = (p * t) / (1 + t * t);
      out.sigmaPGeV[k] = Math.sqrt(dk * dk * vkk + dt * dt * vtt + 2 * dk * dt * vkt);
    } else {
      out.sigmaPGeV[k] = NaN;
    }
    out.curvatureSignificance[k] = absK / Math.sqrt(vkk);
  }
  return out;
}

/** Track k of the columns as a plain object. */
export function momentumAt(m: MomentumColumns, k: number): TrackMomentum {
  return Object.freeze({
    charge: m.charge[k], radiusM: m.radiusM[k], ptGeV: m.ptGeV[k], pGeV: m.pGeV[k], pxGeV: m.pxGeV[k], pyGeV: m.pyGeV[k],
    pzGeV: m.pzGeV[k], tanLambda: m.tanLambda[k], sigmaPtGeV: m.sigmaPtGeV[k], sigmaPGeV: m.sigmaPGeV[k],
    curvatureSignificance: m.curvatureSignificance[k],
  });
}

/**
 * Transverse momentum [GeV/c] of a particle of charge number |z| on radius `radiusM` [m] in
 * `fieldT` [T]: p_T = 0.299792458·|z|·B·R (common practice; exact c, CODATA).
 * @example transverseMomentumGeV(1.5, 2) // 0.899377374
 */
export function transverseMomentumGeV(fieldT: number, radiusM: number, chargeMagnitude = 1): number {
  return GEV_PER_TESLA_METRE * Math.abs(chargeMagnitude) * Math.abs(fieldT) * Math.abs(radiusM);
}

/** Radius of curvature [m] of transverse momentum `ptGeV` [GeV/c] in `fieldT` [T] — the inverse of the above. */
export function radiusOfCurvatureM(ptGeV: number, fieldT: number, chargeMagnitude = 1): number {
  return Math.abs(ptGeV) / (GEV_PER_TESLA_METRE * Math.abs(chargeMagnitude) * Math.abs(fieldT));
}

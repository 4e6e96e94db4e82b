import { cachedRange, cachedRangeAt, type CachedRange } from '../../matter/rangeIntegral.js';
import { chamberMedium } from '../../matter/chamberMedium.js';
import { bohrVarianceMeV2 } from '../../matter/bohrStraggling.js';
import { radiationLengthM } from '../../matter/highland.js';
import type { Material } from '../../matter/materials.js';
import type { Particle } from '../../particles.js';
import { ELECTRON_MASS_MEV } from '../../constants.js';
import { rangeStragglingVariances } from '../../matter/rangeStraggling.js';

/**
 * What the track fit needs from lib/matter for one species in one material, prepared once:
 * the cached CSDA range table (`cachedRange`, the same one the chamber medium of the simulator
 * reads), Highland multiple scattering in steps (`chamberMedium(...).forSpecies(...).theta0Rad`,
 * with the stepwise increment that keeps Highland's log term right over a whole track) and
 * Bohr's straggling variance. Internal units: g/cm² for ranges, MeV for energies.
 */
export interface LossModel {
  readonly table: CachedRange;
  /** 1/(R[i+1] − R[i]) [cm²/g] of each cell of the table's ranges (the Hermite's divisions, done once). */
  readonly invCellWidth: Float64Array;
  /** g/cm² per metre of the material (ρ·100). */
  readonly gcm2PerM: number;
  readonly massMeV: number;
  /** |z| of the species. */
  readonly chargeAbs: number;
  /** θ₀ [rad] for a step (same signature as the medium's). */
  readonly theta0Rad: (momentumGeV: number, beta: number, stepM: number, pathBeforeM: number) => number;
  /** 1/X₀ [1/m] of the material, (0.0136 z)² [GeV²], ln z² (for the stepwise Highland term of `buildReference`), m² [GeV²]. */
  readonly radiationLengthsPerM: number;
  readonly highlandScaleSq: number;
  readonly lnChargeSq: number;
  readonly massGeVSq: number;
  /** Variance of the energy lost per metre [MeV²/m] (Bohr). */
  readonly stragglingMeV2PerM: number;
  /**
   * e± only (0 otherwise): variance of the relative momentum lost by bremsstrahlung per radiation
   * length, ln(4/3)/ln 2 ≈ 0.415 — the small-thickness limit of the Bethe–Heitler distribution
   * of z = E′/E, var z = 3^(−t/ln 2) − 4^(−t/ln 2) ≈ t ln(4/3)/ln 2 (Bethe & Heitler 1934; its
   * Gaussian use as process noise in track fits is common practice). Its mean is in the range table.
   */
  readonly radiativeVariancePerX0: number;
  /**
   * Heavy particles only (empty for e±): range-straggling variance [(g/cm²)²] from each node of
   * `table` to rest (`rangeStragglingVariances`), for the stop constraint.
   */
  readonly rangeStragglingVariance: Float64Array;
}

/** ln(4/3)/ln 2: the Bethe–Heitler variance of the relative energy loss per radiation length (thin layers). */
export const BETHE_HEITLER_VARIANCE_PER_X0 = Math.log(4 / 3) / Math.LN2;

const MODELS = new WeakMap<Material, Map<string, LossModel>>();

/** The loss model of `particle` in `material`, memoised per material object (a pure function of both). */
export function lossModel(material: Material, particle: Particle): LossModel {
  let byParticle = MODELS.get(material);
  if (!byParticle) {
    byParticle = new Map();
    MODELS.set(material, byParticle);
  }
  const key = `${particle.name}\u0000${particle.massMeV}\u0000${particle.charge}`;
  let m = byParticle.get(key);
  if (m) return m;
  const loss = chamberMedium(material).forSpecies(particle);
  const gcm2PerM = material.densityGcm3 * 100;
  const table = cachedRange(particle, material), r = table.csdaRangeGcm2;
  const invCellWidth = new Float64Array(Math.max(0, r.length - 1));
  const electron = Math.abs(particle.massMeV - ELECTRON_MASS_MEV) < 1e-6;
  for (let i = 0; i < invCellWidth.length; i++) invCellWidth[i] = 1 / (r[i + 1] - r[i]);
  m = Object.freeze({
    table,
    invCellWidth,
    gcm2PerM,
    massMeV: particle.massMeV,
    chargeAbs: Math.abs(particle.charge),
    theta0Rad: loss.theta0Rad,
    radiationLengthsPerM: 1 / radiationLengthM(material),
    highlandScaleSq: (0.0136 * particle.charge) ** 2,
    lnChargeSq: Math.log(particle.charge * particle.charge),
    massGeVSq: (particle.massMeV / 1000) ** 2,
    stragglingMeV2PerM: bohrVarianceMeV2(material.zOverA, particle.charge, gcm2PerM),
    radiativeVariancePerX0: electron ? BETHE_HEITLER_VARIANCE_PER_X0 : 0,
    rangeStragglingVariance: electron ? new Float64Array(0) : rangeStragglingVariances(table, particle, material),
  });
  byParticle.set(key, m);
  return m;
}

/** CSDA range [g/cm²] at kinetic energy T [MeV] (Infinity above the table). */
export function rangeAtKinetic(m: LossModel, kineticMeV: number): number {
  return cachedRangeAt(m.table, kineticMeV);
}

/**
 * Kinetic energy T [MeV] and stopping power S = dT/dR [MeV cm²/g] at residual range R [g/cm²],
 * written to out[0], out[1] (out[2] keeps the table cell as a hint for the next call; start it
 * at 0): the cubic Hermite of the cached table (value and slope), the
 * table's power law below its first node, and no loss (S = 0, T = top) above its last.
 */
export function kineticAndStoppingAtRange(m: LossModel, rangeGcm2: number, out: Float64Array): void {
  const c = m.table;
  const t = c.kineticEnergyMeV, s = c.stoppingPowerMeVcm2g, r = c.csdaRangeGcm2;
  const n = r.length;
  if (!(rangeGcm2 > 0)) { out[0] = 0; out[1] = Infinity; return; }
  if (rangeGcm2 <= r[0]) {
    // R ∝ T^k below node 0 with k = T₀/(R₀ S₀): T = T₀ (R/R₀)^(1/k), S = T/(k R).
    const k = t[0] / (r[0] * s[0]);
    const tt = t[0] * Math.pow(rangeGcm2 / r[0], 1 / k);
    out[0] = tt; out[1] = tt / (k * rangeGcm2);
    return;
  }
  if (rangeGcm2 >= r[n - 1]) { out[0] = t[n - 1]; out[1] = 0; return; }
  // Start from the cell of the previous call (out[2]): a track's ranges change slowly.
  let lo = out[2] | 0, hi = lo + 1;
  if (!(lo >= 0 && hi < n && r[lo] <= rangeGcm2 && rangeGcm2 < r[hi])) {
    if (lo >= 0 && hi < n - 1 && r[hi] <= rangeGcm2 && rangeGcm2 < r[hi + 1]) { lo = hi; hi = lo + 1; }
    else if (lo > 0 && hi < n && r[lo - 1] <= rangeGcm2 && rangeGcm2 < r[lo]) { hi = lo; lo = hi - 1; }
    else {
      lo = 0; hi = n - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (r[mid] <= rangeGcm2) lo = mid; else hi = mid;
      }
    }
  }
  out[2] = lo;
  const h = r[hi] - r[lo];
  const ih = m.invCellWidth[lo], u = (rangeGcm2 - r[lo]) * ih;
  const u2 = u * u, u3 = u2 * u;
  const y0 = t[lo], y1 = t[hi], d0 = s[lo], d1 = s[hi];
  out[0] = (2 * u3 - 3 * u2 + 1) * y0 + (u3 - 2 * u2 + u) * h * d0 + (-2 * u3 + 3 * u2) * y1 + (u3 - u2) * h * d1;
  out[1] = ((6 * u2 - 6 * u) * y0 + (-6 * u2 + 6 * u) * y1) * ih + (3 * u2 - 4 * u + 1) * d0 + (3 * u2 - 2 * u) * d1;
}

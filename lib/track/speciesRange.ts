import { BETHE_K_MEV_CM2_PER_MOL, ELECTRON_MASS_MEV } from '../constants.js';
import type { Particle } from '../particles.js';
import type { Material } from '../matter/materials.js';
import { rangeLookup, type RangeLookup } from '../matter/rangeLookup.js';
import { cachedEnergyAtCell, cachedRange } from '../matter/rangeIntegral.js';

/** Range ↔ momentum of one species in one material, in track units (metres, GeV/c). */
export interface SpeciesRange {
  readonly particle: Particle;
  readonly material: Material;
  /** Momentum [GeV/c] with CSDA range `rangeM` [m] left. */
  momentumGeV(rangeM: number): number;
  /** CSDA range [m] of momentum p [GeV/c]. */
  rangeM(momentumGeV: number): number;
  /**
   * Momenta [GeV/c] into `out` at path lengths `pathM` [m] (non-decreasing, a track's hits) of a
   * particle whose CSDA range ends at path `rangeEndM`: `momentumGeV(rangeEndM − pathM[i])`, the
   * table searched from hit to hit (the same numbers).
   */
  momentaAlong(rangeEndM: number, pathM: Float64Array, out: Float64Array): void;
  /** σ of the range [m] of a particle whose CSDA range is `rangeM` (straggling, see below). */
  rangeSigmaM(rangeM: number): number;
}

/** Relative spread of electron ranges (radiative straggling, not in Bohr's formula); 10 % (memory, order of magnitude). */
export const ELECTRON_RANGE_SPREAD = 0.1;
/** Relative accuracy of the range tables themselves in the Bethe region (lib/matter README: ≈ 1 %). */
export const RANGE_TABLE_ACCURACY = 0.01;

/**
 * CSDA range tables of lib/matter (`rangeLookup`, cached per species) in metres and GeV/c, plus
 * range straggling: σ_R² = ∫₀^R k_B / S(r)² dr with Bohr's energy-loss variance per areal density
 * k_B = K m_e c² z² ⟨Z/A⟩ (0.1569 z² Z/A MeV² cm²/g; Bohr 1915, `bohrVarianceMeV2`) and S = dT/dr
 * the mass stopping power along the path (the Gaussian range-straggling integral, common
 * practice; gives ≈ 1.1–1.3 % of the range for protons stopping in light media, cf. ICRU 49
 * (memory)). The table accuracy (1 %) is added in quadrature; for e± the radiative straggling
 * Bohr misses is stood in for by `ELECTRON_RANGE_SPREAD`. Research values; not for treatment planning.
 * @example speciesRange(PROTON, material('liquid-propane')).rangeM(0.4) // ≈ 0.16 m (memory)
 */
export function speciesRange(particle: Particle, material: Material): SpeciesRange {
  const look: RangeLookup = rangeLookup(particle, material);
  const gcm2PerM = 100 * material.densityGcm3;
  const kBohr = BETHE_K_MEV_CM2_PER_MOL * ELECTRON_MASS_MEV * particle.charge * particle.charge * material.zOverA;
  const electronLike = Math.abs(particle.massMeV - ELECTRON_MASS_MEV) < 1e-6;
  const momentumGeV = (rangeM: number) => (rangeM > 0 ? look.momentumMeV(rangeM * gcm2PerM) / 1000 : 0);
  const rangeM = (pGeV: number) => (pGeV > 0 ? look.rangeFromMomentumGcm2(pGeV * 1000) / gcm2PerM : 0);
  const table = cachedRange(particle, material), m = particle.massMeV, cell = new Int32Array(1);
  const momentaAlong = (rangeEndM: number, pathM: Float64Array, out: Float64Array): void => {
    for (let i = 0; i < pathM.length; i++) {
      const left = rangeEndM - pathM[i];
      if (!(left > 0)) { out[i] = 0; continue; }
      const t = cachedEnergyAtCell(table, left * gcm2PerM, cell);
      out[i] = t >= 0 ? Math.sqrt(t * (t + 2 * m)) / 1000 : NaN;
    }
  };
  const rangeSigmaM = (r: number): number => {
    if (!(r > 0)) return 0;
    const rg = r * gcm2PerM;
    const steps = 24;
    let v = 0;
    for (let i = 0; i < steps; i++) {
      const a = (i + 0.25) * rg / steps, b = (i + 0.75) * rg / steps;
      const s = (look.kineticEnergyMeV(b) - look.kineticEnergyMeV(a)) / (b - a);
      v += kBohr * (rg / steps) / (s * s);
    }
    const spread = electronLike ? ELECTRON_RANGE_SPREAD : 0;
    return Math.sqrt(v / (gcm2PerM * gcm2PerM) + (RANGE_TABLE_ACCURACY ** 2 + spread * spread) * r * r);
  };
  return Object.freeze({ particle, material, momentumGeV, rangeM, momentaAlong, rangeSigmaM });
}

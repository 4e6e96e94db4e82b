import { ELECTRON_MASS_MEV } from '../constants.js';
import type { Particle } from '../particles.js';
import type { Material } from '../matter/materials.js';
import { rangeLookup, type RangeLookup } from '../matter/rangeLookup.js';
import { cachedEnergyAtCell, cachedRange } from '../matter/rangeIntegral.js';
import { rangeStragglingGcm2 } from '../matter/rangeStraggling.js';

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
 * range straggling from lib/matter (`rangeStragglingGcm2`: Bohr's variance with its relativistic
 * factor over the CSDA table, ≈ 1.1 % of the range for protons stopping in light media). The
 * table accuracy (1 %) is added in quadrature; for e±, whose range is not Gaussian, a relative
 * spread stands in (`ELECTRON_RANGE_SPREAD`). Research values; not for treatment planning.
 * @example speciesRange(PROTON, material('liquid-propane')).rangeM(0.4) // ≈ 0.16 m (memory)
 */
export function speciesRange(particle: Particle, material: Material): SpeciesRange {
  const look: RangeLookup = rangeLookup(particle, material);
  const gcm2PerM = 100 * material.densityGcm3;
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
    const straggling = electronLike ? 0 : rangeStragglingGcm2(particle, material, look.kineticEnergyMeV(r * gcm2PerM)) / gcm2PerM;
    const spread = electronLike ? ELECTRON_RANGE_SPREAD : 0;
    return Math.sqrt(straggling * straggling + (RANGE_TABLE_ACCURACY ** 2 + spread * spread) * r * r);
  };
  return Object.freeze({ particle, material, momentumGeV, rangeM, momentaAlong, rangeSigmaM });
}

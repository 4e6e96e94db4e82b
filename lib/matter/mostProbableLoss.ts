import { BETHE_K_MEV_CM2_PER_MOL, ELECTRON_MASS_MEV } from '../constants.js';
import { msg } from '../errors.js';
import type { Particle } from '../particles.js';
import { warn } from '../warnings.js';
import { maxEnergyTransferMeV } from './bethe.js';
import { densityEffectDelta } from './densityEffect.js';
import type { Material } from './materials.js';

/** Landau–Vavilov validity: κ = ξ / T_max below this (Landau regime, common practice κ ≲ 0.01–0.05). */
export const LANDAU_MAX_KAPPA = 0.05;
/** The energy lost must stay a small part of T for a fixed-βγ formula (common practice). */
export const LANDAU_MAX_LOSS_FRACTION = 0.1;

export interface MostProbableLoss {
  /** Most probable energy loss Δp in the layer [MeV]. */
  readonly mostProbableMeV: number;
  /** Landau width parameter ξ [MeV]; the FWHM of the straggling function is ≈ 4ξ (PDG). */
  readonly xiMeV: number;
  /** κ = ξ / T_max, the Vavilov parameter. */
  readonly kappa: number;
}

/**
 * Most probable energy loss of a charged particle in a layer of `thicknessGcm2` [g/cm²], the
 * Landau–Vavilov form of the PDG RPP ("Passage of particles through matter", fluctuations in
 * energy loss; Bichsel, Rev. Mod. Phys. 60 (1988) 663):
 *
 *   Δp = ξ [ ln(2 m_e c² β²γ² / I) + ln(ξ / I) + j − β² − δ(βγ) ],  j = 0.200,
 *   ξ = (K/2) ⟨Z/A⟩ z² x / β²  [MeV, x in g/cm²].
 *
 * Chamber and silicon tracks show Δp, not the mean: Δp/x grows like ln x and sits well below
 * ⟨dE/dx⟩. Valid when κ = ξ/T_max < 0.05 and Δp < 10 % of T; heavy particles only (βγ ≥ 0.045).
 * Outside: NaN fields and an 'OUTSIDE_VALIDITY' warning.
 * @example mostProbableEnergyLoss(PION_PLUS, material('silicon'), 500, 0.0699).mostProbableMeV // ≈ 0.078
 */
export function mostProbableEnergyLoss(particle: Particle, material: Material, kineticEnergyMeV: number, thicknessGcm2: number): MostProbableLoss {
  if (particle.charge === 0) throw msg.badArgument('particle', particle.name, 'a charged particle');
  if (!(thicknessGcm2 > 0)) throw msg.badArgument('thicknessGcm2', thicknessGcm2, 'a positive thickness in g/cm²');
  const m = particle.massMeV;
  const t = kineticEnergyMeV;
  const bg2 = (t * (t + 2 * m)) / (m * m);
  const beta2 = bg2 / (1 + bg2);
  const z = particle.charge;
  const xi = (0.5 * BETHE_K_MEV_CM2_PER_MOL * material.zOverA * z * z * thicknessGcm2) / beta2;
  const tmax = maxEnergyTransferMeV(m, Math.sqrt(bg2));
  const kappa = xi / tmax;
  const nan = Object.freeze({ mostProbableMeV: NaN, xiMeV: xi, kappa });
  if (!(bg2 >= 0.045 * 0.045) || Math.abs(m - ELECTRON_MASS_MEV) < 1e-9 || !(kappa < LANDAU_MAX_KAPPA)) {
    warn('OUTSIDE_VALIDITY', `mostProbableEnergyLoss: ${particle.name} at T = ${t} MeV through ${thicknessGcm2} g/cm² has κ = ${kappa.toPrecision(3)} (needs < ${LANDAU_MAX_KAPPA}, heavy particle, βγ ≥ 0.045); result is NaN`, 'mostProbableEnergyLoss');
    return nan;
  }
  const iMeV = material.meanExcitationEV * 1e-6;
  const delta = densityEffectDelta(material.densityEffect, Math.sqrt(bg2));
  const dp = xi * (Math.log((2 * ELECTRON_MASS_MEV * bg2) / iMeV) + Math.log(xi / iMeV) + 0.2 - beta2 - delta);
  if (!(dp < LANDAU_MAX_LOSS_FRACTION * t)) {
    warn('OUTSIDE_VALIDITY', `mostProbableEnergyLoss: Δp = ${dp.toPrecision(3)} MeV is more than ${LANDAU_MAX_LOSS_FRACTION * 100} % of T = ${t} MeV; use a thinner layer or step through the range table; result is NaN`, 'mostProbableEnergyLoss');
    return nan;
  }
  return Object.freeze({ mostProbableMeV: dp, xiMeV: xi, kappa });
}

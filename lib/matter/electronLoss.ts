import { AVOGADRO_PER_MOL, BETHE_K_MEV_CM2_PER_MOL, CLASSICAL_ELECTRON_RADIUS_CM, ELECTRON_MASS_MEV, FINE_STRUCTURE } from '../constants.js';
import type { Particle } from '../particles.js';
import { densityEffectDelta } from './densityEffect.js';
import { type Material, zz1OverA } from './materials.js';
import { warnOutside } from './bethe.js';

/** Validity of the electron/positron formulas [MeV] (ICRU 37 collision formula: ≥ 10 keV). */
export const ELECTRON_MIN_MEV = 0.01;
export const ELECTRON_MAX_MEV = 10_000;
const LN2 = Math.LN2;
const HALF_K = BETHE_K_MEV_CM2_PER_MOL / 2;
/** 4 α r_e² N_A [cm²/mol], the bremsstrahlung prefactor. */
const BREMS_COEFF = 4 * FINE_STRUCTURE * CLASSICAL_ELECTRON_RADIUS_CM ** 2 * AVOGADRO_PER_MOL;

/**
 * Collision mass stopping power of electrons or positrons [MeV cm²/g], ICRU Report 37 (1984)
 * eq. 2.2 with the Møller (e⁻) and Bhabha (e⁺) functions F∓(τ), as in Berger & Seltzer's form
 * used by NIST ESTAR:
 *
 *   S_col = (K/2) ⟨Z/A⟩ (1/β²) [ ln(τ²(τ+2) / (2 (I/m_e c²)²)) + F∓(τ) − δ ]
 *   F⁻ = 1 − β² + [τ²/8 − (2τ+1) ln2] / (τ+1)²
 *   F⁺ = 2 ln2 − (β²/12) [23 + 14/(τ+2) + 10/(τ+2)² + 4/(τ+2)³],  τ = T / m_e c².
 *
 * Valid 10 keV – 10 GeV (ICRU 37 quotes 1–2 % above 100 keV, 2–3 % at 10–100 keV for low Z).
 * Outside: NaN and an 'OUTSIDE_VALIDITY' warning.
 * @example electronCollisionStoppingPower(ELECTRON, material('water'), 1) // ≈ 1.84 (ESTAR 1.849)
 */
export function electronCollisionStoppingPower(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  const t = kineticEnergyMeV;
  if (!(t >= ELECTRON_MIN_MEV && t <= ELECTRON_MAX_MEV)) {
    warnOutside('electronCollisionStoppingPower', particle, t, `${ELECTRON_MIN_MEV}–${ELECTRON_MAX_MEV} MeV`);
    return NaN;
  }
  const tau = t / ELECTRON_MASS_MEV;
  const gamma = tau + 1;
  const beta2 = 1 - 1 / (gamma * gamma);
  const iRatio = (material.meanExcitationEV * 1e-6) / ELECTRON_MASS_MEV;
  let f: number;
  if (particle.charge < 0) {
    f = 1 - beta2 + ((tau * tau) / 8 - (2 * tau + 1) * LN2) / (gamma * gamma);
  } else {
    const y = tau + 2;
    f = 2 * LN2 - (beta2 / 12) * (23 + 14 / y + 10 / (y * y) + 4 / (y * y * y));
  }
  const delta = densityEffectDelta(material.densityEffect, Math.sqrt(tau * (tau + 2)));
  const bracket = Math.log((tau * tau * (tau + 2)) / (2 * iRatio * iRatio)) + f - delta;
  return ((HALF_K * material.zOverA) / beta2) * bracket;
}

/** Σ wZ(Z+1)/A per material, computed once (materials are frozen). */
const BREMS_WEIGHT = new WeakMap<Material, number>();
function bremsWeight(material: Material): number {
  let w = BREMS_WEIGHT.get(material);
  if (w === undefined) {
    w = zz1OverA(material);
    BREMS_WEIGHT.set(material, w);
  }
  return w;
}

/**
 * Radiative (bremsstrahlung) mass stopping power of e± [MeV cm²/g]. Approximation (stated):
 * the smaller of
 *  - the unscreened Bethe–Heitler result, S = 4 α r_e² N_A Σ wZ(Z+1)/A · E [ln(2E/m_e c²) − 1/3]
 *    (Heitler, "The Quantum Theory of Radiation", 3rd ed., §25, form recalled (memory) and checked
 *    against ESTAR; Z(Z+1) counts electron–electron bremsstrahlung, common practice), right for m_e c² ≲ E ≪ 137 m_e c² Z^−1/3, and
 *  - the complete-screening limit S = E / X₀ (PDG RPP, definition of X₀), right for E ≫ that.
 * E is the total energy. Accuracy against NIST ESTAR (water): ≈ 1 % at 1 MeV, up to ≈ 20 % high
 * in the screening transition (≈ 5–500 MeV); radiative loss is a small part of the total below
 * ~10 MeV in light materials, so the total stays within a few per cent there.
 * Valid 10 keV – 10 GeV; outside: NaN and a warning.
 * @example electronRadiativeStoppingPower(ELECTRON, material('water'), 1) // ≈ 0.0128 (ESTAR 0.01280)
 */
export function electronRadiativeStoppingPower(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  const t = kineticEnergyMeV;
  if (!(t >= ELECTRON_MIN_MEV && t <= ELECTRON_MAX_MEV)) {
    warnOutside('electronRadiativeStoppingPower', particle, t, `${ELECTRON_MIN_MEV}–${ELECTRON_MAX_MEV} MeV`);
    return NaN;
  }
  const e = t + ELECTRON_MASS_MEV;
  const unscreened = BREMS_COEFF * bremsWeight(material) * e * (Math.log((2 * e) / ELECTRON_MASS_MEV) - 1 / 3);
  const screened = e / material.radiationLengthGcm2;
  return Math.min(unscreened, screened);
}

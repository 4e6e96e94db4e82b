import { ATOMIC_MASS_UNIT_MEV } from '../constants.js';

/**
 * Squared effective charge of a helium ion (z = 2) moving through a medium of atomic number Z₂,
 * the fit of J.F. Ziegler, J.P. Biersack and U. Littmark, "The Stopping and Range of Ions in
 * Solids" (Pergamon 1985), ch. 3 (coefficients recalled, (memory)); E in keV per atomic mass unit:
 *
 *   γ_He² = 1 − exp(−Σᵢ₌₀⁵ cᵢ (ln E)ⁱ),  c = 0.2865, 0.1266, −0.001429, 0.02402, −0.01135, 0.001475
 *   z_eff² = 4 γ_He² [1 + (0.007 + 0.00005 Z₂) exp(−(7.6 − ln E)²)]²
 *
 * The helium stopping power is then z_eff²·S_p at the same velocity (S_p the proton electronic
 * stopping). Tends to 4 above ~1 MeV/u; at 0.1 MeV/u (α of 0.4 MeV) it is ≈ 2.7. E below
 * 1 keV/u is treated as 1 keV/u.
 * @example heliumEffectiveChargeSquared(3727.379, 2, 8) // ≈ 3.89 (2 MeV α in oxygen)
 */
export function heliumEffectiveChargeSquared(massMeV: number, kineticEnergyMeV: number, targetZ: number): number {
  const keVPerU = Math.max(1, (kineticEnergyMeV * 1000) / (massMeV / ATOMIC_MASS_UNIT_MEV));
  const l = Math.log(keVPerU);
  const c = [0.2865, 0.1266, -0.001429, 0.02402, -0.01135, 0.001475];
  let x = c[0];
  let p = 1;
  for (let i = 1; i < 6; i++) {
    p *= l;
    x += c[i] * p;
  }
  const w = 7.6 - l;
  const z2Term = 1 + (0.007 + 0.00005 * targetZ) * Math.exp(-w * w);
  return 4 * (1 - Math.exp(-x)) * z2Term * z2Term;
}

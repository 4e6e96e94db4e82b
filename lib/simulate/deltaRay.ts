import { BETHE_K_MEV_CM2_PER_MOL, ELECTRON_MASS_MEV } from '../constants.js';

/**
 * Knock-on electrons (δ rays). Source: PDG Review of Particle Physics, "Passage of particles
 * through matter" (section on δ rays; equation numbers change between editions): the spectrum
 * d²N/dT dx = ½ K z² (Z/A) (1/β²) F(T)/T² for I ≪ T ≤ W_max (here F = 1, the spin-0 form), and the emission angle cos θ = (T/p_e)(p_max/T_max). The largest
 * transfer W_max is `maxEnergyTransferMeV` of lib/matter.
 */

/**
 * Mean number of δ rays per metre with kinetic energy in [minKineticMeV, maxKineticMeV], for a
 * particle of charge number `charge` and velocity `beta` in a medium of `zOverA` [mol/g] and
 * `densityGPerCm3`: ½ K z² (Z/A) ρ /β² · (1/T_min − 1/T_max) per cm, × 100 per metre.
 * Valid for T_min well above the mean excitation energy (≳ 10 keV) and T ≪ W_max (F = 1).
 * Source: PDG RPP "Passage of particles through matter", δ-ray section.
 * @example deltaRayRatePerM(0.99212, 0.0708, 1, 1, 1, 100) // ≈ 1.07 per metre in liquid hydrogen above 1 MeV
 */
export function deltaRayRatePerM(
  zOverA: number,
  densityGPerCm3: number,
  charge: number,
  beta: number,
  minKineticMeV: number,
  maxKineticMeV: number,
): number {
  if (!(maxKineticMeV > minKineticMeV)) return 0;
  const perCm = 0.5 * BETHE_K_MEV_CM2_PER_MOL * charge * charge * zOverA * densityGPerCm3 / (beta * beta)
    * (1 / minKineticMeV - 1 / maxKineticMeV);
  return 100 * perCm;
}

/**
 * Samples a δ-ray kinetic energy [MeV] from dN/dT ∝ 1/T² on [minKineticMeV, maxKineticMeV]
 * by inversion, given a uniform number u in [0, 1).
 */
export function sampleDeltaRayKineticMeV(u: number, minKineticMeV: number, maxKineticMeV: number): number {
  const a = 1 / minKineticMeV, b = 1 / maxKineticMeV;
  return 1 / (a - u * (a - b));
}

/**
 * Cosine of the δ-ray emission angle to the parent's direction: cos θ = (T/p_e)(p_max/T_max),
 * with p_e, p_max the electron momenta at T and at T_max = W_max (two-body kinematics on a free
 * electron at rest; PDG RPP "Passage of particles through matter").
 */
export function deltaRayCosTheta(kineticMeV: number, maxTransferMeV: number): number {
  const m = ELECTRON_MASS_MEV;
  const pe = Math.sqrt(kineticMeV * (kineticMeV + 2 * m));
  const pmax = Math.sqrt(maxTransferMeV * (maxTransferMeV + 2 * m));
  return Math.min(1, (kineticMeV / pe) * (pmax / maxTransferMeV));
}

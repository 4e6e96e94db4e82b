import { BETHE_K_MEV_CM2_PER_MOL, ELECTRON_MASS_MEV } from '../constants.js';

/**
 * Variance of the energy loss [MeV²] over a path of `pathGPerCm2` [g/cm²] in the Gaussian (thick
 * absorber) limit, Bohr's formula: σ² = 4π N_A r_e² (m_e c²)² z² (Z/A) ρx = K m_e c² z² (Z/A) ρx,
 * i.e. 0.1569 z² (Z/A) ρx MeV² (N. Bohr, Phil. Mag. 30 (1915) 581; as given in W. R. Leo,
 * "Techniques for Nuclear and Particle Physics Experiments", 2nd ed., §2.7 (memory)). Without
 * the relativistic factor (1 − β²/2)/(1 − β²), so it underestimates straggling of fast particles;
 * valid when many collisions contribute (loss ≫ W_max), i.e. for the thick-absorber end of a
 * stopping track. Used for the optional straggling of the simulator.
 * @example bohrVarianceMeV2(0.99212, 1, 10) // ≈ 1.557 (10 g/cm² of hydrogen, z = 1)
 */
export function bohrVarianceMeV2(zOverA: number, charge: number, pathGPerCm2: number): number {
  return BETHE_K_MEV_CM2_PER_MOL * ELECTRON_MASS_MEV * charge * charge * zOverA * pathGPerCm2;
}

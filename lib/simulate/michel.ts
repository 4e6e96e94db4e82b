import { ELECTRON_MASS_MEV } from '../constants.js';
import type { SeededRandom } from './rng.js';

/**
 * Largest total energy [MeV] of the electron from muon decay at rest:
 * W = (m_μ² + m_e²) / 2m_μ = 52.83 MeV (two-body limit of μ → eνν̄; PDG RPP "Muon decay
 * parameters").
 */
export function michelMaxEnergyMeV(muonMassMeV: number): number {
  return (muonMassMeV * muonMassMeV + ELECTRON_MASS_MEV * ELECTRON_MASS_MEV) / (2 * muonMassMeV);
}

/**
 * Samples x = E/W of the decay electron of a muon at rest from the Michel spectrum with the
 * Standard-Model parameter ρ = 3/4, integrated over angles and neglecting m_e:
 * dΓ/dx ∝ x²(3 − 2x) on [0, 1] (Michel, Proc. Phys. Soc. A63 (1950) 514; PDG RPP "Muon decay
 * parameters"). Rejection sampling under the maximum 1 at x = 1 (acceptance 1/2).
 * Radiative corrections and the muon polarisation (which tilts the angular distribution) are
 * not modelled. Mean of the distribution: 0.7.
 */
export function sampleMichelFraction(rng: SeededRandom): number {
  for (;;) {
    const x = rng.uniform();
    if (rng.uniform() < x * x * (3 - 2 * x)) return x;
  }
}

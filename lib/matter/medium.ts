import type { Particle } from '../particles.js';

/**
 * What the transport needs to know about the chamber medium for one species. The simulator does
 * not compute energy loss itself: `chamberMedium(name)` fills this from lib/matter (Bethe with
 * density effect, CSDA range, Highland), and `VACUUM` turns every effect off. Tests and users may
 * supply their own implementation (e.g. a constant dE/dx) to isolate one effect.
 *
 * Internal units: lengths in metres, kinetic energies in MeV, momenta in GeV/c.
 */
export interface SpeciesLoss {
  /** Mean CSDA range [m] at kinetic energy `kineticMeV`; Infinity when there is no loss. */
  rangeM(kineticMeV: number): number;
  /** Inverse of `rangeM`: kinetic energy [MeV] whose CSDA range is `rangeM` metres. */
  kineticFromRangeM(rangeM: number): number;
  /** Variance of the energy lost per metre of path [MeV²/m] (Gaussian straggling); 0 for none. */
  readonly stragglingVarianceMeV2PerM: number;
  /**
   * Width θ₀ [rad] of the projected multiple-scattering angle to apply for a step of `stepM`
   * metres at momentum `momentumGeV` and velocity `beta`, when the track has already travelled
   * `pathBeforeM` metres (models whose θ₀² is not additive, like Highland's, need it); 0 for none.
   */
  theta0Rad(momentumGeV: number, beta: number, stepM: number, pathBeforeM: number): number;
}

/** A chamber medium: a name for outputs and the per-species loss model. */
export interface Medium {
  readonly name: string;
  /** Density [g/cm³], for outputs; 0 for vacuum. */
  readonly densityGPerCm3: number;
  /** Radiation length [m]; Infinity for vacuum. */
  readonly radiationLengthM: number;
  /** Ratio Z/A of the medium [mol/g] (electrons per nucleon); 0 for vacuum. */
  readonly zOverA: number;
  /** The loss model of one species (implementations cache per species). */
  forSpecies(species: Particle): SpeciesLoss;
}

const NO_LOSS: SpeciesLoss = Object.freeze({
  rangeM: () => Infinity,
  kineticFromRangeM: () => Infinity,
  stragglingVarianceMeV2PerM: 0,
  theta0Rad: () => 0,
});

/** No energy loss, no scattering: tracks are exact helices (used for the analytic-helix check). */
export const VACUUM: Medium = Object.freeze({
  name: 'vacuum',
  densityGPerCm3: 0,
  radiationLengthM: Infinity,
  zOverA: 0,
  forSpecies: () => NO_LOSS,
});

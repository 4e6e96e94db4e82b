import { ELECTRON_MASS_MEV } from '../constants.js';
import { msg } from '../errors.js';
import type { Particle } from '../particles.js';
import { betheStoppingPower } from './bethe.js';
import { electronCollisionStoppingPower, electronRadiativeStoppingPower } from './electronLoss.js';
import type { Material } from './materials.js';

/** True for e⁻ and e⁺ (by mass), which take the ICRU 37 formulas instead of Bethe. */
export function isElectronLike(particle: Particle): boolean {
  return Math.abs(particle.massMeV - ELECTRON_MASS_MEV) < 1e-9;
}

function checkCharged(particle: Particle): void {
  if (particle.charge === 0) throw msg.badArgument('particle', particle.name, 'a charged particle (neutral particles do not lose energy by ionisation)');
}

/**
 * Mean total mass stopping power [MeV cm²/g] of `particle` at kinetic energy T [MeV]:
 *  - heavy particles: electronic stopping power, Bethe formula (`betheStoppingPower`), valid
 *    βγ 0.045–1000 (proton 0.95 MeV – 937 GeV);
 *  - e±: collision (ICRU 37) + radiative (stated approximation), valid 10 keV – 10 GeV.
 * Nuclear stopping is neglected (below 0.1 % of the total above 1 MeV for protons, PSTAR).
 * Outside validity: NaN and a collected 'OUTSIDE_VALIDITY' warning. A neutral particle is a bad
 * call (BAD_ARGUMENT).
 * @example massStoppingPower(PROTON, material('water'), 100) // ≈ 7.29 (PSTAR 7.289)
 */
export function massStoppingPower(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  checkCharged(particle);
  if (isElectronLike(particle)) {
    return electronCollisionStoppingPower(particle, material, kineticEnergyMeV) + electronRadiativeStoppingPower(particle, material, kineticEnergyMeV);
  }
  return betheStoppingPower(particle, material, kineticEnergyMeV);
}

/** Collision (electronic) part only [MeV cm²/g]; same validity as `massStoppingPower`. */
export function collisionStoppingPower(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  checkCharged(particle);
  return isElectronLike(particle)
    ? electronCollisionStoppingPower(particle, material, kineticEnergyMeV)
    : betheStoppingPower(particle, material, kineticEnergyMeV);
}

/** Radiative part [MeV cm²/g]: the e± bremsstrahlung approximation; 0 for heavy particles in the Bethe range. */
export function radiativeStoppingPower(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  checkCharged(particle);
  return isElectronLike(particle) ? electronRadiativeStoppingPower(particle, material, kineticEnergyMeV) : 0;
}

/** Linear stopping power [MeV/cm] = mass stopping power × density. */
export function linearStoppingPower(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  return massStoppingPower(particle, material, kineticEnergyMeV) * material.densityGcm3;
}

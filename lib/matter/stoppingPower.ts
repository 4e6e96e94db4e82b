import { ELECTRON_MASS_MEV } from '../constants.js';
import { msg } from '../errors.js';
import type { Particle } from '../particles.js';
import { warn } from '../warnings.js';
import { BETHE_MAX_BETA_GAMMA, kineticRangeText, warnOutside } from './bethe.js';
import { hasLowEnergyFit, heavyElectronicStopping, stoppingRegime } from './electronicStopping.js';
import { electronCollisionStoppingPower, electronRadiativeStoppingPower } from './electronLoss.js';
import type { Material } from './materials.js';
import { nuclearStoppingPower } from './nuclearStopping.js';

/** True for e⁻ and e⁺ (by mass), which take the ICRU 37 formulas instead of Bethe. */
export function isElectronLike(particle: Particle): boolean {
  return Math.abs(particle.massMeV - ELECTRON_MASS_MEV) < 1e-9;
}

function checkCharged(particle: Particle): void {
  if (particle.charge === 0) throw msg.badArgument('particle', particle.name, 'a charged particle (neutral particles do not lose energy by ionisation)');
}

/** Upper validity of the heavy-particle stopping [MeV] (βγ = 1000; radiative losses beyond, PDG). */
function heavyMaxMeV(particle: Particle): number {
  const bg2 = BETHE_MAX_BETA_GAMMA * BETHE_MAX_BETA_GAMMA;
  return (particle.massMeV * bg2) / (Math.sqrt(1 + bg2) + 1);
}

/** Validity check for heavy particles: 0 < T ≤ T(βγ = 1000); warns and returns false outside. */
function heavyInRange(source: string, particle: Particle, t: number): boolean {
  if (t > 0 && t <= heavyMaxMeV(particle)) return true;
  warnOutside(source, particle, t, `0–${kineticRangeText(particle.massMeV, 0, BETHE_MAX_BETA_GAMMA).split('–')[1]}`);
  return false;
}

function warnExtrapolated(source: string, particle: Particle, material: Material, t: number): void {
  if (!hasLowEnergyFit(material) && stoppingRegime(particle, material, t) === 'extrapolated') {
    warn('APPROXIMATION', `${source}: ${particle.name} in ${material.name} at T = ${Number(t.toPrecision(3))} MeV has no ICRU 49 low-energy fit at this energy (below the proton-equivalent 2 MeV, or 100 MeV for I > 400 eV); the value there is good to ~5–20 % only (lib/matter/README.md)`, source);
  }
}

/**
 * Mean total mass stopping power [MeV cm²/g] of `particle` at kinetic energy T [MeV]:
 *  - heavy particles: electronic stopping by the ICRU 49 scheme of `electronicStopping.ts`
 *    (low-energy fits, Bethe with shell and Bloch corrections, a smooth join between them) plus
 *    nuclear stopping (`nuclearStoppingPower`), valid from T > 0 to βγ = 1000;
 *  - e±: collision (ICRU 37) + radiative (stated approximation), valid 10 keV – 10 GeV.
 * Against NIST PSTAR (water, air, aluminium, copper): see lib/matter/README.md for the accuracy
 * per energy band. Outside validity: NaN and a collected 'OUTSIDE_VALIDITY' warning; in the
 * 'extrapolated' regime (no low-energy fit) an 'APPROXIMATION' warning. A neutral particle is a
 * bad call (BAD_ARGUMENT).
 * @example massStoppingPower(PROTON, material('water'), 100) // ≈ 7.29 (PSTAR 7.289)
 */
export function massStoppingPower(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  checkCharged(particle);
  if (isElectronLike(particle)) {
    return electronCollisionStoppingPower(particle, material, kineticEnergyMeV) + electronRadiativeStoppingPower(particle, material, kineticEnergyMeV);
  }
  if (!heavyInRange('massStoppingPower', particle, kineticEnergyMeV)) return NaN;
  warnExtrapolated('massStoppingPower', particle, material, kineticEnergyMeV);
  return heavyElectronicStopping(particle, material, kineticEnergyMeV) + nuclearStoppingPower(particle, material, kineticEnergyMeV);
}

/** Collision (electronic) part only [MeV cm²/g]; same validity and sources as `massStoppingPower`. */
export function collisionStoppingPower(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  checkCharged(particle);
  if (isElectronLike(particle)) return electronCollisionStoppingPower(particle, material, kineticEnergyMeV);
  if (!heavyInRange('collisionStoppingPower', particle, kineticEnergyMeV)) return NaN;
  warnExtrapolated('collisionStoppingPower', particle, material, kineticEnergyMeV);
  return heavyElectronicStopping(particle, material, kineticEnergyMeV);
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

/**
 * The total mass stopping power without checks or warnings [MeV cm²/g], for integrators that
 * have checked the interval once (range.ts). Same formulas as `massStoppingPower`.
 */
export function stoppingPowerUnchecked(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  if (isElectronLike(particle)) {
    return electronCollisionStoppingPower(particle, material, kineticEnergyMeV) + electronRadiativeStoppingPower(particle, material, kineticEnergyMeV);
  }
  return heavyElectronicStopping(particle, material, kineticEnergyMeV) + nuclearStoppingPower(particle, material, kineticEnergyMeV);
}

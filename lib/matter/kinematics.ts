import type { Particle } from '../particles.js';

/**
 * Relativistic kinematics of a free particle of rest energy M = `particle.massMeV`, in MeV and
 * MeV/c (common practice: E² = p² + M², T = E − M). Valid for any T ≥ 0; NaN for negative or
 * non-finite input. Written in forms that keep full precision at small T (p² / (E + M) rather
 * than E − M), since stopping tracks end with T → 0.
 */

/** Momentum [MeV/c] from kinetic energy [MeV]: p = √(T (T + 2M)).
 *  @example momentumFromKinetic(PROTON, 100) // ≈ 444.58 */
export function momentumFromKinetic(particle: Particle, kineticEnergyMeV: number): number {
  if (!(kineticEnergyMeV >= 0)) return NaN;
  return Math.sqrt(kineticEnergyMeV * (kineticEnergyMeV + 2 * particle.massMeV));
}

/** Kinetic energy [MeV] from momentum [MeV/c]: T = p² / (√(p² + M²) + M).
 *  @example kineticFromMomentum(PROTON, 444.58) // ≈ 100 */
export function kineticFromMomentum(particle: Particle, momentumMeV: number): number {
  if (!(Math.abs(momentumMeV) >= 0)) return NaN;
  const p2 = momentumMeV * momentumMeV;
  const m = particle.massMeV;
  return p2 / (Math.sqrt(p2 + m * m) + m);
}

/** Lorentz factor γ = 1 + T/M. */
export function gammaFromKinetic(particle: Particle, kineticEnergyMeV: number): number {
  if (!(kineticEnergyMeV >= 0)) return NaN;
  return 1 + kineticEnergyMeV / particle.massMeV;
}

/** β = p/E from kinetic energy [MeV]; 0 at rest. */
export function betaFromKinetic(particle: Particle, kineticEnergyMeV: number): number {
  if (!(kineticEnergyMeV >= 0)) return NaN;
  const p = momentumFromKinetic(particle, kineticEnergyMeV);
  return p / (kineticEnergyMeV + particle.massMeV);
}

/** βγ = p/M from kinetic energy [MeV]. */
export function betaGamma(particle: Particle, kineticEnergyMeV: number): number {
  if (!(kineticEnergyMeV >= 0)) return NaN;
  return momentumFromKinetic(particle, kineticEnergyMeV) / particle.massMeV;
}

/** Kinetic energy [MeV] at a given βγ: T = M (√(1 + (βγ)²) − 1), written without cancellation. */
export function kineticFromBetaGamma(particle: Particle, betaGammaValue: number): number {
  if (!(betaGammaValue >= 0)) return NaN;
  const bg2 = betaGammaValue * betaGammaValue;
  return (particle.massMeV * bg2) / (Math.sqrt(1 + bg2) + 1);
}

/** β from momentum [MeV/c]: β = p / √(p² + M²). */
export function betaFromMomentum(particle: Particle, momentumMeV: number): number {
  const p = Math.abs(momentumMeV);
  return p / Math.hypot(p, particle.massMeV);
}

/** Everything at once, for tables and the `range` command. All energies MeV, momentum MeV/c. */
export interface Kinematics {
  readonly kineticEnergyMeV: number;
  readonly totalEnergyMeV: number;
  readonly momentumMeV: number;
  readonly beta: number;
  readonly gamma: number;
  readonly betaGamma: number;
}

export function kinematicsFromKinetic(particle: Particle, kineticEnergyMeV: number): Kinematics {
  const p = momentumFromKinetic(particle, kineticEnergyMeV);
  const e = kineticEnergyMeV + particle.massMeV;
  return Object.freeze({
    kineticEnergyMeV,
    totalEnergyMeV: e,
    momentumMeV: p,
    beta: p / e,
    gamma: e / particle.massMeV,
    betaGamma: p / particle.massMeV,
  });
}

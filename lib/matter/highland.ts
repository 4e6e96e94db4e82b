import { msg } from '../errors.js';
import type { Particle } from '../particles.js';
import { warn } from '../warnings.js';
import type { Material } from './materials.js';

/** Range of x/X₀ over which the Highland form is quoted to 11 % (PDG RPP). */
export const HIGHLAND_MIN_X_OVER_X0 = 1e-3;
export const HIGHLAND_MAX_X_OVER_X0 = 100;
/** Stated accuracy of θ₀ inside that range (PDG RPP: "accurate to 11 % or better"). */
export const HIGHLAND_RELATIVE_ACCURACY = 0.11;

export interface HighlandInput {
  /** Momentum p [GeV/c]. */
  readonly momentumGeV: number;
  /** Velocity β = v/c. */
  readonly beta: number;
  /** Charge number z (sign ignored). */
  readonly charge: number;
  /** Thickness in radiation lengths x/X₀. */
  readonly thicknessOverX0: number;
}

/**
 * Width of the central 98 % of the projected (plane) multiple-scattering angle distribution
 * θ₀ [rad], Highland's formula as corrected by Lynch & Dahl, Nucl. Instrum. Meth. B58 (1991) 6,
 * PDG RPP "Passage of particles through matter", multiple scattering:
 *
 *   θ₀ = 13.6 MeV / (βcp) · |z| · √(x/X₀) · [1 + 0.038 ln(x z² / (X₀ β²))]
 *
 * Accurate to 11 % or better for 1e-3 < x/X₀ < 100 (PDG); outside: NaN + 'OUTSIDE_VALIDITY'
 * warning. The space angle has θ_rms,space = √2 θ₀.
 * @example highlandTheta0({ momentumGeV: 1, beta: 1, charge: 1, thicknessOverX0: 1 }) // 0.0136
 */
export function highlandTheta0(input: HighlandInput): number {
  const { momentumGeV, beta, charge, thicknessOverX0: t } = input;
  if (!(momentumGeV > 0) || !(beta > 0 && beta <= 1)) throw msg.badArgument('momentumGeV/beta', [momentumGeV, beta], 'p > 0 GeV/c and 0 < β ≤ 1');
  if (!(t >= HIGHLAND_MIN_X_OVER_X0 && t <= HIGHLAND_MAX_X_OVER_X0)) {
    warn('OUTSIDE_VALIDITY', `highlandTheta0: x/X₀ = ${t} is outside ${HIGHLAND_MIN_X_OVER_X0}–${HIGHLAND_MAX_X_OVER_X0} where the formula holds to 11 %; result is NaN`, 'highlandTheta0');
    return NaN;
  }
  const z = Math.abs(charge);
  return ((0.0136 * z) / (beta * momentumGeV)) * Math.sqrt(t) * (1 + 0.038 * Math.log((t * z * z) / (beta * beta)));
}

/** Radiation length of a material as a length [m]: X₀ [g/cm²] / ρ [g/cm³] / 100. */
export function radiationLengthM(material: Material): number {
  return material.radiationLengthGcm2 / material.densityGcm3 / 100;
}

/**
 * θ₀ [rad] for `particle` of momentum p [GeV/c] crossing `pathM` [m] of `material`; β from p and
 * the particle's mass. Same source and validity as `highlandTheta0`.
 * @example highlandTheta0InMaterial(MUON_MINUS, material('silicon'), 1, 300e-6) // ≈ 0.60 mrad
 */
export function highlandTheta0InMaterial(particle: Particle, material: Material, momentumGeV: number, pathM: number): number {
  if (!(pathM > 0)) throw msg.badArgument('pathM', pathM, 'a positive path length in metres');
  const mGeV = particle.massMeV / 1000;
  const beta = momentumGeV / Math.hypot(momentumGeV, mGeV);
  return highlandTheta0({ momentumGeV, beta, charge: particle.charge, thicknessOverX0: pathM / radiationLengthM(material) });
}

import { GEV_PER_TESLA_METRE } from '../constants.js';
import { msg } from '../errors.js';

/**
 * Magnetic rigidity Bρ [T·m] of a particle of momentum `momentumGeV` [GeV/c] and charge number
 * z: Bρ = p/(ze) = p[GeV/c]/(0.299792458·|z|) (common practice; exact c).
 * @example magneticRigidityTm(1, 1) // 3.3356 T·m
 */
export function magneticRigidityTm(momentumGeV: number, chargeNumber = 1): number {
  if (!(Math.abs(chargeNumber) > 0)) throw msg.badArgument('chargeNumber', chargeNumber, 'a non-zero charge number');
  return Math.abs(momentumGeV) / (GEV_PER_TESLA_METRE * Math.abs(chargeNumber));
}

/**
 * Bρ [T·m] from kinetic energy [MeV] and mass [MeV/c²]: p = √(T(T + 2m)).
 * @example rigidityFromKineticTm(100, 938.272, 1) // 1.4829 T·m (a 100 MeV proton)
 */
export function rigidityFromKineticTm(kineticMeV: number, massMeV: number, chargeNumber = 1): number {
  if (!(kineticMeV >= 0)) throw msg.badArgument('kineticMeV', kineticMeV, 'a non-negative kinetic energy in MeV');
  return magneticRigidityTm(Math.sqrt(kineticMeV * (kineticMeV + 2 * massMeV)) * 1e-3, chargeNumber);
}

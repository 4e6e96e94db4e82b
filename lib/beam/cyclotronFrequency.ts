import { SPEED_OF_LIGHT_M_S } from '../constants.js';
import { msg } from '../errors.js';

/**
 * Cyclotron (revolution) frequency [Hz] of a particle of charge number z, mass `massMeV`
 * [MeV/c²] and kinetic energy `kineticMeV` in a field `fieldT`: f = |z|eB/(2πγm), γ = 1 + T/m
 * (common practice). With m in MeV: f = |z| B c² / (2π γ m·10⁶).
 * @example cyclotronFrequencyHz(1, 938.27208816) // 15.25 MHz for a slow proton in 1 T
 */
export function cyclotronFrequencyHz(fieldT: number, massMeV: number, chargeNumber = 1, kineticMeV = 0): number {
  if (!(massMeV > 0)) throw msg.badArgument('massMeV', massMeV, 'a positive mass in MeV');
  if (!(kineticMeV >= 0)) throw msg.badArgument('kineticMeV', kineticMeV, 'a non-negative kinetic energy in MeV');
  const gamma = 1 + kineticMeV / massMeV;
  return (Math.abs(chargeNumber) * Math.abs(fieldT) * SPEED_OF_LIGHT_M_S * SPEED_OF_LIGHT_M_S) / (2 * Math.PI * gamma * massMeV * 1e6);
}

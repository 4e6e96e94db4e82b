import { ATOMIC_MASS_UNIT_MEV, ELEMENTARY_CHARGE_C, SPEED_OF_LIGHT_M_S } from '../constants.js';
import { msg } from '../errors.js';

/** Atomic mass constant m_u [kg], CODATA 2018: 1.66053906660(50)e-27 kg. */
export const ATOMIC_MASS_CONSTANT_KG = 1.6605390666e-27;

/**
 * Mass-to-charge ratio [kg/C] of an ion accelerated from rest through `voltageV` [V] and bent on
 * radius `radiusM` [m] by a magnetic sector of field `fieldT` [T]. From p = qBr and kinetic
 * energy T = qV with p²c² = T² + 2Tmc² (exact relativistic kinematics):
 *   m/q = B²r²/(2V) − V/(2c²)
 * (the second term is the relativistic correction: 5.6e-12 of the first for a 10 kV ion of
 * 20 u). Valid for singly or multiply charged ions alike (q = ze).
 * @example massToChargeFromSector({ radiusM: 0.2, fieldT: 0.5, voltageV: 2000 }) / (ATOMIC_MASS_CONSTANT_KG / 1.602176634e-19) // ≈ 48.2 u/e
 */
export function massToChargeFromSector(m: { readonly radiusM: number; readonly fieldT: number; readonly voltageV: number }): number {
  if (!(m.radiusM > 0)) throw msg.badArgument('radiusM', m.radiusM, 'a positive radius in metres');
  if (!(m.voltageV > 0)) throw msg.badArgument('voltageV', m.voltageV, 'a positive accelerating voltage in volts');
  if (!(Math.abs(m.fieldT) > 0)) throw msg.badArgument('fieldT', m.fieldT, 'a non-zero field in tesla');
  const br = m.fieldT * m.radiusM;
  return (br * br) / (2 * m.voltageV) - m.voltageV / (2 * SPEED_OF_LIGHT_M_S * SPEED_OF_LIGHT_M_S);
}

/** m/q [kg/C] → [u per elementary charge]. */
export function massToChargeInU(massToChargeKgPerC: number): number {
  return (massToChargeKgPerC * ELEMENTARY_CHARGE_C) / ATOMIC_MASS_CONSTANT_KG;
}

/**
 * Radius [m] on which a magnetic sector of field `fieldT` bends an ion of mass `massU` [u] and
 * charge number `charge`, accelerated from rest through `voltageV`: r = p/(qB) with
 * pc = √(T² + 2Tmc²), T = zeV. The inverse of `massToChargeFromSector`.
 * @example sectorRadiusM({ massU: 20, charge: 1, voltageV: 2000, fieldT: 0.5 }) // ≈ 0.0408 m
 */
export function sectorRadiusM(m: { readonly massU: number; readonly charge: number; readonly voltageV: number; readonly fieldT: number }): number {
  const tMeV = Math.abs(m.charge) * m.voltageV * 1e-6;
  const mcMeV = m.massU * ATOMIC_MASS_UNIT_MEV;
  const pcMeV = Math.sqrt(tMeV * tMeV + 2 * tMeV * mcMeV);
  return (pcMeV * 1e6) / (SPEED_OF_LIGHT_M_S * Math.abs(m.charge) * Math.abs(m.fieldT));
}

import { msg } from '../errors.js';

/**
 * Speed [m/s] passed undeflected by crossed fields: qE = qvB, v = E/B (Wien filter; common
 * practice), with the electric field of plates `plateVoltageV` apart by `gapM`: E = V/d.
 * Valid for v ≪ c and uniform fields between the plates. Independent of charge and mass.
 * @example selectedSpeedMPerS({ plateVoltageV: 500, gapM: 0.01, fieldT: 0.01 }) // 5e6 m/s
 */
export function selectedSpeedMPerS(s: { readonly plateVoltageV: number; readonly gapM: number; readonly fieldT: number }): number {
  if (!(s.gapM > 0)) throw msg.badArgument('gapM', s.gapM, 'a positive plate gap in metres');
  if (!(Math.abs(s.fieldT) > 0)) throw msg.badArgument('fieldT', s.fieldT, 'a non-zero field in tesla');
  return Math.abs(s.plateVoltageV / s.gapM / s.fieldT);
}

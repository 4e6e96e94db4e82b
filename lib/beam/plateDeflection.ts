import { msg } from '../errors.js';

export interface PlateDeflection {
  /** Transverse displacement at the end of the plates [m]. */
  readonly atPlateEndM: number;
  /** Angle of the beam leaving the plates [rad]. */
  readonly angleRad: number;
  /** Displacement on a screen `screenDistanceM` beyond the plates' end [m]. */
  readonly onScreenM: number;
}

/**
 * Deflection of a charged particle crossing parallel plates: field E = V/d across the gap,
 * plate length L, then a field-free drift D to a screen. Small-angle, the particle's momentum
 * unchanged along the plates: the transverse impulse qE·L/v gives tan θ = zE L/(pv) and the
 * displacement at the plates' end zE L²/(2pv); on the screen y = zE L/(pv)·(L/2 + D)
 * (common practice; exact in the small-angle limit at any speed, with pv in eV so that a
 * charge number z and E in V/m give metres). For an electron accelerated through V_a (pv ≈ 2eV_a
 * when slow) this is the familiar y = V L²/(4 d V_a).
 * @example plateDeflection({ plateVoltageV: 50, gapM: 0.01, lengthM: 0.05, momentumVelocityEV: 2 * 2000, chargeNumber: 1 }).atPlateEndM // 3.125 mm
 */
export function plateDeflection(p: {
  readonly plateVoltageV: number;
  readonly gapM: number;
  readonly lengthM: number;
  /** p·v of the particle [eV] (2T for a slow particle of kinetic energy T). */
  readonly momentumVelocityEV: number;
  readonly chargeNumber?: number;
  readonly screenDistanceM?: number;
}): PlateDeflection {
  if (!(p.gapM > 0)) throw msg.badArgument('gapM', p.gapM, 'a positive plate gap in metres');
  if (!(p.lengthM > 0)) throw msg.badArgument('lengthM', p.lengthM, 'a positive plate length in metres');
  if (!(p.momentumVelocityEV > 0)) throw msg.badArgument('momentumVelocityEV', p.momentumVelocityEV, 'a positive p·v in eV');
  const z = p.chargeNumber ?? 1;
  const e = p.plateVoltageV / p.gapM;
  const slope = (z * e * p.lengthM) / p.momentumVelocityEV;
  const d = p.screenDistanceM ?? 0;
  return { atPlateEndM: 0.5 * slope * p.lengthM, angleRad: Math.atan(slope), onScreenM: slope * (0.5 * p.lengthM + d) };
}

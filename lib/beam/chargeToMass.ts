import { msg } from '../errors.js';

/** A measured value with its error, and the share of the variance from each input. */
export interface ChargeToMassResult {
  /** q/m [C/kg]. */
  readonly valueCPerKg: number;
  readonly sigmaCPerKg: number;
  /** Relative variance contributions (σ_i/value)² of voltage, field and radius. */
  readonly relativeVariance: { readonly voltage: number; readonly field: number; readonly radius: number };
}

export interface OrbitMeasurement {
  /** Accelerating voltage [V] (the particle's kinetic energy is qV). */
  readonly voltageV: number;
  /** Field at the orbit [T]. */
  readonly fieldT: number;
  /** Orbit radius [m]. */
  readonly radiusM: number;
  readonly sigmaVoltageV?: number;
  readonly sigmaFieldT?: number;
  readonly sigmaRadiusM?: number;
}

/**
 * Charge-to-mass ratio [C/kg] of a particle accelerated from rest through `voltageV` and bent on
 * a circle of radius `radiusM` in the field `fieldT`: from qV = ½mv² and r = mv/(qB),
 * q/m = 2V/(B²r²) (non-relativistic; the beam-tube relation, common practice). Errors add in
 * quadrature: (σ/(q/m))² = (σ_V/V)² + (2σ_B/B)² + (2σ_r/r)² (independent inputs).
 * Valid where v ≪ c: for electrons the relativistic correction is V/(2·511 kV), 0.03 % at 300 V.
 * @example chargeToMassFromOrbit({ voltageV: 250, fieldT: 1.0e-3, radiusM: 0.0533 }).valueCPerKg // ≈ 1.76e11
 */
export function chargeToMassFromOrbit(m: OrbitMeasurement): ChargeToMassResult {
  const { voltageV: v, fieldT: b, radiusM: r } = m;
  if (!(v > 0)) throw msg.badArgument('voltageV', v, 'a positive accelerating voltage in volts');
  if (!(Math.abs(b) > 0) || !Number.isFinite(b)) throw msg.badArgument('fieldT', b, 'a non-zero field in tesla');
  if (!(r > 0)) throw msg.badArgument('radiusM', r, 'a positive orbit radius in metres');
  const value = (2 * v) / (b * b * r * r);
  const voltage = ((m.sigmaVoltageV ?? 0) / v) ** 2;
  const field = ((2 * (m.sigmaFieldT ?? 0)) / b) ** 2;
  const radius = ((2 * (m.sigmaRadiusM ?? 0)) / r) ** 2;
  return { valueCPerKg: value, sigmaCPerKg: value * Math.sqrt(voltage + field + radius), relativeVariance: { voltage, field, radius } };
}

import { VACUUM_PERMEABILITY_N_A2 } from '../constants.js';
import { msg } from '../errors.js';
import { completeEllipticIntegrals } from './ellipticIntegrals.js';

/** A pair of equal coaxial circular coils carrying the same current in the same sense. */
export interface CoilPair {
  /** Turns per coil. */
  readonly turns: number;
  /** Mean coil radius [m]. */
  readonly radiusM: number;
  /** Current [A]. */
  readonly currentA: number;
  /** Distance between the coil planes [m]; the Helmholtz condition is spacing = radius (default). */
  readonly spacingM?: number;
}

function check(c: CoilPair): number {
  if (!(c.turns > 0)) throw msg.badArgument('turns', c.turns, 'a positive number of turns');
  if (!(c.radiusM > 0)) throw msg.badArgument('radiusM', c.radiusM, 'a positive coil radius in metres');
  if (!Number.isFinite(c.currentA)) throw msg.badArgument('currentA', c.currentA, 'a current in amperes');
  const d = c.spacingM ?? c.radiusM;
  if (!(d >= 0)) throw msg.badArgument('spacingM', c.spacingM, 'a non-negative coil spacing in metres');
  return d;
}

/**
 * Field [T] at the centre of a Helmholtz pair (spacing = radius): B = (4/5)^{3/2} μ₀ N I / R
 * (Biot–Savart on the axis of two loops; common practice). The field points along the axis.
 * @example helmholtzCentreFieldT({ turns: 130, radiusM: 0.15, currentA: 1.5 }) // ≈ 1.169e-3
 */
export function helmholtzCentreFieldT(c: CoilPair): number {
  check(c);
  return Math.pow(0.8, 1.5) * VACUUM_PERMEABILITY_N_A2 * c.turns * c.currentA / c.radiusM;
}

/**
 * Axial and radial field [T] of the coil pair at (ρ, z) — ρ from the axis, z from the midplane
 * [m] — exact for thin loops: each loop's field from the complete elliptic integrals
 * (Smythe, Static and Dynamic Electricity, §7.10 (memory); the standard closed form):
 *   B_z = μ₀NI/(2π) · 1/√((R+ρ)² + ζ²) · [K + (R² − ρ² − ζ²)/((R−ρ)² + ζ²) · E]
 *   B_ρ = μ₀NI/(2π) · ζ/(ρ√((R+ρ)² + ζ²)) · [−K + (R² + ρ² + ζ²)/((R−ρ)² + ζ²) · E]
 * with ζ the distance from the loop's plane and m = 4Rρ/((R+ρ)² + ζ²). On the axis this is
 * μ₀NIR²/(2(R² + ζ²)^{3/2}). Valid away from the windings (ρ, z not on a loop).
 * @example helmholtzField(coils, 0, 0).bzT // = helmholtzCentreFieldT(coils)
 */
export function helmholtzField(c: CoilPair, rhoM: number, zM: number): { readonly bzT: number; readonly brhoT: number } {
  const d = check(c);
  const k0 = (VACUUM_PERMEABILITY_N_A2 * c.turns * c.currentA) / (2 * Math.PI);
  const R = c.radiusM;
  const rho = Math.abs(rhoM);
  let bz = 0, br = 0;
  for (const plane of [-d / 2, d / 2]) {
    const zeta = zM - plane;
    if (rho < 1e-12 * R) {
      bz += (VACUUM_PERMEABILITY_N_A2 * c.turns * c.currentA * R * R) / (2 * Math.pow(R * R + zeta * zeta, 1.5));
      continue;
    }
    const p2 = (R + rho) ** 2 + zeta * zeta;
    const q2 = (R - rho) ** 2 + zeta * zeta;
    const { k, e } = completeEllipticIntegrals((4 * R * rho) / p2);
    const s = Math.sqrt(p2);
    bz += (k0 / s) * (k + ((R * R - rho * rho - zeta * zeta) / q2) * e);
    br += ((k0 * zeta) / (rho * s)) * (-k + ((R * R + rho * rho + zeta * zeta) / q2) * e);
  }
  return { bzT: bz, brhoT: br };
}

/** How uniform the field is over a beam's circular orbit in the midplane. Fields [T]. */
export interface OrbitFieldUniformity {
  readonly centreT: number;
  /** Mean of B_z over the orbit (equal steps in angle) — the field to use for q/m. */
  readonly meanT: number;
  readonly minT: number;
  readonly maxT: number;
  /** (max − min)/mean. */
  readonly relativeSpread: number;
  /** (mean − centre)/centre: the error made by using the centre field. */
  readonly relativeOffset: number;
}

/**
 * B_z of the coil pair over a circular orbit of radius `orbitRadiusM` in the midplane whose
 * centre lies `centreOffsetM` from the coil axis (in a fine-beam tube the gun sits off-centre, so
 * the orbit does not circle the axis), sampled at `points` equal angles.
 * For a Helmholtz pair the field falls off as the fourth power of the distance from the centre,
 * so an orbit of 5 cm radius inside 15 cm coils sees a few 10⁻³ less than the centre value.
 * @example orbitFieldUniformity(coils, 0.05).relativeOffset // ≈ −1e-3
 */
export function orbitFieldUniformity(c: CoilPair, orbitRadiusM: number, centreOffsetM = 0, points = 360): OrbitFieldUniformity {
  if (!(orbitRadiusM > 0)) throw msg.badArgument('orbitRadiusM', orbitRadiusM, 'a positive orbit radius in metres');
  if (!(points >= 8)) throw msg.badArgument('points', points, 'at least 8 sample points');
  const centre = helmholtzField(c, 0, 0).bzT;
  let sum = 0, lo = Infinity, hi = -Infinity;
  for (let i = 0; i < points; i++) {
    const a = (2 * Math.PI * i) / points;
    const x = centreOffsetM + orbitRadiusM * Math.cos(a), y = orbitRadiusM * Math.sin(a);
    const b = helmholtzField(c, Math.hypot(x, y), 0).bzT;
    sum += b; lo = Math.min(lo, b); hi = Math.max(hi, b);
  }
  const mean = sum / points;
  return { centreT: centre, meanT: mean, minT: lo, maxT: hi, relativeSpread: (hi - lo) / mean, relativeOffset: (mean - centre) / centre };
}

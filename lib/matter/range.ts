import { msg } from '../errors.js';
import type { Particle } from '../particles.js';
import { recordCaution } from '../provenance.js';
import { warn } from '../warnings.js';
import { kineticFromMomentum, momentumFromKinetic } from './kinematics.js';
import type { Material } from './materials.js';
import { stoppingRegime } from './electronicStopping.js';
import { cachedCellOf, cachedRange, integrateRange, rangeBelowCutoffAt, rangeCutoffMeV, rangeMaxMeV } from './rangeIntegral.js';
import { isElectronLike, stoppingPowerUnchecked } from './stoppingPower.js';

export { rangeCutoffMeV, rangeMaxMeV } from './rangeIntegral.js';

/**
 * CSDA range (continuous-slowing-down approximation): R(T) = ∫₀ᵀ dT'/S(T') [g/cm²], S the mean
 * total mass stopping power (`massStoppingPower`), integrated down to zero energy (how the part
 * below the lowest modelled energy is done: `rangeIntegral.ts`). Definition as in ICRU Reports
 * 37 and 49 and NIST PSTAR/ESTAR. It is a mean path length, not a penetration depth, and
 * ignores range straggling and nuclear interactions.
 *
 * Served from a cached per-species table (`cachedRange`): the node below T plus a
 * Gauss–Legendre integral over the rest of the step, so a call costs ~10 stopping-power
 * evaluations and agrees with the full integral to ≈ 1e-12 (the step is one 8-point panel).
 */

function outside(source: string, particle: Particle, what: string, value: number, valid: string): number {
  warn('OUTSIDE_VALIDITY', `${source}: ${particle.name} ${what} ${Number(value.toPrecision(4))} is outside ${valid}; result is NaN`, source);
  return NaN;
}

/**
 * Warns when the part of R(T) that rests on the no-fit extrapolation (worth up to ~20 % of
 * itself) could move R(T) by more than 1 %: i.e. when that part is over 5 % of the range.
 */
function warnIfExtrapolated(source: string, particle: Particle, material: Material, kineticEnergyMeV: number): void {
  if (isElectronLike(particle) || !(kineticEnergyMeV > 0)) return;
  const scale = particle.massMeV / 938.27208816;
  if (stoppingRegime(particle, material, 1e-3 * scale) !== 'extrapolated') return;
  const tEnd = material.meanExcitationEV > 400 ? 100 * scale : 2 * scale;
  const part = rangeOf(particle, material, Math.min(kineticEnergyMeV, tEnd)) / rangeOf(particle, material, kineticEnergyMeV);
  if (part > 0.05) {
    warn('APPROXIMATION', `${source}: ${material.name} has no ICRU 49 low-energy fit; ${Math.round(100 * part)} % of this range lies below the proton-equivalent ${material.meanExcitationEV > 400 ? 100 : 2} MeV, where it rests on the no-fit approximations (good to ~5–20 %, lib/matter/README.md)`, source);
  }
}

/** R(T) from the cache without checks. */
function rangeOf(particle: Particle, material: Material, t: number): number {
  const c = cachedRange(particle, material);
  const t0 = c.kineticEnergyMeV[0];
  if (t <= t0) return t <= 0 ? 0 : rangeBelowCutoffAt(particle, material, t, c.csdaRangeGcm2[0]);
  const i = cachedCellOf(c, t);
  const ti = c.kineticEnergyMeV[i];
  return t > ti ? c.csdaRangeGcm2[i] + integrateRange(particle, material, ti, t, c.kinks) : c.csdaRangeGcm2[i];
}

/**
 * CSDA range [g/cm²] of `particle` with kinetic energy T [MeV] in `material`. Valid from 0 to
 * the stopping-power limit (`rangeMaxMeV`); outside: NaN + 'OUTSIDE_VALIDITY'. An
 * 'APPROXIMATION' warning when part of the range rests on the no-fit extrapolation.
 * Source: definition ICRU 49 / ICRU 37; stopping powers as in `massStoppingPower`.
 * @example csdaRange(PROTON, material('water'), 100) // ≈ 7.72 (PSTAR 7.718)
 */
export function csdaRange(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  recordCaution('stopping-power');
  const tmax = rangeMaxMeV(particle);
  if (!(kineticEnergyMeV >= 0 && kineticEnergyMeV <= tmax)) {
    return outside('csdaRange', particle, 'kinetic energy [MeV]', kineticEnergyMeV, `0–${Number(tmax.toPrecision(3))} MeV`);
  }
  warnIfExtrapolated('csdaRange', particle, material, kineticEnergyMeV);
  return rangeOf(particle, material, kineticEnergyMeV);
}

/**
 * Kinetic energy [MeV] whose CSDA range is `rangeGcm2` [g/cm²]: the inverse of `csdaRange`,
 * from the cached table (cubic Hermite with slopes S) polished by one Newton step on the exact
 * integral (relative agreement with `csdaRange` ≈ 1e-12): about 12 stopping-power evaluations a
 * call once the table is built (bench: test/bench/matter.ts). NaN + warning for a negative range or one beyond R(T_max).
 * @example kineticEnergyFromRange(PROTON, material('water'), 7.718) // ≈ 100
 */
export function kineticEnergyFromRange(particle: Particle, material: Material, rangeGcm2: number): number {
  recordCaution('stopping-power');
  const c = cachedRange(particle, material);
  const r = c.csdaRangeGcm2, t = c.kineticEnergyMeV, s = c.stoppingPowerMeVcm2g;
  const n = r.length;
  if (!(rangeGcm2 >= 0 && rangeGcm2 <= r[n - 1])) {
    return outside('kineticEnergyFromRange', particle, 'range [g/cm²]', rangeGcm2, `0–${Number(r[n - 1].toPrecision(3))} g/cm²`);
  }
  if (rangeGcm2 === 0) return 0;
  if (rangeGcm2 <= r[0]) {
    // Invert the law below the cutoff by bisection-free algebra.
    if (!isElectronLike(particle)) return t[0] * (rangeGcm2 / r[0]) ** 2;
    const k = t[0] / (r[0] * s[0]);
    return t[0] * Math.pow(rangeGcm2 / r[0], 1 / k);
  }
  let lo = 0, hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (r[mid] <= rangeGcm2) lo = mid; else hi = mid;
  }
  let tt = hermite(r[lo], r[hi], t[lo], t[hi], s[lo], s[hi], rangeGcm2);
  // Newton on the exact integral from node lo; the Hermite start is good to ≲ 2e-6 (1e-4 next
  // to a kink), so one step reaches ≈ 1e-12 and a second is taken only when the first moved far.
  for (let k = 0; k < 3; k++) {
    const rt = tt > t[lo] ? r[lo] + integrateRange(particle, material, t[lo], tt, c.kinks) : r[lo] - integrateRange(particle, material, tt, t[lo], c.kinks);
    const dt = (rangeGcm2 - rt) * stoppingPowerUnchecked(particle, material, tt);
    tt += dt;
    if (Math.abs(dt) < 1e-7 * tt) break;
  }
  return tt;
}

function hermite(x0: number, x1: number, y0: number, y1: number, d0: number, d1: number, x: number): number {
  const h = x1 - x0;
  const u = (x - x0) / h;
  const u2 = u * u, u3 = u2 * u;
  return (2 * u3 - 3 * u2 + 1) * y0 + (u3 - 2 * u2 + u) * h * d0 + (-2 * u3 + 3 * u2) * y1 + (u3 - u2) * h * d1;
}

/**
 * Residual CSDA range [g/cm²] after a path of `pathGcm2` [g/cm²] from kinetic energy T [MeV]:
 * R(T) − path, or 0 when the particle stops within the path (CSDA; no straggling).
 */
export function residualRange(particle: Particle, material: Material, kineticEnergyMeV: number, pathGcm2: number): number {
  if (!(pathGcm2 >= 0)) throw msg.badArgument('pathGcm2', pathGcm2, 'a non-negative path length in g/cm²');
  const r = csdaRange(particle, material, kineticEnergyMeV);
  return Math.max(0, r - pathGcm2);
}

/**
 * Mean kinetic energy [MeV] after a path of `pathGcm2` [g/cm²] (CSDA): T(R(T₀) − path); 0 once
 * the particle has stopped. Same sources and validity as `csdaRange`.
 */
export function energyAfterPath(particle: Particle, material: Material, kineticEnergyMeV: number, pathGcm2: number): number {
  const left = residualRange(particle, material, kineticEnergyMeV, pathGcm2);
  if (left === 0) return 0;
  return kineticEnergyFromRange(particle, material, left);
}

/**
 * CSDA range [g/cm²] of a particle of momentum p [MeV/c]: `csdaRange` at T = √(p² + M²) − M.
 * Same validity and source as `csdaRange`; NaN + warning outside.
 * @example csdaRangeFromMomentum(MUON_PLUS, material('liquid-hydrogen'), 29.79) // the 4.1 MeV muon of π⁺ → μ⁺ν decay at rest
 */
export function csdaRangeFromMomentum(particle: Particle, material: Material, momentumMeV: number): number {
  return csdaRange(particle, material, kineticFromMomentum(particle, momentumMeV));
}

/**
 * Momentum [MeV/c] whose CSDA range is `rangeGcm2` [g/cm²]; inverse of `csdaRangeFromMomentum`,
 * served from the cached table like `kineticEnergyFromRange`.
 * @example momentumFromRange(MUON_PLUS, material('liquid-hydrogen'), 0.0995) // ≈ 29.79
 */
export function momentumFromRange(particle: Particle, material: Material, rangeGcm2: number): number {
  return momentumFromKinetic(particle, kineticEnergyFromRange(particle, material, rangeGcm2));
}

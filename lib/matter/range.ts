import { msg } from '../errors.js';
import type { Particle } from '../particles.js';
import { recordCaution } from '../provenance.js';
import { warn } from '../warnings.js';
import { BETHE_MAX_BETA_GAMMA, BETHE_MIN_BETA_GAMMA } from './bethe.js';
import { ELECTRON_MAX_MEV, ELECTRON_MIN_MEV } from './electronLoss.js';
import { kineticFromBetaGamma, kineticFromMomentum, momentumFromKinetic } from './kinematics.js';
import type { Material } from './materials.js';
import { isElectronLike, massStoppingPower } from './stoppingPower.js';

/**
 * CSDA range (continuous-slowing-down approximation): R(T) = ∫ dT'/S(T') from 0 to T [g/cm²],
 * with S the mean total mass stopping power (`massStoppingPower`). Definition as in ICRU Reports
 * 37 and 49 and NIST PSTAR/ESTAR. It is a mean path length, not a penetration depth, and
 * ignores range straggling and nuclear interactions.
 *
 * Lower cutoff T_c = the lower validity limit of the stopping power (heavy particles βγ = 0.045,
 * proton 0.95 MeV; e± 10 keV). The range below T_c is estimated by a power law S ∝ T^−p fitted
 * to the local slope at T_c: R(T_c) = T_c / ((1 + p) S(T_c)) (common practice). For protons in
 * water this piece is ≈ 2 % of R(10 MeV) and ≈ 14 % low against PSTAR's own R(1 MeV), so it moves
 * R(10 MeV) by ≈ 0.3 %. Above T_c the integral is done with 8-point Gauss–Legendre in ln T on
 * panels of ≤ 0.1 split at the density-effect kinks (relative accuracy ≈ 1e-9).
 */

const GL8_X = [-0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498, 0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363];
const GL8_W = [0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.3626837833783620, 0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763];
const GL4_X = [-0.8611363115940526, -0.3399810435848563, 0.3399810435848563, 0.8611363115940526];
const GL4_W = [0.3478548451374538, 0.6521451548625461, 0.6521451548625461, 0.3478548451374538];

/** Lower cutoff of the range integral [MeV] for this species. */
export function rangeCutoffMeV(particle: Particle): number {
  return isElectronLike(particle) ? ELECTRON_MIN_MEV : kineticFromBetaGamma(particle, BETHE_MIN_BETA_GAMMA);
}

/** Upper end of validity [MeV] for this species. */
export function rangeMaxMeV(particle: Particle): number {
  return isElectronLike(particle) ? ELECTRON_MAX_MEV : kineticFromBetaGamma(particle, BETHE_MAX_BETA_GAMMA);
}

/**
 * Energies where S(T) has a kink (the density-effect branches at x₀ and x₁); panels are split
 * there so Gauss–Legendre sees smooth pieces.
 */
function kinks(particle: Particle, material: Material): readonly number[] {
  const p = material.densityEffect;
  return [kineticFromBetaGamma(particle, 10 ** p.x0), kineticFromBetaGamma(particle, 10 ** p.x1)];
}

/** Panel width in ln T. */
const PANEL = 0.1;

/** ∫ dT/S over [t0, t1] by Gauss–Legendre in ln T (8 or 4 nodes per panel of ≤ 0.1 in ln T). */
function integrate(particle: Particle, material: Material, t0: number, t1: number, fine: boolean): number {
  const [k0, k1] = kinks(particle, material);
  let sum = 0;
  let a = t0;
  if (k0 > a && k0 < t1) { sum += integrateSmooth(particle, material, a, k0, fine); a = k0; }
  if (k1 > a && k1 < t1) { sum += integrateSmooth(particle, material, a, k1, fine); a = k1; }
  return sum + integrateSmooth(particle, material, a, t1, fine);
}

function integrateSmooth(particle: Particle, material: Material, t0: number, t1: number, fine: boolean): number {
  const u0 = Math.log(t0);
  const u1 = Math.log(t1);
  const panels = Math.max(1, Math.ceil((u1 - u0) / PANEL));
  const h = (u1 - u0) / panels;
  const xs = fine ? GL8_X : GL4_X;
  const ws = fine ? GL8_W : GL4_W;
  let sum = 0;
  for (let i = 0; i < panels; i++) {
    const mid = u0 + (i + 0.5) * h;
    for (let j = 0; j < xs.length; j++) {
      const t = Math.exp(mid + 0.5 * h * xs[j]);
      sum += (ws[j] * t) / massStoppingPower(particle, material, t);
    }
  }
  return 0.5 * h * sum;
}

/** The range from 0 to T_c by the local power law (see the module note). */
function rangeBelowCutoff(particle: Particle, material: Material): number {
  const tc = rangeCutoffMeV(particle);
  const s0 = massStoppingPower(particle, material, tc);
  const s1 = massStoppingPower(particle, material, tc * 1.05);
  const p = Math.min(1, Math.max(0, -Math.log(s1 / s0) / Math.log(1.05)));
  return tc / ((1 + p) * s0);
}

function outside(source: string, particle: Particle, what: string, value: number, valid: string): number {
  warn('OUTSIDE_VALIDITY', `${source}: ${particle.name} ${what} ${Number(value.toPrecision(4))} is outside ${valid}; result is NaN`, source);
  return NaN;
}

/**
 * CSDA range [g/cm²] of `particle` with kinetic energy T [MeV] in `material`. Valid from the
 * cutoff (`rangeCutoffMeV`) to the stopping-power limit; outside: NaN + warning.
 * Source: definition ICRU 49 / ICRU 37; stopping powers as in `massStoppingPower`.
 * @example csdaRange(PROTON, material('water'), 100) // ≈ 7.72 (PSTAR 7.718)
 */
export function csdaRange(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  const tc = rangeCutoffMeV(particle);
  const tmax = rangeMaxMeV(particle);
  if (!(kineticEnergyMeV >= tc && kineticEnergyMeV <= tmax)) {
    return outside('csdaRange', particle, 'kinetic energy [MeV]', kineticEnergyMeV, `${Number(tc.toPrecision(3))}–${Number(tmax.toPrecision(3))} MeV`);
  }
  return rangeBelowCutoff(particle, material) + (kineticEnergyMeV > tc ? integrate(particle, material, tc, kineticEnergyMeV, true) : 0);
}

/**
 * Kinetic energy [MeV] whose CSDA range is `rangeGcm2` [g/cm²]: the inverse of `csdaRange`,
 * solved by Newton's method in ln T with dR/dT = 1/S (converges to 1e-10 relative in ≤ 8 steps).
 * NaN + warning when the range is below R(T_c) or above R(T_max).
 * @example kineticEnergyFromRange(PROTON, material('water'), 7.718) // ≈ 100
 */
export function kineticEnergyFromRange(particle: Particle, material: Material, rangeGcm2: number): number {
  const tc = rangeCutoffMeV(particle);
  const tmax = rangeMaxMeV(particle);
  const rc = rangeBelowCutoff(particle, material);
  const rmax = rc + integrate(particle, material, tc, tmax, true);
  if (!(rangeGcm2 >= rc && rangeGcm2 <= rmax)) {
    return outside('kineticEnergyFromRange', particle, 'range [g/cm²]', rangeGcm2, `${Number(rc.toPrecision(3))}–${Number(rmax.toPrecision(3))} g/cm²`);
  }
  // Start from the geometric middle, then Newton: ΔT = (R0 − R(T)) · S(T); bracket keeps it safe.
  let lo = tc, hi = tmax;
  let t = Math.sqrt(tc * tmax);
  let r = rc + integrate(particle, material, tc, t, true);
  for (let iter = 0; iter < 100; iter++) {
    if (r > rangeGcm2) hi = t; else lo = t;
    const s = massStoppingPower(particle, material, t);
    let next = t + (rangeGcm2 - r) * s;
    if (!(next > lo && next < hi)) next = Math.sqrt(lo * hi);
    // Move the range by integrating only the step, not from the cutoff again.
    r += next > t ? integrate(particle, material, t, next, true) : -integrate(particle, material, next, t, true);
    const done = Math.abs(next - t) <= 1e-12 * t;
    t = next;
    if (done || Math.abs(r - rangeGcm2) <= 1e-12 * rangeGcm2) break;
  }
  return t;
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
 * Mean kinetic energy [MeV] after a path of `pathGcm2` [g/cm²] (CSDA): T(R(T₀) − path).
 * 0 when the particle stops; NaN + warning when the remaining range falls below R(T_c) (the
 * energy there is not modelled) — a stopping particle is reported as 0 only past the full range.
 */
export function energyAfterPath(particle: Particle, material: Material, kineticEnergyMeV: number, pathGcm2: number): number {
  const left = residualRange(particle, material, kineticEnergyMeV, pathGcm2);
  if (left === 0) return 0;
  return kineticEnergyFromRange(particle, material, left);
}

/** Typed-array range table: log-spaced kinetic energies and the matching columns. */
export interface RangeTable {
  readonly particle: string;
  readonly material: string;
  readonly kineticEnergyMeV: Float64Array;
  readonly momentumMeV: Float64Array;
  /** Total mass stopping power [MeV cm²/g]. */
  readonly stoppingPowerMeVcm2g: Float64Array;
  /** CSDA range [g/cm²]. */
  readonly csdaRangeGcm2: Float64Array;
  readonly densityGcm3: number;
}

export interface RangeTableOptions {
  readonly fromMeV: number;
  readonly toMeV: number;
  readonly points: number;
}

const RANGE_TABLE_DEFAULTS: RangeTableOptions = Object.freeze({ fromMeV: 1, toMeV: 1000, points: 200 });

/**
 * A range table over `points` log-spaced energies from `fromMeV` to `toMeV`, built by cumulative
 * 4-point Gauss–Legendre integration between neighbouring nodes (one pass; a 1000-point table
 * costs ≈ 4000 stopping-power evaluations). A `fromMeV` below the cutoff is raised to the cutoff
 * with a 'RANGE_TABLE_CLAMPED' warning; `toMeV` above the validity limit likewise lowered.
 * Interpolate with `rangeAt` / `energyAtRange` (cubic Hermite using dR/dT = 1/S).
 */
export function rangeTable(particle: Particle, material: Material, options: Partial<RangeTableOptions> = {}): RangeTable {
  // A range table is what reaches dose planning: reports showing one carry the clinical caution.
  recordCaution('stopping-power');
  const o = { ...RANGE_TABLE_DEFAULTS, ...options };
  if (!Number.isInteger(o.points) || o.points < 2) throw msg.badArgument('points', o.points, 'an integer ≥ 2');
  if (!(o.fromMeV > 0 && o.toMeV > o.fromMeV)) throw msg.badArgument('fromMeV/toMeV', [o.fromMeV, o.toMeV], '0 < fromMeV < toMeV');
  const tc = rangeCutoffMeV(particle);
  const tmax = rangeMaxMeV(particle);
  let from = o.fromMeV, to = o.toMeV;
  if (from < tc) {
    warn('RANGE_TABLE_CLAMPED', `rangeTable: fromMeV ${from} is below the ${particle.name} cutoff; table starts at ${Number(tc.toPrecision(4))} MeV`, 'rangeTable');
    from = tc;
  }
  if (to > tmax) {
    warn('RANGE_TABLE_CLAMPED', `rangeTable: toMeV ${to} is above the ${particle.name} validity limit; table ends at ${Number(tmax.toPrecision(4))} MeV`, 'rangeTable');
    to = tmax;
  }
  if (!(to > from)) throw msg.badArgument('fromMeV/toMeV', [o.fromMeV, o.toMeV], `an interval overlapping the validity range ${Number(tc.toPrecision(3))}–${Number(tmax.toPrecision(3))} MeV`);
  const n = o.points;
  const t = new Float64Array(n);
  const p = new Float64Array(n);
  const s = new Float64Array(n);
  const r = new Float64Array(n);
  const lnFrom = Math.log(from);
  const step = (Math.log(to) - lnFrom) / (n - 1);
  for (let i = 0; i < n; i++) {
    t[i] = i === n - 1 ? to : Math.exp(lnFrom + i * step);
    p[i] = momentumFromKinetic(particle, t[i]);
    s[i] = massStoppingPower(particle, material, t[i]);
  }
  r[0] = from === tc ? rangeBelowCutoff(particle, material) : csdaRange(particle, material, from);
  for (let i = 1; i < n; i++) r[i] = r[i - 1] + integrate(particle, material, t[i - 1], t[i], false);
  return Object.freeze({ particle: particle.name, material: material.name, kineticEnergyMeV: t, momentumMeV: p, stoppingPowerMeVcm2g: s, csdaRangeGcm2: r, densityGcm3: material.densityGcm3 });
}

/** Index i with xs[i] ≤ x < xs[i+1] (xs increasing), or −1 outside. */
function bracketIndex(xs: Float64Array, x: number): number {
  const n = xs.length;
  if (!(x >= xs[0] && x <= xs[n - 1])) return -1;
  let lo = 0, hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid] <= x) lo = mid; else hi = mid;
  }
  return lo;
}

function hermite(x0: number, x1: number, y0: number, y1: number, d0: number, d1: number, x: number): number {
  const h = x1 - x0;
  const u = (x - x0) / h;
  const u2 = u * u, u3 = u2 * u;
  return (2 * u3 - 3 * u2 + 1) * y0 + (u3 - 2 * u2 + u) * h * d0 + (-2 * u3 + 3 * u2) * y1 + (u3 - u2) * h * d1;
}

/** CSDA range [g/cm²] at T [MeV] from a table (cubic Hermite, slopes 1/S). NaN + warning outside the table. */
export function rangeAt(table: RangeTable, kineticEnergyMeV: number): number {
  const t = table.kineticEnergyMeV, s = table.stoppingPowerMeVcm2g, r = table.csdaRangeGcm2;
  const i = bracketIndex(t, kineticEnergyMeV);
  if (i < 0) {
    warn('OUTSIDE_TABLE', `rangeAt: T = ${kineticEnergyMeV} MeV is outside the table ${t[0]}–${t[t.length - 1]} MeV; result is NaN`, 'rangeAt');
    return NaN;
  }
  if (i === t.length - 1) return r[i];
  return hermite(t[i], t[i + 1], r[i], r[i + 1], 1 / s[i], 1 / s[i + 1], kineticEnergyMeV);
}

/** Kinetic energy [MeV] at CSDA range R [g/cm²] from a table (cubic Hermite, slopes S). NaN + warning outside. */
export function energyAtRange(table: RangeTable, rangeGcm2: number): number {
  const t = table.kineticEnergyMeV, s = table.stoppingPowerMeVcm2g, r = table.csdaRangeGcm2;
  const i = bracketIndex(r, rangeGcm2);
  if (i < 0) {
    warn('OUTSIDE_TABLE', `energyAtRange: R = ${rangeGcm2} g/cm² is outside the table ${r[0]}–${r[r.length - 1]} g/cm²; result is NaN`, 'energyAtRange');
    return NaN;
  }
  if (i === r.length - 1) return t[i];
  return hermite(r[i], r[i + 1], t[i], t[i + 1], s[i], s[i + 1], rangeGcm2);
}

/**
 * CSDA range [g/cm²] of a particle of momentum p [MeV/c]: `csdaRange` at T = √(p² + M²) − M.
 * Same validity and source as `csdaRange`; NaN + warning outside.
 * @example csdaRangeFromMomentum(MUON_PLUS, material('liquid-hydrogen'), 29.79) // the 4.1 MeV muon of π⁺ → μ⁺ν decay at rest
 */
export function csdaRangeFromMomentum(particle: Particle, material: Material, momentumMeV: number): number {
  return csdaRange(particle, material, kineticFromMomentum(particle, momentumMeV));
}

/** Momentum [MeV/c] whose CSDA range is `rangeGcm2` [g/cm²]; inverse of `csdaRangeFromMomentum`. */
export function momentumFromRange(particle: Particle, material: Material, rangeGcm2: number): number {
  return momentumFromKinetic(particle, kineticEnergyFromRange(particle, material, rangeGcm2));
}

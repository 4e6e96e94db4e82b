import type { Particle } from '../particles.js';
import { BETHE_MAX_BETA_GAMMA } from './bethe.js';
import { ELECTRON_MAX_MEV, ELECTRON_MIN_MEV } from './electronLoss.js';
import { kineticFromBetaGamma } from './kinematics.js';
import type { Material } from './materials.js';
import { isElectronLike, stoppingPowerUnchecked } from './stoppingPower.js';

/**
 * The CSDA range integral R(T) = ∫₀ᵀ dT'/S(T') [g/cm²] and the cached per-species tables that
 * serve it (definition: ICRU Reports 37 and 49, NIST PSTAR/ESTAR).
 *
 * Heavy particles: S is modelled down to the floor T_f = 1 keV proton-equivalent (the lowest
 * energy of the ICRU 49 tables); below it the electronic stopping of the fits goes as √T, so
 * R(T_f) = 2 T_f / S(T_f) and R ∝ √T below (the nuclear part, ≈ 25 % of S at 1 keV, is treated
 * the same way; its effect on R(0.1 MeV) is ≈ 0.5 %). e±: S is modelled from 10 keV (ICRU 37);
 * below, a power law S ∝ T^−p fitted to the local slope gives R(T_c) = T_c/((1+p) S(T_c))
 * (common practice; ≈ 1 % of R(100 keV)).
 *
 * Above the floor the integral is 8-point Gauss–Legendre in ln T on panels of ≤ 0.1, split at
 * the kinks of S (density-effect branches, the 10 keV switch of the proton fit).
 */

const GL8_X = [-0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498, 0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363];
const GL8_W = [0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.3626837833783620, 0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763];
const PANEL = 0.1;
const PROTON_MASS_MEV = 938.27208816;

/** Lowest energy [MeV] at which S is computed from a formula (below it R follows the stated law). */
export function rangeCutoffMeV(particle: Particle): number {
  return isElectronLike(particle) ? ELECTRON_MIN_MEV : (1e-5 * particle.massMeV) / PROTON_MASS_MEV;
}

/** Upper end of validity [MeV] for this species (e±: 10 GeV; heavy: βγ = 1000). */
export function rangeMaxMeV(particle: Particle): number {
  return isElectronLike(particle) ? ELECTRON_MAX_MEV : kineticFromBetaGamma(particle, BETHE_MAX_BETA_GAMMA);
}

export function rangeKinks(particle: Particle, material: Material): number[] {
  const p = material.densityEffect;
  const out = [kineticFromBetaGamma(particle, 10 ** p.x0), kineticFromBetaGamma(particle, 10 ** p.x1)];
  if (!isElectronLike(particle)) out.push((0.01 * particle.massMeV) / PROTON_MASS_MEV);
  return out.sort((a, b) => a - b);
}

function integrateSmooth(particle: Particle, material: Material, t0: number, t1: number): number {
  const u0 = Math.log(t0);
  const u1 = Math.log(t1);
  const panels = Math.max(1, Math.ceil((u1 - u0) / PANEL));
  const h = (u1 - u0) / panels;
  let sum = 0;
  for (let i = 0; i < panels; i++) {
    const mid = u0 + (i + 0.5) * h;
    for (let j = 0; j < 8; j++) {
      const t = Math.exp(mid + 0.5 * h * GL8_X[j]);
      sum += (GL8_W[j] * t) / stoppingPowerUnchecked(particle, material, t);
    }
  }
  return 0.5 * h * sum;
}

/** ∫ dT/S over [t0, t1] (t0 < t1, both ≥ the cutoff), split at the kinks (`rangeKinks`, or given). */
export function integrateRange(particle: Particle, material: Material, t0: number, t1: number, kinks: readonly number[] = rangeKinks(particle, material)): number {
  let sum = 0;
  let a = t0;
  for (const k of kinks) {
    if (k > a && k < t1) {
      sum += integrateSmooth(particle, material, a, k);
      a = k;
    }
  }
  return sum + integrateSmooth(particle, material, a, t1);
}

/** R(T_c): the range from 0 to the cutoff (see the module note). */
export function rangeBelowCutoff(particle: Particle, material: Material): number {
  const tc = rangeCutoffMeV(particle);
  const s0 = stoppingPowerUnchecked(particle, material, tc);
  if (!isElectronLike(particle)) return (2 * tc) / s0;
  const s1 = stoppingPowerUnchecked(particle, material, tc * 1.05);
  const p = Math.min(1, Math.max(0, -Math.log(s1 / s0) / Math.log(1.05)));
  return tc / ((1 + p) * s0);
}

/** Range [g/cm²] below the cutoff at T < T_c: √T law (heavy) or the fitted power law (e±). */
export function rangeBelowCutoffAt(particle: Particle, material: Material, kineticEnergyMeV: number, rc: number): number {
  const tc = rangeCutoffMeV(particle);
  if (!isElectronLike(particle)) return rc * Math.sqrt(kineticEnergyMeV / tc);
  // R ∝ T^(1+p) with 1 + p = T_c / (R_c S_c).
  const k = tc / (rc * stoppingPowerUnchecked(particle, material, tc));
  return rc * Math.pow(kineticEnergyMeV / tc, k);
}

/** Cached log-spaced table from the cutoff to the top of validity: nodes T, S and R. */
export interface CachedRange {
  readonly kineticEnergyMeV: Float64Array;
  readonly stoppingPowerMeVcm2g: Float64Array;
  readonly csdaRangeGcm2: Float64Array;
  /** Energies where S has a kink [MeV] (`rangeKinks`). */
  readonly kinks: readonly number[];
  /** ln T of node 0 and the node spacing in ln T. */
  readonly lnFrom: number;
  readonly step: number;
}

/** Node spacing of the cached tables in ln T (40 nodes per e-fold; Hermite error ≲ 2e-6, up to 1e-4 in a cell holding a kink of S). */
const CACHE_STEP = 0.025;
const CACHE = new WeakMap<Material, Map<string, CachedRange>>();

/**
 * The cached table of `particle` in `material`, built on first use (≈ 800 nodes for a proton,
 * a few ms) and kept for the life of the material object. Memoisation only: the table is a pure
 * function of its inputs, so sharing it cannot change a result.
 */
export function cachedRange(particle: Particle, material: Material): CachedRange {
  let byParticle = CACHE.get(material);
  if (!byParticle) {
    byParticle = new Map();
    CACHE.set(material, byParticle);
  }
  const key = `${particle.name}\u0000${particle.massMeV}\u0000${particle.charge}`;
  let c = byParticle.get(key);
  if (c) return c;
  const from = rangeCutoffMeV(particle);
  const to = rangeMaxMeV(particle);
  const lnFrom = Math.log(from);
  const n = Math.ceil((Math.log(to) - lnFrom) / CACHE_STEP) + 1;
  const step = (Math.log(to) - lnFrom) / (n - 1);
  const t = new Float64Array(n), s = new Float64Array(n), r = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    t[i] = i === n - 1 ? to : Math.exp(lnFrom + i * step);
    s[i] = stoppingPowerUnchecked(particle, material, t[i]);
  }
  const kinks = Object.freeze(rangeKinks(particle, material));
  r[0] = rangeBelowCutoff(particle, material);
  for (let i = 1; i < n; i++) r[i] = r[i - 1] + integrateRange(particle, material, t[i - 1], t[i], kinks);
  c = Object.freeze({ kineticEnergyMeV: t, stoppingPowerMeVcm2g: s, csdaRangeGcm2: r, kinks, lnFrom, step });
  byParticle.set(key, c);
  return c;
}

function hermite(x0: number, x1: number, y0: number, y1: number, d0: number, d1: number, x: number): number {
  const h = x1 - x0;
  const u = (x - x0) / h;
  const u2 = u * u, u3 = u2 * u;
  return (2 * u3 - 3 * u2 + 1) * y0 + (u3 - 2 * u2 + u) * h * d0 + (-2 * u3 + 3 * u2) * y1 + (u3 - u2) * h * d1;
}

/** Exponent k of R ∝ T^k below node 0 (½ for heavy particles, 1 + p for e±). */
function lowExponent(c: CachedRange): number {
  return c.kineticEnergyMeV[0] / (c.csdaRangeGcm2[0] * c.stoppingPowerMeVcm2g[0]);
}

/**
 * The cell of a cached table that holds T: the node i with T_i ≤ T < T_{i+1}, clamped to
 * 0 … n − 2. The nodes are even in ln T, so the index comes from ln T directly; the two loops
 * only move it a node where ln rounds across a node (a node is exp of a rounded sum).
 */
export function cachedCellOf(c: CachedRange, kineticEnergyMeV: number): number {
  const t = c.kineticEnergyMeV, n = t.length;
  let i = Math.min(Math.max(Math.floor((Math.log(kineticEnergyMeV) - c.lnFrom) / c.step), 0), n - 2);
  while (i > 0 && t[i] > kineticEnergyMeV) i--;
  while (i < n - 2 && t[i + 1] <= kineticEnergyMeV) i++;
  return i;
}

/**
 * R(T) [g/cm²] by cubic Hermite on a cached table (slopes 1/S), with the cutoff law below node 0
 * and Infinity above the top: no checks, no warnings, ≲ 2e-6 relative (1e-4 next to a kink of
 * S, e.g. the 10 keV switch of the proton fits) — for per-step callers
 * (the chamber medium, track fits).
 */
export function cachedRangeAt(c: CachedRange, kineticEnergyMeV: number): number {
  const t = c.kineticEnergyMeV, s = c.stoppingPowerMeVcm2g, r = c.csdaRangeGcm2;
  if (!(kineticEnergyMeV > 0)) return 0;
  if (kineticEnergyMeV <= t[0]) return r[0] * Math.pow(kineticEnergyMeV / t[0], lowExponent(c));
  const n = t.length;
  if (kineticEnergyMeV >= t[n - 1]) return kineticEnergyMeV === t[n - 1] ? r[n - 1] : Infinity;
  const i = cachedCellOf(c, kineticEnergyMeV);
  return hermite(t[i], t[i + 1], r[i], r[i + 1], 1 / s[i], 1 / s[i + 1], kineticEnergyMeV);
}

/**
 * `cachedEnergyAt` for a caller whose ranges change little from call to call (the hits of a
 * track): the table cell is searched from `cell[0]`, the cell of the previous call, by steps
 * (a binary search when it is more than a few cells away), and left there. The same numbers.
 */
export function cachedEnergyAtCell(c: CachedRange, rangeGcm2: number, cell: Int32Array): number {
  const t = c.kineticEnergyMeV, s = c.stoppingPowerMeVcm2g, r = c.csdaRangeGcm2;
  const n = r.length;
  if (!(rangeGcm2 > r[0]) || rangeGcm2 >= r[n - 1]) return cachedEnergyAt(c, rangeGcm2);
  let lo = cell[0];
  if (!(lo >= 0 && lo < n - 1)) lo = 0;
  let steps = 0;
  while (r[lo] > rangeGcm2 && steps < 8) { lo--; steps++; }
  while (r[lo + 1] <= rangeGcm2 && steps < 8) { lo++; steps++; }
  if (!(r[lo] <= rangeGcm2 && rangeGcm2 < r[lo + 1])) {
    lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (r[mid] <= rangeGcm2) lo = mid; else hi = mid;
    }
  }
  cell[0] = lo;
  return hermite(r[lo], r[lo + 1], t[lo], t[lo + 1], s[lo], s[lo + 1], rangeGcm2);
}

/** T(R) [MeV] by cubic Hermite on a cached table (slopes S); the top energy beyond the table. */
export function cachedEnergyAt(c: CachedRange, rangeGcm2: number): number {
  const t = c.kineticEnergyMeV, s = c.stoppingPowerMeVcm2g, r = c.csdaRangeGcm2;
  if (!(rangeGcm2 > 0)) return 0;
  if (rangeGcm2 <= r[0]) return t[0] * Math.pow(rangeGcm2 / r[0], 1 / lowExponent(c));
  const n = r.length;
  if (rangeGcm2 >= r[n - 1]) return t[n - 1];
  let lo = 0, hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (r[mid] <= rangeGcm2) lo = mid; else hi = mid;
  }
  return hermite(r[lo], r[hi], t[lo], t[hi], s[lo], s[hi], rangeGcm2);
}

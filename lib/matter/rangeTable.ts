import { msg } from '../errors.js';
import { recordCaution } from '../provenance.js';
import type { Particle } from '../particles.js';
import { warn } from '../warnings.js';
import { momentumFromKinetic } from './kinematics.js';
import type { Material } from './materials.js';
import { csdaRange } from './range.js';
import { rangeCutoffMeV, rangeMaxMeV } from './rangeIntegral.js';
import { isElectronLike, massStoppingPower } from './stoppingPower.js';

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
 * A range table over `points` log-spaced energies from `fromMeV` to `toMeV` [MeV]: kinetic
 * energy, momentum [MeV/c], total stopping power [MeV cm²/g] and CSDA range [g/cm²] (from the
 * cached per-species table, `csdaRange`). Heavy particles: any fromMeV > 0 (ranges run to zero
 * energy); e±: a `fromMeV` below 10 keV is raised to it with a 'RANGE_TABLE_CLAMPED' warning.
 * `toMeV` above the validity limit is lowered likewise. Interpolate with `rangeAt` /
 * `energyAtRange` (cubic Hermite using dR/dT = 1/S). Same sources as `massStoppingPower`.
 * @example rangeTable(PROTON, material('water'), { fromMeV: 1, toMeV: 250, points: 50 })
 */
export function rangeTable(particle: Particle, material: Material, options: Partial<RangeTableOptions> = {}): RangeTable {
  // A range table is what reaches dose planning: reports showing one carry the clinical caution.
  recordCaution('stopping-power');
  const o = { ...RANGE_TABLE_DEFAULTS, ...options };
  if (!Number.isInteger(o.points) || o.points < 2) throw msg.badArgument('points', o.points, 'an integer ≥ 2');
  if (!(o.fromMeV > 0 && o.toMeV > o.fromMeV)) throw msg.badArgument('fromMeV/toMeV', [o.fromMeV, o.toMeV], '0 < fromMeV < toMeV');
  const tc = isElectronLike(particle) ? rangeCutoffMeV(particle) : 0;
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
    // Both ends exactly as asked (exp(ln from) can differ from it in the last bit).
    t[i] = i === 0 ? from : i === n - 1 ? to : Math.exp(lnFrom + i * step);
    p[i] = momentumFromKinetic(particle, t[i]);
    s[i] = massStoppingPower(particle, material, t[i]);
  }
  for (let i = 0; i < n; i++) r[i] = csdaRange(particle, material, t[i]);
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

/**
 * Matter benchmarks (run by `npm run bench`, or directly: `npx tsx test/bench/matter.ts`).
 * Targets from issue 3: a 1000-point range table for one material and species in < 5 ms;
 * massStoppingPower ≥ 5 M evaluations/s (issue 10 added the low-energy scheme and nuclear
 * stopping: compare with the plain-Bethe line, printed as a reference for the machine's load).
 * Issue 10: per-hit range → momentum look-ups (`rangeLookup`) < 0.5 µs. Inputs are built before the timed bodies; each body is
 * warmed up first and the median of several repetitions is reported.
 */
import { performance } from 'node:perf_hooks';
import { cpus } from 'node:os';
import { PROTON, ELECTRON } from '../../lib/particles.js';
import { material } from '../../lib/matter/materials.js';
import { massStoppingPower } from '../../lib/matter/stoppingPower.js';
import { csdaRange, kineticEnergyFromRange, momentumFromRange } from '../../lib/matter/range.js';
import { rangeTable, energyAtRange } from '../../lib/matter/rangeTable.js';
import { rangeLookup } from '../../lib/matter/rangeLookup.js';
import { betheStoppingPower } from '../../lib/matter/bethe.js';

export interface BenchResult { readonly name: string; readonly value: number; readonly unit: string; readonly target: string; readonly pass: boolean }

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1];
}

export function benchMatter(): BenchResult[] {
  const water = material('water');
  const argon = material('argon-gas');
  const out: BenchResult[] = [];

  // Stopping power: 1e6 energies spread 1 MeV – 10 GeV.
  const n = 1_000_000;
  const energies = new Float64Array(n);
  for (let i = 0; i < n; i++) energies[i] = 10 ** ((4 * i) / n);
  let sink = 0;
  const reps: number[] = [];
  for (let r = 0; r < 6; r++) {
    const t0 = performance.now();
    for (let i = 0; i < n; i++) sink += massStoppingPower(PROTON, water, energies[i]);
    reps.push(performance.now() - t0);
  }
  const perSec = n / (median(reps.slice(1)) / 1000);
  // The plain Bethe formula (unchanged since issue 3) as a reference for the machine's load.
  const rb: number[] = [];
  for (let r = 0; r < 4; r++) {
    const t0 = performance.now();
    for (let i = 0; i < n; i++) sink += betheStoppingPower(PROTON, water, 2 + energies[i]);
    rb.push(performance.now() - t0);
  }
  out.push({ name: 'betheStoppingPower(proton, water) [load reference]', value: n / (median(rb.slice(1)) / 1000) / 1e6, unit: 'M evaluations/s', target: '(info)', pass: true });
  out.push({ name: 'massStoppingPower(proton, water)', value: perSec / 1e6, unit: 'M evaluations/s', target: '≥ 5', pass: perSec >= 5e6 });

  const repsE: number[] = [];
  for (let r = 0; r < 4; r++) {
    const t0 = performance.now();
    for (let i = 0; i < n; i++) sink += massStoppingPower(ELECTRON, argon, energies[i]);
    repsE.push(performance.now() - t0);
  }
  out.push({ name: 'massStoppingPower(electron, argon-gas)', value: n / (median(repsE.slice(1)) / 1000) / 1e6, unit: 'M evaluations/s', target: '(info)', pass: true });

  // 1000-point range table.
  const tt: number[] = [];
  for (let r = 0; r < 30; r++) {
    const t0 = performance.now();
    const t = rangeTable(PROTON, water, { fromMeV: 1, toMeV: 1000, points: 1000 });
    tt.push(performance.now() - t0);
    sink += t.csdaRangeGcm2[999];
  }
  const ms = median(tt.slice(5));
  out.push({ name: 'rangeTable(proton, water, 1000 points)', value: ms, unit: 'ms', target: '< 5', pass: ms < 5 });

  // Table lookups, as the simulator uses them.
  const table = rangeTable(PROTON, water, { fromMeV: 1, toMeV: 1000, points: 1000 });
  const ranges = new Float64Array(n);
  for (let i = 0; i < n; i++) ranges[i] = 0.01 + (300 * i) / n;
  const tl: number[] = [];
  for (let r = 0; r < 4; r++) {
    const t0 = performance.now();
    for (let i = 0; i < n; i++) sink += energyAtRange(table, ranges[i]);
    tl.push(performance.now() - t0);
  }
  out.push({ name: 'energyAtRange(table) lookups', value: n / (median(tl.slice(1)) / 1000) / 1e6, unit: 'M lookups/s', target: '(info)', pass: true });

  // Inverse look-ups per hit (issue 10: served from the cached table; was ≈ 286 µs a call).
  const ranges2 = new Float64Array(2000);
  for (let i = 0; i < ranges2.length; i++) ranges2[i] = 1e-4 + (30 * i) / ranges2.length;
  momentumFromRange(PROTON, water, 1);
  const tm: number[] = [];
  for (let r = 0; r < 6; r++) {
    const t0 = performance.now();
    for (let i = 0; i < ranges2.length; i++) sink += momentumFromRange(PROTON, water, ranges2[i]);
    tm.push(performance.now() - t0);
  }
  out.push({ name: 'momentumFromRange(proton, water)', value: (median(tm.slice(1)) * 1000) / ranges2.length, unit: 'µs/call', target: '(info)', pass: true });
  const te: number[] = [];
  for (let r = 0; r < 6; r++) {
    const t0 = performance.now();
    for (let i = 0; i < ranges2.length; i++) sink += kineticEnergyFromRange(PROTON, water, ranges2[i]);
    te.push(performance.now() - t0);
  }
  out.push({ name: 'kineticEnergyFromRange(proton, water)', value: (median(te.slice(1)) * 1000) / ranges2.length, unit: 'µs/call', target: '(info)', pass: true });

  const look = rangeLookup(PROTON, water);
  const tq: number[] = [];
  for (let r = 0; r < 6; r++) {
    const t0 = performance.now();
    for (let k = 0; k < 50; k++) for (let i = 0; i < ranges2.length; i++) sink += look.momentumMeV(ranges2[i]);
    tq.push(performance.now() - t0);
  }
  out.push({ name: 'rangeLookup(proton, water).momentumMeV', value: (median(tq.slice(1)) * 1000) / (50 * ranges2.length), unit: 'µs/call', target: '< 0.5', pass: (median(tq.slice(1)) * 1000) / (50 * ranges2.length) < 0.5 });

  // One csdaRange call (cached node + remainder integral).
  const tc: number[] = [];
  for (let r = 0; r < 200; r++) {
    const t0 = performance.now();
    sink += csdaRange(PROTON, water, 10 + r);
    tc.push(performance.now() - t0);
  }
  out.push({ name: 'csdaRange(proton, water, ~100 MeV)', value: median(tc.slice(20)) * 1000, unit: 'µs/call', target: '(info)', pass: true });

  if (!Number.isFinite(sink)) throw new Error('benchmark sink is not finite');
  return out;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const cpu = cpus()[0]?.model ?? 'unknown CPU';
  process.stdout.write(`matter benchmarks — Node ${process.version}, ${cpus().length} × ${cpu}\n`);
  for (const r of benchMatter()) {
    process.stdout.write(`  ${r.name.padEnd(44)} ${r.value.toPrecision(3).padStart(8)} ${r.unit.padEnd(16)} target ${r.target}${r.pass ? '' : '  (MISSED)'}\n`);
  }
}

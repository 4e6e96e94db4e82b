/**
 * Simulator and fit-lab benchmarks (run by `npm run bench`, or `npx tsx test/bench/simulate.ts`).
 * Target from issue 4: 10 000 tracks × 50 hits in well under a second per core (single thread).
 * Inputs and configurations are built before the timed bodies; each body is warmed up once and
 * the median of the repetitions is reported.
 */
import { cpus, loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { PION_MINUS, PROTON } from '../../lib/particles.js';
import { chamber, seededRandom, simulateChamber, transportTrack, TRANSPORT_DEFAULTS, type SimulationConfig } from '../../lib/simulate/index.js';
import { chamberMedium, VACUUM } from '../../lib/matter/index.js';
import { BUILT_IN_FIT_METHODS } from '../../lib/fit/index.js';
import { compareFitters, fitLabSample } from '../../lib/fitlab/index.js';

export interface BenchResult { readonly name: string; readonly value: number; readonly unit: string; readonly target: string; readonly pass: boolean }

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1];
}

/**
 * Median CPU time [s] of the body (user + system of this process, so that a machine shared with
 * other jobs does not inflate it the way wall-clock time does); wall time is printed beside it.
 */
const wall: number[] = [];
function timeIt(reps: number, body: () => void): number {
  body();
  const t: number[] = [];
  const w: number[] = [];
  for (let r = 0; r < reps; r++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    body();
    w.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    t.push((c.user + c.system) / 1000);
  }
  wall.push(median(w) / 1000);
  return median(t) / 1000;
}

export function benchSimulate(): BenchResult[] {
  const out: BenchResult[] = [];
  const tracks = 10_000, hitsPerTrack = 50;

  // Transport alone: 1 GeV/c π⁻ over 1 m in 1.5 T, a hit every 2 cm, no medium.
  const vac = chamber({ sizeM: [4, 4, 4], medium: VACUUM, fieldT: [0, 0, 1.5] });
  const opts = { ...TRANSPORT_DEFAULTS, energyLoss: 'off' as const, scattering: false, maxStepM: 0.02, maxPathM: hitsPerTrack * 0.02 + 0.01, sampling: { kind: 'spacing' as const, spacingM: 0.02 } };
  let hits = 0;
  const tTransport = timeIt(5, () => {
    const rng = seededRandom(1, 'bench');
    hits = 0;
    for (let i = 0; i < tracks; i++) {
      transportTrack({ species: PION_MINUS, xM: 0, yM: 0, zM: 0, ux: 1, uy: 0, uz: 0, momentumGeV: 1 }, vac, opts, rng, () => { hits++; });
    }
  });
  out.push({ name: `transportTrack vacuum, ${tracks} tracks × ${hits / tracks} hits (CPU)`, value: tTransport * 1000, unit: 'ms', target: '< 1000 (well under)', pass: tTransport < 1 });
  out.push({ name: '  same, wall clock', value: wall[wall.length - 1] * 1000, unit: 'ms', target: '(info)', pass: true });

  // The full event loop in liquid hydrogen: mean loss + straggling + Highland + smearing + noise.
  const lh2 = chamber({ sizeM: [1.2, 0.8, 0.5], medium: chamberMedium('liquid hydrogen'), fieldT: [0, 0, 1.5] });
  const config: SimulationConfig = {
    name: 'bench', chamber: lh2,
    transport: { energyLoss: 'straggling', scattering: true, maxStepM: 0.02, maxPathM: 5, deltaRayMinMeV: 0 },
    measurement: { sampling: { kind: 'spacing', spacingM: 0.02 }, sigmaXM: 3e-4, sigmaYM: 3e-4, sigmaZM: 1e-3, efficiency: 0.98, noiseHitsPerEvent: 0 },
    sources: [{ kind: 'beam', events: tracks, species: [{ particle: PION_MINUS, weight: 3 }, { particle: PROTON, weight: 1 }], momentumGeV: 1.5, momentumSpread: 0.02, originM: [-0.59, 0, 0], direction: [1, 0, 0], spotSigmaM: 0.01, divergenceRad: 0.003 }],
  };
  let rows = 0;
  const tSim = timeIt(3, () => { rows = simulateChamber(config, 2).hits.length; });
  out.push({ name: `simulateChamber LH2, ${tracks} tracks, ${(rows / tracks).toFixed(0)} hits each (CPU)`, value: tSim * 1000, unit: 'ms', target: '< 1000', pass: tSim < 1 });
  out.push({ name: '  same, wall clock', value: wall[wall.length - 1] * 1000, unit: 'ms', target: '(info)', pass: true });
  out.push({ name: 'simulateChamber LH2 hit rate', value: rows / tSim / 1e6, unit: 'M hits/s', target: '(info)', pass: true });

  // Fit lab: sample + three circle fits on 10 000 tracks of 50 hits.
  let sampleSeconds = 0;
  const tLab = timeIt(2, () => {
    const t0 = performance.now();
    const s = fitLabSample({ tracks, momentumGeV: [0.3, 10], lengthsM: [0.5, 1], hitsPerTrack, sigmaM: 3e-4, fieldT: 1.5, seed: 3 });
    sampleSeconds = (performance.now() - t0) / 1000;
    compareFitters(BUILT_IN_FIT_METHODS, s);
  });
  out.push({ name: `fitLabSample ${tracks} × ${hitsPerTrack}`, value: sampleSeconds * 1000, unit: 'ms', target: '(info)', pass: true });
  out.push({ name: `compareFitters ${BUILT_IN_FIT_METHODS.length} built-in fits, incl. sample`, value: tracks / tLab, unit: 'tracks/s', target: '(info)', pass: true });
  return out;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const cpu = cpus()[0]?.model ?? 'unknown CPU';
  process.stdout.write(`simulate benchmarks — Node ${process.version}, ${cpus().length} × ${cpu}, single thread, load average ${loadavg()[0].toFixed(1)}\n`);
  for (const r of benchSimulate()) {
    process.stdout.write(`  ${r.name.padEnd(56)} ${r.value.toPrecision(3).padStart(8)} ${r.unit.padEnd(10)} target ${r.target}${r.pass ? '' : '  (MISSED)'}\n`);
  }
}

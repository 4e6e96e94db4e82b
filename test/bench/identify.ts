/**
 * Identification-by-range benchmark (run by `npm run bench`, or `node --import tsx test/bench/identify.ts`).
 * Issue 9 asks for the cost of five hypotheses per track. Input: stopping p, K⁺, π⁺, μ⁺ tracks
 * and electron spirals of the Hollowmere chamber (liquid propane, 2 T, a hit every 5 mm;
 * 20–60 cm of path, so 40–120 hits a track), simulated with seed 11 and measured before the
 * timed body. Timed: `identifyTracks` with one hypothesis (the true species' mass) and with all
 * five (e, μ, π, K, p); median of three runs, one core (the calls are synchronous).
 */
import { readFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { performance } from 'node:perf_hooks';
import { material } from '../../lib/matter/materials.js';
import { resolveScenario } from '../../lib/simulate/scenario.js';
import { simulateChamber } from '../../lib/simulate/simulate.js';
import { identifyTracks } from '../../lib/track/identifyTracks.js';
import { measureTracks } from '../../lib/track/measureTracks.js';

const scenario = JSON.parse(readFileSync(new URL('../../notebooks/data/hollowmere.scenario.json', import.meta.url), 'utf8'));
const sim = simulateChamber(resolveScenario(scenario), 11);
const tracks = measureTracks(sim.hits, { fieldT: 2 });
const mat = material('liquid-propane');
const volume = { min: [-0.8, -0.5, -0.3], max: [0.8, 0.5, 0.3] } as const;
let hits = 0;
for (let k = 0; k < tracks.count; k++) hits += tracks.nhits[k];

function time(species: readonly string[]): number {
  const runs: number[] = [];
  for (let r = 0; r < 3; r++) {
    const t0 = performance.now();
    identifyTracks(tracks, { fieldT: 2, material: mat, volume, species });
    runs.push((performance.now() - t0) / 1000);
  }
  return runs.sort((a, b) => a - b)[1];
}

const one = time(['pi+']);
const five = time(['electron', 'mu-', 'pi+', 'K+', 'proton']);
process.stdout.write(`identifyTracks: ${tracks.count} tracks, ${(hits / tracks.count).toFixed(0)} hits per track on average, ${cpus()[0]?.model ?? 'CPU'}\n`);
process.stdout.write(`  one hypothesis:   ${(tracks.count / one).toFixed(0)} tracks/s (${((1e6 * one) / tracks.count).toFixed(0)} µs a track)\n`);
process.stdout.write(`  five hypotheses:  ${(tracks.count / five).toFixed(0)} tracks/s (${((1e6 * five) / tracks.count).toFixed(0)} µs a track; ${(five / one).toFixed(1)}× one)\n`);
process.stdout.write('  (each hypothesis: ~36 Kalman-filter passes over the hits to fit its one parameter (20-point scan, Brent minimisation ≈ 13, error 3); the issue sets no target for five)\n');

/**
 * Fit-with-material benchmark (run by `npm run bench`, or directly:
 * `node --import tsx test/bench/matterFit.ts`). Target from issue 9, one core: ≥ 50 000
 * tracks/s for 50-hit tracks under one mass hypothesis; the cost of five hypotheses
 * (e, μ, π, K, p) is reported beside it. Inputs (simulated pions in liquid propane, 2 T, a hit
 * every 5 mm, 200 µm errors, 0.2–5 GeV/c) are built before the timed bodies; the median of
 * several repetitions is reported, by the wall clock and per core from the process's CPU time.
 */
import { loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { fitTracksInMatter } from '../../lib/fit/matter/fitTracksInMatter.js';
import { matterSample } from '../../lib/fitlab/matterSample.js';
import { material } from '../../lib/matter/materials.js';
import { ELECTRON, KAON_PLUS, MUON_MINUS, PION_PLUS, PROTON } from '../../lib/particles.js';

const med = material('liquid-propane');
const s = matterSample({ tracks: 2000, species: PION_PLUS, momentumGeV: [0.2, 5], material: med, fieldT: 2, spacingM: 5e-3, sigmaM: 2e-4, maxHits: 50, tanLambda: [-0.3, 0.3], seed: 5 });
const hits = { x: s.x, y: s.y, z: s.z, sigmaX: s.sigma, sigmaY: s.sigma, sigmaZ: s.sigma };
const meanHits = s.x.length / s.count;

function median(xs: number[]): number {
  const v = [...xs].sort((a, b) => a - b);
  return v[v.length >> 1];
}

/**
 * Tracks per second from the median of five timed runs: by the wall clock, and per core from the
 * process's own CPU time (user + system), which a machine shared with other jobs inflates less.
 */
function timed(label: string, species: readonly (typeof PION_PLUS)[], target?: number): number {
  const body = () => { for (const sp of species) fitTracksInMatter(hits, s.offsets, { fieldT: 2, medium: med, particle: sp }); };
  for (let w = 0; w < 2; w++) body();
  const wall: number[] = [], cpu: number[] = [];
  for (let r = 0; r < 5; r++) {
    const c0 = process.cpuUsage(), t0 = performance.now();
    body();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  const perSecond = s.count / (median(wall) / 1000), perCore = s.count / (median(cpu) / 1000);
  const flag = target === undefined ? '' : perCore >= target ? `  (target ≥ ${target} per core)` : `  (target ≥ ${target} per core: MISSED)`;
  process.stdout.write(`  ${label.padEnd(36)} ${perSecond.toFixed(0).padStart(8)} tracks/s wall  ${perCore.toFixed(0).padStart(8)} tracks/s per core (CPU time)  ${(perCore * meanHits).toFixed(0).padStart(9)} hits/s${flag}\n`);
  return perCore;
}

process.stdout.write(`fit with material: ${s.count} tracks, ${meanHits.toFixed(1)} hits per track on average, liquid propane, 2 T (load average ${loadavg()[0].toFixed(1)})\n`);
const one = timed('one hypothesis (pi+)', [PION_PLUS], 50_000);
const five = timed('five hypotheses (e, mu, pi, K, p)', [ELECTRON, MUON_MINUS, PION_PLUS, KAON_PLUS, PROTON]);
process.stdout.write(`  five hypotheses cost ${(one / five).toFixed(2)} × one\n`);

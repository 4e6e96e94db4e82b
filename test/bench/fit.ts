/**
 * Fit benchmarks (run by `npm run bench`, or directly: `node --import tsx test/bench/fit.ts`).
 * Targets from the foundation issue, one core, 20-hit tracks: Kåsa ≥ 8 M tracks/s, Taubin
 * ≥ 5 M tracks/s, geometric fit with covariance ≥ 500 k tracks/s; `sagitta fit` on a
 * 200 000-track × 20-hit CSV under 2.5 s wall, parse included.
 * Inputs are built before the timed bodies; the median of several repetitions is reported.
 */
import { performance } from 'node:perf_hooks';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, openSync, writeSync, closeSync, statSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { fitCircles } from '../../lib/fit/fitCircles.js';
import { preparePlaneHits } from '../../lib/fit/preparePlaneHits.js';
import { parseHitsCsv } from '../../lib/io/parseHitsCsv.js';
import { readFileSync } from 'node:fs';
import { seededRandom } from '../../lib/simulate/rng.js';

const TRACKS = 200_000;
const HITS = 20;

function makeTracks() {
  const rng = seededRandom(1, 'bench');
  const x = new Float64Array(TRACKS * HITS), y = new Float64Array(TRACKS * HITS);
  const offsets = new Int32Array(TRACKS + 1);
  for (let k = 0; k < TRACKS; k++) {
    const R = 0.3 + 5 * rng.uniform(), a0 = 2 * Math.PI * rng.uniform(), span = (rng.uniform() < 0.5 ? -1 : 1) * (0.3 + rng.uniform());
    for (let i = 0; i < HITS; i++) {
      const a = a0 + (span * i) / (HITS - 1);
      x[k * HITS + i] = R * Math.cos(a) + 2e-4 * rng.gaussian();
      y[k * HITS + i] = R * Math.sin(a) + 2e-4 * rng.gaussian();
    }
    offsets[k + 1] = (k + 1) * HITS;
  }
  return { x, y, offsets, sigma: new Float64Array(TRACKS * HITS).fill(2e-4) };
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1];
}

function rate(label: string, target: number | undefined, body: () => void, reps = 11): void {
  for (let w = 0; w < 5; w++) body(); // warm-up: let the JIT settle
  const times: number[] = [];
  for (let r = 0; r < reps; r++) {
    const t0 = performance.now();
    body();
    times.push(performance.now() - t0);
  }
  const perSecond = TRACKS / (median(times) / 1000);
  const flag = target === undefined ? '' : perSecond >= target ? `  (target ≥ ${fmt(target)})` : `  (target ≥ ${fmt(target)}: MISSED)`;
  process.stdout.write(`  ${label.padEnd(52)} ${fmt(perSecond).padStart(7)} tracks/s  ${fmt(perSecond * HITS).padStart(7)} hits/s${flag}\n`);
}

const fmt = (v: number) => (v >= 1e6 ? `${(v / 1e6).toFixed(2)} M` : `${(v / 1e3).toFixed(0)} k`);

function fitRates(): void {
  const { x, y, offsets, sigma } = makeTracks();
  const plain = { x, y, sigmaX: sigma, sigmaY: sigma };
  // Weights and the screen of all numbers are made once per table (the input), as measureTracks
  // and the fit lab do; the last line shows the cost with that preparation inside the timing.
  const hits = preparePlaneHits(plain);
  const cases: [string, string, boolean, number | undefined][] = [
    ['kasa (centre, radius, κ, φ0, d0)', 'kasa', false, 8e6],
    ['kasa + χ² + covariance', 'kasa', true, undefined],
    ['taubin (centre, radius, κ, φ0, d0)', 'taubin', false, 5e6],
    ['taubin + χ² + covariance', 'taubin', true, undefined],
    ['geometric (iterated, χ², covariance)', 'geometric', true, 5e5],
  ];
  for (const [label, method, covariance, target] of cases) {
    rate(label, target, () => void fitCircles(hits, offsets, { method, covariance }));
  }
  rate('kasa, preparing the hits inside the timing', undefined, () => void fitCircles(plain, offsets, { method: 'kasa', covariance: false }));
}

/** Writes the 200 000 × 20 CSV the end-to-end timing reads. */
function writeCsv(path: string): void {
  const rng = seededRandom(2, 'bench');
  const fd = openSync(path, 'w');
  writeSync(fd, 'event,track,x,y,z\n');
  let chunk = '';
  for (let k = 0; k < TRACKS; k++) {
    const R = 300 + 3000 * rng.uniform(), a0 = 2 * Math.PI * rng.uniform(), span = (rng.uniform() < 0.5 ? -1 : 1) * (0.2 + 0.4 * rng.uniform());
    const event = 1 + Math.floor(k / 4);
    for (let i = 0; i < HITS; i++) {
      const a = a0 + (span * i) / (HITS - 1);
      chunk += `${event},${k % 4},${(R * Math.cos(a) - R * Math.cos(a0)).toFixed(3)},${(R * Math.sin(a) - R * Math.sin(a0)).toFixed(3)},${(20 * i + 0.2 * rng.gaussian()).toFixed(3)}\n`;
    }
    if (chunk.length > 1 << 20) { writeSync(fd, chunk); chunk = ''; }
  }
  writeSync(fd, chunk);
  closeSync(fd);
}

function endToEnd(): void {
  const dir = mkdtempSync(join(tmpdir(), 'sagitta-bench-'));
  const csv = join(dir, 'hits-200k.csv');
  writeCsv(csv);
  const size = statSync(csv).size;
  // Parse alone, in process.
  const bytes = readFileSync(csv);
  const parse: number[] = [];
  for (let r = 0; r < 3; r++) {
    const t0 = performance.now();
    parseHitsCsv(bytes, csv);
    parse.push(performance.now() - t0);
  }
  const p = median(parse);
  process.stdout.write(`  ${'CSV parse (in process)'.padEnd(52)} ${(size / 2 ** 20 / (p / 1000)).toFixed(0).padStart(7)} MB/s    ${(p / 1000).toFixed(2)} s for ${(size / 1e6).toFixed(0)} MB\n`);
  const bin = fileURLToPath(new URL('../../kernel/bin/sagitta.js', import.meta.url));
  const walls: number[] = [];
  let summary = '';
  for (let r = 0; r < 3; r++) {
    const t0 = performance.now();
    const run = spawnSync(process.execPath, [bin, 'fit', csv, '--field', '1.5 T', '--out', join(dir, 'tracks.csv')], { encoding: 'utf8' });
    walls.push(performance.now() - t0);
    if (run.status !== 0) throw new Error(run.stderr);
    summary = run.stderr.trim();
  }
  const wall = median(walls) / 1000;
  process.stdout.write(`  ${'sagitta fit, 200 000 tracks × 20 hits, wall'.padEnd(52)} ${wall.toFixed(2).padStart(7)} s        (target < 2.5 s${wall < 2.5 ? '' : ': MISSED'})\n`);
  process.stdout.write(summary.split('\n').map((l) => `      ${l}`).join('\n') + '\n');
  rmSync(dir, { recursive: true, force: true });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  process.stdout.write('circle fits, one core, 20-hit tracks (200 000 per repetition):\n');
  fitRates();
  process.stdout.write('end to end:\n');
  endToEnd();
}

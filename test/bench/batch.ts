/**
 * Batch-path benchmarks (run by `npm run bench -- batch`, or directly:
 * `node --import tsx test/bench/batch.ts [tracks…]`). Targets of the scale issue, on the 2-core
 * reference machine: 1 M tracks × 20 hits from CSV to results in under 10 s wall and under 1 GB
 * peak RSS; the 200 000-track × 20-hit CSV in at most half the time of an array-language script
 * doing CSV read + vectorised Kåsa (about 2.5 s there, so ≤ 1.25 s). Wall time and peak RSS of the
 * whole `sagitta fit` process (worker threads included) come from /usr/bin/time, with its CPU
 * time (user + system, all threads); the machine's load average is printed beside them, since
 * other work on the two cores slows every figure. Timed twice over: from the build (made first,
 * `npm run build`; what an installed package runs on plain Node) and from the sources through
 * tsx (a checkout, which pays about a second of loading in each thread).
 */
import { spawnSync } from 'node:child_process';
import { closeSync, existsSync, mkdtempSync, openSync, rmSync, statSync, writeSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { seededRandom } from '../../lib/simulate/rng.js';

const HITS = 20;

/** Writes `tracks` helices of 20 hits (4 tracks an event, seed 13) as CSV in metres-free mm columns. */
function writeCsv(path: string, tracks: number): void {
  const rng = seededRandom(13, 'bench-batch');
  const fd = openSync(path, 'w');
  writeSync(fd, 'event,track,x,y,z\n');
  let chunk = '';
  for (let k = 0; k < tracks; k++) {
    const R = 300 + 3000 * rng.uniform(), a0 = 2 * Math.PI * rng.uniform(), span = (rng.uniform() < 0.5 ? -1 : 1) * (0.2 + 0.4 * rng.uniform());
    const event = 1 + Math.floor(k / 4);
    for (let i = 0; i < HITS; i++) {
      const a = a0 + (span * i) / (HITS - 1);
      chunk += `${event},${k % 4},${(R * Math.cos(a) - R * Math.cos(a0)).toFixed(3)},${(R * Math.sin(a) - R * Math.sin(a0)).toFixed(3)},${(20 * i + 0.2 * rng.gaussian()).toFixed(3)}\n`;
    }
    if (chunk.length > 1 << 22) { writeSync(fd, chunk); chunk = ''; }
  }
  writeSync(fd, chunk);
  closeSync(fd);
}

interface Timed { readonly wallS: number; readonly cpuS: number; readonly peakMB: number; readonly summary: string }

/** The two ways `sagitta` runs: the build on plain Node (an installed package), or the sources through tsx (a checkout). */
const ENTRIES = {
  build: fileURLToPath(new URL('../../dist/kernel/entry/sagitta.js', import.meta.url)),
  source: fileURLToPath(new URL('../../kernel/bin/sagitta.js', import.meta.url)),
} as const;

function timedFit(entry: keyof typeof ENTRIES, csv: string, out: string, extra: readonly string[]): Timed {
  const r = spawnSync('/usr/bin/time', ['-f', 'TIME %e %U %S %M', process.execPath, ENTRIES[entry], 'fit', csv, '--field', '1.5 T', '--quiet', '--out', out, ...extra], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(r.stderr);
  const m = /TIME ([\d.]+) ([\d.]+) ([\d.]+) (\d+)/.exec(r.stderr);
  if (!m) throw new Error(`no timing in ${r.stderr}`);
  return { wallS: Number(m[1]), cpuS: Number(m[2]) + Number(m[3]), peakMB: Number(m[4]) / 1024, summary: r.stderr.replace(/TIME.*\n?/, '').trim() };
}

function line(what: string, t: Timed, target: string, met: boolean): void {
  process.stdout.write(`  ${what.padEnd(52)} ${t.wallS.toFixed(2).padStart(6)} s wall ${t.cpuS.toFixed(2).padStart(6)} s CPU ${t.peakMB.toFixed(0).padStart(5)} MB peak RSS   (target ${target}${met ? '' : ': MISSED'})\n`);
}

if (import.meta.url === `file://${process.argv[1]}`) {
  if (!existsSync('/usr/bin/time')) throw new Error('needs /usr/bin/time (Debian package "time") for the peak RSS');
  // The build is what an installed package runs; made afresh so it is the code of this checkout.
  const built = spawnSync(process.execPath, [fileURLToPath(new URL('../../kernel/bin/build.js', import.meta.url))], { encoding: 'utf8' });
  if (built.status !== 0) throw new Error(`npm run build failed:\n${built.stderr}`);
  const dir = mkdtempSync(join(tmpdir(), 'sagitta-bench-batch-'));
  const load = () => `load average ${loadavg().map((l) => l.toFixed(2)).join(' ')}`;
  process.stdout.write(`sagitta fit from CSV, ${availableParallelism()} cores, all threads unless said; from the build (plain Node, as installed) unless said; ${load()}\n`);
  try {
    const sizes = process.argv.slice(2).map(Number).filter((n) => n > 0);
    for (const tracks of sizes.length ? sizes : [200_000, 1_000_000]) {
      const csv = join(dir, `hits-${tracks}.csv`);
      writeCsv(csv, tracks);
      const mb = statSync(csv).size / 1e6;
      const label = `${tracks.toLocaleString('en')} tracks × 20 hits (${mb.toFixed(0)} MB)`;
      const runs = [0, 1, 2].map(() => timedFit('build', csv, join(dir, 'tracks.csv'), []));
      const best = runs.sort((a, b) => a.wallS - b.wallS)[1];
      if (tracks === 200_000) line(`${label}, median of 3`, best, '≤ 1.25 s', best.wallS <= 1.25);
      else line(`${label}, median of 3`, best, '< 10 s and < 1 GB', best.wallS < 10 && best.peakMB < 1024);
      const same = (other: string) => spawnSync('cmp', ['-s', join(dir, 'tracks.csv'), join(dir, other)]).status === 0;
      const one = timedFit('build', csv, join(dir, 'tracks-1.csv'), ['--threads', '1']);
      line('  the same, --threads 1', one, 'same bytes', same('tracks-1.csv'));
      const source = timedFit('source', csv, join(dir, 'tracks-source.csv'), []);
      line('  the same from source (tsx; a checkout)', source, 'same bytes', same('tracks-source.csv'));
      const sourceOne = timedFit('source', csv, join(dir, 'tracks-source-1.csv'), ['--threads', '1']);
      line('  the same from source, --threads 1', sourceOne, 'same bytes', same('tracks-source-1.csv'));
      process.stdout.write(`      ${best.summary.split('\n').slice(-1)[0]}; ${load()}\n`);
      rmSync(csv);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

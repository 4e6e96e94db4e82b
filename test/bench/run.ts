/**
 * `npm run bench`: runs every benchmark file in this folder in its own process, one after the
 * other (so one does not warm or pollute the next), and prints their throughput lines.
 * A benchmark file prints its results when executed directly. Nothing here asserts a time:
 * targets are printed beside the measured figures.
 */
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import { cpus, totalmem } from 'node:os';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv.slice(2);
const files = readdirSync(here)
  .filter((f) => f.endsWith('.ts') && f !== 'run.ts' && !f.startsWith('_'))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();

process.stdout.write(`Sagitta benchmarks — Node ${process.version}, ${cpus().length} × ${cpus()[0]?.model ?? 'CPU'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB\n`);
let failed = 0;
for (const f of files) {
  process.stdout.write(`\n== ${f}\n`);
  const r = spawnSync(process.execPath, ['--import', 'tsx', join(here, f)], { stdio: 'inherit' });
  if (r.status !== 0) failed++;
}
process.exitCode = failed ? 1 : 0;

/**
 * Import time of the library: `import … from "sagitta-tracks"` in a fresh Node process, as an
 * installed package (the build, plain Node) and from the sources in a checkout (through tsx).
 * Target (issue: one public API): under 300 ms for the installed package on the 2-core machine.
 * Builds dist/ first when it is missing (dist/ is the build's own ignored output).
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
if (!existsSync(join(root, 'dist', 'lib', 'index.js'))) spawnSync(process.execPath, [join(root, 'kernel', 'bin', 'build.js')], { stdio: 'inherit' });

function medianMs(args: string[], runs = 9): number {
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    const r = spawnSync(process.execPath, args, { cwd: root, encoding: 'utf8' });
    if (r.status !== 0) throw new Error(r.stderr);
    times.push(performance.now() - t0);
  }
  return times.sort((a, b) => a - b)[Math.floor(runs / 2)];
}

const empty = medianMs(['-e', '0']);
const built = medianMs(['--input-type=module', '-e', `await import(${JSON.stringify(pathToFileURL(join(root, 'dist', 'lib', 'index.js')).href)})`]);
const source = medianMs(['--import', 'tsx', '--input-type=module', '-e', `await import(${JSON.stringify(pathToFileURL(join(root, 'lib', 'index.ts')).href)})`]);
const fmt = (ms: number) => `${ms.toFixed(0)} ms`;
process.stdout.write(`node start-up alone: ${fmt(empty)} (median of 9)\n`);
process.stdout.write(`import the installed build (plain Node): ${fmt(built)} in a fresh process, ${fmt(built - empty)} beyond start-up (target < 300 ms)\n`);
process.stdout.write(`import the sources through tsx (a checkout): ${fmt(source)}\n`);

/**
 * Kernel benchmarks (`npm run bench`, or `node --import tsx test/bench/kernel-start.ts`).
 * Target from issue 5: kernel start to first `idle` under 2.5 s — measured from spawning
 * kernel.json's argv to the first `idle` status on iopub (after the kernel_info request a front
 * end sends first). Also printed: the first cell after idle (session start-up, library load and
 * first compile included) and the round trip of a trivial cell once warm.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath } from 'node:url';
import { ProtocolClient, readKernelJson, withTimeout } from '../kernel/protocol-client.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const RUNS = 5;
const WARM_CELLS = 20;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[s.length >> 1];
}

const kernels = mkdtempSync(path.join(tmpdir(), 'sagitta-bench-kernels-'));
const work = mkdtempSync(path.join(tmpdir(), 'sagitta-bench-nb-'));
execFileSync(process.execPath, [path.join(root, 'kernel/bin/sagitta.js'), 'kernel', 'install', '--dir', kernels, '--id', 'bench'], { cwd: root });
const argv = readKernelJson(path.join(kernels, 'bench')).argv;

const toIdle: number[] = [];
const firstCell: number[] = [];
const firstImport: number[] = [];
const warm: number[] = [];
for (let run = 0; run < RUNS; run++) {
  const client = new ProtocolClient();
  const t0 = performance.now();
  await client.launch(argv, work);
  await client.handshake(60_000, 50);
  toIdle.push(performance.now() - t0);
  const t1 = performance.now();
  await client.request('shell', 'execute_request', { code: '1 + 1' }, 120_000);
  firstCell.push(performance.now() - t1);
  const t2 = performance.now();
  await client.request('shell', 'execute_request', { code: 'import { PROTON } from "sagitta-tracks";\nPROTON.massMeV' }, 120_000);
  firstImport.push(performance.now() - t2);
  if (run === 0) {
    for (let i = 0; i < WARM_CELLS; i++) {
      const t = performance.now();
      await client.request('shell', 'execute_request', { code: `${i} * 2` });
      warm.push(performance.now() - t);
    }
  }
  await client.request('control', 'shutdown_request', { restart: false });
  await withTimeout(client.exitCode, 15_000, 'kernel exit');
  client.close();
}
// A front end usually sits idle for a while before the first cell: the kernel warms up meanwhile.
const THINK_MS = 10_000;
let afterPause = NaN;
{
  const client = new ProtocolClient();
  await client.launch(argv, work);
  await client.handshake(60_000, 50);
  await new Promise((resolve) => setTimeout(resolve, THINK_MS));
  const t = performance.now();
  await client.request('shell', 'execute_request', { code: 'import { PROTON } from "sagitta-tracks";\nPROTON.massMeV' }, 120_000);
  afterPause = performance.now() - t;
  await client.request('control', 'shutdown_request', { restart: false });
  await withTimeout(client.exitCode, 15_000, 'kernel exit');
  client.close();
}
rmSync(kernels, { recursive: true, force: true });
rmSync(work, { recursive: true, force: true });

const ms = (x: number) => `${x.toFixed(0)} ms`;
process.stdout.write(`kernel start → first idle: median ${ms(median(toIdle))} (min ${ms(Math.min(...toIdle))}, max ${ms(Math.max(...toIdle))}, ${RUNS} starts; target < 2500 ms)\n`);
process.stdout.write(`first cell after idle ("1 + 1", session start-up included): median ${ms(median(firstCell))}\n`);
process.stdout.write(`first cell importing "sagitta-tracks" (library load and check): median ${ms(median(firstImport))}\n`);
process.stdout.write(`first cell importing "sagitta-tracks" ${THINK_MS / 1000} s after idle (warmed up meanwhile): ${ms(afterPause)}\n`);
process.stdout.write(`warm trivial cell round trip: median ${ms(median(warm))} (${WARM_CELLS} cells, ${(1000 / median(warm)).toFixed(1)} cells/s)\n`);
process.exit(0);

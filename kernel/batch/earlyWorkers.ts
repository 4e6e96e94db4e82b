/**
 * Batch worker threads started as the command starts, before it has loaded its own modules: a
 * worker needs about as long to load the library as this thread does (a quarter of a second from
 * the build, a second from source through tsx), so started then, it is ready when the first
 * chunk is. Only for `sagitta fit` / `sagitta vertices` on an input of several chunks, with the
 * thread count runBatch will use; the pool adopts them (`adoptEarlyWorker`), given its settings by
 * message. Until adopted they do not keep the process alive, and runBatch stops any left over.
 * This file loads nothing of the library (it runs before it).
 */
import { statSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { Worker } from 'node:worker_threads';
import { workerUrl } from '../packageMode.js';
import { CHUNK_BYTES } from './chunkBytes.js';

/** The commands whose batch job has the command's name. */
const BATCH_COMMANDS: ReadonlySet<string> = new Set(['fit', 'vertices']);

interface EarlyWorker {
  readonly worker: Worker;
  readonly jobName: string;
  ready: boolean;
  readonly stopListening: () => void;
}

/** Started and not yet adopted, for this process (one command runs per process). */
const early: EarlyWorker[] = [];

/**
 * Input bytes per worker thread beyond this one when the thread count is not given, per batch
 * job. Each thread loads the library and warms up its compiled code on its own (≈ 0.5 s of CPU),
 * and two busy threads on this 2-core machine run each chunk ≈ 1.3× slower than one. Measured
 * for `fit` on the 20-hit helix CSV (2026-12-04, load < 2): 126 MB took 1.99 s with one thread
 * and 2.22 s with two, 252 MB 2.8–3.0 s and 2.4–2.8 s, 644 MB 7.1 s and 5.3 s; so a second
 * thread starts from 160 MB (`npm run bench -- batch`). Jobs not listed (`vertices`, whose work
 * per byte is far larger) use every core from the second chunk on.
 */
export const BYTES_PER_EXTRA_THREAD: Readonly<Record<string, number>> = Object.freeze({ fit: 160e6 });

/**
 * The thread count of a batch run of `jobName`: the request, or by default all cores — for a
 * job in BYTES_PER_EXTRA_THREAD one thread more per that many bytes of input (a small file is
 * quicker in one); at most 64 and at most one per chunk of the input. runBatch uses the same rule.
 */
export function batchThreads(requested: number | undefined, inputBytes: number, jobName: string): number {
  const per = BYTES_PER_EXTRA_THREAD[jobName];
  const byDefault = per === undefined ? availableParallelism() : Math.min(availableParallelism(), 1 + Math.floor(inputBytes / per));
  return Math.max(1, Math.min(requested ?? byDefault, 64, Math.ceil(inputBytes / CHUNK_BYTES)));
}

/**
 * Starts the worker threads `sagitta <fit|vertices> <input> … [--threads n]` will use, read from
 * the command line as given (node, script, command, input, …). Anything unusual (no such input,
 * a malformed --threads) starts none: the command then reports it as usual.
 */
export function startEarlyWorkers(argv: readonly string[]): void {
  const [, , command, input] = argv;
  if (command === undefined || !BATCH_COMMANDS.has(command) || input === undefined || input.startsWith('-')) return;
  let requested: number | undefined;
  for (let i = 4; i < argv.length; i++) {
    const m = /^--threads(?:=(.*))?$/.exec(argv[i]);
    if (!m) continue;
    const text = m[1] ?? argv[i + 1] ?? '';
    if (!/^\s*\d{1,3}\s*$/.test(text)) return;
    requested = Number(text);
  }
  let bytes: number;
  try {
    const st = statSync(input);
    if (!st.isFile()) return;
    bytes = st.size;
  } catch {
    return;
  }
  const workers = batchThreads(requested, bytes, command) - 1;
  for (let t = 0; t < workers; t++) {
    const worker = new Worker(workerUrl('kernel/batch/batchWorker'), { workerData: { jobName: command } });
    worker.unref();
    const slot: EarlyWorker = {
      worker, jobName: command, ready: false,
      stopListening: () => {
        worker.off('message', onMessage);
        worker.off('error', onError);
      },
    };
    const onMessage = (m: { ready?: boolean }) => {
      if (m.ready) slot.ready = true;
    };
    // A worker that fails before it is adopted is dropped; the pool starts a fresh one instead.
    const onError = () => {
      const at = early.indexOf(slot);
      if (at >= 0) early.splice(at, 1);
    };
    worker.on('message', onMessage);
    worker.on('error', onError);
    early.push(slot);
  }
}

/** An early worker for `jobName` (and whether it has loaded), now the caller's; undefined when none is left. */
export function adoptEarlyWorker(jobName: string): { worker: Worker; ready: boolean } | undefined {
  const at = early.findIndex((w) => w.jobName === jobName);
  if (at < 0) return undefined;
  const [slot] = early.splice(at, 1);
  slot.stopListening();
  slot.worker.ref();
  return { worker: slot.worker, ready: slot.ready };
}

/** Stops the early workers nobody adopted (a run that needed fewer threads, or none). */
export async function stopEarlyWorkers(): Promise<void> {
  const left = early.splice(0);
  await Promise.all(left.map((w) => w.worker.terminate()));
}

import { Worker } from 'node:worker_threads';
import { workerUrl } from '../packageMode.js';
import { adoptEarlyWorker } from './earlyWorkers.js';
import { errorFromData, type Chunk, type ChunkOutcome, type ChunkSettings, type ErrorData } from './processChunk.js';

const ENTRY = workerUrl('kernel/batch/batchWorker');

type Reply = { id: number; outcome?: ChunkOutcome; error?: ErrorData; ready?: boolean };

/** A chunk's outcome, or the error it raised as plain data (so the caller can place its line). */
export type Settled = { outcome: ChunkOutcome } | { error: ErrorData };

/** Chunks a worker holds at most (one worked, one waiting), so it never waits for the next. */
const QUEUE = 2;

/**
 * A fixed set of worker threads running one batch job. `submit` hands a chunk to the least busy
 * worker and returns a promise of its outcome; callers await them in submission order, so the
 * output order never depends on which thread finished first. `hasRoom` tells the caller whether
 * a started worker would take a chunk now; when none would, the caller works it itself.
 */
export class WorkerPool {
  private readonly workers: { worker: Worker; busy: number; ready: boolean }[] = [];
  private readonly waiting = new Map<number, (s: Settled) => void>();
  private nextId = 0;
  private failure: Error | undefined;

  constructor(threads: number, jobName: string, settings: ChunkSettings) {
    for (let t = 0; t < threads; t++) {
      // A worker started with the command (earlyWorkers.ts) gets its settings by message.
      const adopted = adoptEarlyWorker(jobName);
      const worker = adopted?.worker ?? new Worker(ENTRY, { workerData: { jobName, settings } });
      if (adopted) worker.postMessage({ settings });
      const slot = { worker, busy: 0, ready: adopted?.ready ?? false };
      worker.on('message', (m: Reply) => {
        if (m.ready) {
          slot.ready = true;
          return;
        }
        slot.busy--;
        const done = this.waiting.get(m.id);
        this.waiting.delete(m.id);
        done?.(m.error ? { error: m.error } : { outcome: m.outcome! });
      });
      worker.on('error', (err) => this.fail(err));
      worker.on('exit', (code) => {
        if (code !== 0) this.fail(new Error(`a batch worker thread stopped (exit code ${code})`));
      });
      this.workers.push(slot);
    }
  }

  /**
   * True when a started worker holds fewer than QUEUE chunks, or one still starting holds none
   * (it works that one as soon as it has loaded, while the caller works the next ones itself).
   */
  hasRoom(): boolean {
    return this.failure === undefined && this.workers.some((w) => w.busy < (w.ready ? QUEUE : 1));
  }

  /**
   * Hands `chunk` to a worker. A text chunk's bytes are moved, not copied; so are the buffers in
   * `moved` (those of a table this thread made for the worker and no longer needs).
   */
  submit(chunk: Chunk, moved: readonly ArrayBuffer[] = []): Promise<Settled> {
    if (this.failure) return Promise.reject(this.failure);
    const slot = this.workers.reduce((a, b) => (Number(b.ready) - Number(a.ready) || a.busy - b.busy) > 0 ? b : a);
    const id = this.nextId++;
    slot.busy++;
    const transfer = chunk.kind === 'table' ? [...moved] : [chunk.bytes.buffer as ArrayBuffer];
    return new Promise<Settled>((resolve, reject) => {
      this.waiting.set(id, resolve);
      this.rejectors.set(id, reject);
      slot.worker.postMessage({ id, chunk }, transfer);
    }).finally(() => this.rejectors.delete(id));
  }

  private readonly rejectors = new Map<number, (e: Error) => void>();

  private fail(err: Error): void {
    this.failure ??= err;
    for (const reject of this.rejectors.values()) reject(err);
    this.rejectors.clear();
    this.waiting.clear();
  }

  async close(): Promise<void> {
    await Promise.all(this.workers.map((w) => w.worker.terminate()));
  }
}

export { errorFromData };

import { Worker } from 'node:worker_threads';
import { workerUrl } from '../packageMode.js';
import { errorFromData, type Chunk, type ChunkOutcome, type ChunkSettings, type ErrorData } from './processChunk.js';

const ENTRY = workerUrl('kernel/batch/batchWorker');

type Reply = { id: number; outcome?: ChunkOutcome; error?: ErrorData; ready?: boolean };

/** A chunk's outcome, or the error it raised as plain data (so the caller can place its line). */
export type Settled = { outcome: ChunkOutcome } | { error: ErrorData };

/**
 * A fixed set of worker threads running one batch job. `submit` hands a chunk to the least busy
 * worker and returns a promise of its outcome; callers await them in submission order, so the
 * output order never depends on which thread finished first.
 */
export class WorkerPool {
  private readonly workers: { worker: Worker; busy: number }[] = [];
  private readonly waiting = new Map<number, (s: Settled) => void>();
  private nextId = 0;
  private failure: Error | undefined;

  constructor(threads: number, jobName: string, settings: ChunkSettings) {
    for (let t = 0; t < threads; t++) {
      const worker = new Worker(ENTRY, { workerData: { jobName, settings } });
      const slot = { worker, busy: 0 };
      worker.on('message', (m: Reply) => {
        if (m.ready) return;
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

  submit(chunk: Chunk): Promise<Settled> {
    if (this.failure) return Promise.reject(this.failure);
    const slot = this.workers.reduce((a, b) => (b.busy < a.busy ? b : a));
    const id = this.nextId++;
    slot.busy++;
    const transfer = chunk.kind === 'table' ? [] : [chunk.bytes.buffer as ArrayBuffer];
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

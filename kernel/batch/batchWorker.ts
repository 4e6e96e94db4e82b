/**
 * A batch worker thread: loads one job, then processes chunks as they come and posts each
 * outcome back (encoded rows moved, not copied). Errors go back as plain data.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { loadBatchJob } from './batchJobs.js';
import { errorToData, processChunk, type Chunk, type ChunkSettings } from './processChunk.js';

// Settings come with the start, or by a first message for a worker started with the command
// (earlyWorkers.ts), before any chunk.
const data = workerData as { jobName: string; settings?: ChunkSettings };
let settings = data.settings;
const port = parentPort!;
const job = await loadBatchJob(data.jobName);

port.on('message', (m: { id: number; chunk: Chunk } | { settings: ChunkSettings }) => {
  if ('settings' in m) {
    settings = m.settings;
    return;
  }
  try {
    const outcome = processChunk(m.chunk, job, settings!);
    const transfer: ArrayBuffer[] = [];
    if (outcome.encoded && outcome.encoded.byteOffset === 0 && outcome.encoded.buffer instanceof ArrayBuffer) transfer.push(outcome.encoded.buffer);
    port.postMessage({ id: m.id, outcome }, transfer);
  } catch (err) {
    port.postMessage({ id: m.id, error: errorToData(err) });
  }
});
port.postMessage({ ready: true });

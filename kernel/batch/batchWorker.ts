/**
 * A batch worker thread: loads one job, then processes chunks as they come and posts each
 * outcome back (encoded rows moved, not copied). Errors go back as plain data.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { loadBatchJob } from './batchJobs.js';
import { errorToData, processChunk, type Chunk, type ChunkSettings } from './processChunk.js';

const { jobName, settings } = workerData as { jobName: string; settings: ChunkSettings };
const port = parentPort!;
const job = await loadBatchJob(jobName);

port.on('message', (m: { id: number; chunk: Chunk }) => {
  try {
    const outcome = processChunk(m.chunk, job, settings);
    const transfer: ArrayBuffer[] = [];
    if (outcome.encoded && outcome.encoded.byteOffset === 0 && outcome.encoded.buffer instanceof ArrayBuffer) transfer.push(outcome.encoded.buffer);
    port.postMessage({ id: m.id, outcome }, transfer);
  } catch (err) {
    port.postMessage({ id: m.id, error: errorToData(err) });
  }
});
port.postMessage({ ready: true });

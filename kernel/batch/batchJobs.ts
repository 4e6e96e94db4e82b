import type { BatchJob } from './batchJob.js';

/**
 * Every batch job by name, loaded on demand (a worker thread loads only the one it runs).
 * Add a job here: `name: async () => (await import('./myJob.js')).MY_JOB`.
 */
export const BATCH_JOBS: Readonly<Record<string, () => Promise<BatchJob<never>>>> = {
  fit: async () => (await import('./fitJob.js')).FIT_JOB as BatchJob<never>,
  vertices: async () => (await import('./verticesJob.js')).VERTICES_JOB as BatchJob<never>,
};

export async function loadBatchJob(name: string): Promise<BatchJob<unknown>> {
  const load = BATCH_JOBS[name];
  if (load === undefined) throw new Error(`internal: no batch job named ${name}`);
  return (await load()) as BatchJob<unknown>;
}

import { availableParallelism } from 'node:os';
import { describe, expect, it } from 'vitest';
import { BYTES_PER_EXTRA_THREAD, batchThreads } from '../../kernel/batch/earlyWorkers.js';
import { CHUNK_BYTES } from '../../kernel/batch/chunkBytes.js';

/** The default thread count of the batch path (the benchmark figures behind it are in earlyWorkers.ts). */
describe('batchThreads', () => {
  const cores = availableParallelism();

  it('fit: one thread below 160 MB, one more per 160 MB above, never more than the cores', () => {
    expect(BYTES_PER_EXTRA_THREAD.fit).toBe(160e6);
    expect(batchThreads(undefined, 126e6, 'fit')).toBe(1);
    expect(batchThreads(undefined, 160e6 - 1, 'fit')).toBe(1);
    expect(batchThreads(undefined, 160e6, 'fit')).toBe(Math.min(cores, 2));
    expect(batchThreads(undefined, 644e6, 'fit')).toBe(Math.min(cores, 5));
  });

  it('vertices (not listed): every core once the input has as many chunks', () => {
    expect(batchThreads(undefined, 100 * CHUNK_BYTES, 'vertices')).toBe(Math.min(cores, 64));
    expect(batchThreads(undefined, CHUNK_BYTES, 'vertices')).toBe(1);
  });

  it('a requested count is kept, up to 64 and one per chunk', () => {
    expect(batchThreads(3, 126e6, 'fit')).toBe(3);
    expect(batchThreads(200, 1000 * CHUNK_BYTES, 'fit')).toBe(64);
    expect(batchThreads(8, 2.5 * CHUNK_BYTES, 'fit')).toBe(3);
    expect(batchThreads(4, 0, 'fit')).toBe(1);
  });
});

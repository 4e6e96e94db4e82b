import { defaultServerConditions } from 'vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
  // This file lives in test/ to keep the top level as the design card lists it; paths are from the root.
  root: new URL('..', import.meta.url).pathname,
  // Scripts that import the package by name (notebooks/data/make-data.ts) get its sources, not dist/.
  resolve: { conditions: ['sagitta-source', ...defaultServerConditions] },
  ssr: { resolve: { conditions: ['sagitta-source', ...defaultServerConditions], externalConditions: ['sagitta-source'] } },
  test: {
    include: ['test/**/*.test.ts'],
    exclude: ['test/bench/**', 'node_modules/**', 'test/.tmp/**'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    // Two cores on the reference machine: keep the pool small so browser and kernel tests get time.
    maxWorkers: 2,
  },
});

import { defineConfig } from 'vitest/config';
import base from './vitest.config.js';

/**
 * The test set mutation testing runs against (`npm run mutate`): the tests of the numeric rooms
 * only, so a mutant never starts notebook, kernel or browser tests. Stryker narrows it further to
 * the tests related to the mutated files. Spread, not `mergeConfig`: mergeConfig concatenates
 * arrays, so the base `include` (every test) would survive beside this list.
 */
export default defineConfig({
  ...base,
  test: {
    ...base.test,
    include: [
      'test/fit/**/*.test.ts', 'test/track/**/*.test.ts', 'test/matter/**/*.test.ts', 'test/analysis/**/*.test.ts',
      'test/vertex/**/*.test.ts', 'test/fitlab/**/*.test.ts', 'test/simulate/**/*.test.ts', 'test/particles.test.ts',
      'test/units.test.ts',
    ],
    maxWorkers: 1,
  },
});

import { defineConfig } from 'vitest/config';
import base from './vitest.config.js';

/** The numeric rooms' tests (and those of the rooms that exercise them). */
const NUMERIC_ROOM_TESTS = [
  'test/fit/**/*.test.ts', 'test/track/**/*.test.ts', 'test/matter/**/*.test.ts', 'test/analysis/**/*.test.ts',
  'test/vertex/**/*.test.ts', 'test/fitlab/**/*.test.ts', 'test/simulate/**/*.test.ts', 'test/particles.test.ts',
  'test/units.test.ts',
];

/**
 * The test set mutation testing runs against (`npm run mutate`): the tests of the numeric rooms
 * only, so a mutant never starts notebook, kernel or browser tests. Stryker narrows it further to
 * the tests related to the mutated files. Spread, not `mergeConfig`: mergeConfig concatenates
 * arrays, so the base `include` (every test) would survive beside this list.
 *
 * `SAGITTA_MUTATE_TESTS` (comma-separated globs) narrows the set further, e.g. to a room's own
 * tests (`SAGITTA_MUTATE_TESTS='test/matter/**\/*.test.ts'`): a "static" mutant re-runs every test
 * of the set, and with the whole set that is ≈ 90 s a mutant for lib/matter. The score is then
 * what the room's own tests kill (a lower bound of the full set's).
 */
const only = process.env.SAGITTA_MUTATE_TESTS?.split(',').map((s) => s.trim()).filter(Boolean);

export default defineConfig({
  ...base,
  test: {
    ...base.test,
    include: only && only.length > 0 ? only : NUMERIC_ROOM_TESTS,
    maxWorkers: 1,
  },
});

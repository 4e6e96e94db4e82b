// Mutation testing of the numeric rooms (npm run mutate). Too slow for CI or npm test: run it
// before resolving an issue that touches physics, on the files the issue changed, e.g.
//   npm run mutate -- --mutate lib/track/momentum.ts --concurrency 1
// Scores and the surviving mutants judged equivalent are kept in test/mutation.md.
/** @type {import('@stryker-mutator/api/core').PartialStrykerOptions} */
export default {
  testRunner: 'vitest',
  vitest: { configFile: 'test/vitest.mutate.config.ts', related: true },
  plugins: ['@stryker-mutator/vitest-runner'],
  mutate: [
    'lib/fit/**/*.ts', 'lib/track/**/*.ts', 'lib/matter/**/*.ts', 'lib/analysis/**/*.ts', 'lib/vertex/**/*.ts',
    '!lib/**/index.ts',
  ],
  checkers: [],
  coverageAnalysis: 'perTest',
  concurrency: 1,
  timeoutMS: 60000,
  tempDirName: 'test/.tmp/stryker',
  cleanTempDir: 'always',
  reporters: ['clear-text', 'progress', 'json'],
  jsonReporter: { fileName: 'test/.tmp/mutation/report.json' },
  thresholds: { high: 90, low: 85, break: null },
  ignorePatterns: ['test/.tmp/**', '.ci/**'],
};

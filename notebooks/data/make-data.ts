/**
 * Makes the invented demo data in notebooks/data/ from the scenario files beside this script.
 * Run from the repository root:  npx tsx notebooks/data/make-data.ts
 * Each scenario runs with the fixed seed listed below; the outputs are byte-identical on every
 * regeneration (seeded pure-rand stream, fixed-decimal formatting, no dates in the files).
 * `npx tsx notebooks/data/make-data.ts --check` regenerates in memory and fails if any file differs.
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { formatHitsCsv, formatRunRecord, formatTruthCsv, readScenario, SCENARIO_SCHEMA, simulateChamber } from 'sagitta';
import { benchFiles } from './benchSeries.js';
import { overlayEvents } from './overlay.js';

const here = dirname(fileURLToPath(import.meta.url));

/** Scenario name → seed. Changing a seed changes every number in that dataset. */
export const DEMO_SEEDS: Readonly<Record<string, number>> = Object.freeze({
  brindlemoor: 20260401,
  'brindlemoor-planes': 20260402,
  cinderfell: 20260403,
  larkspur: 20260404,
});

/**
 * Datasets made by laying the events of one scenario over another's (`overlay.ts`): each event
 * of the first scenario gets `perEvent` events of the second. Both run with the dataset's seed
 * (the second with seed + 1).
 */
export const DEMO_OVERLAYS: Readonly<Record<string, { readonly base: string; readonly extra: string; readonly perEvent: number }>> = Object.freeze({
  cinderfell: { base: 'cinderfell-decays', extra: 'cinderfell-prompt', perEvent: 2 },
});

export function makeDemoFiles(name: string): Record<string, string> {
  const overlay = DEMO_OVERLAYS[name];
  if (overlay) {
    const base = simulateChamber(readScenario(join(here, `${overlay.base}.scenario.json`)), DEMO_SEEDS[name]);
    const extra = simulateChamber(readScenario(join(here, `${overlay.extra}.scenario.json`)), DEMO_SEEDS[name] + 1);
    const result = overlayEvents(base, extra, overlay.perEvent, name);
    const files = { hits: `${name}-hits.csv`, truth: `${name}-truth.csv`, scenarios: `${overlay.base}.scenario.json + ${overlay.perEvent} × ${overlay.extra}.scenario.json` };
    return { [files.hits]: formatHitsCsv(result), [files.truth]: formatTruthCsv(result), [`${name}.run.json`]: formatRunRecord(result, files) };
  }
  const benchFile = join(here, `${name}.bench.json`);
  if (existsSync(benchFile)) return benchFiles(JSON.parse(readFileSync(benchFile, 'utf8')), DEMO_SEEDS[name]);
  const scenarioFile = join(here, `${name}.scenario.json`);
  const config = readScenario(scenarioFile);
  const result = simulateChamber(config, DEMO_SEEDS[name]);
  const files = {
    hits: `${name}-hits.csv`,
    truth: `${name}-truth.csv`,
    scenario: `${name}.scenario.json`,
  };
  return {
    [files.hits]: formatHitsCsv(result),
    [files.truth]: formatTruthCsv(result),
    [`${name}.run.json`]: formatRunRecord(result, files),
  };
}

/** The JSON Schema of scenario files, kept beside them so that editors can check them. */
export function schemaFile(): Record<string, string> {
  return { 'scenario.schema.json': JSON.stringify(SCENARIO_SCHEMA, null, 2) + '\n' };
}

function main(): void {
  const check = process.argv.includes('--check');
  let differ = 0;
  const outputs = [schemaFile(), ...Object.keys(DEMO_SEEDS).map(makeDemoFiles)];
  for (const files of outputs) {
    for (const [file, text] of Object.entries(files)) {
      const path = join(here, file);
      if (check) {
        let old = '';
        try { old = readFileSync(path, 'utf8'); } catch { /* missing counts as different */ }
        if (old !== text) { differ++; process.stderr.write(`differs: ${file}\n`); }
      } else {
        writeFileSync(path, text);
        process.stdout.write(`wrote ${file} (${Buffer.byteLength(text)} bytes)\n`);
      }
    }
  }
  if (differ > 0) process.exitCode = 1;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) main();

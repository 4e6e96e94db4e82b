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
import { formatHitsCsv, formatRunRecord, formatTruthCsv, readScenario, SCENARIO_SCHEMA, seededRandom, simulateChamber, type SimulationResult } from 'sagitta-tracks';
import { benchFiles } from './benchSeries.js';
import { overlayEvents } from './overlay.js';

const here = dirname(fileURLToPath(import.meta.url));

/** Scenario name → seed. Changing a seed changes every number in that dataset. */
export const DEMO_SEEDS: Readonly<Record<string, number>> = Object.freeze({
  brindlemoor: 20260401,
  'brindlemoor-planes': 20260402,
  cinderfell: 20260403,
  larkspur: 20260404,
  ashgrove: 20260416,
  fenwick: 20260611,
});

/**
 * Datasets made by laying the events of one scenario over another's (`overlay.ts`): each event
 * of the first scenario gets `perEvent` events of the second. Both run with the dataset's seed
 * (the second with seed + 1).
 */
export const DEMO_OVERLAYS: Readonly<Record<string, { readonly base: string; readonly extra: string; readonly perEvent: number }>> = Object.freeze({
  cinderfell: { base: 'cinderfell-decays', extra: 'cinderfell-prompt', perEvent: 2 },
});

/**
 * Scenarios written as unlabelled hits for the track-finding notebook: no track column, each
 * event's rows in a shuffled order (seed + 1), and the truth of every row in a labels file
 * beside them (`true_track`, `true_order` = place along the true track, −1 for noise).
 */
const UNLABELLED: ReadonlySet<string> = new Set(['ashgrove']);

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
  if (UNLABELLED.has(name)) {
    const { hits, labels } = unlabelled(result, DEMO_SEEDS[name] + 1);
    return {
      [files.hits]: hits,
      [`${name}-labels.csv`]: labels,
      [files.truth]: formatTruthCsv(result),
      [`${name}.run.json`]: formatRunRecord(result, files),
    };
  }
  return {
    [files.hits]: formatHitsCsv(result),
    [files.truth]: formatTruthCsv(result),
    [`${name}.run.json`]: formatRunRecord(result, files),
  };
}

/** The simulator's hit rows without the track column, shuffled within each event, and their labels. */
function unlabelled(result: SimulationResult, seed: number): { hits: string; labels: string } {
  const lines = formatHitsCsv(result).split('\n');
  const header = lines[0].split(',');
  const trackAt = header.indexOf('track');
  const rng = seededRandom(seed, 'make-data shuffle');
  const h = result.hits;
  const place = new Float64Array(h.length);
  for (let i = 0, k = 0; i < h.length; i++) {
    k = i > 0 && h.event[i] === h.event[i - 1] && h.track[i] === h.track[i - 1] ? k + 1 : 0;
    place[i] = h.track[i] < 0 ? -1 : k;
  }
  const hitLines = [header.filter((_, j) => j !== trackAt).join(',')];
  const labelLines = ['true_track,true_order'];
  for (let a = 0; a < h.length;) {
    let b = a;
    while (b < h.length && h.event[b] === h.event[a]) b++;
    const rows = Array.from({ length: b - a }, (_, j) => a + j);
    // Fisher–Yates shuffle (Knuth, TAOCP vol. 2, §3.4.2) from the seeded stream.
    for (let j = rows.length - 1; j > 0; j--) {
      const r = Math.floor(rng.uniform() * (j + 1));
      [rows[j], rows[r]] = [rows[r], rows[j]];
    }
    for (const i of rows) {
      hitLines.push(lines[i + 1].split(',').filter((_, j) => j !== trackAt).join(','));
      labelLines.push(`${h.track[i]},${place[i]}`);
    }
    a = b;
  }
  return { hits: hitLines.join('\n') + '\n', labels: labelLines.join('\n') + '\n' };
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

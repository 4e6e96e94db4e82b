import { writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import type { Command } from 'commander';
import { consumeWarnings, formatHitsCsv, formatRunRecord, formatTruthCsv, readScenario, SCENARIO_SCHEMA, simulateChamber } from '../../../lib/index.js';
import { msg } from '../../../lib/internal.js';

export interface SimulateCommandOptions {
  seed: string;
  out?: string;
  truth?: string;
  schema?: boolean;
}

/** Said in the help text and the notebooks' data README: the scenario describes hazardous kit. */
export const SIMULATE_CAUTION =
  'The output is simulated data. Cryogenic liquid hydrogen and strong magnets are hazardous: real chambers are built and ' +
  'run only under the host laboratory\'s safety review and the applicable pressure, cryogenic, magnet and fire codes.';

/**
 * `sagitta simulate <scenario.json> --seed 7 --out hits.csv [--truth truth.csv]`: runs a scenario
 * and writes the hit table (the columns `sagitta fit` reads), optionally the truth table, and a
 * run record `<out>.run.json` with the seed and counts.
 */
export function registerSimulate(program: Command): void {
  program
    .command('simulate')
    .description('simulate a chamber scenario (seeded): hits with Gaussian smearing, plus the true particles')
    .argument('[scenario]', 'scenario file (JSON, format "sagitta-scenario/1"; see --schema)')
    .option('--seed <n>', 'seed of the run, a whole number 0…4294967295 (recorded in the run record)', '1')
    .option('--out <file>', 'hit table to write (CSV: event,track,x[mm],y[mm],z[mm],sigma[mm],sigma_z[mm]); default <name>-hits.csv')
    .option('--truth <file>', 'also write the truth table (one row per particle: species, vertex, momentum, end point, …)')
    .option('--schema', 'print the JSON Schema of scenario files and exit')
    .addHelpText('after', `
A scenario sets the chamber (size, medium, field), the transport (energy loss, straggling,
multiple scattering, knock-on electrons), the measurement model (hit spacing or detector planes,
resolution per coordinate, efficiency, noise hits) and the sources (beam, neutral-decay, cosmic,
stopping) with their event counts. The same scenario and seed always give the same bytes.

${wrap(SIMULATE_CAUTION, 96)}

Examples:
  sagitta simulate notebooks/data/brindlemoor.scenario.json --seed 7 --out hits.csv --truth truth.csv
  sagitta simulate --schema > scenario.schema.json`)
    .action((scenario: string | undefined, options: SimulateCommandOptions) => {
      const { stdout, stderr } = runSimulate(scenario, options);
      process.stdout.write(stdout);
      process.stderr.write(stderr);
    });
}

/** Breaks text into lines of at most `width` characters at spaces. */
function wrap(text: string, width: number): string {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(' ')) {
    if (line !== '' && line.length + 1 + word.length > width) { lines.push(line); line = word; }
    else line = line === '' ? word : `${line} ${word}`;
  }
  if (line !== '') lines.push(line);
  return lines.join('\n');
}

/** The command's work without touching process streams (for tests). Writes the output files. */
export function runSimulate(scenario: string | undefined, options: SimulateCommandOptions): { stdout: string; stderr: string } {
  if (options.schema) return { stdout: JSON.stringify(SCENARIO_SCHEMA, null, 2) + '\n', stderr: '' };
  if (scenario === undefined) throw msg.badArgument('scenario', undefined, 'a scenario file, e.g. sagitta simulate run.json --seed 7 (or --schema)');
  const seed = Number(options.seed);
  if (!/^\d+$/.test(options.seed.trim()) || !(seed <= 0xffffffff)) throw msg.badArgument('--seed', options.seed, 'a whole number from 0 to 4294967295, e.g. --seed 7');
  const config = readScenario(scenario);
  const result = simulateChamber(config, seed);
  const out = options.out ?? `${config.name}-hits.csv`;
  const record = join(dirname(out), `${basename(out).replace(/\.[^.]*$/, '')}.run.json`);
  const files: Record<string, string> = { hits: basename(out), scenario: basename(scenario) };
  writeFileSync(out, formatHitsCsv(result));
  if (options.truth !== undefined) {
    writeFileSync(options.truth, formatTruthCsv(result));
    files.truth = basename(options.truth);
  }
  writeFileSync(record, formatRunRecord(result, files));
  const warnings = consumeWarnings();
  const written = [out, options.truth, record].filter((f): f is string => f !== undefined).join(', ');
  return {
    stdout: `simulated ${result.events} events, ${result.truth.length} particles, ${result.hits.length} hits (scenario ${config.name}, seed ${seed}) → ${written}\n`,
    stderr: warnings.map((w) => `sagitta simulate: warning: ${w.message}\n`).join(''),
  };
}

import { basename, dirname, join } from 'node:path';
import type { Command } from 'commander';
import { consumeWarnings, formatHitsCsv, formatRunRecordTotals, formatTruthCsv, readScenario, SCENARIO_SCHEMA, simulateChamberInParts, type SimulationTotals } from '../../../lib/index.js';
import { msg } from '../../../lib/internal.js';
import { planOutputs, type NamedPath } from '../../batch/outputPlan.js';
import { OutputSet } from '../../batch/outputSet.js';
import { usage } from '../usage.js';

/** Events simulated and written per part: a few MB of hits, whatever the scenario's event count. */
const EVENTS_PER_PART = 500;

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
    .action(async (scenario: string | undefined, options: SimulateCommandOptions) => {
      const { set, stdout, stderr } = simulateToOutputs(scenario, options);
      try {
        // A Ctrl-C that arrived during the (synchronous) simulation is handled here: nothing is written.
        await set?.commitWhenSettled();
      } catch (err) {
        set?.abandon();
        throw err;
      }
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
  const { set, stdout, stderr } = simulateToOutputs(scenario, options);
  try {
    set?.commit();
  } catch (err) {
    set?.abandon();
    throw err;
  }
  return { stdout, stderr };
}

/** Runs the simulation into the temporary outputs, not yet renamed into place (`set.commit()` does that). */
function simulateToOutputs(scenario: string | undefined, options: SimulateCommandOptions): { set?: OutputSet; stdout: string; stderr: string } {
  if (options.schema) return { stdout: JSON.stringify(SCENARIO_SCHEMA, null, 2) + '\n', stderr: '' };
  const seed = usage(() => {
    if (scenario === undefined) throw msg.badArgument('<scenario>', '(none given)', 'a scenario file, e.g. sagitta simulate run.json --seed 7 (or --schema)');
    const seedText = options.seed.trim();
    if (!/^\d+$/.test(seedText) || !(Number(seedText) <= 0xffffffff)) throw msg.badArgument('--seed', options.seed, 'a whole number from 0 to 4294967295, e.g. --seed 7');
    return Number(seedText);
  });
  const config = readScenario(scenario!);
  const outputs = usage(() => {
    const out = options.out ?? `${config.name}-hits.csv`;
    const record = join(dirname(out), `${basename(out).replace(/\.[^.]*$/, '')}.run.json`);
    const wanted: NamedPath[] = [{ flag: '--out', path: out }];
    if (options.truth !== undefined) wanted.push({ flag: '--truth', path: options.truth });
    wanted.push({ flag: 'the run record', path: record });
    // Every output checked before the run: none may be the scenario or another output, in any spelling.
    return planOutputs([{ flag: '<scenario>', path: scenario! }], wanted);
  });
  const [out, ...rest] = outputs;
  const truth = options.truth !== undefined ? rest[0] : undefined;
  const record = rest[rest.length - 1];
  const files: Record<string, string> = { hits: basename(out.path), scenario: basename(scenario!) };
  if (truth) files.truth = basename(truth.path);
  // Streamed to the temporary files in parts of whole events (memory stays bounded for any event
  // count); hits, truth and run record are renamed into place together at the end, or not at all.
  const set = new OutputSet(outputs);
  let totals: SimulationTotals;
  try {
    let first = true;
    totals = simulateChamberInParts(config, seed, (part) => {
      set.write(out.flag, formatHitsCsv(part, { header: first }));
      if (truth) set.write(truth.flag, formatTruthCsv(part, { header: first }));
      first = false;
    }, EVENTS_PER_PART);
    set.write(record.flag, formatRunRecordTotals(totals, files));
  } catch (err) {
    set.abandon();
    throw err;
  }
  const warnings = consumeWarnings();
  const written = outputs.filter((o) => o !== record).map((o) => o.path).join(', ');
  return {
    set,
    stdout: `simulated ${totals.events} events, ${totals.particles} particles, ${totals.hitRows} hits (scenario ${config.name}, seed ${seed}) → ${written}\n` +
      `run record (seed, scenario, counts; marks the hits as simulated for reports) → ${record.path}\n`,
    stderr: warnings.map((w) => `sagitta simulate: warning: ${w.message}\n`).join(''),
  };
}

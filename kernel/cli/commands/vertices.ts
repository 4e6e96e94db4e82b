import { Command, Option } from 'commander';
import { availableParallelism } from 'node:os';
import { performance } from 'node:perf_hooks';
import { angleRad, fitMethods, formatWarning, lengthMetres, material as lookupMaterial, pointMetres, READ_HITS_DEFAULTS, V0_FINDER_DEFAULTS } from '../../../lib/index.js';
import { msg } from '../../../lib/internal.js';
import { resultFormatOf } from '../../batch/inputFormat.js';
import { planOutputs } from '../../batch/outputPlan.js';
import { OutputSet } from '../../batch/outputSet.js';
import { wantProgress } from '../../batch/progress.js';
import { stdoutTarget } from '../../batch/resultSink.js';
import { runBatch, type BatchTotals } from '../../batch/runBatch.js';
import type { VerticesJobOptions } from '../../batch/verticesJob.js';
import { parseThreads } from '../threads.js';
import { checkHitFileOptions } from '../hitOptions.js';
import { usage } from '../usage.js';

export interface VerticesCommandOptions {
  field: string;
  fitter: string;
  out?: string;
  lengthUnit: string;
  hitError?: string;
  material?: string;
  primary?: string;
  maxDca?: string;
  minFlight?: string;
  maxPointing?: string;
  threads?: string;
  quiet?: boolean;
}

/** Help examples; each runs as written from the package folder. */
export const VERTICES_EXAMPLES = [
  'sagitta vertices notebooks/data/cinderfell-hits.csv --field "1.0 T" --primary "-55 0 0 cm" --material argon-gas --out out/v0.csv',
];

/**
 * `sagitta vertices <hits> --field "1.5 T"`: one row per V⁰ candidate (K⁰_S, Λ, Λ̄, photon
 * conversion) found among the tracks of each event. Input handling, streaming, threads, outputs
 * and exit codes are those of `sagitta fit` (the same batch path, with the vertices job).
 */
export function registerVertices(program: Command): void {
  program
    .command('vertices')
    .description('find V0 decays (K0S, Lambda, anti-Lambda, conversions) among the tracks of each event: vertices, masses with errors, Armenteros variables')
    .argument('<hits>', 'hit file: .csv/.tsv, .jsonl, .parquet or .arrow with columns event, track, x, y [, z, sigma | sigma_x, sigma_y, sigma_z]')
    .requiredOption('-B, --field <quantity>', 'magnetic field along +z with its unit, e.g. "1.5 T", "15 kG"')
    .addOption(new Option('--fitter <method>', 'track fit method (as in sagitta fit)').choices(fitMethods().map((m) => m.name)).default('geometric'))
    .option('-o, --out <file>', 'write candidates to a .csv, .jsonl, .json or .parquet file (default: CSV on stdout)')
    .option('--length-unit <unit>', 'unit of length columns whose header has none', READ_HITS_DEFAULTS.lengthUnit)
    .option('--hit-error <quantity>', 'position error for hits without a sigma column, e.g. "200 um"')
    .option('--material <name>', 'chamber medium, e.g. liquid-hydrogen: adds back the energy each daughter lost between the vertex and its first hit, under each mass hypothesis')
    .option('--primary <point>', 'primary interaction point, three coordinates and a unit, e.g. "-59.5 0 0 cm" (default the origin)')
    .option('--max-dca <quantity>', `largest distance of closest approach of the two tracks (default ${V0_FINDER_DEFAULTS.maxDcaM * 100} cm)`)
    .option('--min-flight <quantity>', `smallest distance from the primary point (default ${V0_FINDER_DEFAULTS.minFlightM * 100} cm)`)
    .option('--max-pointing <angle>', `largest angle between flight direction and V0 momentum (default ${V0_FINDER_DEFAULTS.maxPointingRad * 1000} mrad)`)
    .option('--threads <n>', `threads to work in: this one and n − 1 workers (default: all ${availableParallelism()} cores); the output is the same for any count`)
    .option('-q, --quiet', 'no progress bar')
    .addHelpText('after', `
Pairs of opposite-charge tracks in one event are tried; the cuts, in order: the circles come
within --max-dca in the bending plane; the 3-D closest approach lies upstream of both first hits
(1 cm of slack) and within --max-dca; it is at least --min-flight from the primary point; the
summed momentum points back to the primary within --max-pointing.

Output columns: event, track_pos, track_neg, x_m, y_m, z_m, dca_m, flight_m, mass_pipi_MeV,
sigma_mass_pipi_MeV, mass_ppi_MeV, sigma_mass_ppi_MeV, mass_pip_MeV, sigma_mass_pip_MeV,
armenteros_alpha, armenteros_qt_MeV, then sigma_x_m, sigma_y_m, sigma_z_m, chi2 (vertex fit,
1 degree of freedom), sigma_flight_m, pointing_rad, p_MeV_c, mass_ee_MeV, sigma_mass_ee_MeV,
proper_time_k0s_ps, proper_time_lambda_ps, and status (ok, vertex-singular, ranged-out).
ppi: positive daughter as proton, negative as pi-; pip: positive as pi+, negative as antiproton.
Mass errors propagate both tracks' fit covariances; multiple scattering between the vertex and
the first hits is not in them.

Exit codes: 0 done; 1 the input is unusable (file:line, column named); 2 bad usage.

Example (from the package folder, with an out/ folder):
${VERTICES_EXAMPLES.map((e) => `  ${e}`).join('\n')}`)
    .action(async (hitsPath: string, options: VerticesCommandOptions) => {
      process.stderr.write((await runVertices(hitsPath, options)) + '\n');
    });
}

function checkOptions(o: VerticesCommandOptions): { job: VerticesJobOptions; threads?: number; format: 'csv' | 'jsonl' | 'json' | 'parquet' } {
  const { fieldT, hitErrorM } = checkHitFileOptions(o);
  if (o.material !== undefined) lookupMaterial(o.material);
  const positive = (text: string | undefined, what: string, read: (t: string) => number): number | undefined => {
    if (text === undefined) return undefined;
    const v = read(text);
    if (!(v >= 0 && Number.isFinite(v))) throw msg.badArgument(what, text, 'a non-negative quantity with its unit');
    return v;
  };
  return {
    job: {
      fieldT, method: o.fitter, hitErrorM, material: o.material,
      primaryM: o.primary !== undefined ? pointMetres(o.primary, { what: '--primary' }) : [0, 0, 0],
      maxDcaM: positive(o.maxDca, '--max-dca', (t) => lengthMetres(t, { what: '--max-dca' })),
      minFlightM: positive(o.minFlight, '--min-flight', (t) => lengthMetres(t, { what: '--min-flight' })),
      maxPointingRad: positive(o.maxPointing, '--max-pointing', (t) => angleRad(t, { what: '--max-pointing' })),
    },
    threads: o.threads === undefined ? undefined : parseThreads(o.threads),
    format: o.out === undefined ? 'csv' : resultFormatOf(o.out),
  };
}

/** Runs the vertices command and returns its summary text (also used by tests). */
export async function runVertices(hitsPath: string, options: VerticesCommandOptions): Promise<string> {
  const t0 = performance.now();
  const checked = usage(() => checkOptions(options));
  const outputs = usage(() => (options.out === undefined ? [] : planOutputs([{ flag: '<hits>', path: hitsPath }], [{ flag: '--out', path: options.out }])));
  const files = outputs.length ? new OutputSet(outputs) : undefined;
  let totals: BatchTotals;
  try {
    totals = await runBatch({
      input: hitsPath, lengthUnit: options.lengthUnit, job: 'vertices', jobOptions: checked.job, threads: checked.threads,
      format: checked.format, target: files ? (bytes) => files.write('--out', bytes) : stdoutTarget, restart: files ? () => files.restart('--out') : undefined,
      meta: (t) => ({ input: hitsPath, length_units: t.units, field_T: checked.job.fieldT, fitter: t.method ?? checked.job.method, material: options.material ?? null, primary_m: checked.job.primaryM, counts: t.counts }),
      progress: wantProgress(options.quiet), progressLabel: 'vertices',
    });
    await files?.commitWhenSettled();
  } catch (err) {
    files?.abandon();
    throw err;
  }
  const n = totals.counts;
  const units = Object.entries(totals.units).map(([col, u]) => `${col}[${u}]`).join(' ');
  const lines = [
    `sagitta vertices: ${hitsPath}: ${n.track_hits ?? 0} hits on ${n.tracks ?? 0} tracks (${n.usable_tracks ?? 0} fitted)` +
      (n.unassigned_hits ? `, ${n.unassigned_hits} unassigned hits (track < 0) set aside` : '') + `; lengths read as ${units}`,
    `  field ${checked.job.fieldT} T, primary point (${checked.job.primaryM.map((v) => v.toPrecision(4)).join(', ')}) m` +
      (options.material ? `, energy loss in ${options.material} added back` : ', no energy-loss correction') + (totals.hasZ ? '' : '; no z: vertices in the bending plane only'),
    `  ${n.pairs_tried ?? 0} opposite-charge pairs tried, ${n.candidates ?? 0} candidates found` +
      ` (removed by: circles ${n.rejected_circles ?? 0}, closest approach ${n.rejected_closest_approach ?? 0}, flight ${n.rejected_flight ?? 0}, pointing ${n.rejected_pointing ?? 0})`,
    `  time ${((performance.now() - t0) / 1000).toFixed(2)} s, ${totals.threads} thread${totals.threads === 1 ? '' : 's'}${options.out ? `; candidates in ${options.out}` : ''}`,
  ];
  for (const w of totals.warnings) lines.push(`  ${formatWarning(w)}`);
  if (totals.ignoredColumns.length) lines.push(`  ignored columns: ${totals.ignoredColumns.join(', ')}`);
  return lines.join('\n');
}

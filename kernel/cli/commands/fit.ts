import { Command, Option } from 'commander';
import { availableParallelism } from 'node:os';
import { performance } from 'node:perf_hooks';
import { fitMethods, formatWarning, lengthMetres, material as lookupMaterial, particle as lookupParticle, READ_HITS_DEFAULTS } from '../../../lib/index.js';
import { msg, POOR_FIT_PROBABILITY, speciesList } from '../../../lib/internal.js';
import type { FitJobOptions } from '../../batch/fitJob.js';
import { BYTES_PER_EXTRA_THREAD } from '../../batch/earlyWorkers.js';
import { resultFormatOf } from '../../batch/inputFormat.js';
import { planOutputs } from '../../batch/outputPlan.js';
import { OutputSet } from '../../batch/outputSet.js';
import { wantProgress } from '../../batch/progress.js';
import { stdoutTarget } from '../../batch/resultSink.js';
import { runBatch, type BatchTotals } from '../../batch/runBatch.js';
import { parseShard, type Shard } from '../../batch/shard.js';
import { checkHitFileOptions } from '../hitOptions.js';
import { usage } from '../usage.js';
import { parseThreads } from '../threads.js';

export interface FitCommandOptions {
  field: string;
  fitter: string;
  out?: string;
  lengthUnit: string;
  hitError?: string;
  chargeNumber: string;
  /** Chamber medium for the momentum error budget (adds sigma_p_meas_GeV_c, sigma_p_ms_GeV_c, sigma_p_total_GeV_c). */
  material?: string;
  /** Mass hypothesis for β in the multiple-scattering term (with --material). */
  particle?: string;
  /** Full sizes x,y,z of the sensitive box centred on the origin, for the stop decision. */
  volume?: string;
  /** With --material: keep the plain helix fit instead of the fit with material effects. */
  plainHelix?: boolean;
  threads?: string;
  shard?: string;
  quiet?: boolean;
}

/** Help examples; each runs as written from the package folder (test/cli/helpExamples.test.ts). */
export const FIT_EXAMPLES = [
  'sagitta fit notebooks/data/brindlemoor-hits.csv --field "15 kG" --out out/tracks.csv',
  'sagitta fit notebooks/data/brindlemoor-hits.csv --field "1.5 T" --material liquid-hydrogen --out out/tracks.json',
  'sagitta fit notebooks/data/brindlemoor-hits.csv --field "1.5 T" --shard 2/4 --out out/part-2.csv',
  'sagitta fit notebooks/data/hollowmere-hits.csv --field "2 T" --material liquid-propane --particle auto --volume "160 cm,100 cm,60 cm" --out out/pid.csv',
];

/**
 * `sagitta fit <hits> --field "1.5 T"`: one row per track (momentum, charge, errors, fit
 * quality) to a CSV, JSON Lines, JSON or Parquet file, or CSV on stdout; a short summary on
 * stderr. Large inputs stream through worker threads (kernel/batch), with the same bytes out
 * whatever the thread count. Exit codes as kernel/cli/main.ts says.
 */
export function registerFit(program: Command): void {
  program
    .command('fit')
    .description('fit circles/helices to the tracks in a hit file and report momenta, charges and errors')
    .argument('<hits>', 'hit file: .csv/.tsv, .jsonl, .parquet or .arrow with columns event, track, x, y [, z, sigma | sigma_x, sigma_y, sigma_z]')
    .requiredOption('-B, --field <quantity>', 'magnetic field along +z with its unit, e.g. "1.5 T", "15 kG", "-0.8 T" (negative: along -z)')
    .addOption(new Option('--fitter <method>', `fit method: ${fitMethods().map((m) => `${m.name} — ${m.summary}`).join('; ')}`).choices(fitMethods().map((m) => m.name)).default('geometric'))
    .option('-o, --out <file>', 'write results to a .csv, .jsonl, .json or .parquet file (default: CSV on stdout)')
    .option('--length-unit <unit>', 'unit of length columns whose header has none, e.g. x[cm] overrides it', READ_HITS_DEFAULTS.lengthUnit)
    .option('--hit-error <quantity>', 'position error for hits without a sigma column, e.g. "200 um" (default: estimated from each track\'s residuals)')
    .option('--charge-number <z>', 'charge magnitude |z| of the particles (2 for alpha particles)', '1')
    .option('--material <name>', 'medium the tracks cross, e.g. argon-gas, liquid-hydrogen, liquid-propane: fits with energy loss and multiple scattering, p at the first hit, and adds the error budget columns')
    .option('--particle <name>', 'mass hypothesis for the fit with material (energy loss, β in the scattering term); "auto" identifies each track by range among e, mu, pi, K, p, or give a list such as mu-,pi-,proton', 'pi+')
    .option('--volume <x,y,z>', 'with --material: full sizes of the sensitive box centred on the origin, e.g. "160 cm,100 cm,60 cm"; a track whose last hit lies 2 cm or more inside every face stops and is fitted with its range (with --particle auto or a list it is also the stop decision; without it the curvature must rise along the track)')
    .option('--plain-helix', 'with --material: fit one plain helix per track as without a material (for comparison; biased low on slowing tracks)')
    .option('--threads <n>', `threads to work in: this one and n − 1 workers (default: all ${availableParallelism()} cores, one more per ${BYTES_PER_EXTRA_THREAD.fit / 1e6} MB of input); the output is the same for any count`)
    .option('--shard <K/N>', 'fit only the K-th of N slices of the events (by event id), e.g. 3/8; combine the parts with "sagitta merge"')
    .option('-q, --quiet', 'no progress bar (there is none off a terminal anyway)')
    .addHelpText('after', `
Hits with a negative track id belong to no track (noise); they are counted, not fitted.
Hits of one track must be in the order the particle travelled: the turning sense, and so the
sign of the charge, is read from that order (B along +z: positive particles turn clockwise).

Output columns: event, track, n_hits, charge, radius_m, pt_GeV_c, p_GeV_c, tan_lambda, phi0_rad,
d0_m, z0_m, sigma_pt_GeV_c, sigma_p_GeV_c, kappa_significance, chi2, ndf, chi2_prob, iterations,
status. p_GeV_c, tan_lambda and z0_m need a z column; chi2 and chi2_prob (the chi-square
probability) are empty when the hit errors were estimated from the residuals. Status is ok,
poor-fit (converged, chi2_prob below 0.001), too-few-hits, degenerate, not-converged, bad-input,
and with --material also cannot-reach (the --particle hypothesis ranges out before a hit) or
diverged.

With --material (and not --plain-helix): a helix fit with the mean energy loss of --particle
and multiple scattering in the medium (Kalman filter with smoother); p_GeV_c, phi0_rad and
the direction are at the first hit, sigma_p_GeV_c includes the scattering, and the columns
p_last_GeV_c, sigma_p_last_GeV_c, path_m and residual_range_m follow status. It needs hit errors
(sigma columns or --hit-error). With --volume, a track whose last hit lies 2 cm or more inside
the box is taken to stop within one hit spacing after it: its fit adds the range-energy relation
(momentum from range, range straggling; one more degree of freedom), column stops = 1, so its
momentum error is that of the range, and a track that did not stop (a decay in flight, a gap, a
wrong mass) shows as poor-fit. Range tables are research values, not for treatment planning.
Ids are exact whole numbers up to 2^63 - 1.

With --material: sigma_p_meas_GeV_c (from the hit errors, exact least squares for each track's
hits), sigma_p_ms_GeV_c (multiple scattering in the medium over the track length, Gluckstern/PDG
form, β from --particle) and sigma_p_total_GeV_c (quadrature sum).

With --material and --particle auto (or a list such as mu-,pi-,proton): each track is fitted
under every species and the one with the least -2 ln L is chosen (a Kalman filter about the
species' range-momentum profile, with scattering and straggling; for a track that stops, the
length must agree with the range, and the masses left are refitted with material and scored by
that fit's chi2 and its residual range at the last hit; a mass whose fit cannot reach the last
hit is ruled out). Columns pid (the species, in the names sagitta range --particle reads, or
undecided), pid_delta_m2lnL (-2 ln L of the runner-up minus the best; empty when every other
mass was ruled out), stops (1 when the last hit lies 2 cm or more inside --volume, or without it
when the curvature rises and a stop just past the last hit fits about as well as leaving) and
p_min_GeV_c (least momentum
that reaches the last hit), decay_of (the track id of the stopping track this one starts from,
within 1.5 cm of its last hit: a decay at rest) and decay_distance_m follow; p_GeV_c and
sigma_p_GeV_c are those of the chosen species (of the charged pion for an undecided track;
p_species names the mass used). A
track that does not stop is named only when the margin is at least 9, else undecided. The error
budget columns are not written then (they need one species).

Large files are read in pieces of whole events, so memory stays bounded; a file whose events are
not grouped (an event reappears after others) is read whole instead. With --shard K/N, each
result row starts with first_hit_position (where the track starts in the input), which
"sagitta merge" uses to put the parts back in input order and then removes.

Exit codes: 0 done (failed fits are rows with a status); 1 the input is unusable (file:line,
column named); 2 bad usage.

Examples (from the package folder, with an out/ folder):
${FIT_EXAMPLES.map((e) => `  ${e}`).join('\n')}`)
    .action(async (hitsPath: string, options: FitCommandOptions) => {
      const summary = await runFit(hitsPath, options);
      process.stderr.write(summary + '\n');
    });
}

interface CheckedFit {
  readonly job: FitJobOptions;
  readonly threads: number | undefined;
  readonly shard: Shard | undefined;
  readonly format: 'csv' | 'jsonl' | 'json' | 'parquet';
}

/** Every option checked, with the flag named in the message (usage errors, exit 2). */
function checkOptions(hitsPath: string, o: FitCommandOptions): CheckedFit {
  const { fieldT, hitErrorM } = checkHitFileOptions(o);
  const chargeMagnitude = /^\s*\d+(\.\d+)?\s*$/.test(o.chargeNumber) ? Number(o.chargeNumber) : NaN;
  if (!(chargeMagnitude > 0 && chargeMagnitude <= 200)) throw msg.badArgument('--charge-number', o.chargeNumber, 'a positive number such as 1 or 2');
  if (o.material !== undefined) lookupMaterial(o.material);
  const particle = o.particle ?? 'pi+';
  const several = speciesList(particle);
  if (several !== undefined) {
    if (o.material === undefined || o.plainHelix) throw msg.badArgument('--particle', particle, 'one species without --material or with --plain-helix: identification by range ("auto" or a list) needs --material and the fit with material');
  } else lookupParticle(particle);
  let volume: FitJobOptions['volume'];
  if (o.volume !== undefined) {
    const parts = o.volume.split(',');
    if (parts.length !== 3) throw msg.badArgument('--volume', o.volume, 'three full sizes x,y,z with units, e.g. "160 cm,100 cm,60 cm"');
    const size = parts.map((t) => lengthMetres(t, { what: '--volume' }));
    if (!size.every((v) => v > 0 && Number.isFinite(v))) throw msg.badArgument('--volume', o.volume, 'three positive sizes, e.g. "160 cm,100 cm,60 cm"');
    volume = { min: [-size[0] / 2, -size[1] / 2, -size[2] / 2], max: [size[0] / 2, size[1] / 2, size[2] / 2] };
  }
  const format = o.out === undefined ? 'csv' : resultFormatOf(o.out);
  return {
    job: { fieldT, method: o.fitter, chargeMagnitude, hitErrorM, material: o.material, particle, fit: o.plainHelix ? 'plain-helix' : 'matter', volume },
    threads: o.threads === undefined ? undefined : parseThreads(o.threads),
    shard: o.shard === undefined ? undefined : parseShard(o.shard),
    format,
  };
}

/** Runs the fit command and returns its summary text (also used by tests). */
export async function runFit(hitsPath: string, options: FitCommandOptions): Promise<string> {
  const t0 = performance.now();
  const checked = usage(() => checkOptions(hitsPath, options));
  const outputs = usage(() => (options.out === undefined ? [] : planOutputs([{ flag: '<hits>', path: hitsPath }], [{ flag: '--out', path: options.out }])));
  const files = outputs.length ? new OutputSet(outputs) : undefined;
  let totals: BatchTotals;
  try {
    totals = await runBatch({
      input: hitsPath,
      lengthUnit: options.lengthUnit,
      job: 'fit',
      jobOptions: checked.job,
      threads: checked.threads,
      shard: checked.shard,
      format: checked.format,
      target: files ? (bytes) => files.write('--out', bytes) : stdoutTarget,
      restart: files ? () => files.restart('--out') : undefined,
      meta: (t) => fitMeta(hitsPath, t, checked, options),
      progress: wantProgress(options.quiet),
      progressLabel: 'fit',
    });
    await files?.commitWhenSettled();
  } catch (err) {
    files?.abandon();
    throw err;
  }
  return fitSummary(hitsPath, totals, checked, options, (performance.now() - t0) / 1000);
}

/** The JSON meta block: snake_case keys with units, the counts merge adds up. */
function fitMeta(hitsPath: string, t: BatchTotals, c: CheckedFit, o: FitCommandOptions): Record<string, unknown> {
  const { other_shard_hits: _skipped, ...counts } = t.counts;
  return {
    input: hitsPath,
    length_units: t.units,
    field_T: c.job.fieldT,
    fitter: t.method ?? c.job.method,
    helix: t.hasZ,
    hit_error_m: c.job.hitErrorM ?? null,
    hit_errors: t.estimatedErrors ? 'estimated from residuals' : c.job.hitErrorM !== undefined ? 'given by --hit-error' : 'from the file',
    charge_number: c.job.chargeMagnitude,
    material: o.material ?? null,
    particle: o.material !== undefined ? c.job.particle : null,
    fit: o.material !== undefined && !o.plainHelix ? 'matter' : 'plain-helix',
    poor_fit_probability: POOR_FIT_PROBABILITY,
    counts,
    ...(c.shard ? { shard: `${c.shard.index}/${c.shard.count}` } : {}),
  };
}

function fitSummary(hitsPath: string, t: BatchTotals, c: CheckedFit, o: FitCommandOptions, seconds: number): string {
  const n = t.counts;
  const statuses = Object.entries(n).filter(([k, v]) => k.startsWith('status_') && k !== 'status_ok' && k !== 'status_poor-fit' && v > 0).map(([k, v]) => `${k.slice(7)} ${v}`);
  const poor = n['status_poor-fit'] ?? 0;
  const failed = (n.tracks ?? 0) - (n.status_ok ?? 0) - poor;
  const matter = o.material !== undefined && !o.plainHelix;
  const units = Object.entries(t.units).map(([col, u]) => `${col}[${u}]`).join(' ');
  const errors = t.estimatedErrors ? 'hit errors estimated from the residuals (chi2 left empty)' : c.job.hitErrorM !== undefined ? `hit error ${o.hitError}` : 'hit errors from the file';
  const lines = [
    `sagitta fit: ${hitsPath}: ${n.track_hits ?? 0} hits on ${n.tracks ?? 0} tracks` +
      (n.unassigned_hits ? `, ${n.unassigned_hits} unassigned hits (track < 0) set aside` : '') + `; lengths read as ${units}; ${errors}`,
    `  field ${c.job.fieldT} T along ${c.job.fieldT > 0 ? '+z' : '-z'}, ` + (matter && speciesList(c.job.particle)
      ? `identification by range among ${speciesList(c.job.particle)!.map((p) => p.name).join(', ')} in ${o.material}; each track fitted with material under its chosen species, p at the first hit`
      : matter
      ? `fit with material: energy loss of ${c.job.particle} and multiple scattering in ${o.material}, p at the first hit`
      : `fitter ${t.method ?? c.job.method}${t.hasZ ? ', helix (z present)' : ', circle only (no z: p and tan(lambda) not measured)'}`),
    `  fitted ${(n.status_ok ?? 0) + poor}` + (poor ? ` (${poor} poor fits: chi2 probability${matter && c.job.volume && !speciesList(c.job.particle) ? ', or that of stop_chi2,' : ''} below 0.001)` : '') + `, failed ${failed}${statuses.length ? ` (${statuses.join(', ')})` : ''}`,
  ];
  if (c.shard) lines.push(`  shard ${c.shard.index}/${c.shard.count}: ${n.other_shard_hits ?? 0} hits of other slices' events skipped`);
  if (t.readWhole) lines.push('  the events of this file are not grouped (an event reappears after others): read whole instead of streamed');
  lines.push(`  time ${seconds.toFixed(2)} s, ${t.threads} thread${t.threads === 1 ? '' : 's'}${o.out ? `; results in ${o.out}` : ''}`);
  const pids = Object.entries(n).filter(([k]) => k.startsWith('pid_')).map(([k, v]) => `${k.slice(4)} ${v}`);
  if (!pids.length && c.job.volume && c.job.material && n.stopping !== undefined) lines.push(`  ${n.stopping} tracks end 2 cm or more inside --volume: fitted as stopping (momentum from range)`);
  if (pids.length) lines.push(`  pid: ${pids.join(', ')}; ${n.stopping ?? 0} tracks stop (${c.job.volume ? 'last hit 2 cm or more inside --volume' : 'curvature rising along the track'})`);
  if (o.material !== undefined && !speciesList(c.job.particle)) {
    lines.push(`  error budget in ${o.material} (β from ${c.job.particle}): median σp/p measurement ${medianPercent(t.samples.measurement)}, multiple scattering ${medianPercent(t.samples.scattering)}`);
  }
  for (const w of t.warnings) lines.push(`  ${formatWarning(w)}`);
  if (t.ignoredColumns.length) lines.push(`  ignored columns: ${t.ignoredColumns.join(', ')}`);
  return lines.join('\n');
}

/** "1.23 %" for the median of the finite values, "n/a" when there are none. */
function medianPercent(values: readonly number[] | undefined): string {
  const r = (values ?? []).filter(Number.isFinite).sort((a, b) => a - b);
  return r.length ? `${(100 * r[r.length >> 1]).toPrecision(3)} %` : 'n/a';
}

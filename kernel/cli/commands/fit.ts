import { Command, Option } from 'commander';
import { performance } from 'node:perf_hooks';
import { readHits } from '../../../lib/io/readHits.js';
import { READ_HITS_DEFAULTS } from '../../../lib/io/parseHitsCsv.js';
import { formatCsvBytes, rowObjects, writeFileAtomic } from '../../../lib/io/columnTable.js';
import { fitMethods } from '../../../lib/fit/fitMethods.js';
import { measureTracks, type TrackTable } from '../../../lib/track/measureTracks.js';
import { trackTableColumns } from '../../../lib/track/trackTableColumns.js';
import { fieldTesla, lengthMetres, metresPerUnit } from '../../../lib/units.js';
import { msg } from '../../../lib/errors.js';
import { consumeWarnings } from '../../../lib/warnings.js';
import type { ColumnTable } from '../../../lib/io/columnTable.js';
import { material as lookupMaterial } from '../../../lib/matter/materials.js';
import { particle as lookupParticle } from '../../../lib/particles.js';
import { resolutionBudget, resolutionBudgetColumns, type ResolutionBudgetColumns } from '../../../lib/track/resolutionBudget.js';

export interface FitCommandOptions {
  field: string;
  fitter: string;
  out?: string;
  lengthUnit: string;
  hitError?: string;
  chargeNumber: string;
  /** Chamber medium for the momentum error budget (adds sigma_p_meas, sigma_p_ms, sigma_p_total). */
  material?: string;
  /** Mass hypothesis for β in the multiple-scattering term (with --material). */
  particle?: string;
}

/**
 * `sagitta fit <hits> --field "1.5 T"`: one row per track (momentum, charge, errors, fit
 * quality) to a CSV or JSON file, or CSV on stdout; a short summary on stderr.
 * Exit code 1 only for unusable input; a track that cannot be fitted is a row with a status.
 */
export function registerFit(program: Command): void {
  program
    .command('fit')
    .description('fit circles/helices to the tracks in a hit file and report momenta, charges and errors')
    .argument('<hits>', 'hit file: .csv/.tsv or .jsonl with columns event, track, x, y [, z, sigma | sigma_x, sigma_y, sigma_z]')
    .requiredOption('-B, --field <quantity>', 'magnetic field along +z with its unit, e.g. "1.5 T", "15 kG", "-0.8 T" (negative: along -z)')
    .addOption(new Option('--fitter <method>', `fit method: ${fitMethods().map((m) => `${m.name} — ${m.summary}`).join('; ')}`).choices(fitMethods().map((m) => m.name)).default('geometric'))
    .option('-o, --out <file>', 'write results to a .csv or .json file (default: CSV on stdout)')
    .option('--length-unit <unit>', 'unit of length columns whose header has none, e.g. x[cm] overrides it', READ_HITS_DEFAULTS.lengthUnit)
    .option('--hit-error <quantity>', 'position error for hits without a sigma column, e.g. "200 um" (default: estimated from each track\'s residuals)')
    .option('--charge-number <z>', 'charge magnitude |z| of the particles (2 for alpha particles)', '1')
    .option('--material <name>', 'medium the tracks cross, e.g. argon-gas, liquid-hydrogen, liquid-propane: adds the momentum error budget columns')
    .option('--particle <name>', 'mass hypothesis for β in the multiple-scattering term (with --material)', 'pi+')
    .addHelpText('after', `
Hits with a negative track id belong to no track (noise); they are counted, not fitted.
Hits of one track must be in the order the particle travelled: the turning sense, and so the
sign of the charge, is read from that order (B along +z: positive particles turn clockwise).

Output columns: event, track, nhits, charge, R_m, pT_GeV, p_GeV, tanLambda, phi0_rad, d0_m, z0_m,
sigma_pT_GeV, sigma_p_GeV, kappa_signif, chi2, ndf, iterations, status. p_GeV, tanLambda and z0_m
need a z column. Status is ok, too-few-hits, degenerate, not-converged or bad-input.

With --material: sigma_p_meas (from the hit errors, exact least squares for each track's hits),
sigma_p_ms (multiple scattering in the medium over the track length, Gluckstern/PDG form, β from
--particle) and sigma_p_total (quadrature sum), all in GeV/c.

Example:
  sagitta fit notebooks/data/hits.csv --field "15 kG" --out tracks.csv
  sagitta fit notebooks/data/hits.csv --field "1.5 T" --material argon-gas --out tracks.csv`)
    .action((hitsPath: string, options: FitCommandOptions) => {
      const summary = runFit(hitsPath, options);
      process.stderr.write(summary + '\n');
    });
}

/** Runs the fit command and returns its summary text (also used by tests). */
export function runFit(hitsPath: string, options: FitCommandOptions): string {
  const t0 = performance.now();
  const fieldT = fieldTesla(options.field, { what: '--field' });
  if (fieldT === 0) throw msg.badArgument('--field', options.field, 'a non-zero field');
  metresPerUnit(options.lengthUnit);
  const hitErrorM = options.hitError !== undefined ? lengthMetres(options.hitError, { what: '--hit-error' }) : undefined;
  const chargeMagnitude = Number(options.chargeNumber);
  if (!(chargeMagnitude > 0)) throw msg.badArgument('--charge-number', options.chargeNumber, 'a positive number such as 1 or 2');
  if (options.out !== undefined && !/\.(csv|json)$/i.test(options.out)) throw msg.unknownFormat(options.out, ['.csv', '.json']);

  const hits = readHits(hitsPath, { lengthUnit: options.lengthUnit });
  const tRead = performance.now();
  const tracks = measureTracks(hits, { fieldT, method: options.fitter, chargeMagnitude, hitErrorM });
  const tFit = performance.now();
  const medium = options.material !== undefined ? lookupMaterial(options.material) : undefined;
  const budget = medium ? resolutionBudget(tracks, { material: medium, particle: lookupParticle(options.particle ?? 'pi+'), hitErrorM }) : undefined;
  const baseTable = trackTableColumns(tracks);
  const table: ColumnTable = budget ? { rows: baseTable.rows, columns: [...baseTable.columns, ...resolutionBudgetColumns(budget)] } : baseTable;
  if (options.out === undefined) process.stdout.write(formatCsvBytes(table));
  else if (/\.json$/i.test(options.out)) writeFileAtomic(options.out, formatJson(table, tracks, hitsPath, hits.source.units, options));
  else writeFileAtomic(options.out, formatCsvBytes(table));
  const tEnd = performance.now();

  const failed = tracks.count - tracks.statusCounts.ok;
  const failures = Object.entries(tracks.statusCounts).filter(([s, c]) => s !== 'ok' && c > 0).map(([s, c]) => `${s} ${c}`);
  const units = Object.entries(hits.source.units).map(([c, u]) => `${c}[${u}]`).join(' ');
  const lines = [
    `sagitta fit: ${hitsPath}: ${hits.length} hits in ${tracks.count} tracks; lengths read as ${units}` +
      (hitErrorM !== undefined && hits.sigmaX === undefined ? `; hit error ${options.hitError}` : hits.sigmaX === undefined ? '; hit errors estimated from residuals' : ''),
    `  field ${fieldT} T along ${fieldT > 0 ? '+z' : '-z'}, fitter ${tracks.method}${tracks.hasZ ? ', helix (z present)' : ', circle only (no z: p and tan(lambda) not measured)'}`,
    `  fitted ${tracks.statusCounts.ok}, failed ${failed}${failures.length ? ` (${failures.join(', ')})` : ''}` +
      (tracks.unassignedHits ? `; ${tracks.unassignedHits} unassigned hits (track < 0) set aside` : ''),
    `  time ${((tEnd - t0) / 1000).toFixed(2)} s (read ${((tRead - t0) / 1000).toFixed(2)}, fit ${((tFit - tRead) / 1000).toFixed(2)}, write ${((tEnd - tFit) / 1000).toFixed(2)})` +
      (options.out ? `; results in ${options.out}` : ''),
  ];
  if (budget && medium) lines.push(budgetSummary(budget, tracks, medium.name, options.particle ?? 'pi+'));
  for (const w of consumeWarnings()) lines.push(`  warning: ${w.message}`);
  if (hits.source.ignoredColumns.length) lines.push(`  ignored columns: ${hits.source.ignoredColumns.join(', ')}`);
  return lines.join('\n');
}

function formatJson(table: ColumnTable, tracks: TrackTable, hitsPath: string, units: Record<string, string>, options: FitCommandOptions): string {
  const meta = {
    input: hitsPath,
    lengthUnits: units,
    fieldT: tracks.fieldT,
    fitter: tracks.method,
    hasZ: tracks.hasZ,
    hitError: options.hitError ?? null,
    statusCounts: tracks.statusCounts,
    material: options.material ?? null,
  };
  return JSON.stringify({ meta, tracks: rowObjects(table) }, null, 0) + '\n';
}

/** "error budget in argon-gas (β from pi+): median σp/p measurement 1.2 %, multiple scattering 0.8 %". */
function budgetSummary(budget: ResolutionBudgetColumns, tracks: TrackTable, medium: string, species: string): string {
  const median = (sigma: Float64Array): string => {
    const r: number[] = [];
    for (let k = 0; k < tracks.count; k++) {
      const v = sigma[k] / (tracks.hasZ ? tracks.momentum.pGeV[k] : tracks.momentum.ptGeV[k]);
      if (Number.isFinite(v)) r.push(v);
    }
    r.sort((a, b) => a - b);
    return r.length ? `${(100 * r[r.length >> 1]).toPrecision(3)} %` : 'n/a';
  };
  return `  error budget in ${medium} (β from ${species}): median σp/p measurement ${median(budget.sigmaPMeasGeV)}, multiple scattering ${median(budget.sigmaPMsGeV)}`;
}

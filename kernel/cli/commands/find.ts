import { Command } from 'commander';
import { existsSync, readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { fieldTesla, findTracks, fitCircles, type FoundTracks, GEV_PER_TESLA_METRE, type HitTable, lengthMetres, READ_HITS_DEFAULTS, recordInput } from '../../../lib/index.js';
import { metresPerUnit, msg, parseCsvRows, parseHitsJsonl, readCsvLayout } from '../../../lib/internal.js';
import { planOutputs } from '../../batch/outputPlan.js';
import { OutputSet } from '../../batch/outputSet.js';
import { labelledCsv, labelledJsonl } from '../labelledRows.js';
import { usage } from '../usage.js';

export interface FindCommandOptions {
  field: string;
  out?: string;
  lengthUnit: string;
  hitError?: string;
  hitSpacing?: string;
  origin?: string;
}

/** Help examples; each runs as written from the package folder (test/cli/helpExamples.test.ts). */
export const FIND_EXAMPLES = [
  'sagitta find notebooks/data/ashgrove-hits.csv --field "1 T" --origin "0,0,0 mm" --out out/labelled.csv',
  'sagitta fit out/labelled.csv --field "1 T" --out out/tracks.csv',
];

const CSV = ['.csv', '.tsv', '.txt'], JSONL = ['.jsonl', '.ndjson'];

/**
 * `sagitta find <hits> --field F --out labelled.csv`: finds the tracks among unlabelled hits
 * (lib/find) and writes every input row, in the input order, with a `track` column it assigns
 * (−1: on no track) and `hit_order` (place along the track in the direction of travel, 0 first).
 * `sagitta fit` reads that file directly. A summary on stderr.
 */
export function registerFind(program: Command): void {
  program
    .command('find')
    .description('find tracks among unlabelled hits; write every hit with the track it belongs to and its place along it')
    .argument('<hits>', 'hit file: .csv/.tsv or .jsonl with columns event, x, y [, z, sigma | sigma_x, sigma_y, sigma_z]; a track column is ignored')
    .requiredOption('-B, --field <quantity>', 'magnetic field along +z with its unit, e.g. "1 T", "15 kG" (for the momentum range in the summary)')
    .option('-o, --out <file>', 'labelled hits, in the input\'s format (.csv for CSV input, .jsonl for JSON Lines); default: stdout')
    .option('--length-unit <unit>', 'unit of length columns whose header has none, e.g. x[cm] overrides it', READ_HITS_DEFAULTS.lengthUnit)
    .option('--hit-error <quantity>', 'hit error for the road, e.g. "300 um" (default: the sigma column, else 3 % of the hit spacing)')
    .option('--hit-spacing <quantity>', 'distance between neighbouring hits of a track, e.g. "10 mm" (default: estimated from the hits)')
    .option('--origin <point>', 'common start point of the tracks, "x,y,z unit", e.g. "0,0,0 mm": no road crosses it, tracks start there')
    .addHelpText('after', `
Method: seeds of three neighbouring hits, grown both ways by road following on the local helix
with a chi-square gate; a spiral of several turns stays one track (turns are told apart by z).
A hit on two tracks goes to the first found and is counted as shared; hits on no track get -1.

Direction of travel (hit_order 0 = first): when the curvature grows measurably along a track
(a slowing particle curls up), the end with the smaller curvature is first; otherwise the end
nearer the origin (--origin, else 0,0,0) is first. Tracks that start elsewhere and do not slow
measurably cannot be oriented from their hits: check the charge sign of such tracks.

Exit codes: 0 done; 1 the input is unusable (file:line, column named); 2 bad usage.

Examples (from the package folder, with an out/ folder):
${FIND_EXAMPLES.map((e) => `  ${e}`).join('\n')}`)
    .action((hitsPath: string, options: FindCommandOptions) => {
      process.stderr.write(runFind(hitsPath, options) + '\n');
    });
}

interface CheckedFind {
  readonly fieldT: number;
  readonly hitErrorM?: number;
  readonly hitSpacingM?: number;
  readonly originM?: readonly [number, number, number];
  readonly jsonl: boolean;
}

function checkOptions(hitsPath: string, o: FindCommandOptions): CheckedFind {
  const fieldT = fieldTesla(o.field, { what: '--field' });
  if (fieldT === 0 || !Number.isFinite(fieldT)) throw msg.badArgument('--field', o.field, 'a non-zero finite field, e.g. "1 T"');
  metresPerUnit(o.lengthUnit, { column: '--length-unit' });
  const positive = (text: string | undefined, flag: string, example: string) => {
    if (text === undefined) return undefined;
    const v = lengthMetres(text, { what: flag });
    if (!(v > 0 && Number.isFinite(v))) throw msg.badArgument(flag, text, `a positive length, e.g. "${example}"`);
    return v;
  };
  const lower = hitsPath.toLowerCase();
  const jsonl = JSONL.some((e) => lower.endsWith(e));
  if (!jsonl && !CSV.some((e) => lower.endsWith(e))) throw msg.unknownFormat(hitsPath, [...CSV, ...JSONL]);
  if (o.out !== undefined) {
    const out = o.out.toLowerCase();
    const ok = jsonl ? JSONL.some((e) => out.endsWith(e)) : CSV.some((e) => out.endsWith(e));
    if (!ok) throw msg.unknownFormat(o.out, jsonl ? JSONL : CSV);
  }
  return {
    fieldT,
    hitErrorM: positive(o.hitError, '--hit-error', '300 um'),
    hitSpacingM: positive(o.hitSpacing, '--hit-spacing', '10 mm'),
    originM: o.origin === undefined ? undefined : parsePoint(o.origin),
    jsonl,
  };
}

/** "x,y,z unit" (or "x,y unit": z = 0) → metres. */
function parsePoint(text: string): [number, number, number] {
  const m = /^\s*([^,]+),([^,]+)(?:,([^,]+?))?\s+([A-Za-zµμ]+)\s*$/.exec(text);
  if (!m) throw msg.badQuantity(text, '--origin', '0,0,0 mm');
  const scale = metresPerUnit(m[4], { column: '--origin' });
  const coords = [m[1], m[2], m[3] ?? '0'].map((v) => Number(v.trim()) * scale);
  if (!coords.every(Number.isFinite)) throw msg.badQuantity(text, '--origin', '0,0,0 mm');
  return coords as [number, number, number];
}

/** Runs the find command and returns its summary text (also used by tests). */
export function runFind(hitsPath: string, options: FindCommandOptions): string {
  const t0 = performance.now();
  const c = usage(() => checkOptions(hitsPath, options));
  const outputs = usage(() => (options.out === undefined ? [] : planOutputs([{ flag: '<hits>', path: hitsPath }], [{ flag: '--out', path: options.out }])));
  if (!existsSync(hitsPath)) throw msg.fileNotFound(hitsPath);
  const bytes = readFileSync(hitsPath);
  recordInput(hitsPath, bytes);
  let table: HitTable, labelled: (f: FoundTracks) => Uint8Array;
  if (c.jsonl) {
    table = parseHitsJsonl(bytes, hitsPath, { lengthUnit: options.lengthUnit, trackOptional: true });
    labelled = (f) => labelledJsonl(bytes, table, f.track, f.hitOrder);
  } else {
    const layout = readCsvLayout(bytes, hitsPath, options.lengthUnit, true, true)!;
    table = parseCsvRows(bytes, layout, hitsPath, { start: layout.bodyStart, end: bytes.length, firstLine: layout.bodyLine });
    labelled = (f) => labelledCsv(bytes, table, layout.delimiter, layout.bodyLine - 1, f.track, f.hitOrder);
  }
  const tRead = performance.now();
  const found = findTracks(table, { hitErrorM: c.hitErrorM, hitSpacingM: c.hitSpacingM, originM: c.originM });
  const tFind = performance.now();
  const text = labelled(found);
  if (outputs.length === 0) process.stdout.write(text);
  else {
    const files = new OutputSet(outputs);
    try {
      files.write('--out', text);
      files.commit();
    } catch (err) {
      files.abandon();
      throw err;
    }
  }
  const seconds = (performance.now() - t0) / 1000;
  return findSummary(hitsPath, table, found, c, options, [(tRead - t0) / 1000, (tFind - tRead) / 1000, seconds]);
}

function findSummary(hitsPath: string, table: HitTable, f: FoundTracks, c: CheckedFind, o: FindCommandOptions, [read, find, total]: number[]): string {
  const hadTrack = !(table.source.absentColumns ?? []).includes('track');
  const units = Object.entries(table.source.units).map(([col, u]) => `${col}[${u}]`).join(' ');
  const mm = (m: number) => `${(m * 1e3).toPrecision(3)} mm`;
  const byCurvature = f.direction.filter((d) => d === 'curvature').length;
  const sorted = Array.from(f.nhits).sort((a, b) => a - b);
  const lines = [
    `sagitta find: ${hitsPath}: ${table.length} hits in ${f.events} events; lengths read as ${units}` +
      (hadTrack ? '; the track column of the input was ignored and replaced' : ''),
    `  found ${f.count} tracks (median ${sorted.length ? sorted[sorted.length >> 1] : 0} hits), ${f.unassignedHits} hits on no track (track -1, ${table.length ? ((100 * f.unassignedHits) / table.length).toFixed(1) : '0'} %), ${f.sharedHitsTotal} shared hits kept by one track`,
    `  hit spacing ${mm(f.hitSpacingM)}${f.hitSpacingEstimated ? ' (estimated)' : ''}, road error ${mm(f.hitErrorM)} ` +
      `(${f.hitErrorSource === 'hits' ? 'from the sigma column' : f.hitErrorSource === 'option' ? 'from --hit-error' : '3 % of the spacing: give --hit-error for a better road'})`,
    `  direction of travel: ${byCurvature} by curvature change, ${f.count - byCurvature} by nearness to ${c.originM ? `the origin ${o.origin}` : '0,0,0 (no --origin)'}`,
    `  ${ptRange(table, f, c.fieldT)}`,
    `  time ${total.toFixed(2)} s (read ${read.toFixed(2)}, find ${find.toFixed(2)})${o.out ? `; labelled hits in ${o.out}` : ''}`,
  ];
  if (table.source.ignoredColumns.length) lines.push(`  other columns copied as they are: ${table.source.ignoredColumns.join(', ')}`);
  return lines.join('\n');
}

/** "p_T of the found tracks 0.10 … 1.9 GeV/c (median 0.45)", from a quick circle fit of each. */
function ptRange(table: HitTable, f: FoundTracks, fieldT: number): string {
  if (f.count === 0) return 'no tracks to measure';
  const x = new Float64Array(f.rows.length), y = new Float64Array(f.rows.length);
  for (let i = 0; i < f.rows.length; i++) { x[i] = table.x[f.rows[i]]; y[i] = table.y[f.rows[i]]; }
  const fits = fitCircles({ x, y }, f.offsets, { method: 'kasa', covariance: false });
  const pt: number[] = [];
  for (let k = 0; k < fits.count; k++) {
    const v = (GEV_PER_TESLA_METRE * Math.abs(fieldT)) / Math.abs(fits.kappa[k]);
    if (Number.isFinite(v)) pt.push(v);
  }
  pt.sort((a, b) => a - b);
  if (pt.length === 0) return 'no track gave a curvature';
  const g = (v: number) => (v < 1 ? `${(v * 1e3).toPrecision(3)} MeV/c` : `${v.toPrecision(3)} GeV/c`);
  return `p_T of the found tracks (quick circle fits, |z| = 1): ${g(pt[0])} … ${g(pt[pt.length - 1])}, median ${g(pt[pt.length >> 1])}`;
}

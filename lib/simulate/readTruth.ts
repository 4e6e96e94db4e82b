import { msg } from '../errors.js';
import { recordInput } from '../provenance.js';
import { readInputFile } from '../io/readInputFile.js';
import type { TruthTable } from './simulate.js';
import { TRUTH_CSV_COLUMNS } from './simulationCsv.js';

const TEXT_COLUMNS = new Set(['species', 'process', 'end']);
/** Factor from the file's unit to the TruthTable's (mm → m, MeV/c → GeV/c). */
const SCALE: Readonly<Record<string, number>> = { '[mm]': 1e-3, '[MeV/c]': 1e-3 };

/**
 * Reads a truth file written by `sagitta simulate` (columns `TRUTH_CSV_COLUMNS`) back into a
 * TruthTable — lengths in metres, momenta in GeV/c — and records the file for the report's
 * provenance. Throws with file:line for a wrong header, a short row or a bad number.
 * @example const truth = readTruth('notebooks/data/brindlemoor-truth.csv'); truth.px[0] // GeV/c
 */
export function readTruth(path: string): TruthTable {
  const bytes = readInputFile(path, 'the truth file');
  recordInput(path, bytes);
  const lines = bytes.toString('utf8').replace(/^\ufeff/, '').split(/\r?\n/);
  const header = lines[0].split(',');
  if (header.join(',') !== TRUTH_CSV_COLUMNS.join(',')) {
    throw msg.badRow(path, 1, `not a truth file of sagitta simulate: the header should be ${TRUTH_CSV_COLUMNS.join(',')}`);
  }
  const rows = lines.slice(1).filter((l) => l.trim() !== '');
  const n = rows.length;
  const numeric: Record<string, Float64Array> = {};
  const text: Record<string, string[]> = {};
  for (const c of header) {
    if (TEXT_COLUMNS.has(c)) text[c] = new Array<string>(n);
    else numeric[c] = new Float64Array(n);
  }
  const scales = header.map((c) => SCALE[c.slice(c.indexOf('['))] ?? 1);
  for (let r = 0, lineNo = 2; r < n; lineNo++) {
    const raw = lines[lineNo - 1];
    if (raw.trim() === '') continue;
    const cells = raw.split(',');
    if (cells.length !== header.length) throw msg.badRow(path, lineNo, `row has ${cells.length} fields but the header has ${header.length}`);
    for (let j = 0; j < header.length; j++) {
      const c = header[j];
      if (TEXT_COLUMNS.has(c)) { text[c][r] = cells[j]; continue; }
      const v = Number(cells[j]);
      if (cells[j].trim() === '' || !Number.isFinite(v)) throw msg.badNumber(path, lineNo, c, cells[j]);
      numeric[c][r] = v * scales[j];
    }
    r++;
  }
  return {
    length: n,
    event: numeric['event'], track: numeric['track'], parent: numeric['parent'],
    species: text['species'], charge: numeric['charge'], process: text['process'],
    vx: numeric['vx[mm]'], vy: numeric['vy[mm]'], vz: numeric['vz[mm]'],
    px: numeric['px[MeV/c]'], py: numeric['py[MeV/c]'], pz: numeric['pz[MeV/c]'],
    end: text['end'],
    ex: numeric['ex[mm]'], ey: numeric['ey[mm]'], ez: numeric['ez[mm]'],
    pathM: numeric['path[mm]'], hits: numeric['hits'],
  };
}

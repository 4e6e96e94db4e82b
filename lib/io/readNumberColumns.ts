import { msg } from '../errors.js';
import { recordInput } from '../provenance.js';
import { readInputFile } from './readInputFile.js';

/**
 * A small table of numbers from a comma-separated file with a header row — a measurement series
 * (voltages, currents, radii …) rather than a hit file — as one Float64Array per column, keyed
 * by the header names as written (units belong in them: `voltage_V`). Text cells (labels) are
 * kept as strings in `text`. The file is recorded for provenance, as every reader does.
 * Throws FILE_NOT_FOUND, EMPTY_FILE, or BAD_ROW naming file and line when a row has the wrong
 * number of cells.
 * @example readNumberColumns('data/larkspur-tube.csv').columns.voltage_V
 */
export function readNumberColumns(path: string): { readonly rows: number; readonly columns: Record<string, Float64Array>; readonly text: Record<string, string[]> } {
  const bytes = readInputFile(path, 'the table file');
  recordInput(path, bytes);
  const lines = bytes.toString('utf8').replace(/^\uFEFF/, '').split(/\r?\n/).filter((l) => l.trim() !== '');
  if (lines.length === 0) throw msg.emptyFile(path, 'a header row and rows of numbers');
  const names = lines[0].split(',').map((h) => h.trim());
  const rows = lines.length - 1;
  const cells = lines.slice(1).map((l, i) => {
    const c = l.split(',').map((x) => x.trim());
    if (c.length !== names.length) throw msg.badRow(path, i + 2, `${c.length} cells where the header has ${names.length}`);
    return c;
  });
  const columns: Record<string, Float64Array> = {}, text: Record<string, string[]> = {};
  names.forEach((name, k) => {
    const raw = cells.map((c) => c[k]);
    if (raw.every((v) => v !== '' && Number.isFinite(Number(v)))) columns[name] = Float64Array.from(raw, Number);
    else text[name] = raw;
  });
  return { rows, columns, text };
}

import { msg } from '../errors.js';
import { parseHeader, unitsOf, type HeaderField } from './hitColumns.js';
import { HitTableBuilder } from './hitTableBuilder.js';
import type { HitTable } from './hitTable.js';
import { READ_HITS_DEFAULTS, type ReadHitsOptions } from './parseHitsCsv.js';

/**
 * Parses JSON Lines hits: one JSON object per line, keys as in the CSV header (`event`,
 * `track`, `x`, `y`, optional `z`, `sigma` or `sigma_x`/`sigma_y`, `sigma_z`; a key may carry a
 * unit, `"x[cm]"`). The keys of the first object fix the columns; every later line must have
 * the same used keys with finite numbers. Blank lines are skipped; a BOM and CRLF are accepted.
 */
export function parseHitsJsonl(bytes: Uint8Array, file: string, options: ReadHitsOptions = {}): HitTable {
  const lengthUnit = options.lengthUnit ?? READ_HITS_DEFAULTS.lengthUnit;
  let text = new TextDecoder().decode(bytes);
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const lines = text.split('\n');
  let fields: HeaderField[] | undefined;
  let builder: HitTableBuilder | undefined;
  for (let k = 0; k < lines.length; k++) {
    const raw = lines[k].trim();
    if (raw === '') continue;
    const lineNo = k + 1;
    let obj: unknown;
    try {
      obj = JSON.parse(raw);
    } catch (err) {
      throw msg.badRow(file, lineNo, `not a JSON object (${(err as Error).message}); each line must hold one object like {"event":1,"track":1,"x":0.1,"y":2.3}`);
    }
    if (obj === null || typeof obj !== 'object' || Array.isArray(obj)) {
      throw msg.badRow(file, lineNo, 'each line must hold one JSON object like {"event":1,"track":1,"x":0.1,"y":2.3}');
    }
    const record = obj as Record<string, unknown>;
    if (fields === undefined) {
      fields = parseHeader(Object.keys(record), file, lengthUnit, lineNo);
      builder = new HitTableBuilder(fields, Math.ceil(lines.length * 1.05));
    }
    const row = builder!.addRow(lineNo);
    for (const f of fields) {
      if (f.column === undefined) continue;
      if (!(f.raw in record)) throw msg.missingColumn(file, f.raw, Object.keys(record), lineNo);
      const value = record[f.raw];
      const v = typeof value === 'number' ? value : typeof value === 'string' && value.trim() !== '' ? Number(value) : NaN;
      if (!Number.isFinite(v)) throw msg.badNumber(file, lineNo, f.raw, JSON.stringify(value) ?? String(value));
      builder!.column(f.column)[row] = v * f.scale;
    }
  }
  if (fields === undefined || builder === undefined) throw msg.emptyFile(file, 'one JSON object per line');
  return builder.finish(file, unitsOf(fields, lengthUnit), fields.filter((f) => f.column === undefined).map((f) => f.raw));
}

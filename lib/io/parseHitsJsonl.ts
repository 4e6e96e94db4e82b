import { msg } from '../errors.js';
import { columnOf, parseHeader, unitsOf, type HeaderField } from './hitColumns.js';
import { HitTableBuilder } from './hitTableBuilder.js';
import type { HitTable } from './hitTable.js';
import { parseIdText } from './hitIds.js';
import { READ_HITS_DEFAULTS, type CsvRows, type ReadHitsOptions } from './parseHitsCsv.js';

const STRICT_DECIMAL = /^\s*[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?\s*$/;
const EXAMPLE = '{"event":1,"track":1,"x":0.1,"y":2.3}';
const LF = 10;

/**
 * Parses JSON Lines hits: one JSON object per line, keys as in the CSV header (`event`,
 * `track`, `x`, `y`, optional `z`, `sigma` or `sigma_x`/`sigma_y`, `sigma_z`; a key may carry a
 * unit, `"x[cm]"`). The keys of the first object fix the columns; every later line must have
 * the same used keys with finite numbers (a number or a decimal string; not hexadecimal). A hit
 * column first seen after the first line is an error (the earlier rows lack it); other keys first
 * seen later are listed with the ignored columns. Ids are exact up to 2⁶³ − 1 (write ids beyond
 * 2⁵³ as strings, or as plain JSON integers). Blank lines are skipped; a BOM and CRLF are accepted.
 */
export function parseHitsJsonl(bytes: Uint8Array, file: string, options: ReadHitsOptions = {}): HitTable {
  let start = 0;
  if (bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) start = 3;
  return parseJsonlRows(bytes, file, { start, end: bytes.length, firstLine: 1 }, options);
}

/** The fields of a JSON Lines file, from its first object (read before a file is read in pieces). */
export function jsonlFields(firstObjectLine: string, file: string, line: number, lengthUnit: string): HeaderField[] {
  return parseHeader(Object.keys(parseObject(firstObjectLine, file, line)), file, lengthUnit, line);
}

/** Parses the lines in `bytes[rows.start, rows.end)`; `fields` from `jsonlFields` (else from the first line). */
export function parseJsonlRows(bytes: Uint8Array, file: string, rows: CsvRows, options: ReadHitsOptions = {}, known?: readonly HeaderField[]): HitTable {
  const lengthUnit = options.lengthUnit ?? READ_HITS_DEFAULTS.lengthUnit;
  const decoder = new TextDecoder();
  let fields: readonly HeaderField[] | undefined = known;
  let builder: HitTableBuilder | undefined;
  let used: Set<string> | undefined;
  const ignored: string[] = [];
  let allKeys: Set<string> | undefined;
  const base = rows.positionBase ?? 0;
  let i = rows.start;
  let lineNo = rows.firstLine;
  for (; i < rows.end; lineNo++) {
    let e = bytes.indexOf(LF, i);
    if (e < 0 || e > rows.end) e = rows.end;
    const lineStart = i;
    i = e + 1;
    const raw = decoder.decode(bytes.subarray(lineStart, e)).trim();
    if (raw === '') continue;
    const record = parseObject(raw, file, lineNo);
    if (fields === undefined) fields = parseHeader(Object.keys(record), file, lengthUnit, lineNo, options.trackOptional);
    if (builder === undefined) {
      builder = new HitTableBuilder(fields, Math.ceil((rows.end - rows.start) / Math.max(16, raw.length) * 1.1) + 16, rows.positions === true);
      used = new Set(fields.filter((f) => f.column !== undefined).map((f) => f.raw));
      allKeys = new Set(fields.map((f) => f.raw));
      for (const f of fields) if (f.column === undefined) ignored.push(f.raw);
    }
    for (const key of Object.keys(record)) {
      if (allKeys!.has(key)) continue;
      allKeys!.add(key);
      if (columnOf(key) !== undefined) {
        throw msg.badRow(file, lineNo, `key '${key}' first appears on this line, but earlier lines lack it; give every line the same hit columns (${[...used!].join(', ')}${used!.size ? ', ' : ''}${key})`);
      }
      ignored.push(key);
    }
    const row = builder.addRow(lineNo, base + lineStart);
    for (const f of fields) {
      if (f.column === undefined) continue;
      if (!(f.raw in record)) throw msg.missingColumn(file, f.raw, Object.keys(record), lineNo);
      const value = record[f.raw];
      if (f.column === 'event' || f.column === 'track') {
        storeId(builder, f, row, value, raw, file, lineNo);
        continue;
      }
      const v = typeof value === 'number' ? value : typeof value === 'string' && STRICT_DECIMAL.test(value) ? Number(value) : NaN;
      if (!Number.isFinite(v)) throw msg.badNumber(file, lineNo, f.raw, JSON.stringify(value) ?? String(value));
      builder.column(f.column)[row] = v * f.scale;
    }
  }
  if (fields === undefined || builder === undefined) {
    if (rows.allowEmpty && fields !== undefined) builder = new HitTableBuilder(fields, 16);
    else throw msg.emptyFile(file, 'one JSON object per line');
  }
  return builder.finish(file, unitsOf(fields, lengthUnit), ignored, rows.allowEmpty === true);
}

function parseObject(raw: string, file: string, lineNo: number): Record<string, unknown> {
  let obj: unknown;
  try {
    obj = JSON.parse(raw);
  } catch (err) {
    throw msg.badRow(file, lineNo, `not a JSON object (${(err as Error).message}); each line must hold one object like ${EXAMPLE}`);
  }
  if (obj === null || typeof obj !== 'object' || Array.isArray(obj)) {
    throw msg.badRow(file, lineNo, `each line must hold one JSON object like ${EXAMPLE}`);
  }
  return obj as Record<string, unknown>;
}

/**
 * An id from a JSON value. JSON.parse rounds integers beyond 2⁵³, so for those the digits are
 * taken from the line's text itself.
 */
function storeId(builder: HitTableBuilder, f: HeaderField, row: number, value: unknown, raw: string, file: string, lineNo: number): void {
  let text: string;
  if (typeof value === 'number') {
    if (Number.isSafeInteger(value)) {
      builder.column(f.column!)[row] = value === 0 ? 0 : value;
      return;
    }
    const key = JSON.stringify(f.raw).replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
    const literal = new RegExp(`${key}\\s*:\\s*(-?\\d+(?:\\.\\d*)?(?:[eE][+-]?\\d+)?)\\s*[,}]`).exec(raw);
    text = literal ? literal[1] : String(value);
  } else if (typeof value === 'string') text = value;
  else text = JSON.stringify(value) ?? String(value);
  const id = parseIdText(text, file, lineNo, f.raw);
  if (typeof id === 'number') builder.column(f.column!)[row] = id;
  else builder.wideId(f.column as 'event' | 'track', row, id);
}

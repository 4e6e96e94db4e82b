import { msg } from '../errors.js';
import { unitsOf } from './hitColumns.js';
import { HitTableBuilder } from './hitTableBuilder.js';
import type { HitTable } from './hitTable.js';
import { parseIdText } from './hitIds.js';
import { readCsvLayout, type CsvLayout } from './csvLayout.js';
import { scanNumber, scanEnd } from './scanNumber.js';

export interface ReadHitsOptions {
  /** Unit of length columns whose header carries none. Default 'mm'. */
  readonly lengthUnit?: string;
  /** Accept a file without a `track` column (every row then gets track −1, on no track). Default false. */
  readonly trackOptional?: boolean;
}

export const READ_HITS_DEFAULTS = Object.freeze({ lengthUnit: 'mm' });

/** A slice of whole data rows of a CSV file, for `parseCsvRows`. */
export interface CsvRows {
  /** Byte range [start, end) of the slice in `bytes`; it starts at a row and ends after one. */
  readonly start: number;
  readonly end: number;
  /** Line number of the slice's first byte. */
  readonly firstLine: number;
  /** Position of `bytes[0]` in the whole file; with `positions`, rows record their byte offset. */
  readonly positionBase?: number;
  readonly positions?: boolean;
  /** A slice with no rows gives an empty table instead of an error. */
  readonly allowEmpty?: boolean;
  /** Filled with the number of LF bytes in the slice (so a caller numbering lines across slices need not scan it again). */
  readonly counted?: { lineEnds: number };
}

const CR = 13, LF = 10, QUOTE = 34, SPACE = 32;
const MINUS = 45, DOT = 46, ZERO = 48;
const POW10 = Float64Array.from({ length: 16 }, (_, k) => 10 ** k);
/** Field kinds: ignored, a length or error (number × scale), an id (exact whole number). */
const IGNORED = 0, NUMBER = 1, ID = 2;
const STRICT_DECIMAL = /^\s*[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?\s*$/;

/**
 * Parses a CSV hit file held in memory (bytes, UTF-8) into a HitTable.
 *
 * Accepts a UTF-8 byte-order mark, LF or CRLF line ends, comma, semicolon or tab as separator
 * (taken from the header line), quoted text in columns Sagitta ignores, and blank lines.
 * Everything else that is not a clean finite number in a used column stops the read with an
 * error naming file:line and column (STYLE.md §5): non-numeric text, NaN, Inf, hexadecimal, a
 * missing field, a quote not closed on its line, a zero or negative error, an id that is not a
 * whole number, a header line repeated inside the data (concatenated files), a header without
 * `event`, `track`, `x` or `y`, or a column named twice. Ids are exact up to 2⁶³ − 1.
 *
 * The loop works on bytes and never splits a row into strings (110 MB in well under a second).
 */
export function parseHitsCsv(bytes: Uint8Array, file: string, options: ReadHitsOptions = {}): HitTable {
  const layout = readCsvLayout(bytes, file, options.lengthUnit ?? READ_HITS_DEFAULTS.lengthUnit, true, options.trackOptional)!;
  return parseCsvRows(bytes, layout, file, { start: layout.bodyStart, end: bytes.length, firstLine: layout.bodyLine });
}

/** Parses the whole data rows in `bytes[rows.start, rows.end)` with a header read before. */
export function parseCsvRows(bytes: Uint8Array, layout: CsvLayout, file: string, rows: CsvRows): HitTable {
  const { fields, delimiter, headerText } = layout;
  const nf = fields.length;
  const n = rows.end;
  let i = rows.start;
  let line = rows.firstLine;
  const base = rows.positionBase ?? 0;

  // Size the columns from the mean length of the first rows (up to 64 KiB of them), with 10 %
  // to spare, so that a large file is neither copied while growing nor over-allocated.
  const sampleEnd = Math.min(n, i + 65536);
  let sampleRows = 0;
  for (let q = i; q < sampleEnd; q++) if (bytes[q] === LF) sampleRows++;
  const meanRowBytes = sampleRows > 0 ? (sampleEnd - i) / sampleRows : Math.max(8, headerText.length);
  const builder = new HitTableBuilder(fields, Math.ceil(((n - i) / meanRowBytes) * 1.1) + 16, rows.positions === true);
  // Field index → storage of its column (null: ignored field), scale to metres, kind.
  let target = builder.fieldArrays(fields);
  const scale = Float64Array.from(fields.map((f) => f.scale));
  const kind = Uint8Array.from(fields.map((f) => (f.column === undefined ? IGNORED : f.column === 'event' || f.column === 'track' ? ID : NUMBER)));
  let row = 0;
  let lineEnds = 0;

  while (i < n) {
    // Blank line (or trailing CR): not a row.
    let c = bytes[i];
    if (c === LF) {
      i++;
      line++;
      lineEnds++;
      continue;
    }
    if (c === CR && (i + 1 >= n || bytes[i + 1] === LF)) {
      if (i + 1 < n) lineEnds++;
      i += 2;
      line++;
      continue;
    }
    if (builder.reserve(row, line, base + i)) target = builder.fieldArrays(fields);
    for (let f = 0; f < nf; f++) {
      const column = target[f];
      if (bytes[i] === QUOTE) {
        const end = closingQuote(bytes, i, n, file, line, fields[f].raw);
        if (column !== null) {
          const text = new TextDecoder().decode(bytes.subarray(i + 1, end - 1)).replace(/""/g, '"');
          if (kind[f] === ID) storeId(builder, column, row, text, file, line, fields[f]);
          else {
            const v = STRICT_DECIMAL.test(text) ? Number(text) : NaN;
            if (!Number.isFinite(v)) throw rowError(bytes, file, line, fields[f].raw, i + 1, end - 1, headerText);
            column[row] = v * scale[f];
          }
        }
        i = end;
        while (i < n && bytes[i] === SPACE) i++;
      } else if (column !== null) {
        // Inline fast path for the usual cell, [-]digits[.digits] with at most 15 digits: the
        // significand is exact and one division by an exact power of ten rounds correctly
        // (Clinger's fast path). Anything else goes to scanNumber (or the id reader).
        // (A digit is one unsigned compare, (byte − '0') >>> 0 < 10; counts come from positions.)
        let j = i;
        let negative = false;
        if (bytes[j] === MINUS) { negative = true; j++; }
        const digitsStart = j;
        let mantissa = 0, d = 0, fraction = 0, point = 0;
        while (j < n && (d = bytes[j] - ZERO) >>> 0 < 10) { mantissa = mantissa * 10 + d; j++; }
        if (j < n && bytes[j] === DOT) {
          const fractionStart = ++j;
          point = 1;
          while (j < n && (d = bytes[j] - ZERO) >>> 0 < 10) { mantissa = mantissa * 10 + d; j++; }
          fraction = j - fractionStart;
        }
        const digits = j - digitsStart - point;
        const clean = digits > 0 && digits <= 15 && (j >= n || (c = bytes[j]) === delimiter || c === LF || c === CR);
        if (kind[f] === ID) {
          if (clean && fraction === 0 && j > i + (negative ? 1 : 0)) {
            column[row] = negative ? (mantissa === 0 ? 0 : -mantissa) : mantissa;
            i = j;
          } else {
            let e = i;
            while (e < n && (c = bytes[e]) !== delimiter && c !== LF && c !== CR) e++;
            try {
              storeId(builder, column, row, latin1(bytes, i, e), file, line, fields[f]);
            } catch (err) {
              throw headerRepeat(bytes, file, line, i, headerText) ?? err;
            }
            i = e;
          }
        } else if (clean) {
          const v = fraction === 0 ? mantissa : mantissa / POW10[fraction];
          column[row] = (negative ? -v : v) * scale[f];
          i = j;
        } else {
          const v = scanNumber(bytes, i, n, delimiter);
          if (v !== v) throw rowError(bytes, file, line, fields[f].raw, i, scanEnd, headerText);
          column[row] = v * scale[f];
          i = scanEnd;
        }
      } else {
        while (i < n && (c = bytes[i]) !== delimiter && c !== LF && c !== CR) i++;
      }
      // Now at a delimiter, CR, LF or the end.
      c = i < n ? bytes[i] : LF;
      if (f < nf - 1) {
        if (c !== delimiter) {
          throw msg.badRow(file, line, `row has ${f + 1} field${f === 0 ? '' : 's'} but the header has ${nf}; fill the missing values or fix the separators`);
        }
        i++;
      } else if (c === delimiter) {
        throw msg.badRow(file, line, `row has more fields than the ${nf} in the header; remove the extra values or add a header name for them`);
      } else if (c !== LF && c !== CR) {
        throw msg.badRow(file, line, `unexpected text after the last field; check the quotes and separators`);
      }
    }
    // End of row.
    row++;
    if (i < n && bytes[i] === CR) i++;
    if (i < n && bytes[i] === LF) {
      i++;
      lineEnds++;
    }
    line++;
  }
  if (rows.counted) rows.counted.lineEnds = lineEnds;
  return builder.finish(file, unitsOf(fields, layout.lengthUnit), fields.filter((f) => f.column === undefined).map((f) => f.raw), rows.allowEmpty === true);
}

function storeId(builder: HitTableBuilder, column: Float64Array, row: number, text: string, file: string, line: number, field: { raw: string; column?: string }): void {
  const id = parseIdText(text, file, line, field.raw);
  if (typeof id === 'number') column[row] = id;
  else builder.wideId(field.column as 'event' | 'track', row, id);
}

/**
 * Index just past the quoted field starting at `start` (which holds the opening quote). A hit
 * file keeps each row on one line, so a quote still open at the line's end is an error — read
 * as the standard allows, it would silently swallow every row after it.
 */
function closingQuote(bytes: Uint8Array, start: number, n: number, file: string, line: number, column: string): number {
  let i = start + 1;
  while (i < n) {
    const c = bytes[i];
    if (c === QUOTE) {
      if (i + 1 < n && bytes[i + 1] === QUOTE) i += 2;
      else return i + 1;
    } else if (c === LF || c === CR) break;
    else i++;
  }
  throw msg.badRow(file, line, `column '${column}': a quote opened here is not closed on this line; close it (hit files keep each row on one line)`);
}

function latin1(buf: Uint8Array, start: number, end: number): string {
  let s = '';
  for (let i = start; i < end; i++) s += String.fromCharCode(buf[i]);
  return s;
}

function rowError(bytes: Uint8Array, file: string, line: number, column: string, start: number, end: number, headerText: string) {
  const text = new TextDecoder().decode(bytes.subarray(start, end)).trim();
  return headerRepeat(bytes, file, line, start, headerText) ?? msg.badNumber(file, line, column, text);
}

/** A header repeated inside the data (files joined with `cat`) deserves its own advice. */
function headerRepeat(bytes: Uint8Array, file: string, line: number, start: number, headerText: string) {
  let lineEnd = start;
  let lineStart = start;
  while (lineStart > 0 && bytes[lineStart - 1] !== LF) lineStart--;
  while (lineEnd < bytes.length && bytes[lineEnd] !== LF) lineEnd++;
  const rowText = new TextDecoder().decode(bytes.subarray(lineStart, lineEnd)).replace(/\r$/, '');
  if (rowText.trim() === headerText.trim()) {
    return msg.badRow(file, line, 'this line repeats the header (were two files joined?); remove it or read the files separately');
  }
  return undefined;
}


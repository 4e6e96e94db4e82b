import { msg, type SagittaError } from '../errors.js';

/**
 * Event and track identifiers are exact whole numbers, from −(2⁶³−1) to 2⁶³−1 (the range of a
 * 64-bit signed integer, what read-out systems and columnar formats store).
 *
 * Inside a HitTable the id columns are Float64Array. A double holds every integer up to
 * 2⁵³−1 exactly, so in the usual file the column holds the ids themselves. When a column has an
 * id beyond that, a double would merge neighbouring ids (2⁵³ and 2⁵³+1 are the same double), so
 * the whole column is stored as codes instead: whole numbers that sort, group and keep their sign
 * exactly as the ids do, with the exact ids as text in an `IdLabels` (code c ↦ text[c + zero]).
 * Writers print the text; `idText` turns a code back into the id.
 */
export interface IdLabels {
  /** Canonical decimal text of each distinct id, in increasing order of the ids. */
  readonly text: readonly string[];
  /** Index in `text` of code 0; codes below zero are the negative ids. */
  readonly zero: number;
}

/** Largest id accepted (2⁶³ − 1), as a BigInt. */
export const MAX_ID = (1n << 63n) - 1n;

const INTEGER_TEXT = /^[+-]?\d+$/;
const DECIMAL_TEXT = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Reads one id cell. Returns the id as a number when it is exactly representable (|id| ≤ 2⁵³−1),
 * or its canonical decimal text when it is larger (up to 2⁶³−1); throws a located error for
 * anything that is not a whole number ("1.5", "0x1A", "1e30", "", "abc").
 * Integer-valued decimals within the exact range ("3.0", "1e3") are accepted, as spreadsheet
 * exports write them.
 */
export function parseIdText(raw: string, file: string, line: number, column: string): number | string {
  const text = raw.trim();
  if (INTEGER_TEXT.test(text)) {
    const n = Number(text);
    if (Number.isSafeInteger(n)) return n === 0 ? 0 : n;
    const big = BigInt(text);
    if (big > MAX_ID || big < -MAX_ID) throw idError(file, line, column, text, 'is beyond the id range ±(2^63 − 1)');
    return big.toString();
  }
  if (DECIMAL_TEXT.test(text)) {
    const n = Number(text);
    if (Number.isSafeInteger(n)) return n === 0 ? 0 : n;
    if (Number.isInteger(n)) throw idError(file, line, column, text, 'is too large to be read exactly in this form; write the id as plain digits');
    throw idError(file, line, column, text, 'is not a whole number; event and track ids are integers');
  }
  throw idError(file, line, column, text, 'is not a whole number; event and track ids are integers');
}

function idError(file: string, line: number, column: string, text: string, why: string): SagittaError {
  return msg.badId(file, line, column, text, why);
}

/**
 * Replaces an id column holding numbers and, at the rows in `wide`, ids too large for a double
 * (NaN in the column) by sign-keeping order codes; returns the labels. Runs only for files that
 * have such ids.
 */
export function encodeWideIds(column: Float64Array, wide: ReadonlyMap<number, string>): IdLabels {
  const ids = new Array<bigint>(column.length);
  for (let i = 0; i < column.length; i++) {
    const w = wide.get(i);
    ids[i] = w !== undefined ? BigInt(w) : BigInt(column[i]);
  }
  const distinct = [...new Set(ids)].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  let zero = distinct.findIndex((v) => v >= 0n);
  if (zero < 0) zero = distinct.length;
  const code = new Map<bigint, number>();
  distinct.forEach((v, k) => code.set(v, k - zero));
  for (let i = 0; i < column.length; i++) column[i] = code.get(ids[i])!;
  return { text: distinct.map((v) => v.toString()), zero };
}

/** The id a column value stands for, as exact decimal text. */
export function idText(value: number, labels: IdLabels | undefined): string {
  if (labels === undefined) return String(value);
  const t = labels.text[value + labels.zero];
  return t ?? String(value);
}

/** An id column as text for writers (exact for codes and plain numbers alike). */
export function idColumnText(values: ArrayLike<number>, labels: IdLabels | undefined): string[] {
  const out = new Array<string>(values.length);
  for (let i = 0; i < values.length; i++) out[i] = idText(values[i], labels);
  return out;
}

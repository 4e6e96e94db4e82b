import type { Column, ColumnTable } from '../io/columnTable.js';

/** Column names that say what a row is, in the order they key it. */
export const ROW_KEYS: readonly string[] = Object.freeze(['run', 'event', 'track', 'vertex', 'candidate', 'peak']);

/** True for a `{ rows, columns: [{ name, values }] }` result table. */
export function isColumnTable(value: unknown): value is ColumnTable {
  if (value === null || typeof value !== 'object') return false;
  const v = value as Partial<ColumnTable>;
  return typeof v.rows === 'number' && Array.isArray(v.columns) && v.columns.every((c) => c && typeof c.name === 'string' && c.values !== undefined && typeof (c.values as ArrayLike<unknown>).length === 'number');
}

function isRecord(v: unknown): v is Record<string, unknown> {
  if (v === null || typeof v !== 'object' || Array.isArray(v)) return false;
  const proto = Object.getPrototypeOf(v);
  return proto === Object.prototype || proto === null;
}

/** True for a non-empty array of plain objects (rows of a table). */
export function isRecordArray(value: unknown): value is readonly Record<string, unknown>[] {
  return Array.isArray(value) && value.length > 0 && value.length <= 1_000_000 && value.every(isRecord);
}

function cellText(v: unknown): string {
  if (v === null || v === undefined) return '';
  if (Array.isArray(v)) return v.map(cellText).join(' / ');
  if (typeof v === 'object') return JSON.stringify(v);
  return String(v);
}

/** Rows of plain objects as columns: numbers where every value is a number (or missing), text otherwise. */
export function recordsToColumns(rows: readonly Record<string, unknown>[]): ColumnTable {
  const names: string[] = [];
  const seen = new Set<string>();
  for (const r of rows) for (const k of Object.keys(r)) if (!seen.has(k)) { seen.add(k); names.push(k); }
  const columns: Column[] = names.map((name) => {
    const numeric = rows.every((r) => r[name] === undefined || r[name] === null || typeof r[name] === 'number');
    return numeric
      ? { name, values: Float64Array.from(rows, (r) => (typeof r[name] === 'number' ? (r[name] as number) : NaN)) }
      : { name, values: rows.map((r) => cellText(r[name])) };
  });
  return { rows: rows.length, columns };
}

/** The parts of a DataFrame or Series we read (duck-typed: the DataFrame library is never loaded for a display). */
interface FrameLike { columns: string[]; values: unknown[] }

/** A DataFrame (or Series) as columns, or undefined for anything else. */
export function frameToColumns(value: unknown): ColumnTable | undefined {
  if (value === null || typeof value !== 'object') return undefined;
  const v = value as Partial<FrameLike> & { ndim?: unknown; $isSeries?: unknown };
  if (!('$isSeries' in v) || !Array.isArray(v.values) || !Array.isArray(v.columns)) return undefined;
  const rows = v.ndim === 2 ? (v.values as unknown[][]) : v.ndim === 1 ? (v.values as unknown[]).map((x) => [x]) : undefined;
  if (!rows) return undefined;
  const names = (v.columns as unknown[]).map(String);
  return recordsToColumns(rows.map((r) => Object.fromEntries(names.map((n, j) => [n, r[j]]))));
}

import { writeFileSync, renameSync } from 'node:fs';
import type { DataFrame } from 'danfojs-node';
import { loadDanfo } from './hitsToDataFrame';
import { formatSignificant } from './formatSignificant';

/**
 * A named, ordered set of equally long columns — the shape every result table takes on its way
 * out (CSV, JSON, DataFrame). Numbers are written with `digits` significant digits; NaN is
 * written as an empty CSV cell and as null in JSON.
 */
export interface Column {
  readonly name: string;
  readonly values: ArrayLike<number> | readonly string[];
  /** Significant digits for numbers (default 10); 0 means integers. */
  readonly digits?: number;
}

export interface ColumnTable {
  readonly columns: readonly Column[];
  readonly rows: number;
}

function cell(c: Column, i: number): string {
  const v = c.values[i];
  if (typeof v === 'string') return /[",\n\r]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
  if (!Number.isFinite(v)) return '';
  if (c.digits === 0 || Number.isInteger(v)) return String(v);
  return formatSignificant(v, c.digits ?? 10);
}

/** CSV text with a header row. */
export function formatCsv(table: ColumnTable): string {
  const { columns, rows } = table;
  const parts: string[] = [columns.map((c) => c.name).join(',')];
  for (let i = 0; i < rows; i++) {
    let line = cell(columns[0], i);
    for (let j = 1; j < columns.length; j++) line += ',' + cell(columns[j], i);
    parts.push(line);
  }
  return parts.join('\n') + '\n';
}

/** Rows as plain objects (NaN → null), for JSON output. */
export function rowObjects(table: ColumnTable): Record<string, number | string | null>[] {
  const out: Record<string, number | string | null>[] = new Array(table.rows);
  for (let i = 0; i < table.rows; i++) {
    const row: Record<string, number | string | null> = {};
    for (const c of table.columns) {
      const v = c.values[i];
      row[c.name] = typeof v === 'string' ? v : Number.isFinite(v) ? (c.digits === 0 || Number.isInteger(v) ? v : Number(formatSignificant(v, c.digits ?? 10))) : null;
    }
    out[i] = row;
  }
  return out;
}

/** The table as a danfojs DataFrame (notebooks); NaN stays NaN. */
export function columnTableToDataFrame(table: ColumnTable): DataFrame {
  const data: Record<string, (number | string)[]> = {};
  for (const c of table.columns) data[c.name] = Array.from(c.values as ArrayLike<number | string>);
  const { DataFrame: Frame } = loadDanfo();
  return new Frame(data);
}

/** Writes text atomically: to a temporary file beside the target, then rename. */
export function writeFileAtomic(path: string, text: string): void {
  const tmp = `${path}.${process.pid}.tmp`;
  writeFileSync(tmp, text);
  renameSync(tmp, path);
}

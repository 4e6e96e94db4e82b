import { asMime, type MimeBundle, type Presentable } from '../asMime.js';
import { msg } from '../errors.js';
import type { ColumnTable } from '../io/columnTable.js';
import { recordCaution } from '../provenance.js';
import { errorColumnName } from './columnHeading.js';
import { tableHtml, tableText } from './renderTable.js';
import { isColumnTable, isRecordArray, recordsToColumns, ROW_KEYS } from './tableSource.js';

export interface TableViewOptions {
  /** What one row is ('track', 'candidate', …), for the caption; default 'row'. */
  readonly noun?: string;
  /** Columns that say what a row is; default those of ROW_KEYS the table has. */
  readonly keys?: readonly string[];
  /** Columns shown; default all but the keys. */
  readonly columns?: readonly string[];
  /** Words that open the caption, e.g. 'Fitted tracks, 1.5 T'. */
  readonly caption?: string;
  /** Most rows a display draws; default 20. */
  readonly shown?: number;
}

/** One row as an object: column name → number or text. */
export type TableRow = Readonly<Record<string, number | string>>;

/** Columns whose values are ranges or stopping powers: a display of them carries the clinical caution. */
const RANGE_COLUMN = /(^|_)(range|csda|stopping|dedx)(_|$)/i;

/** What the table display says under ranges and stopping powers. */
export const TABLE_CAUTION = 'Caution: ranges and stopping powers here are for track analysis, not for treatment planning, dosimetry or any clinical decision.';

/**
 * A view of a result table: which rows, in which order, which columns — with small selection
 * verbs (`where`, `sortBy`, `first`, `columns`) that each return a new view, and a display of
 * Sagitta's own look: rows headed by what they are (event, track), units under the headings,
 * `value ± error` where a `sigma_<name>` column exists, and a caption saying how many rows are
 * shown of how many. Nothing is copied but the row order; no DataFrame library is loaded.
 * @example tableView(trackTableColumns(tracks), { noun: 'track' }).where((t) => t.status === 'ok').first(10)
 */
export class TableView implements Presentable {
  readonly table: ColumnTable;
  /** Source rows of this view, in order. */
  readonly rows: Int32Array;
  readonly keys: readonly string[];
  readonly names: readonly string[];
  readonly noun: string;
  readonly caption: string;
  readonly shown: number;

  constructor(table: ColumnTable, options: TableViewOptions & { rows?: Int32Array } = {}) {
    const all = table.columns.map((c) => c.name);
    for (const n of [...(options.keys ?? []), ...(options.columns ?? [])]) if (!all.includes(n)) throw msg.badArgument('column', n, `one of the table's columns: ${all.join(', ')}`);
    this.table = table;
    this.rows = options.rows ?? Int32Array.from({ length: table.rows }, (_, i) => i);
    this.keys = options.keys ?? ROW_KEYS.filter((k) => all.includes(k));
    const errors = new Set(all.filter((n) => all.includes(n.replace(/^sigma_/, '')) && n.startsWith('sigma_')));
    this.names = options.columns ?? all.filter((n) => !this.keys.includes(n) && !errors.has(n));
    this.noun = options.noun ?? 'row';
    this.caption = options.caption ?? '';
    this.shown = options.shown ?? 20;
  }

  /** Rows in this view. */
  get length(): number {
    return this.rows.length;
  }

  private with(change: { rows?: Int32Array; columns?: readonly string[] }): TableView {
    return new TableView(this.table, { noun: this.noun, keys: this.keys, caption: this.caption, shown: this.shown, columns: change.columns ?? this.names, rows: change.rows ?? this.rows });
  }

  /** Row i of this view as an object of every column (not only the shown ones). */
  row(i: number): TableRow {
    const r = this.rows[i];
    return Object.fromEntries(this.table.columns.map((c) => [c.name, c.values[r]]));
  }

  /** Every row of this view as objects. */
  toRows(): TableRow[] {
    return Array.from(this.rows, (_, i) => this.row(i));
  }

  /** The rows for which `test` is true. */
  where(test: (row: TableRow) => boolean): TableView {
    return this.with({ rows: this.rows.filter((_, i) => test(this.row(i))) });
  }

  /** Rows ordered by a column (numbers, NaN last; text in alphabetical order); a stable sort. */
  sortBy(column: string, order: 'ascending' | 'descending' = 'ascending'): TableView {
    const c = this.table.columns.find((x) => x.name === column);
    if (!c) throw msg.badArgument('column', column, `one of the table's columns: ${this.table.columns.map((x) => x.name).join(', ')}`);
    const dir = order === 'descending' ? -1 : 1;
    const v = c.values as ArrayLike<number | string>;
    const cmp = (a: number, b: number) => {
      const x = v[a], y = v[b];
      if (typeof x === 'number' && typeof y === 'number') {
        if (Number.isNaN(x) || Number.isNaN(y)) return Number.isNaN(x) ? (Number.isNaN(y) ? 0 : 1) : -1;
        return dir * (x - y);
      }
      return dir * String(x).localeCompare(String(y));
    };
    return this.with({ rows: Int32Array.from(this.rows).sort(cmp) });
  }

  /** The first n rows. */
  first(n: number): TableView {
    return this.with({ rows: this.rows.slice(0, Math.max(0, Math.floor(n))) });
  }

  /** Only these columns, in this order (the row keys stay; an error column shows folded into its value). */
  columns(...names: string[]): TableView {
    const all = this.table.columns.map((c) => c.name);
    for (const n of names) if (!all.includes(n)) throw msg.badArgument('column', n, `one of the table's columns: ${all.join(', ')}`);
    const folded = names.filter((n) => !(n.startsWith('sigma_') && names.includes(n.slice(6))));
    return this.with({ columns: folded.filter((n) => !this.keys.includes(n)) });
  }

  [asMime](): MimeBundle {
    const drawn = this.rows.subarray(0, Math.min(this.rows.length, this.shown));
    const plural = (n: number) => `${n} ${n === 1 ? this.noun : /[^aeiou]y$/.test(this.noun) ? `${this.noun.slice(0, -1)}ies` : `${this.noun}s`}`;
    const counts = this.rows.length === this.table.rows ? plural(this.rows.length) : `${this.rows.length} of ${plural(this.table.rows)}`;
    const cut = drawn.length < this.rows.length ? ` — the first ${drawn.length} shown (.first(n), .where(…) pick others)` : '';
    const caption = `${this.caption ? `${this.caption}: ` : ''}${counts}${cut}`;
    const shownNames = [...this.keys, ...this.names, ...this.names.map(errorColumnName)];
    const ranges = shownNames.some((n) => RANGE_COLUMN.test(n) && this.table.columns.some((c) => c.name === n));
    if (ranges) recordCaution('stopping-power');
    const layout = { table: this.table, rows: drawn, keys: this.keys, names: this.names, caption, footnote: ranges ? TABLE_CAUTION : '' };
    return { 'text/html': tableHtml(layout), 'text/plain': tableText(layout) };
  }
}

/**
 * A table view of a result table (`{ rows, columns }`, e.g. `trackTableColumns(tracks)`) or of an
 * array of plain objects (one per row).
 * @example tableView([{ peak: 1, m_over_q_u: 3.9892, sigma_m_over_q_u: 0.0021 }], { noun: 'peak' })
 */
export function tableView(source: ColumnTable | readonly Record<string, unknown>[], options: TableViewOptions = {}): TableView {
  if (isColumnTable(source)) return new TableView(source, options);
  if (Array.isArray(source) && (source.length === 0 || isRecordArray(source))) return new TableView(recordsToColumns(source), options);
  throw msg.badArgument('source', source, 'a result table { rows, columns } or an array of plain objects');
}

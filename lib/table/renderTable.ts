import type { Column, ColumnTable } from '../io/columnTable.js';
import { columnHeading, errorColumnName } from './columnHeading.js';
import { columnDecimals, formatMeasured, formatWithDecimals } from './formatCell.js';

/** What to draw: which rows of which table, keyed how, under which caption. */
export interface TableLayout {
  readonly table: ColumnTable;
  /** Source rows to draw, in order. */
  readonly rows: ArrayLike<number>;
  /** Columns that say what a row is (drawn as row headings). */
  readonly keys: readonly string[];
  /** Other columns to draw, in order (error columns fold into their value's cell). */
  readonly names: readonly string[];
  readonly caption: string;
  /** A line under the table (e.g. the clinical caution), or ''. */
  readonly footnote: string;
}

function escape(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** One drawn column: heading and the text of each drawn row. */
interface DrawnColumn { readonly html: string; readonly text: string; readonly unit: string; readonly cells: string[]; readonly numeric: boolean }

function drawColumn(table: ColumnTable, c: Column, rows: ArrayLike<number>): DrawnColumn {
  const h = columnHeading(c.name);
  const err = table.columns.find((e) => e.name === errorColumnName(c.name));
  const values = c.values;
  const cells: string[] = [];
  if (values.length > 0 && typeof values[0] === 'string') {
    for (let i = 0; i < rows.length; i++) cells.push(String((values as readonly string[])[rows[i]] ?? ''));
    return { ...h, cells, numeric: false };
  }
  const numbers = values as ArrayLike<number>;
  if (err) {
    const e = err.values as ArrayLike<number>;
    for (let i = 0; i < rows.length; i++) cells.push(formatMeasured(numbers[rows[i]], e[rows[i]]));
    return { ...h, cells, numeric: true };
  }
  const picked = Float64Array.from({ length: rows.length }, (_, i) => numbers[rows[i]]);
  const decimals = columnDecimals(picked, c.digits === 0 ? 1 : Math.min(c.digits ?? 4, 4), c.digits === 0);
  for (const v of picked) cells.push(formatWithDecimals(v, decimals));
  return { ...h, cells, numeric: true };
}

function drawn(layout: TableLayout): { keys: DrawnColumn[]; cols: DrawnColumn[] } {
  const byName = new Map(layout.table.columns.map((c) => [c.name, c]));
  const pick = (n: string) => drawColumn(layout.table, byName.get(n)!, layout.rows);
  return { keys: layout.keys.map(pick), cols: layout.names.map(pick) };
}

/** The table as HTML: keys as row headings, units under each heading, `value ± error` cells, our caption. */
export function tableHtml(layout: TableLayout): string {
  const { keys, cols } = drawn(layout);
  const head = [...keys, ...cols].map((c, j) => `<th scope="col"${j < keys.length ? ' class="sg-key"' : ''}>${c.html}${c.unit ? `<br><span class="sg-unit">[${escape(c.unit)}]</span>` : ''}</th>`).join('');
  const body: string[] = [];
  for (let i = 0; i < layout.rows.length; i++) {
    const k = keys.map((c) => `<th scope="row">${escape(c.cells[i])}</th>`).join('');
    const v = cols.map((c) => `<td${c.numeric ? ' class="sg-num"' : ''}>${escape(c.cells[i])}</td>`).join('');
    body.push(`<tr>${k}${v}</tr>`);
  }
  const foot = layout.footnote ? `<tfoot><tr><td colspan="${keys.length + cols.length}">${escape(layout.footnote)}</td></tr></tfoot>` : '';
  return `<table class="sagitta-table"><caption>${escape(layout.caption)}</caption><thead><tr>${head}</tr></thead><tbody>${body.join('')}</tbody>${foot}</table>`;
}

/** The table as aligned plain text: heading and unit lines, then rows, caption last. */
export function tableText(layout: TableLayout): string {
  const { keys, cols } = drawn(layout);
  const all = [...keys, ...cols];
  const lines = [all.map((c) => c.text), all.map((c) => (c.unit ? `[${c.unit}]` : '')), ...Array.from({ length: layout.rows.length }, (_, i) => all.map((c) => c.cells[i]))];
  const widths = all.map((_, j) => Math.max(...lines.map((l) => [...l[j]].length)));
  const pad = (s: string, j: number) => (all[j].numeric ? s.padStart(widths[j] + s.length - [...s].length) : s.padEnd(widths[j] + s.length - [...s].length));
  const out = lines.map((l) => l.map(pad).join('  ').trimEnd());
  if (!out[1].trim()) out.splice(1, 1);
  return [layout.caption, ...out, ...(layout.footnote ? [layout.footnote] : [])].join('\n');
}

import { asMime, type MimeBundle } from '../asMime.js';
import { setTableDisplay } from '../display.js';
import { frameToColumns, isColumnTable, isRecordArray, recordsToColumns } from './tableSource.js';
import { TableView } from './tableView.js';

/**
 * The display of anything shaped like a table — a `{ rows, columns }` result table, an array of
 * plain objects, a DataFrame or Series — as a TableView (Sagitta's own look, no DataFrame library
 * loaded); undefined for anything else. lib/display's `mimeBundleOf` calls it for values that do
 * not display themselves: this module installs it there when it loads (lib/index.ts and
 * lib/internal.ts load it).
 * @example tableDisplay([{ event: 1, pt_GeV_c: 0.5 }])?.['text/plain']
 */
export function tableDisplay(value: unknown): MimeBundle | undefined {
  const table = isColumnTable(value) ? value : isRecordArray(value) ? recordsToColumns(value) : frameToColumns(value);
  return table === undefined ? undefined : new TableView(table)[asMime]();
}

setTableDisplay(tableDisplay);

// lib/table: result tables shown in Sagitta's own look, with small selection verbs. Named re-exports only.
export { TableView, tableView, TABLE_CAUTION, type TableRow, type TableViewOptions } from './tableView.js';
export { columnHeading, type ColumnHeading } from './columnHeading.js';
export { formatMeasured, formatSignificant } from './formatCell.js';
export { trackRows } from './trackRows.js';
export { tableDisplay } from './tableDisplay.js';

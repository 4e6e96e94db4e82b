export type { HitTable, HitTableSource, TrackIndex } from './hitTable.js';
export { HIT_COLUMNS, REQUIRED_HIT_COLUMNS } from './hitColumns.js';
export { parseHitsCsv, READ_HITS_DEFAULTS, type ReadHitsOptions } from './parseHitsCsv.js';
export { parseHitsJsonl } from './parseHitsJsonl.js';
export { readHits, HIT_FILE_FORMATS } from './readHits.js';
export { indexTracks, gatherRows } from './indexTracks.js';
export { readNumberColumns } from './readNumberColumns.js';
export { hitsToDataFrame, loadDanfo } from './hitsToDataFrame.js';
export { formatCsv, formatCsvBytes, rowObjects, columnTableToDataFrame, writeFileAtomic, type Column, type ColumnTable } from './columnTable.js';

export type { HitTable, HitTableSource, TrackIndex } from './hitTable';
export { HIT_COLUMNS, REQUIRED_HIT_COLUMNS } from './hitColumns';
export { parseHitsCsv, READ_HITS_DEFAULTS, type ReadHitsOptions } from './parseHitsCsv';
export { parseHitsJsonl } from './parseHitsJsonl';
export { readHits, HIT_FILE_FORMATS } from './readHits';
export { indexTracks, gatherRows } from './indexTracks';
export { hitsToDataFrame, loadDanfo } from './hitsToDataFrame';
export { formatCsv, formatCsvBytes, rowObjects, columnTableToDataFrame, writeFileAtomic, type Column, type ColumnTable } from './columnTable';

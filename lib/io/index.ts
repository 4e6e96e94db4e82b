// lib/io: everything this room offers the other rooms, by name (the public subset is in lib/index.ts).
export { columnTableToDataFrame, formatCsv, formatCsvBytes, rowObjects, type Column, type ColumnTable } from './columnTable.js';
export { HIT_COLUMNS, REQUIRED_HIT_COLUMNS } from './hitColumns.js';
export { type HitTable, type HitTableSource, type TrackIndex } from './hitTable.js';
export { type HitCoordinates } from './hitCoordinates.js';
export { hitsToDataFrame, loadDanfo } from './hitsToDataFrame.js';
export { gatherRows, indexTracks } from './indexTracks.js';
export { READ_HITS_DEFAULTS, parseHitsCsv, type ReadHitsOptions } from './parseHitsCsv.js';
export { parseHitsJsonl } from './parseHitsJsonl.js';
export { HIT_FILE_FORMATS, readHits } from './readHits.js';
export { readNumberColumns } from './readNumberColumns.js';
export { writeFileAtomic } from './writeFileAtomic.js';

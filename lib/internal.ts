// Plumbing the kernel (command line, batch path, runner, session, report) shares with the library
// but users do not need: catalogue factories, atomic writes, display sinks, knob and provenance
// bookkeeping, streaming parsers. Not part of the package's exports; lib/index.ts is the public API.
export { escapeHtml, mimeBundleOf, setCellChannel, setDisplaySink } from './display.js';
export { msg } from './errors.js';
export { formatCsvBytes } from './io/columnTable.js';
export { readCsvLayout, type CsvLayout } from './io/csvLayout.js';
export { parseHeader, type HeaderField } from './io/hitColumns.js';
export { idColumnText, idText, type IdLabels } from './io/hitIds.js';
export { hitTableFromColumns, type ColumnValues } from './io/hitTableFromColumns.js';
export { gatherRows } from './io/indexTracks.js';
export { parseCsvRows } from './io/parseHitsCsv.js';
export { jsonlFields, parseHitsJsonl, parseJsonlRows } from './io/parseHitsJsonl.js';
export { inputError, readInputFile } from './io/readInputFile.js';
export { writeFileAtomic } from './io/writeFileAtomic.js';
export { checkKnobName, knobKind, knobSnapshot, readKnobValue, supplyKnobs, type KnobRecord } from './knob.js';
export { parseMaterialFile } from './matter/materialFile.js';
export { isElectronLike } from './matter/stoppingPower.js';
export { PLOTLY_MIME } from './plot/figure.js';
export { provenanceSnapshot, type ProvenanceSnapshot } from './provenance.js';
export { tableDisplay } from './table/tableDisplay.js';
export { checkHitOrder } from './track/hitOrderCheck.js';
export { speciesList } from './track/measureByIdentity.js';
export { POOR_FIT_PROBABILITY } from './track/measureTracks.js';
export { metresPerUnit } from './units.js';

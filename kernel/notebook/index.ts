// kernel/notebook: nbformat read, validate, upgrade and atomic write (named re-exports).
export { type Cell, type CodeCell, type DisplayDataOutput, type ErrorOutput, type ExecuteResultOutput, type MarkdownCell, type MultilineString, type Notebook, type Output, type RawCell, type SagittaCellMeta, type StreamOutput } from './types.js';
export { joinSource, splitLines } from './source.js';
export { validateNotebook } from './validate.js';
export { upgradeNotebook, WRITTEN_MINOR } from './upgrade.js';
export { type LoadedNotebook, parseNotebook, readNotebook } from './read.js';
export { serializeNotebook, writeNotebook } from './write.js';

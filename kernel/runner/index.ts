export type { ToChild, FromChild } from './messages.js';
export { parseDuration } from './duration.js';
export { parseSetArguments } from './setArguments.js';
export { findKnobs, checkSuppliedKnobs, type DeclaredKnob } from './findKnobs.js';
export { runNotebook, type NotebookRun, type RunNotebookOptions, type RunProgress } from './runNotebook.js';
export type { RunRecord, LibraryRecord, ModuleRecord } from './runRecord.js';
export { stepName } from './failureText.js';
export { longTimer } from './longTimer.js';

export type { CellError, CellHooks, CellOutcome, Completeness, CompletionReply, ExecuteOptions, Session, SessionOptions } from './types.js';
export { createSession } from './session.js';
export { codePointToUtf16, utf16ToCodePoint } from './positions.js';
export { jsonSafeBundle } from './jsonSafeBundle.js';
export { CellPhase, createPhaseFlag } from './phase.js';

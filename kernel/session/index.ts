export * from './types.js';
export { createSession } from './session.js';
export { codePointToUtf16, utf16ToCodePoint } from './positions.js';

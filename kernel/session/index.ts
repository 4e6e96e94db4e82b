export * from './types';
export { createSession } from './session';
export { codePointToUtf16, utf16ToCodePoint } from './positions';

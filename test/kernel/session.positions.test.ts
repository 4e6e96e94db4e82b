import { describe, expect, it } from 'vitest';
import { codePointToUtf16, utf16ToCodePoint } from '../../kernel/session/positions.js';

// Messaging protocol 5.2+: cursor_pos counts Unicode code points; JavaScript strings are UTF-16.
describe('code-point ↔ UTF-16 positions', () => {
  const text = 'a𝜎b🧲c'; // 𝜎 (U+1D70E) and 🧲 (U+1F9F2) are outside the BMP: 2 code units each
  it('codePointToUtf16 skips surrogate pairs as one character', () => {
    expect([0, 1, 2, 3, 4, 5].map((cp) => codePointToUtf16(text, cp))).toEqual([0, 1, 3, 4, 6, 7]);
  });
  it('utf16ToCodePoint is its inverse on character boundaries', () => {
    expect([0, 1, 3, 4, 6, 7].map((u) => utf16ToCodePoint(text, u))).toEqual([0, 1, 2, 3, 4, 5]);
  });
  it('positions past the end are clamped to the text', () => {
    expect(codePointToUtf16(text, 99)).toBe(text.length);
    expect(utf16ToCodePoint(text, 99)).toBe([...text].length);
  });
  it('plain ASCII maps one to one', () => {
    expect(codePointToUtf16('Math.max', 5)).toBe(5);
  });
});

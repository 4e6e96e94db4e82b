/**
 * Cursor positions. The notebook messaging protocol (5.2 and later) counts cursor positions in
 * Unicode code points; the TypeScript compiler counts UTF-16 code units. Characters outside the
 * Basic Multilingual Plane (e.g. "𝜎", "🧲") take one code point but two code units.
 */

/** UTF-16 offset of the `codePoint`-th code point of `text` (clamped to the text's length). */
export function codePointToUtf16(text: string, codePoint: number): number {
  let units = 0;
  let points = 0;
  while (points < codePoint && units < text.length) {
    const c = text.charCodeAt(units);
    units += c >= 0xd800 && c <= 0xdbff && units + 1 < text.length ? 2 : 1;
    points++;
  }
  return units;
}

/** Number of code points in the first `utf16` code units of `text`. */
export function utf16ToCodePoint(text: string, utf16: number): number {
  let points = 0;
  let units = 0;
  const end = Math.min(utf16, text.length);
  while (units < end) {
    const c = text.charCodeAt(units);
    units += c >= 0xd800 && c <= 0xdbff && units + 1 < text.length ? 2 : 1;
    points++;
  }
  return points;
}

const POW10 = Array.from({ length: 41 }, (_, i) => 10 ** (i - 20));
const pow10 = (k: number): number => (k >= -20 && k <= 20 ? POW10[k + 20] : 10 ** k);

/**
 * A finite number rounded to `digits` significant digits (1–15), written without trailing
 * zeros: plain notation for 1e-6 ≤ |v| < 1e15, exponent notation otherwise
 * (e.g. 0.8993773740 → "0.899377374", 1.2e-9 → "1.2e-9").
 * About ten times faster than `toPrecision` in V8, which matters when a result file has millions
 * of cells. The value written reads back within half a unit in the last digit.
 */
export function formatSignificant(v: number, digits: number): string {
  if (v === 0) return '0';
  const a = v < 0 ? -v : v;
  let e = Math.floor(Math.log10(a));
  let m = Math.round(a * pow10(digits - 1 - e));
  // log10 can be off by one near powers of ten, and rounding can carry into a new digit.
  if (m >= pow10(digits)) { e++; m = Math.round(a * pow10(digits - 1 - e)); }
  else if (m < pow10(digits - 1)) { e--; m = Math.round(a * pow10(digits - 1 - e)); }
  let s = String(m);
  // Drop trailing zeros of the significand (they carry no information).
  let end = s.length;
  while (end > 1 && s.charCodeAt(end - 1) === 48) end--;
  s = s.slice(0, end);
  const sign = v < 0 ? '-' : '';
  if (e < -6 || e >= 15) return `${sign}${s[0]}${s.length > 1 ? '.' + s.slice(1) : ''}e${e}`;
  if (e < 0) return `${sign}0.${'0'.repeat(-e - 1)}${s}`;
  if (s.length <= e + 1) return sign + s + '0'.repeat(e + 1 - s.length);
  return `${sign}${s.slice(0, e + 1)}.${s.slice(e + 1)}`;
}

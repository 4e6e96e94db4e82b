/**
 * Numbers as a table shows them: a measured value with its error rounded to two significant
 * digits of the error and the value to the same decimal place (common practice), plain values
 * with one number of decimals per column, chosen so the largest shows four significant digits.
 */

const MINUS = '\u2212';
const sign = (s: string) => s.replace(/^-/, MINUS);

/**
 * `value ± error`, both to the error's second significant digit.
 * @example formatMeasured(0.51234, 0.01347) // '0.512 ± 0.013'
 */
export function formatMeasured(value: number, error: number): string {
  if (!Number.isFinite(value)) return '';
  if (!(Number.isFinite(error) && error > 0)) return formatSignificant(value, 4);
  const e = Math.floor(Math.log10(error));
  const decimals = 1 - e;
  if (decimals >= 0 && decimals <= 8 && Math.abs(value) < 1e6) return `${sign(value.toFixed(decimals))} ± ${error.toFixed(decimals)}`;
  // Very large or very small: a common power of ten.
  const p = Math.floor(Math.log10(Math.max(Math.abs(value), error)));
  const scale = 10 ** p, d = Math.max(0, p - e + 1);
  return `(${sign((value / scale).toFixed(d))} ± ${(error / scale).toFixed(d)})×10${superscript(p)}`;
}

const SUP: Readonly<Record<string, string>> = { '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻' };
function superscript(n: number): string {
  return [...String(n)].map((c) => SUP[c] ?? c).join('');
}

/** ±∞ as '∞' and '−∞' (a score that rules a hypothesis out, say); NaN (no value) as ''. */
const infinite = (v: number) => (v === Infinity ? '∞' : v === -Infinity ? `${MINUS}∞` : '');

/** A number to `digits` significant digits, without exponent notation between 10⁻⁴ and 10⁹; ±∞ as '∞', NaN blank. */
export function formatSignificant(v: number, digits: number): string {
  if (!Number.isFinite(v)) return infinite(v);
  if (v === 0) return '0';
  const mag = Math.floor(Math.log10(Math.abs(v)));
  if (mag < -4 || mag >= 9) {
    const [m, x] = v.toExponential(digits - 1).split('e');
    return `${sign(m)}×10${superscript(Number(x))}`;
  }
  return sign(v.toFixed(Math.max(0, digits - 1 - mag)));
}

/**
 * The decimals a column of plain numbers is shown with: the largest magnitude gets `digits`
 * significant digits; integers (all values whole, or `integer`) get none.
 */
export function columnDecimals(values: ArrayLike<number>, digits: number, integer: boolean): number {
  let max = 0, whole = true;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    max = Math.max(max, Math.abs(v));
    if (!Number.isInteger(v)) whole = false;
  }
  if (integer || whole) return 0;
  if (max === 0) return 0;
  return Math.min(8, Math.max(0, digits - 1 - Math.floor(Math.log10(max))));
}

/** A plain number with a column's decimals (exponent form when that would show no digit of it); ±∞ as '∞', NaN blank. */
export function formatWithDecimals(v: number, decimals: number): string {
  if (!Number.isFinite(v)) return infinite(v);
  if (v !== 0 && Math.abs(v) < 0.5 * 10 ** -decimals) return formatSignificant(v, 3);
  if (Math.abs(v) >= 1e9) return formatSignificant(v, 4);
  return sign(v.toFixed(decimals));
}

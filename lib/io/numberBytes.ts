/**
 * Numbers written straight into a byte buffer as ASCII, with exactly the text JavaScript's own
 * conversions give — `String(v)` for whole numbers, `v.toPrecision(p)` otherwise — but without
 * making a string per cell: the result tables of the batch path have millions of cells.
 * Each writer returns the index just past what it wrote; the caller leaves room (MAX_NUMBER_BYTES).
 */

/** Room a caller leaves for one number: sign, 17 digits, point, "e-324" and some to spare. */
export const MAX_NUMBER_BYTES = 32;

const MINUS = 45, DOT = 46, ZERO = 48, LOWER_E = 101, PLUS = 43;
const POW10 = Float64Array.from({ length: 23 }, (_, k) => 10 ** k);
/** Largest significant digits the fast path of `writePrecision` takes (see there). */
const FAST_DIGITS = 10;
/** How near a half the scaled value may come before the rounding is left to toPrecision. */
const HALF_BAND = 1e-4;

/**
 * Writes a whole number |v| < 2⁵³ as `String(v)` does (−0 as "0"); other values through String.
 * @example writeInteger(buf, 0, -42) // buf holds "-42", returns 3
 */
export function writeInteger(buf: Uint8Array, pos: number, v: number): number {
  if (!(Number.isSafeInteger(v))) return writeText(buf, pos, String(v));
  if (v < 0) {
    buf[pos++] = MINUS;
    v = -v;
  }
  return writeDigits(buf, pos, v);
}

/**
 * Writes a finite v as `v.toPrecision(digits)` does (ECMA-262 Number.prototype.toPrecision: the
 * n with `digits` digits nearest to v / 10^(e − digits + 1), the larger on a tie; exponential
 * form when e < −6 or e ≥ digits).
 *
 * Fast path for digits ≤ 10 and 10^|k| exact (|k| ≤ 22, k = digits − 1 − e): v × 10^k is then
 * one correctly rounded operation, so it is within 10¹⁰ × 2⁻⁵³ ≈ 1.1e-6 of the exact scaled value,
 * and rounding it to the nearest integer gives the exact decimal significand unless its
 * fraction lies within HALF_BAND of one half. Those rare values, and everything outside the fast
 * path, are written from `toPrecision` itself — so the bytes are always the same.
 * @example writePrecision(buf, 0, -1.5e-9, 10) // "-1.500000000e-9"
 */
export function writePrecision(buf: Uint8Array, pos: number, v: number, digits: number): number {
  const x = v < 0 ? -v : v;
  if (digits > FAST_DIGITS || !(x > 0) || x === Infinity) return writeText(buf, pos, v.toPrecision(digits));
  let e = decade(x);
  let n = 0;
  // log10 may be one off near a power of ten: the bounds on n correct e (at most twice).
  for (let attempt = 0; ; attempt++) {
    const k = digits - 1 - e;
    if (k > 22 || k < -22 || attempt > 2) return writeText(buf, pos, v.toPrecision(digits));
    const y = k >= 0 ? x * POW10[k] : x / POW10[-k];
    const whole = Math.floor(y);
    const fraction = y - whole;
    if (Math.abs(fraction - 0.5) < HALF_BAND) return writeText(buf, pos, v.toPrecision(digits));
    n = fraction > 0.5 ? whole + 1 : whole;
    if (n >= POW10[digits]) e++;
    else if (n < POW10[digits - 1]) e--;
    else break;
  }
  if (v < 0) buf[pos++] = MINUS;
  if (e < -6 || e >= digits) {
    // d.ddd…e±x
    const start = pos;
    pos = writeDigits(buf, pos + 1, n);
    buf[start] = buf[start + 1];
    if (digits > 1) buf[start + 1] = DOT;
    else pos--;
    buf[pos++] = LOWER_E;
    buf[pos++] = e < 0 ? MINUS : PLUS;
    return writeDigits(buf, pos, e < 0 ? -e : e);
  }
  if (e >= 0) {
    // e + 1 digits before the point, the rest after it (no point when there is no rest).
    const start = pos;
    pos = writeDigits(buf, pos + 1, n);
    if (e === digits - 1) {
      buf.copyWithin(start, start + 1, pos);
      return pos - 1;
    }
    buf.copyWithin(start, start + 1, start + 1 + e + 1);
    buf[start + e + 1] = DOT;
    return pos;
  }
  // 0.000ddd
  buf[pos++] = ZERO;
  buf[pos++] = DOT;
  for (let z = -1; z > e; z--) buf[pos++] = ZERO;
  return writeDigits(buf, pos, n);
}

/** Decimal powers 1e-22 … 1e22 (those below 1 rounded: they only guess the decade). */
const DECADES = Float64Array.from({ length: 45 }, (_, k) => 10 ** (k - 22));

/** floor(log10(x)) for 1e-22 ≤ x < 1e23, possibly one off at a power of ten; out of range: ±99. */
function decade(x: number): number {
  if (!(x >= DECADES[0])) return -99;
  if (x >= 1e23) return 99;
  let lo = 0, hi = DECADES.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (DECADES[mid] <= x) lo = mid;
    else hi = mid - 1;
  }
  return lo - 22;
}

/** Decimal digits of a whole number 0 ≤ n < 2⁵³ (in 32-bit pieces: integer division is quick there). */
function writeDigits(buf: Uint8Array, pos: number, n: number): number {
  if (n < 2147483648) return writeSmallDigits(buf, pos, n | 0);
  const high = Math.floor(n / 1e8);
  pos = writeSmallDigits(buf, pos, high);
  let low = (n - high * 1e8) | 0;
  for (let q = pos + 7; q >= pos; q--) {
    const rest = (low / 10) | 0;
    buf[q] = ZERO + low - rest * 10;
    low = rest;
  }
  return pos + 8;
}

/** Decimal digits of 0 ≤ v < 2³¹. */
function writeSmallDigits(buf: Uint8Array, pos: number, v: number): number {
  let len = 1;
  while (len < 10 && v >= POW10[len]) len++;
  const end = pos + len;
  for (let q = end - 1; q >= pos; q--) {
    const rest = (v / 10) | 0;
    buf[q] = ZERO + v - rest * 10;
    v = rest;
  }
  return end;
}

/** ASCII text (number conversions give only ASCII). */
function writeText(buf: Uint8Array, pos: number, text: string): number {
  for (let q = 0; q < text.length; q++) buf[pos + q] = text.charCodeAt(q);
  return pos + text.length;
}

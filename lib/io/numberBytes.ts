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
  // The decade guess may be one low: the bounds on n correct e (at most twice).
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
  significand(n, digits);
  if (v < 0) buf[pos++] = MINUS;
  if (e < -6 || e >= digits) {
    // d.ddd…e±x
    buf[pos++] = SIGNIFICAND[0];
    if (digits > 1) buf[pos++] = DOT;
    for (let q = 1; q < digits; q++) buf[pos++] = SIGNIFICAND[q];
    buf[pos++] = LOWER_E;
    buf[pos++] = e < 0 ? MINUS : PLUS;
    return writeSmallDigits(buf, pos, e < 0 ? -e : e);
  }
  if (e >= 0) {
    // e + 1 digits before the point, the rest after it (no point when there is no rest).
    for (let q = 0; q <= e; q++) buf[pos++] = SIGNIFICAND[q];
    if (e < digits - 1) buf[pos++] = DOT;
    for (let q = e + 1; q < digits; q++) buf[pos++] = SIGNIFICAND[q];
    return pos;
  }
  // 0.000ddd
  buf[pos++] = ZERO;
  buf[pos++] = DOT;
  for (let z = -1; z > e; z--) buf[pos++] = ZERO;
  for (let q = 0; q < digits; q++) buf[pos++] = SIGNIFICAND[q];
  return pos;
}

/** The digits of the last significand, as ASCII (one buffer: writing is single-threaded per thread). */
const SIGNIFICAND = new Uint8Array(FAST_DIGITS);

/** Fills SIGNIFICAND with the `digits` digits of n (10^(digits−1) ≤ n < 10^digits ≤ 10¹⁰), in 32-bit halves. */
function significand(n: number, digits: number): void {
  const high = Math.floor(n / 100000);
  let low = (n - high * 100000) | 0;
  let q = digits - 1;
  for (const stop = Math.max(0, digits - 5); q >= stop; q--) {
    const rest = (low / 10) | 0;
    SIGNIFICAND[q] = ZERO + low - rest * 10;
    low = rest;
  }
  let h = high | 0;
  for (; q >= 0; q--) {
    const rest = (h / 10) | 0;
    SIGNIFICAND[q] = ZERO + h - rest * 10;
    h = rest;
  }
}

/** The double's bits, to read its binary exponent (the high word's index depends on the byte order). */
const BITS = new Float64Array(1);
const WORDS = new Uint32Array(BITS.buffer);
const HIGH_WORD = new Uint8Array(Uint16Array.of(1).buffer)[0] === 1 ? 1 : 0;

/** floor(log10(x)) for a positive finite x, or one less: from the binary exponent (× log10 2). */
function decade(x: number): number {
  BITS[0] = x;
  const binary = ((WORDS[HIGH_WORD] >>> 20) & 0x7ff) - 1023;
  return Math.floor(binary * 0.30102999566398120);
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

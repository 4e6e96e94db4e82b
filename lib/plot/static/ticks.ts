/**
 * Axis ticks of the static renderer: "nice" steps (1, 2 or 5 × 10ᵏ) on linear axes, decades
 * (or 1-2-5 within a decade) on log axes, and labels with just enough digits to tell
 * neighbouring ticks apart (common practice of axis labelling).
 */

/** One tick: its value in data units and its label. */
export interface Tick {
  readonly value: number;
  readonly label: string;
}

const MINUS = '\u2212';
const SUPERSCRIPT: Readonly<Record<string, string>> = { '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹', '-': '⁻' };

/** 10ⁿ with superscript digits, e.g. power10(-3) → "10⁻³". */
export function power10(n: number): string {
  return `10${[...String(n)].map((c) => SUPERSCRIPT[c] ?? c).join('')}`;
}

/** The nice step (1, 2 or 5 × 10ᵏ) closest above span / target. */
export function niceStep(span: number, target: number): number {
  const raw = span / Math.max(1, target);
  const k = Math.floor(Math.log10(raw));
  const base = 10 ** k;
  const m = raw / base;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * base;
}

/**
 * Labels for values spaced `step` apart: fixed decimals enough for the step, or a mantissa
 * × 10ⁿ form when the numbers are very large or very small (so 0.000751 shows as 7.5×10⁻⁴).
 * @example tickLabel(0.25, 0.05) // "0.25"
 */
export function tickLabel(value: number, step: number): string {
  if (value === 0) return '0';
  const mag = Math.max(Math.abs(value), step);
  if (mag >= 1e5 || step < 1e-3) {
    const e = Math.floor(Math.log10(mag));
    const digits = Math.max(0, Math.min(6, Math.ceil(e - Math.log10(step) - 1e-9)));
    const mantissa = (value / 10 ** e).toFixed(digits).replace(/\.?0+$/, '');
    return `${mantissa.replace('-', MINUS)}×${power10(e)}`;
  }
  let decimals = 0; // the fewest decimals that write the step exactly (0.25 → 2, 2.5 → 1, 5 → 0)
  while (decimals < 8 && Math.abs(Math.round(step * 10 ** decimals) - step * 10 ** decimals) > 1e-6 * step * 10 ** decimals) decimals++;
  return value.toFixed(decimals).replace('-', MINUS);
}

/** Ticks of a linear axis over [lo, hi], about `target` of them. */
export function linearTicks(lo: number, hi: number, target: number): Tick[] {
  if (!(hi > lo)) return [{ value: lo, label: tickLabel(lo, Math.abs(lo) || 1) }];
  const step = niceStep(hi - lo, target);
  const out: Tick[] = [];
  const first = Math.ceil(lo / step - 1e-9);
  for (let k = first; k * step <= hi + 1e-9 * step; k++) {
    const v = Math.abs(k * step) < 1e-12 * step ? 0 : k * step;
    out.push({ value: v, label: tickLabel(v, step) });
  }
  return out;
}

/**
 * Ticks of a log axis whose range is [lo10, hi10] in log₁₀ units: decades (every n-th when
 * there are many), with 2 and 5 added when the axis spans under two decades; labels are plain
 * numbers between 0.001 and 10⁴ and powers of ten outside.
 */
export function logTicks(lo10: number, hi10: number, target: number): Tick[] {
  const span = hi10 - lo10;
  if (!(span > 0)) return [];
  const plain = lo10 >= -3.01 && hi10 <= 4.01;
  const label = (v: number, e: number) => (plain ? tickLabel(v, 10 ** Math.min(e, 0)) : Number.isInteger(Math.log10(v)) ? power10(e) : `${Math.round(v / 10 ** e)}×${power10(e)}`);
  const out: Tick[] = [];
  if (span >= 2) {
    const every = Math.max(1, Math.ceil(span / Math.max(2, target)));
    for (let e = Math.ceil(lo10 - 1e-9); e <= hi10 + 1e-9; e++) if (e % every === 0) out.push({ value: 10 ** e, label: label(10 ** e, e) });
    return out;
  }
  for (let e = Math.floor(lo10) - 1; e <= Math.ceil(hi10); e++) {
    for (const m of [1, 2, 5]) {
      const v = m * 10 ** e;
      const l = Math.log10(v);
      if (l >= lo10 - 1e-9 && l <= hi10 + 1e-9) out.push({ value: v, label: label(v, e) });
    }
  }
  if (out.length >= 2) return out;
  return linearTicks(10 ** lo10, 10 ** hi10, target).filter((t) => t.value > 0);
}

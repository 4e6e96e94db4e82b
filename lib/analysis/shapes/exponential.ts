import type { Shape } from './shape.js';

/**
 * Exponential norm · exp(slope · (x − origin)) with parameters [norm, slope]: `norm` is the
 * value at x = origin (entries per unit x in a histogram fit), `slope` in 1/(x's unit)
 * (negative for a falling background; a lifetime τ is −1/slope). The integral is exact and
 * stays accurate as slope → 0 (through expm1).
 * @example exponential().value(1, [2, -1]) // 2/e ≈ 0.7357589
 */
export function exponential(options: { readonly origin?: number } = {}): Shape {
  const x0 = options.origin ?? 0;
  return Object.freeze({
    name: 'exponential',
    parameters: Object.freeze(['norm', 'slope']),
    value(x: number, p: ArrayLike<number>, at = 0): number {
      return p[at] * Math.exp(p[at + 1] * (x - x0));
    },
    integral(a: number, b: number, p: ArrayLike<number>, at = 0): number {
      const s = p[at + 1], w = b - a;
      const ratio = Math.abs(s * w) < 1e-300 ? w : Math.expm1(s * w) / s;
      return p[at] * Math.exp(s * (a - x0)) * ratio;
    },
  });
}

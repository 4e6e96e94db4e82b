import { msg } from '../../errors.js';
import type { Shape } from './shape.js';

/**
 * Polynomial c0 + c1 (x − origin) + … + c_d (x − origin)^d with parameters [c0, …, c_d].
 * Choosing `origin` inside the fitted range keeps the coefficients weakly correlated.
 * The integral is exact.
 * @example polynomial(1).value(2, [1, 3]) // 7
 */
export function polynomial(degree: number, options: { readonly origin?: number } = {}): Shape {
  if (!Number.isInteger(degree) || degree < 0 || degree > 20) throw msg.badArgument('degree', degree, 'a whole number from 0 to 20');
  const x0 = options.origin ?? 0;
  const n = degree + 1;
  return Object.freeze({
    name: `polynomial of degree ${degree}`,
    parameters: Object.freeze(Array.from({ length: n }, (_, k) => `c${k}`)),
    value(x: number, p: ArrayLike<number>, at = 0): number {
      const u = x - x0;
      let s = p[at + degree];
      for (let k = degree - 1; k >= 0; k--) s = s * u + p[at + k];
      return s;
    },
    integral(a: number, b: number, p: ArrayLike<number>, at = 0): number {
      const ua = a - x0, ub = b - x0;
      let sa = p[at + degree] / n, sb = sa;
      for (let k = degree - 1; k >= 0; k--) { sa = sa * ua + p[at + k] / (k + 1); sb = sb * ub + p[at + k] / (k + 1); }
      return sb * ub - sa * ua;
    },
  });
}

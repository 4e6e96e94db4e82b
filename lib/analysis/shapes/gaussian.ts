import { erfc } from '../erf.js';
import type { Shape } from './shape.js';

const INV_SQRT_2PI = 1 / Math.sqrt(2 * Math.PI);

/**
 * Gaussian peak with parameters [area, mean, sigma]: area · exp(−½((x − mean)/sigma)²) / (sigma √(2π)).
 * `area` is the integral over all x (entries, in a histogram fit), `mean` and `sigma` in x's
 * unit. The bin integral is exact: area · [Φ(z_b) − Φ(z_a)] from erfc on the tail side, so
 * far-tail bins keep their relative accuracy. sigma ≤ 0 gives NaN.
 * @example gaussian().value(0, [1, 0, 1]) // 0.3989422804 (1/√(2π))
 */
export function gaussian(): Shape {
  return GAUSSIAN;
}

const GAUSSIAN: Shape = Object.freeze({
  name: 'gaussian',
  parameters: Object.freeze(['area', 'mean', 'sigma']),
  value(x: number, p: ArrayLike<number>, at = 0): number {
    const s = p[at + 2];
    if (!(s > 0)) return NaN;
    const z = (x - p[at + 1]) / s;
    return (p[at] * INV_SQRT_2PI / s) * Math.exp(-0.5 * z * z);
  },
  integral(a: number, b: number, p: ArrayLike<number>, at = 0): number {
    const s = p[at + 2];
    if (!(s > 0)) return NaN;
    const za = (a - p[at + 1]) / (s * Math.SQRT2), zb = (b - p[at + 1]) / (s * Math.SQRT2);
    // Φ(b) − Φ(a) = ½[erfc(−zb) − erfc(−za)] below the mean, ½[erfc(za) − erfc(zb)] above it.
    const part = za >= 0 ? 0.5 * (erfc(za) - erfc(zb)) : zb <= 0 ? 0.5 * (erfc(-zb) - erfc(-za)) : 1 - 0.5 * (erfc(-za) + erfc(zb));
    return p[at] * part;
  },
});

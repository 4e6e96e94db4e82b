import type { Shape } from './shape.js';
import { faddeeva } from './faddeeva.js';

const INV_SQRT_2PI = 1 / Math.sqrt(2 * Math.PI);

/**
 * Voigt peak — a Breit–Wigner (Lorentzian) of full width `width` convolved with a Gaussian of
 * standard deviation `sigma` — with parameters [area, mean, sigma, width]:
 * area · Re w(z) / (sigma √(2π)), z = (x − mean + i·width/2) / (sigma √2), w the Faddeeva
 * function (`faddeeva`, Weideman's series; relative accuracy ~1e-13). `area` is the integral
 * over all x. No closed-form bin integral: binned fits integrate it numerically.
 * sigma ≤ 0 or width < 0 gives NaN.
 * @example voigt().value(0, [1, 0, 1, 0]) // 0.3989422804 (a pure Gaussian at width 0)
 */
export function voigt(): Shape {
  const w = new Float64Array(2);
  return Object.freeze({
    name: 'Voigt',
    parameters: Object.freeze(['area', 'mean', 'sigma', 'width']),
    value(x: number, p: ArrayLike<number>, at = 0): number {
      const s = p[at + 2], g = p[at + 3];
      if (!(s > 0) || !(g >= 0)) return NaN;
      const k = 1 / (s * Math.SQRT2);
      faddeeva((x - p[at + 1]) * k, 0.5 * g * k, w);
      return (p[at] * INV_SQRT_2PI / s) * w[0];
    },
  });
}

import type { Shape } from './shape.js';

/**
 * Non-relativistic Breit–Wigner (Cauchy) peak with parameters [area, peak, width]:
 * area · (Γ/2π) / ((x − M)² + Γ²/4), with M = `peak` and Γ = `width` the full width at half
 * maximum (PDG RPP, "Kinematics", eq. for the Breit–Wigner distribution; common practice).
 * `area` is the integral over all x; the bin integral is exact (arctangents). The relativistic
 * form is not provided: pass a custom shape when the width is not small against the mass.
 * width ≤ 0 gives NaN.
 * @example breitWigner().value(0, [1, 0, 2]) // 1/π ≈ 0.3183099
 */
export function breitWigner(): Shape {
  return BREIT_WIGNER;
}

const BREIT_WIGNER: Shape = Object.freeze({
  name: 'Breit–Wigner',
  parameters: Object.freeze(['area', 'peak', 'width']),
  value(x: number, p: ArrayLike<number>, at = 0): number {
    const g = p[at + 2];
    if (!(g > 0)) return NaN;
    const d = x - p[at + 1];
    return (p[at] * g) / (2 * Math.PI * (d * d + 0.25 * g * g));
  },
  integral(a: number, b: number, p: ArrayLike<number>, at = 0): number {
    const g = p[at + 2];
    if (!(g > 0)) return NaN;
    const ta = (2 * (a - p[at + 1])) / g, tb = (2 * (b - p[at + 1])) / g;
    // atan(tb) − atan(ta) = atan((tb − ta) / (1 + ta·tb)) when ta·tb > −1 (no cancellation in far tails).
    const diff = ta * tb > -1 ? Math.atan((tb - ta) / (1 + ta * tb)) : Math.atan(tb) - Math.atan(ta);
    return (p[at] / Math.PI) * diff;
  },
});

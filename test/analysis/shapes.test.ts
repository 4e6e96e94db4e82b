import { describe, expect, it } from 'vitest';
import { breitWigner, erfc, exponential, faddeeva, gaussian, michelSpectrum, polynomial, sumShapes, voigt, type Shape } from '../../lib/analysis/index.js';

/** Composite Simpson on n panels: an independent check of each shape's closed-form integral. */
function simpson(f: (x: number) => number, a: number, b: number, n = 20_000): number {
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}

const check = (shape: Shape, p: number[], a: number, b: number) =>
  Math.abs(shape.integral!(a, b, p) / simpson((x) => shape.value(x, p), a, b) - 1);

describe('shapes: values, and closed-form integrals against Simpson quadrature (1e-10)', () => {
  it('gaussian: peak value area/(σ√2π); integrals in the core, across the mean and 8σ out in the tail', () => {
    const g = gaussian(), p = [250, 3, 0.5];
    expect(g.value(3, p)).toBeCloseTo(250 / (0.5 * Math.sqrt(2 * Math.PI)), 12);
    expect(check(g, p, 2.2, 3.7)).toBeLessThan(1e-10);
    expect(check(g, p, 7, 7.5)).toBeLessThan(1e-10); // 8–9σ: needs the erfc difference, not 1 − erf
    expect(Math.abs(g.integral!(-1e3, 1e3, p) / 250 - 1)).toBeLessThan(1e-14);
    expect(g.value(0, [1, 0, 0])).toBeNaN();
  });
  it('polynomial(3) about an origin, exponential (also at slope → 0), Breit–Wigner (peak 2A/πΓ, area A over all x)', () => {
    expect(check(polynomial(3, { origin: 1 }), [1, -2, 0.5, 0.1], -2, 4)).toBeLessThan(1e-10);
    expect(polynomial(2).value(2, [1, 1, 1])).toBe(7);
    expect(check(exponential({ origin: 400 }), [30, -0.012], 420, 700)).toBeLessThan(1e-10);
    expect(Math.abs(exponential().integral!(1, 3, [2, 1e-18]) - 4)).toBeLessThan(1e-12);
    const bw = breitWigner();
    expect(bw.value(91.19, [1, 91.19, 2.5])).toBeCloseTo(2 / (Math.PI * 2.5), 14);
    expect(check(bw, [1, 91.19, 2.5], 85, 95)).toBeLessThan(1e-10);
    expect(check(bw, [1, 91.19, 2.5], 150, 160)).toBeLessThan(1e-10);
    expect(Math.abs(bw.integral!(-1e12, 1e12, [1, 0, 2]) - 1)).toBeLessThan(1e-11);
  });
  it('Michel spectrum: unit area over [0, E₀], the V−A shape 2u²(3 − 2u)/E₀, zero beyond the endpoint', () => {
    const m = michelSpectrum(), e0 = 52.83;
    expect(Math.abs(m.integral!(0, e0, [1, e0]) - 1)).toBeLessThan(1e-15);
    expect(check(m, [1, e0], 10, 40)).toBeLessThan(1e-10);
    expect(m.value(0.5 * e0, [1, e0])).toBeCloseTo((2 / e0) * 0.25 * 2, 14);
    expect(m.value(e0 + 0.01, [1, e0])).toBe(0);
    expect(m.integral!(e0, 100, [1, e0])).toBe(0);
  });
  it('sumShapes prefixes parameter names and adds values and integrals', () => {
    const s = sumShapes({ peak: gaussian(), background: exponential() });
    expect(s.parameters).toEqual(['peak.area', 'peak.mean', 'peak.sigma', 'background.norm', 'background.slope']);
    const p = [100, 5, 1, 10, -0.2];
    expect(s.value(4, p)).toBeCloseTo(gaussian().value(4, p) + 10 * Math.exp(-0.8), 13);
    expect(check(s, p, 0, 10)).toBeLessThan(1e-10);
    expect(sumShapes({ v: voigt() }).integral).toBeUndefined();
  });
});

describe('Faddeeva function and Voigt profile', () => {
  it('w(iy) = e^(y²) erfc(y) on the imaginary axis and Re w(x) = e^(−x²) on the real axis, to 5e-14 absolute', () => {
    const w = new Float64Array(2);
    let checked = 0;
    for (const y of [0, 0.01, 0.3, 1, 2.5, 6, 15]) {
      faddeeva(0, y, w);
      expect(Math.abs(w[0] - Math.exp(y * y) * erfc(y))).toBeLessThan(5e-14);
      expect(Math.abs(w[1])).toBeLessThan(5e-14);
      checked++;
    }
    for (const x of [0.1, 0.7, 1.5, 3, 6]) {
      faddeeva(x, 0, w);
      expect(Math.abs(w[0] - Math.exp(-x * x))).toBeLessThan(5e-14);
      checked++;
    }
    expect(checked).toBe(12);
  });
  it('Im w(x) on the real axis is (2/√π) times Dawson’s integral: D(1) = 0.5380795069 (A&S Table 7.5), to 1e-10', () => {
    const w = new Float64Array(2);
    faddeeva(1, 0, w);
    expect(Math.abs(w[1] / (2 / Math.sqrt(Math.PI)) - 0.5380795069)).toBeLessThan(1e-10);
  });
  it('Voigt: unit area; tends to the Gaussian as the width → 0 and to the Breit–Wigner as σ → 0', () => {
    const v = voigt(), p = [1, 0, 0.8, 1.3];
    expect(Math.abs(simpson((x) => v.value(x, p), -4000, 4000, 400_000) - 1)).toBeLessThan(1e-3); // Lorentzian tails beyond ±4000 hold 2e-4
    for (const x of [0, 0.5, 2]) {
      expect(Math.abs(v.value(x, [1, 0, 0.8, 0]) / gaussian().value(x, [1, 0, 0.8]) - 1)).toBeLessThan(1e-12);
      expect(Math.abs(v.value(x, [1, 0, 1e-4, 1.3]) / breitWigner().value(x, [1, 0, 1.3]) - 1)).toBeLessThan(1e-6);
    }
  });
});

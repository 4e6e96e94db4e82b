import { describe, expect, it } from 'vitest';
import { minimiseOnInterval } from '../../lib/analysis/minimiseOnInterval.js';

// Minima known in closed form (calculus, common practice); Brent's method (Brent 1973, ch. 5)
// promises |x − x*| ≤ 2·(√ε·|x| + tol/3) at the end for a function unimodal on the interval.
describe('minimiseOnInterval (Brent 1973)', () => {
  const cases: [string, (x: number) => number, number, number, number][] = [
    ['(x − 2)²', (x) => (x - 2) ** 2, 0, 5, 2],
    ['sin x on [3, 5]', Math.sin, 3, 5, 1.5 * Math.PI],
    ['−x e^(−x)', (x) => -x * Math.exp(-x), 0, 10, 1],
    ['cosh(x − 0.7)', (x) => Math.cosh(x - 0.7), -2, 2, 0.7],
    ['ln λ + t̄/λ (−ln L per candidate of an exponential, t̄ = 0.0268), minimum at λ = t̄', (l) => Math.log(l) + 0.0268 / l, 0.001, 1, 0.0268],
  ];
  for (const [name, f, a, b, xStar] of cases) {
    it(`${name}: the minimum to 1e-8 within 20 evaluations`, () => {
      const r = minimiseOnInterval(f, a, b);
      expect(Math.abs(r.x - xStar)).toBeLessThan(1e-8);
      expect(r.value).toBe(f(r.x));
      expect(r.evaluations).toBeLessThanOrEqual(20);
    });
  }
  it('a quadratic needs a handful of evaluations, where golden section to the same width needs ~50', () => {
    const r = minimiseOnInterval((x) => 3 * (x - 1.234) ** 2 + 7, -10, 10);
    expect(r.x).toBeCloseTo(1.234, 9);
    expect(r.evaluations).toBeLessThanOrEqual(8);
  });
  it('non-smooth and flat minima still converge (golden-section fall-back): |x − 1| and (x − 0.3)⁴', () => {
    const kink = minimiseOnInterval((x) => Math.abs(x - 1), -3, 4);
    expect(Math.abs(kink.x - 1)).toBeLessThan(1e-7);
    const flat = minimiseOnInterval((x) => (x - 0.3) ** 4, -1, 2);
    expect(Math.abs(flat.x - 0.3)).toBeLessThan(1e-6);
  });
  it('a function falling towards an end: the answer is that end, within the tolerance', () => {
    const r = minimiseOnInterval((x) => -x, 0, 1, { toleranceX: 1e-6 });
    expect(r.x).toBeGreaterThan(1 - 1e-6);
    expect(r.x).toBeLessThanOrEqual(1);
  });
  it('toleranceX sets the precision; maxEvaluations caps the work; the ends may come in either order', () => {
    const coarse = minimiseOnInterval((x) => Math.abs(x - 0.4), 0, 1, { toleranceX: 1e-3 });
    const fine = minimiseOnInterval((x) => Math.abs(x - 0.4), 0, 1, { toleranceX: 1e-9 });
    expect(Math.abs(coarse.x - 0.4)).toBeLessThan(1e-3);
    expect(Math.abs(fine.x - 0.4)).toBeLessThan(1e-8);
    expect(coarse.evaluations).toBeLessThan(fine.evaluations);
    expect(minimiseOnInterval((x) => Math.abs(x - 0.4), 0, 1, { maxEvaluations: 5 }).evaluations).toBe(5);
    expect(minimiseOnInterval((x) => (x - 2) ** 2, 5, 0).x).toBeCloseTo(2, 9);
  });
});

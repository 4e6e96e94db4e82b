import { describe, expect, it } from 'vitest';
import { binCounts, propagateErrors, regularizedGammaP, regularizedGammaQ, weightedMean } from '../../lib/analysis/index.js';
import { msg } from '../../lib/errors.js';

// Small numerical helpers against answers worked out here by hand from their definitions, and
// their refusals against the error catalogue.
const refusal = (name: string, value: unknown, expected: string) => msg.badArgument(name, value, expected).message;

describe('binCounts', () => {
  it('without a range: equal bins from the smallest to the largest finite value, the last bin closed', () => {
    const b = binCounts([3, 1, NaN, 2, 5, Infinity, 5], 4);
    expect(Array.from(b.edges)).toEqual([1, 2, 3, 4, 5]);
    expect(Array.from(b.counts)).toEqual([1, 1, 1, 2]);
    expect([b.outside, b.nonFinite]).toEqual([0, 2]);
    const neg = binCounts([-4, -8, -6], 2);
    expect(Array.from(neg.edges)).toEqual([-8, -6, -4]);
    expect(Array.from(neg.counts)).toEqual([1, 2]);
  });
  it('with a range: values outside counted apart; one value or a zero-width range gets a unit-wide bin about it', () => {
    const b = binCounts([0, 0.5, 1, 1.5, 2, -0.1, 2.1], 4, [0, 2]);
    expect(Array.from(b.edges)).toEqual([0, 0.5, 1, 1.5, 2]);
    expect(Array.from(b.counts)).toEqual([1, 1, 1, 2]);
    expect(b.outside).toBe(2);
    const one = binCounts([7, 7], 2);
    expect(Array.from(one.edges)).toEqual([6.5, 7, 7.5]);
    expect(Array.from(one.counts)).toEqual([0, 2]);
    expect(Array.from(binCounts([1], 1, [3, 3]).edges)).toEqual([2.5, 3.5]);
  });
  it('refuses bad bins, ranges and values with nothing finite, with the catalogue messages', () => {
    const why = 'finite [low, high] with low ≤ high (or values with at least one finite entry)';
    for (const bins of [0, 2.5, -1]) expect(() => binCounts([1], bins)).toThrow(refusal('bins', bins, 'a whole number ≥ 1'));
    expect(() => binCounts([1], 2, [2, 1])).toThrow(refusal('range', [2, 1], why));
    expect(() => binCounts([1], 2, [0, NaN])).toThrow(refusal('range', [0, NaN], why));
    expect(() => binCounts([1], 2, [-Infinity, 1])).toThrow(refusal('range', [-Infinity, 1], why));
    expect(() => binCounts([NaN, Infinity], 2)).toThrow(refusal('range', [Infinity, -Infinity], why));
    expect(() => binCounts([], 2)).toThrow(refusal('range', [Infinity, -Infinity], why));
  });
});

describe('weightedMean at its ends', () => {
  it('one usable value: its value and error, no χ² test (ndf 0: p-value NaN, scale factor 1)', () => {
    const m = weightedMean([4, NaN, 9], [0.5, 1, 0]);
    expect([m.mean, m.error, m.chi2, m.ndf, m.scaleFactor, m.excluded]).toEqual([4, 0.5, 0, 0, 1, 2]);
    expect(m.pValue).toBeNaN();
  });
  it('two values: ndf 1, the p-value of their χ², the PDG scale factor √(χ²/ndf) only above 1', () => {
    const m = weightedMean([0, 3], [1, 1]); // mean 1.5, χ² = 4.5
    expect([m.mean, m.chi2, m.ndf]).toEqual([1.5, 4.5, 1]);
    expect(m.pValue).toBeCloseTo(0.0338949, 6); // P(χ²₁ ≥ 4.5) = erfc(√2.25) (common practice)
    expect(m.scaleFactor).toBeCloseTo(Math.sqrt(4.5), 14);
    expect(weightedMean([1, 1.1], [1, 1]).scaleFactor).toBe(1);
  });
  it('refuses mismatched lengths and inputs with nothing usable, with the catalogue messages', () => {
    expect(() => weightedMean([1, 2], [1])).toThrow(refusal('errors', '1 errors', 'one error per value (2)'));
    expect(() => weightedMean([NaN, 1], [1, -1])).toThrow(refusal('values', '2 values', 'at least one finite value with a finite error > 0'));
  });
});

describe('propagateErrors: shapes of input and output', () => {
  it('a function of one output from errors, and of two outputs from a covariance: values, Jacobian rows, covariance JCᴶᵀ', () => {
    const one = propagateErrors((p) => p[0] * p[1], [2, 3], { errors: [0.1, 0.2] });
    expect(one.values).toEqual([6]);
    expect(one.jacobian[0][0]).toBeCloseTo(3, 9);
    expect(one.jacobian[0][1]).toBeCloseTo(2, 9);
    expect(one.errors[0]).toBeCloseTo(Math.hypot(3 * 0.1, 2 * 0.2), 9);
    const C = [[0.04, 0.01], [0.01, 0.09]];
    const two = propagateErrors((p) => [p[0] + p[1], p[0] - 2 * p[1]], [1, 1], { covariance: C });
    expect(two.values).toEqual([2, -1]);
    expect(two.jacobian.map((r) => r.map((v) => Number(v.toFixed(9))))).toEqual([[1, 1], [1, -2]]);
    // J C Jᵀ by hand: J C = [[0.05, 0.10], [0.02, −0.17]], so J C Jᵀ = [[0.15, −0.15], [−0.15, 0.36]].
    expect(two.covariance[0][0]).toBeCloseTo(0.04 + 0.09 + 0.02, 9);
    expect(two.covariance[0][1]).toBeCloseTo(-0.15, 9);
    expect(two.covariance[1][0]).toBeCloseTo(two.covariance[0][1], 12);
    expect(two.covariance[1][1]).toBeCloseTo(0.04 + 4 * 0.09 - 4 * 0.01, 9);
    expect(two.errors[1]).toBeCloseTo(Math.sqrt(0.36), 9);
  });
  it('refuses errors of the wrong length and a covariance of the wrong shape, with the catalogue messages', () => {
    expect(() => propagateErrors((p) => p[0], [1, 2], { errors: [1] })).toThrow(refusal('errors', '1 errors', 'one error per value (2)'));
    expect(() => propagateErrors((p) => p[0], [1, 2], { covariance: [[1, 0]] })).toThrow(refusal('covariance', '1 rows', 'a 2×2 matrix'));
    expect(() => propagateErrors((p) => p[0], [1, 2], { covariance: [[1, 0], [0]] })).toThrow(refusal('covariance', '2 rows', 'a 2×2 matrix'));
  });
});

describe('regularizedGammaP / Q against the closed forms for integer a (common practice: Q(n, x) = e^(−x) Σ_{k<n} x^k/k!)', () => {
  const q = (n: number, x: number) => { let s = 0, t = 1; for (let k = 0; k < n; k++) { s += t; t *= x / (k + 1); } return Math.exp(-x) * s; };
  it('on both sides of the switch at x = a + 1, far into the upper tail, and far into the lower one', () => {
    let checked = 0;
    for (const n of [1, 2, 3, 7]) for (const x of [1e-8, 0.3, n, n + 0.999, n + 1, n + 1.001, 12, 50, 300, 700]) {
      const Q = q(n, x), P = 1 - Q;
      expect(Math.abs(regularizedGammaQ(n, x) / Q - 1), `Q(${n}, ${x})`).toBeLessThan(1e-12);
      expect(Math.abs(regularizedGammaP(n, x) - P), `P(${n}, ${x})`).toBeLessThan(1e-14); // the doc comment claims ~1e-14
      checked++;
    }
    expect(checked).toBe(40);
    // Lower tail of P for a = 1: 1 − e^(−x) = −expm1(−x), relative.
    expect(regularizedGammaP(1, 1e-10) / -Math.expm1(-1e-10) - 1).toBeLessThan(1e-14);
    expect(regularizedGammaP(1, 800)).toBe(1);
  });
  it('ends and refusals: P(a, 0) = 0, Q(a, 0) = 1, P(a, ∞) = 1, Q(a, ∞) = 0, NaN for a ≤ 0, x < 0 or NaN', () => {
    expect([regularizedGammaP(2, 0), regularizedGammaQ(2, 0), regularizedGammaP(2, Infinity), regularizedGammaQ(2, Infinity)]).toEqual([0, 1, 1, 0]);
    for (const [a, x] of [[0, 1], [-1, 1], [1, -1], [NaN, 1], [1, NaN]]) {
      expect(regularizedGammaP(a, x)).toBeNaN();
      expect(regularizedGammaQ(a, x)).toBeNaN();
    }
  });
});

import { describe, expect, it } from 'vitest';
import { chi2Survival, lnGamma } from '../../lib/analysis/index.js';

/**
 * Critical values of the χ² distribution: NIST/SEMATECH e-Handbook of Statistical Methods,
 * §1.3.6.7.4 "Critical Values of the Chi-Square Distribution" (upper-tail probabilities 0.05 and
 * 0.01) (memory; the same numbers appear in every statistics table).
 */
const CRITICAL: readonly [number, number, number][] = [
  // [ndf, upper-tail probability, critical value]
  [1, 0.05, 3.841], [1, 0.01, 6.635], [2, 0.05, 5.991], [5, 0.05, 11.070],
  [10, 0.05, 18.307], [10, 0.01, 23.209], [20, 0.05, 31.410], [30, 0.01, 50.892], [100, 0.05, 124.342],
];

describe('chi2Survival(χ², ndf) = P(χ²_ndf ≥ χ²)', () => {
  for (const [ndf, p, x] of CRITICAL) {
    it(`ndf ${ndf}: P(χ² ≥ ${x}) = ${p} (table value, 3 decimals)`, () => {
      expect(Math.abs(chi2Survival(x, ndf) / p - 1)).toBeLessThan(2e-3);
    });
  }
  it('ndf 2 is exactly exp(−χ²/2) (closed form), to 1e-13', () => {
    for (const x of [0.01, 0.5, 3, 10, 40]) expect(Math.abs(chi2Survival(x, 2) / Math.exp(-x / 2) - 1)).toBeLessThan(1e-13);
  });
  it('edges: χ² ≤ 0 gives 1, bad ndf gives NaN; lnGamma(n) = ln (n−1)! and lnGamma(½) = ln √π', () => {
    expect(chi2Survival(0, 4)).toBe(1);
    expect(chi2Survival(3, 0)).toBeNaN();
    expect(lnGamma(10)).toBeCloseTo(Math.log(362880), 12);
    expect(lnGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 12);
  });
});

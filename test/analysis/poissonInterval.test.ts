import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { chi2Quantile, poissonInterval, poissonLimit } from '../../lib/analysis/index.js';

const table = JSON.parse(readFileSync(join(import.meta.dirname, '..', 'fixtures', 'gehrels-1986', 'poisson-limits-s1.json'), 'utf8')) as { n: number[]; upper: number[]; lower: number[] };

/** Half a unit in the last printed figure of a Gehrels entry: 4 significant figures below 10, 2 decimals above. */
const rounding = (v: number) => (v < 10 ? 0.0005 : 0.005) + 1e-12;

describe('poissonInterval(n) against Gehrels (1986) Tables 1–2, S = 1 (CL 0.8413 one-sided, 0.6827 central)', () => {
  it('reproduces all 31 upper and 30 non-zero lower limits for n = 0 … 30 to the printed rounding', () => {
    let checked = 0;
    table.n.forEach((n, i) => {
      const iv = poissonInterval(n);
      expect(Math.abs(iv.upper - table.upper[i]), `upper, n = ${n}`).toBeLessThanOrEqual(rounding(table.upper[i]));
      expect(Math.abs(iv.lower - table.lower[i]), `lower, n = ${n}`).toBeLessThanOrEqual(rounding(table.lower[i]));
      checked++;
    });
    expect(checked).toBe(31);
  });
  it('the tolerance is tight enough to see a wrong confidence level: 0.8 instead of 0.8413 one-sided fails at n = 0', () => {
    expect(Math.abs(poissonLimit(0, 0.8, 'upper') - table.upper[0])).toBeGreaterThan(2 * rounding(table.upper[0]));
  });
  it('closed forms: the upper limit for n = 0 is −ln(1 − CL) (ln 10 at 90 %, ln 20 at 95 %), to 1e-12', () => {
    expect(Math.abs(poissonLimit(0, 0.9, 'upper') - Math.log(10))).toBeLessThan(1e-12);
    expect(Math.abs(poissonLimit(0, 0.95, 'upper') - Math.log(20))).toBeLessThan(1e-12);
    expect(poissonLimit(0, 0.9, 'lower')).toBe(0);
  });
  it('definitions: P(N ≤ n | μ_u) = 1 − CL and P(N ≥ n | μ_l) = 1 − CL, summed directly, to 1e-10', () => {
    const cdf = (n: number, mu: number) => { let s = 0, t = Math.exp(-mu); for (let k = 0; k <= n; k++) { s += t; t *= mu / (k + 1); } return s; };
    let checked = 0;
    for (const n of [1, 4, 17, 60]) {
      for (const cl of [0.9, 0.95, 0.99]) {
        expect(Math.abs(cdf(n, poissonLimit(n, cl, 'upper')) - (1 - cl))).toBeLessThan(1e-10);
        expect(Math.abs(1 - cdf(n - 1, poissonLimit(n, cl, 'lower')) - (1 - cl))).toBeLessThan(1e-10);
        checked++;
      }
    }
    expect(checked).toBe(12);
  });
  it('bad calls throw BAD_ARGUMENT: negative or fractional n, cl outside (0, 1)', () => {
    for (const call of [() => poissonInterval(-1), () => poissonInterval(2.5), () => poissonInterval(3, 1), () => poissonLimit(3, 0, 'upper')]) {
      expect(call).toThrow(expect.objectContaining({ code: 'BAD_ARGUMENT' }));
    }
    expect(chi2Quantile(0.5, -1)).toBeNaN();
  });
});

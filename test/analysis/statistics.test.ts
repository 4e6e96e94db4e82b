import { describe, expect, it } from 'vitest';
import { chi2Quantile, chi2Survival, erf, erfc, normalCdf, normalQuantile, propagateErrors, regularizedGammaP, weightedMean } from '../../lib/analysis/index.js';

describe('normal distribution', () => {
  // Upper critical values z_p of N(0, 1), 3 decimals: NIST/SEMATECH e-Handbook of Statistical
  // Methods, §1.3.6.7.1 (memory; the same in every table).
  const CRITICAL: [number, number][] = [[0.9, 1.282], [0.95, 1.645], [0.975, 1.96], [0.99, 2.326], [0.995, 2.576], [0.999, 3.09]];
  it('normalQuantile reproduces the tabulated critical values to their 3 decimals', () => {
    for (const [p, z] of CRITICAL) expect(Math.abs(normalQuantile(p) - z), `p = ${p}`).toBeLessThan(5e-4);
  });
  it('normalQuantile inverts normalCdf to 1e-13 relative (3e-13 below 1e-100, the rounding of e^(−z²/2)), and is odd about ½', () => {
    let checked = 0;
    for (const p of [1e-300, 1e-100, 1e-20, 1e-8, 0.001, 0.3, 0.5, 0.8, 0.999, 1 - 1e-12]) {
      expect(Math.abs(normalCdf(normalQuantile(p)) / p - 1), `p = ${p}`).toBeLessThan(p < 1e-99 ? 3e-13 : 1e-13);
      checked++;
    }
    expect(checked).toBe(10);
    expect(normalQuantile(0.2) + normalQuantile(0.8)).toBeCloseTo(0, 15);
    expect([normalQuantile(0), normalQuantile(1), normalQuantile(1.5)]).toEqual([-Infinity, Infinity, NaN]);
  });
  it('erf and erfc: A&S Table 7.1 values (10 digits, memory) and the series–gamma identity erf(x) = P(½, x²) to 1e-14', () => {
    for (const [x, v] of [[0.5, 0.5204998778], [1, 0.8427007929], [2, 0.995322265]] as const) expect(Math.abs(erf(x) - v)).toBeLessThan(6e-11);
    for (const x of [0.01, 0.3, 0.7, 1.9, 4]) expect(Math.abs(erf(x) / regularizedGammaP(0.5, x * x) - 1)).toBeLessThan(1e-14);
    expect(erf(-0.7)).toBe(-erf(0.7));
    expect(Math.abs(erfc(5) / 1.5374597944280349e-12 - 1)).toBeLessThan(1e-13); // = Q(½, 25)
    expect(erfc(-1)).toBeCloseTo(2 - erfc(1), 15);
  });
});

describe('chi2Quantile', () => {
  // Same table as chi2Survival's test (NIST/SEMATECH §1.3.6.7.4, 3 decimals, memory).
  const CRITICAL: [number, number, number][] = [[1, 0.05, 3.841], [1, 0.01, 6.635], [2, 0.05, 5.991], [5, 0.05, 11.07], [10, 0.05, 18.307], [10, 0.01, 23.209], [20, 0.05, 31.41], [30, 0.01, 50.892], [100, 0.05, 124.342]];
  it('reproduces the tabulated critical values to their 3 decimals', () => {
    for (const [ndf, tail, x] of CRITICAL) expect(Math.abs(chi2Quantile(1 - tail, ndf) - x), `ndf ${ndf}, ${tail}`).toBeLessThan(5e-4);
  });
  it('inverts chi2Survival to 1e-12 relative across tails and degrees of freedom (also fractional)', () => {
    let checked = 0;
    for (const ndf of [0.5, 1, 2, 7.5, 30, 400]) for (const p of [1e-12, 0.01, 0.5, 0.99, 1 - 1e-10]) {
      const x = chi2Quantile(p, ndf);
      expect(Math.abs(chi2Survival(x, ndf) / (1 - p) - 1), `ndf ${ndf}, p ${p}`).toBeLessThan(1e-9);
      checked++;
    }
    expect(checked).toBe(30);
    expect(chi2Quantile(0.95, 2)).toBeCloseTo(-2 * Math.log(0.05), 12); // closed form for 2 d.o.f.
  });
  it('far lower tail (p down to 1e-300): inverts regularizedGammaP to 1e-12 and meets the closed forms for 1 and 2 d.o.f.', () => {
    // Closed forms (common practice): 2 d.o.f. P = 1 − e^(−x/2), so x = −2 ln(1 − p); 1 d.o.f.
    // P = erf(√(x/2)) ≈ √(2x/π) for small x, so x = πp²/2 (relative correction ~x/3).
    expect(chi2Quantile(1e-300, 2) / 2e-300 - 1).toBeLessThan(1e-13);
    expect(Math.abs(chi2Quantile(1e-20, 2) / (-2 * Math.log1p(-1e-20)) - 1)).toBeLessThan(1e-13);
    expect(Math.abs(chi2Quantile(1e-100, 1) / ((Math.PI / 2) * 1e-200) - 1)).toBeLessThan(1e-13);
    let checked = 0;
    for (const ndf of [0.5, 1, 3, 10, 50, 200]) for (const p of [1e-300, 1e-150, 1e-40, 1e-30, 1e-11]) {
      const x = chi2Quantile(p, ndf);
      if (x < 1e-300) continue; // the quantile itself underflows a double (e.g. 1 d.o.f. at 1e-300: x ≈ 1.6e-600)
      expect(Math.abs(regularizedGammaP(ndf / 2, x / 2) / p - 1), `ndf ${ndf}, p ${p}`).toBeLessThan(1e-12);
      checked++;
    }
    expect(checked).toBe(27); // 30 less the three that underflow (½ d.o.f. at 1e-300 and 1e-150, 1 d.o.f. at 1e-300)
    // The far upper tail through Q (2 d.o.f.: x = −2 ln(1 − p)), and the ends and refusals of the doc comment.
    expect(Math.abs(chi2Quantile(1 - 2 ** -40, 2) / (80 * Math.LN2) - 1)).toBeLessThan(1e-14); // 1 − 2⁻⁴⁰ is exact in a double
    expect(Math.abs(chi2Survival(chi2Quantile(1 - 2 ** -45, 3), 3) / 2 ** -45 - 1)).toBeLessThan(1e-12);
    expect([chi2Quantile(0, 3), chi2Quantile(1, 3), chi2Quantile(0.5, 0), chi2Quantile(0.5, -1), chi2Quantile(-0.1, 3), chi2Quantile(1.1, 3), chi2Quantile(NaN, 3), chi2Quantile(0.5, NaN)]).toEqual([0, Infinity, NaN, NaN, NaN, NaN, NaN, NaN]);
    expect(chi2Quantile(1e-5, 1e-3)).toBe(0); // x ≈ 2·(1e-5)^2000 underflows
    // Either side of the switch to the logarithmic search, the quantile is continuous: x ∝ p^(2/ndf) there.
    expect(chi2Quantile(1.0001e-10, 3) / chi2Quantile(0.9999e-10, 3)).toBeCloseTo((1.0001 / 0.9999) ** (2 / 3), 6);
  });
});

describe('weightedMean', () => {
  it('inverse-variance mean, error 1/√Σw, χ², and the PDG scale factor; unusable rows counted', () => {
    const m = weightedMean([10.1, 9.8, 10.3, NaN, 5], [0.2, 0.3, 0.4, 0.1, 0]);
    const w = [25, 1 / 0.09, 6.25];
    const mean = (10.1 * w[0] + 9.8 * w[1] + 10.3 * w[2]) / (w[0] + w[1] + w[2]);
    expect(m.mean).toBeCloseTo(mean, 13);
    expect(m.error).toBeCloseTo(1 / Math.sqrt(w[0] + w[1] + w[2]), 14);
    const chi2 = ((10.1 - mean) / 0.2) ** 2 + ((9.8 - mean) / 0.3) ** 2 + ((10.3 - mean) / 0.4) ** 2;
    expect(m.chi2).toBeCloseTo(chi2, 12);
    expect([m.ndf, m.excluded]).toEqual([2, 2]);
    expect(m.scaleFactor).toBeCloseTo(Math.max(1, Math.sqrt(chi2 / 2)), 12);
  });
});

describe('propagateErrors', () => {
  it('a ratio: σ_r/r = √((σa/a)² + (σb/b)²) for independent inputs, to 1e-9', () => {
    const r = propagateErrors((p) => p[0] / p[1], [10, 2], { errors: [0.1, 0.05] });
    expect(Math.abs(r.errors[0] / (5 * Math.hypot(0.01, 0.025)) - 1)).toBeLessThan(1e-9);
  });
  it('correlated inputs and two outputs: C_f = J C Jᵀ against the hand-computed Jacobian, to 1e-9', () => {
    const c = [[0.04, 0.01], [0.01, 0.09]];
    const r = propagateErrors((p) => [p[0] * p[1], p[0] + 2 * p[1]], [3, 4], { covariance: c });
    const J = [[4, 3], [1, 2]];
    const expected = J.map((a) => J.map((b) => a[0] * (c[0][0] * b[0] + c[0][1] * b[1]) + a[1] * (c[1][0] * b[0] + c[1][1] * b[1])));
    r.covariance.forEach((row, i) => row.forEach((v, j) => expect(Math.abs(v / expected[i][j] - 1)).toBeLessThan(1e-9)));
    expect(r.values).toEqual([12, 11]);
  });
});

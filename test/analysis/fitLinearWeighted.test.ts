import { describe, expect, it } from 'vitest';
import { fitLinear, fitStraightLine } from '../../lib/analysis/index.js';
import { msg } from '../../lib/errors.js';

// Weighted straight-line least squares against the closed form (common practice; e.g. Bevington &
// Robinson, "Data Reduction and Error Analysis", ch. 6): with wᵢ = 1/σᵢ², S = Σw, Sx = Σwx,
// Sy = Σwy, Sxx = Σwx², Sxy = Σwxy, Δ = S·Sxx − Sx²: a = (Sxx·Sy − Sx·Sxy)/Δ, b = (S·Sxy − Sx·Sy)/Δ,
// var a = Sxx/Δ, var b = S/Δ, cov(a, b) = −Sx/Δ. (The unweighted NIST problems are in nistLinear.test.ts.)
const refusal = (name: string, value: unknown, expected: string) => msg.badArgument(name, value, expected).message;

function closedForm(x: number[], y: number[], s: number[]) {
  let S = 0, Sx = 0, Sy = 0, Sxx = 0, Sxy = 0;
  x.forEach((xi, i) => { const w = 1 / s[i] ** 2; S += w; Sx += w * xi; Sy += w * y[i]; Sxx += w * xi * xi; Sxy += w * xi * y[i]; });
  const D = S * Sxx - Sx * Sx, a = (Sxx * Sy - Sx * Sxy) / D, b = (S * Sxy - Sx * Sy) / D;
  const chi2 = x.reduce((c, xi, i) => c + ((y[i] - a - b * xi) / s[i]) ** 2, 0);
  return { a, b, va: Sxx / D, vb: S / D, cab: -Sx / D, chi2 };
}

describe('fitLinear with errors on y', () => {
  const x = [0, 1, 2, 3, 4], y = [1.1, 2.9, 5.2, 6.8, 9.3], s = [0.1, 0.2, 0.1, 0.4, 0.2];
  it('a straight line with per-point σ: coefficients, covariance and χ² of the closed form; errors not scaled; χ² has its distribution', () => {
    const f = fitLinear({ columns: [x], y, sigma: s });
    const c = closedForm(x, y, s);
    expect(f.names).toEqual(['intercept', 'b1']);
    expect(f.values[0]).toBeCloseTo(c.a, 12);
    expect(f.values[1]).toBeCloseTo(c.b, 12);
    expect(f.covariance[0][0]).toBeCloseTo(c.va, 12);
    expect(f.covariance[1][1]).toBeCloseTo(c.vb, 12);
    expect(f.covariance[0][1]).toBeCloseTo(c.cab, 12);
    expect(f.chi2).toBeCloseTo(c.chi2, 10);
    expect([f.ndf, f.errorScale, f.excluded, f.method]).toEqual([3, 1, 0, 'least-squares']);
    expect(f.errors[1]).toBeCloseTo(Math.sqrt(c.vb), 12);
    expect(f.pValue).toBeGreaterThan(0);
  });
  it('one σ for all equals the unweighted fit with errors from σ, not from the scatter; without σ the errors are scaled by √(χ²/ndf)', () => {
    const one = fitLinear({ columns: [x], y, sigma: 0.5 });
    const c = closedForm(x, y, [0.5, 0.5, 0.5, 0.5, 0.5]);
    expect(one.values[1]).toBeCloseTo(c.b, 12);
    expect(one.errors[1]).toBeCloseTo(Math.sqrt(c.vb), 12);
    const none = fitLinear({ columns: [x], y });
    const rss = c.chi2 * 0.25; // χ² of σ = 0.5 times σ²
    expect(none.errorScale).toBeCloseTo(Math.sqrt(rss / 3), 12);
    expect(none.errors[1]).toBeCloseTo(Math.sqrt((c.vb / 0.25) * (rss / 3)), 12);
    expect(fitLinear({ columns: [x], y }, { scaleErrors: false }).errorScale).toBe(1);
    expect(fitLinear({ columns: [[0, 1]], y: [0, 1] }).errorScale).toBeNaN(); // ndf 0: no scatter to scale by
  });
  it('through the origin, rows with a non-finite value left out and counted, names given', () => {
    const f = fitLinear({ columns: [[1, 2, NaN, 4, 3]], y: [2, 4, 5, NaN, 6.3], sigma: [1, 1, 1, 1, 0.5] }, { intercept: false, names: ['slope'] });
    // Σwxy/Σwx² over the rows 0, 1, 4 (w = 1, 1, 4): (2 + 8 + 4·18.9)/(1 + 4 + 4·9).
    expect(f.values[0]).toBeCloseTo((2 + 8 + 4 * 18.9) / (1 + 4 + 36), 12);
    expect([f.names, f.excluded, f.ndf]).toEqual([['slope'], 2, 2]);
  });
  it('refuses mismatched columns, no coefficients, wrong names, a wrong σ length and a bad σ, with the catalogue messages', () => {
    expect(() => fitLinear({ columns: [[1, 2]], y: [1, 2, 3] })).toThrow(refusal('columns[0]', '2 values', 'one value per y (3)'));
    expect(() => fitLinear({ columns: [], y: [1, 2] }, { intercept: false })).toThrow(refusal('columns', [], 'at least one predictor column, or intercept: true'));
    expect(() => fitLinear({ columns: [[1, 2]], y: [1, 2] }, { names: ['a'] })).toThrow(refusal('names', ['a'], '2 names'));
    expect(() => fitLinear({ columns: [[1, 2]], y: [1, 2], sigma: [1] })).toThrow(refusal('sigma', '1 values', 'one error per y (2)'));
    for (const bad of [0, -1, NaN, Infinity]) {
      expect(() => fitLinear({ columns: [[1, 2, 3]], y: [1, 2, 3], sigma: [1, bad, 1] })).toThrow(refusal('sigma[1]', bad, 'a finite error > 0 for every point'));
    }
    // A bad σ on a row left out for its non-finite value is not looked at.
    expect(fitLinear({ columns: [[1, 2, 3]], y: [1, NaN, 3], sigma: [1, 0, 1] }).excluded).toBe(1);
  });
});

describe('fitStraightLine without errors on x', () => {
  it('is the weighted linear fit, with its parameters named intercept and slope (or slope alone through the origin)', () => {
    const x = [0, 1, 2, 3, 4], y = [1.1, 2.9, 5.2, 6.8, 9.3], s = [0.1, 0.2, 0.1, 0.4, 0.2];
    const line = fitStraightLine({ x, y, sigma: s });
    const c = closedForm(x, y, s);
    expect(line.names).toEqual(['intercept', 'slope']);
    expect(line.parameters.slope.value).toBeCloseTo(c.b, 12);
    expect(line.parameters.intercept.error).toBeCloseTo(Math.sqrt(c.va), 12);
    const origin = fitStraightLine({ x: [1, 2, 3], y: [2.1, 3.9, 6.2], sigma: 0.1 }, { throughOrigin: true });
    expect(origin.names).toEqual(['slope']);
    expect(origin.values[0]).toBeCloseTo((2.1 + 7.8 + 18.6) / 14, 12);
  });
});

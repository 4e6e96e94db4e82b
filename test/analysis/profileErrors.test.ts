import { describe, expect, it } from 'vitest';
import { customShape, fitHistogram, fitModel, Histogram, polynomial } from '../../lib/analysis/index.js';

/**
 * Likelihood-ratio (profile) errors against crossings found here independently: the objective
 * written out in the test, minimised over the other parameters by golden sections, its rise by
 * 1 bracketed and bisected. The scan claims each distance to ~5e-4 of the curvature error
 * (it stops when √ΔF is within 5e-4 of 1), so the tolerance is 1e-3 of that error.
 */

/** The x in [a, b] where g(x) = 0, g changing sign over [a, b] (bisection to 1e-13 relative). */
function root(g: (x: number) => number, a: number, b: number): number {
  let ga = g(a);
  for (let i = 0; i < 200 && Math.abs(b - a) > 1e-13 * Math.max(Math.abs(a), Math.abs(b)); i++) {
    const m = 0.5 * (a + b), gm = g(m);
    if ((gm < 0) === (ga < 0)) { a = m; ga = gm; } else b = m;
  }
  return 0.5 * (a + b);
}

/** The minimum over [a, b] of a unimodal f (golden sections to 1e-12 relative). */
function minimum(f: (x: number) => number, a: number, b: number): number {
  const g = (Math.sqrt(5) - 1) / 2;
  let c = b - g * (b - a), d = a + g * (b - a), fc = f(c), fd = f(d);
  while (Math.abs(b - a) > 1e-12 * (Math.abs(a) + Math.abs(b))) {
    if (fc < fd) { b = d; d = c; fd = fc; c = b - g * (b - a); fc = f(c); } else { a = c; c = d; fc = fd; d = a + g * (b - a); fd = f(d); }
  }
  return Math.min(fc, fd);
}

/** Baker–Cousins χ² of counts n against expectations mu. */
const bakerCousins = (n: readonly number[], mu: readonly number[]) => 2 * n.reduce((s, k, i) => s + mu[i] - k + (k > 0 ? k * Math.log(k / mu[i]) : 0), 0);

function countHistogram(counts: readonly number[], range: readonly [number, number]): Histogram {
  const h = new Histogram({ bins: counts.length, range });
  const w = (range[1] - range[0]) / counts.length;
  counts.forEach((c, k) => { if (c > 0) h.fill(new Float64Array(c).fill(range[0] + (k + 0.5) * w)); });
  return h;
}

describe('likelihood-ratio errors (asymmetricErrors) against independently found Δ = 1 crossings', () => {
  it('fitHistogram poisson, a constant over 3 bins holding 1, 2, 1 entries: the interval [μ₋, μ₊] where 2[3μ − 4 + 4 ln(4/3μ)] = 1 (asymmetric, longer above), to 1e-3 σ', () => {
    const counts = [1, 2, 1];
    const fit = fitHistogram(countHistogram(counts, [0, 3]), polynomial(0), [1], { asymmetricErrors: true });
    const best = 4 / 3, sigma = fit.errors[0];
    expect(Math.abs(fit.values[0] - best)).toBeLessThan(1e-6);
    const rise = (mu: number) => 2 * (3 * mu - 4 + 4 * Math.log(4 / (3 * mu))) - 1;
    const lower = best - root(rise, 1e-6, best), upper = root(rise, best, 10) - best;
    const p = fit.parameters.c0;
    expect(Math.abs(p.lowerError! - lower)).toBeLessThan(1e-3 * sigma);
    expect(Math.abs(p.upperError! - upper)).toBeLessThan(1e-3 * sigma);
    expect(upper / lower).toBeGreaterThan(1.15); // few counts: the interval is far from symmetric
  });

  it('fitHistogram poisson, a peak of fixed shape on a flat background (2 parameters): the profile over the background of the signal area, to 1e-3 σ', () => {
    // Expected per bin: s·g_i + b with g a fixed Gaussian shape over 8 unit bins (Σg = 1).
    const counts = [2, 1, 4, 9, 7, 3, 0, 2];
    const g = Array.from({ length: 8 }, (_, i) => Math.exp(-0.5 * ((i + 0.5 - 4) / 1.2) ** 2));
    const gSum = g.reduce((a, b) => a + b, 0);
    const shape = customShape('fixed peak on flat', ['signal', 'flat'],
      (x, q, at = 0) => q[at] * (g[Math.min(7, Math.max(0, Math.floor(x)))] / gSum) + q[at + 1],
      (a, b, q, at = 0) => { let s = 0; for (let i = Math.max(0, Math.ceil(a - 1e-12)); i < Math.min(8, Math.floor(b + 1e-12)); i++) s += q[at] * g[i] / gSum + q[at + 1]; return s; });
    const fit = fitHistogram(countHistogram(counts, [0, 8]), shape, { signal: 15, flat: 1 }, { asymmetricErrors: true });
    expect(fit.status).toBe('ok');
    const chi2 = (s: number, b: number) => bakerCousins(counts, g.map((v) => (s * v) / gSum + b));
    const profile = (s: number) => minimum((b) => chi2(s, b), 1e-9, 20);
    const best = fit.values[0], fMin = profile(best);
    expect(Math.abs(fMin - fit.chi2)).toBeLessThan(1e-6);
    const rise = (s: number) => profile(s) - fMin - 1;
    const lower = best - root(rise, best - 5 * fit.errors[0], best), upper = root(rise, best, best + 5 * fit.errors[0]) - best;
    expect(Math.abs(fit.parameters.signal.lowerError! - lower)).toBeLessThan(1e-3 * fit.errors[0]);
    expect(Math.abs(fit.parameters.signal.upperError! - upper)).toBeLessThan(1e-3 * fit.errors[0]);
    // The profile differs from the scan with the background held at its best value, which is narrower.
    const fixedB = fit.values[1];
    const lowerFixed = best - root((s) => chi2(s, fixedB) - fMin - 1, best - 5 * fit.errors[0], best);
    expect(lower - lowerFixed).toBeGreaterThan(0.02 * fit.errors[0]);
  });

  it('fitModel with σ, y = p²·x (one parameter, curved χ²): the crossings of χ²(p) = χ²min + 1 written out, to 1e-3 σ', () => {
    const x = [1, 2, 3, 4], y = [0.9, 1.3, 2.8, 3.1], sigma = 0.6;
    const fit = fitModel({ x, y, sigma }, (xv, p) => p[0] * p[0] * xv, [1], { asymmetricErrors: true });
    const chi2 = (p: number) => x.reduce((s, xv, i) => s + ((y[i] - p * p * xv) / sigma) ** 2, 0);
    const best = fit.values[0], fMin = chi2(best);
    const lower = best - root((p) => chi2(p) - fMin - 1, 0.01, best), upper = root((p) => chi2(p) - fMin - 1, best, 3) - best;
    expect(Math.abs(fit.parameters.p0.lowerError! - lower)).toBeLessThan(1e-3 * fit.errors[0]);
    expect(Math.abs(fit.parameters.p0.upperError! - upper)).toBeLessThan(1e-3 * fit.errors[0]);
    expect(lower).toBeGreaterThan(upper); // χ² in p rises faster above: the interval is longer below
  });

  it('fitModel, a straight line (χ² exactly quadratic): both scan errors equal the covariance errors to 1e-3, with and without σ', () => {
    const x = [0, 1, 2, 3, 4, 5], y = [0.2, 1.1, 1.9, 3.2, 3.9, 5.1];
    for (const sigma of [0.15, undefined]) {
      const fit = fitModel({ x, y, sigma }, (xv, p) => p[0] + p[1] * xv, { a: 0, b: 1 }, { asymmetricErrors: true });
      for (const name of ['a', 'b']) {
        const p = fit.parameters[name];
        expect(Math.abs(p.lowerError! / p.error - 1), `${name}, σ ${sigma}`).toBeLessThan(1e-3);
        expect(Math.abs(p.upperError! / p.error - 1), `${name}, σ ${sigma}`).toBeLessThan(1e-3);
      }
    }
  });
});

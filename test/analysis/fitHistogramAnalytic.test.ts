import { describe, expect, it } from 'vitest';
import { fitHistogram, fitUnbinned, Histogram, polynomial } from '../../lib/analysis/index.js';
import { consumeWarnings } from '../../lib/warnings.js';

/** Analytic cases of the binned and unbinned likelihoods, where the answer is known in closed form. */
describe('fitHistogram and fitUnbinned: analytic cases', () => {
  const counts = [3, 0, 7, 1, 4, 0, 2, 9, 5, 1];
  const h = new Histogram({ bins: counts.length, range: [0, 10] });
  counts.forEach((c, k) => h.fill(new Float64Array(c).fill(k + 0.5)));
  const mean = counts.reduce((a, b) => a + b, 0) / counts.length;

  it('poisson: a constant model estimates the mean count per bin, with error √(mean/bins) (the Poisson MLE), to 1e-6', () => {
    const fit = fitHistogram(h, polynomial(0), [1], { method: 'poisson' });
    expect(fit.status).toBe('ok');
    expect(Math.abs(fit.values[0] / mean - 1)).toBeLessThan(1e-6);
    expect(Math.abs(fit.errors[0] / Math.sqrt(mean / counts.length) - 1)).toBeLessThan(1e-4);
    // Baker–Cousins χ² at that constant: 2 Σ [μ − n + n ln(n/μ)].
    const bc = 2 * counts.reduce((s, n) => s + mean - n + (n > 0 ? n * Math.log(n / mean) : 0), 0);
    expect(Math.abs(fit.chi2 - bc)).toBeLessThan(1e-6);
    expect(fit.ndf).toBe(counts.length - 1);
  });
  it('neyman: a constant estimates Σ(n/σ²)/Σ(1/σ²) with σ² = max(n, 1), and warns that 7 of 10 bins are sparse', () => {
    consumeWarnings();
    const fit = fitHistogram(h, polynomial(0), [1], { method: 'neyman' });
    const expected = counts.reduce((s, n) => s + n / Math.max(n, 1), 0) / counts.reduce((s, n) => s + 1 / Math.max(n, 1), 0);
    expect(Math.abs(fit.values[0] / expected - 1)).toBeLessThan(1e-6);
    const w = consumeWarnings();
    expect(w.map((x) => x.code)).toEqual(['SPARSE_BINS']);
    expect(w[0].message).toContain('7 of 10 bins');
  });
  it('pearson: a constant estimates √(Σn²/N), the minimum of Σ(n − μ)²/μ', () => {
    const fit = fitHistogram(h, polynomial(0), [1], { method: 'pearson' });
    const expected = Math.sqrt(counts.reduce((s, n) => s + n * n, 0) / counts.length);
    expect(Math.abs(fit.values[0] / expected - 1)).toBeLessThan(1e-6);
    consumeWarnings();
  });
  it('unbinned: an exponential truncated below at a estimates τ = mean(x) − a, error τ/√n (the closed-form MLE), to 1e-6', () => {
    const t = [0.31, 1.7, 0.52, 2.9, 0.8, 4.1, 1.2, 0.45, 3.3, 0.6, 1.05, 2.2];
    const a = 0.3;
    const tau = t.reduce((s, v) => s + v, 0) / t.length - a;
    const fit = fitUnbinned([...t, 0.1, NaN], (x, p) => Math.exp(-x / p[0]), { tau: 1 }, { range: [a, 1e4] });
    expect(Math.abs(fit.values[0] / tau - 1)).toBeLessThan(1e-6);
    expect(Math.abs(fit.errors[0] / (tau / Math.sqrt(t.length)) - 1)).toBeLessThan(1e-4);
    expect(fit.excluded).toBe(2);
  });
});

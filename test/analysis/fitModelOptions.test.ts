import { describe, expect, it } from 'vitest';
import { fitModel, fitStraightLine, gaussian } from '../../lib/analysis/index.js';
import { seededRandom } from '../../lib/simulate/rng.js';

const code = (c: string) => expect.objectContaining({ code: c });

describe('fitModel options', () => {
  const x = Float64Array.from({ length: 30 }, (_, i) => i * 0.5);
  const truth = [4, 0.3];
  const rng = seededRandom(3, 'fitModel');
  const y = x.map((v) => truth[0] * Math.exp(-truth[1] * v) + 0.05 * rng.gaussian());

  it('named start values, a fixed parameter (error 0, not counted in ndf) and χ²/p-value with σ given', () => {
    const fit = fitModel({ x, y, sigma: 0.05 }, (t, p) => p[0] * Math.exp(-p[1] * t) + p[2], { amplitude: 3, rate: 0.5, offset: 0 }, { fixed: ['offset'] });
    expect(fit.names).toEqual(['amplitude', 'rate', 'offset']);
    expect(fit.parameters.offset).toMatchObject({ value: 0, error: 0, fixed: true });
    expect(fit.ndf).toBe(28);
    expect(Math.abs(fit.parameters.rate.value - 0.3)).toBeLessThan(4 * fit.parameters.rate.error);
    expect(fit.pValue).toBeGreaterThan(0.001);
    expect(fit.correlation[0][1]).toBeGreaterThan(0.5); // amplitude and rate correlate
  });
  it('a bound the minimum lies beyond: the parameter ends on it, flagged atBound', () => {
    const fit = fitModel({ x, y, sigma: 0.05 }, (t, p) => p[0] * Math.exp(-p[1] * t), { a: 3, rate: 0.5 }, { bounds: { rate: [0.4, 2] } });
    expect(fit.parameters.rate.value).toBe(0.4);
    expect(fit.parameters.rate.atBound).toBe(true);
    expect(fit.parameters.a.atBound).toBe(false);
  });
  it('a Shape as the model takes its parameter names; an unknown start name is a bad call', () => {
    const gx = Float64Array.from({ length: 41 }, (_, i) => -4 + 0.2 * i);
    const gy = gx.map((v) => gaussian().value(v, [10, 0.3, 1.2]));
    const fit = fitModel({ x: gx, y: gy }, gaussian(), { area: 8, mean: 0, sigma: 1 });
    expect(Math.abs(fit.parameters.mean.value - 0.3)).toBeLessThan(1e-9);
    expect(() => fitModel({ x: gx, y: gy }, gaussian(), { area: 8, mean: 0, width: 1 })).toThrow(code('BAD_ARGUMENT'));
  });
  it('bad calls: lengths, σ ≤ 0, xSigma without sigma, start outside its bounds', () => {
    const f = (t: number, p: Float64Array) => p[0] * t;
    expect(() => fitModel({ x: [1, 2], y: [1] }, f, [1])).toThrow(code('BAD_ARGUMENT'));
    expect(() => fitModel({ x: [1, 2], y: [1, 2], sigma: [1, 0] }, f, [1])).toThrow(/sigma\[1\]/);
    expect(() => fitModel({ x: [1, 2], y: [1, 2], xSigma: 0.1 }, f, [1])).toThrow(/sigma/);
    expect(() => fitModel({ x: [1, 2], y: [1, 2] }, f, [5], { bounds: { p0: [0, 1] } })).toThrow(/bounds/);
  });
  it('non-finite points are left out and counted; a model that is NaN at the start gives status not-finite', () => {
    const fit = fitModel({ x: [1, 2, 3, NaN], y: [2, 4, 6.1, 1] }, (t, p) => p[0] * t, [1]);
    expect(fit.excluded).toBe(1);
    expect(fit.ndf).toBe(2);
    expect(fitModel({ x: [1, 2, 3], y: [1, 2, 3] }, (t, p) => Math.sqrt(p[0]) * t, [-1]).status).toBe('not-finite');
  });
});

describe('straight line with errors on both axes (effective variance)', () => {
  // Pearson's (1901) data with York's (1966) weights. The best line has intercept 5.47991022403
  // and slope −0.48053340745 (J. H. Williamson, Can. J. Phys. 46 (1968) 1845; B. C. Reed,
  // Am. J. Phys. 57 (1989) 642, agree to 9 digits), χ² = 11.8664 for 8 degrees of freedom
  // (D. York et al., Am. J. Phys. 72 (2004) 367).
  const x = [0.0, 0.9, 1.8, 2.6, 3.3, 4.4, 5.2, 6.1, 6.5, 7.4];
  const y = [5.9, 5.4, 4.4, 4.6, 3.5, 3.7, 2.8, 2.8, 2.4, 1.5];
  const wx = [1000, 1000, 500, 800, 200, 80, 60, 20, 1.8, 1];
  const wy = [1, 1.8, 4, 8, 20, 20, 70, 70, 100, 500];
  it('Pearson–York: intercept and slope to 1e-7 relative, χ² to 1e-5', () => {
    const fit = fitStraightLine({ x, y, sigma: wy.map((w) => 1 / Math.sqrt(w)), xSigma: wx.map((w) => 1 / Math.sqrt(w)) });
    expect(Math.abs(fit.parameters.intercept.value / 5.47991022403 - 1)).toBeLessThan(1e-7);
    expect(Math.abs(fit.parameters.slope.value / -0.48053340745 - 1)).toBeLessThan(1e-7);
    expect(Math.abs(fit.chi2 - 11.8664)).toBeLessThan(1e-4);
    expect(fit.ndf).toBe(8);
  });
  it('errors cover: 600 simulated lines through the origin with σ_x = σ_y give slope pulls of mean 0 ± 0.13 and width 1 ± 0.09', () => {
    const rng = seededRandom(8, 'both-axes');
    const xs = [1, 2, 3, 4, 5, 6, 7, 8];
    const pulls: number[] = [];
    for (let toy = 0; toy < 600; toy++) {
      const ox = xs.map((v) => v + 0.3 * rng.gaussian());
      const oy = xs.map((v) => 1.7 * v + 0.3 * rng.gaussian());
      const fit = fitStraightLine({ x: ox, y: oy, sigma: 0.3, xSigma: 0.3 }, { throughOrigin: true });
      if (fit.status === 'ok') pulls.push((fit.parameters.slope.value - 1.7) / fit.parameters.slope.error);
    }
    expect(pulls.length).toBe(600);
    const mean = pulls.reduce((a, b) => a + b, 0) / pulls.length;
    const width = Math.sqrt(pulls.reduce((a, b) => a + (b - mean) ** 2, 0) / (pulls.length - 1));
    // Statistical errors for 600 pulls: 0.041 (mean) and 0.029 (width); bands at ~3σ.
    expect(Math.abs(mean)).toBeLessThan(0.13);
    expect(Math.abs(width - 1)).toBeLessThan(0.09);
  });
});

describe('a curved model with errors on both axes (effective variance)', () => {
  it('errors cover: 600 simulated decay curves y = A·exp(−x/τ) with σ_x and 4 % σ_y give pulls of A and τ with mean 0 ± 0.13 and width 1 ± 0.09', () => {
    // x errors move points along a curve whose slope changes by e⁴ over the range, so the
    // effective variance matters: with σ_y alone the pulls of both are ~1.9 wide on these toys.
    const rng = seededRandom(9, 'both-axes curved');
    const xs = [0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5];
    const truth = { amplitude: 20, tau: 1.25 };
    const sx = 0.08;
    const pulls: Record<string, number[]> = { amplitude: [], tau: [] };
    for (let toy = 0; toy < 600; toy++) {
      const f = xs.map((v) => truth.amplitude * Math.exp(-v / truth.tau));
      const sy = f.map((v) => 0.04 * v);
      const ox = xs.map((v) => v + sx * rng.gaussian());
      const oy = f.map((v, i) => v + sy[i] * rng.gaussian());
      const fit = fitModel({ x: ox, y: oy, sigma: sy, xSigma: sx }, (x, p) => p[0] * Math.exp(-x / p[1]), { amplitude: 15, tau: 1 });
      if (fit.status !== 'ok') continue;
      for (const name of ['amplitude', 'tau'] as const) pulls[name].push((fit.parameters[name].value - truth[name]) / fit.parameters[name].error);
    }
    for (const name of ['amplitude', 'tau']) {
      const v = pulls[name];
      expect(v.length).toBe(600);
      const mean = v.reduce((a, b) => a + b, 0) / v.length;
      const width = Math.sqrt(v.reduce((a, b) => a + (b - mean) ** 2, 0) / (v.length - 1));
      expect(Math.abs(mean), `${name} pull mean`).toBeLessThan(0.13);
      expect(Math.abs(width - 1), `${name} pull width`).toBeLessThan(0.09);
    }
  });
});

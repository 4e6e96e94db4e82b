import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { exponential, fitHistogram, gaussian, Histogram, sumShapes } from '../../lib/analysis/index.js';
import { spectrumFigure } from '../../lib/plot/index.js';
import { expectGolden } from '../expectGolden.js';

type Trace = Record<string, unknown> & { name?: string; x: (number | null)[]; y: (number | null)[] };

const counts = [12, 9, 7, 11, 30, 52, 33, 9, 4, 3, 1, 0, 2, 0, 1];
const h = new Histogram({ bins: counts.length, range: [400, 700] });
counts.forEach((c, k) => h.fill(new Float64Array(c).fill(410 + 20 * k)));
const model = sumShapes({ peak: gaussian(), background: exponential({ origin: 400 }) });
const fit = fitHistogram(h, model, { 'peak.area': 2000, 'peak.mean': 505, 'peak.sigma': 15, 'background.norm': 0.5, 'background.slope': -0.01 });

describe('spectrumFigure', () => {
  it('data points at bin centres with exact Poisson error bars (asymmetric; an empty bin gets +1.841, −0)', () => {
    const fig = spectrumFigure(h);
    const d = fig.data[0] as unknown as Trace & { error_y: { array: number[]; arrayminus: number[] } };
    expect(d.x).toEqual(Array.from({ length: 15 }, (_, k) => 410 + 20 * k));
    expect(d.y).toEqual(counts);
    expect(d.error_y.array[11]).toBeCloseTo(1.841, 3);
    expect(d.error_y.arrayminus[11]).toBe(0);
    expect(d.error_y.arrayminus[4]).toBeCloseTo(30 - 24.55, 2); // Gehrels 1986 Table 2, n = 30
    expect(fig.data).toHaveLength(1); // no fit: no curve, no pull panel
  });
  it('with a fit: the model curve in entries per bin, and pulls whose squares add up to the fit’s χ² (1e-9)', () => {
    const fig = spectrumFigure(h, { fit, model, xTitle: 'p [MeV/c]' });
    const curve = fig.data.find((t) => String(t.name).startsWith('fit')) as unknown as Trace;
    const p = Float64Array.from(fit.values);
    expect(curve.x).toHaveLength(400);
    expect((curve.y[200] as number) / (model.value(curve.x[200] as number, p) * 20) - 1).toBeCloseTo(0, 12);
    expect(String(curve.name)).toContain(`${fit.chi2.toFixed(1)}/${fit.ndf}`);
    const pulls = fig.data.find((t) => t.name === 'pulls') as unknown as Trace;
    expect(pulls.xaxis).toBe('x2');
    const sum = (pulls.y as number[]).reduce((s, v) => s + v * v, 0);
    expect(Math.abs(sum - fit.chi2)).toBeLessThan(1e-9 * fit.chi2);
    expect((fig.layout.xaxis2 as Record<string, unknown>).title).toEqual({ text: 'p [MeV/c]' });
  });
  it('log y: empty bins become 1σ upper limits, the range covers every point and error bar, one label per decade', () => {
    const fig = spectrumFigure(h, { yScale: 'log' });
    const d = fig.data[0] as unknown as Trace & { error_y: { array: number[]; arrayminus: number[] } };
    expect(d.y[11]).toBeNull();
    const limits = fig.data[1] as unknown as Trace;
    expect(limits.x).toEqual([630, 670]);
    expect((limits.y as number[])[0]).toBeCloseTo(1.841, 3);
    const range = (fig.layout.yaxis as { range: number[]; type: string }).range;
    expect((fig.layout.yaxis as { type: string }).type).toBe('log');
    const lows = d.y.map((v, k) => (v === null ? Infinity : v - d.error_y.arrayminus[k]));
    const highs = d.y.map((v, k) => (v === null ? -Infinity : v + d.error_y.array[k]));
    expect(10 ** range[0]).toBeLessThan(Math.min(...lows));
    expect(10 ** range[1]).toBeGreaterThan(Math.max(...highs));
  });
  it('legend in the bottom margin, title in the top margin (container coordinates): the legend never covers the title', () => {
    const layout = spectrumFigure(h, { fit, model, title: 'Beam momentum' }).layout as Record<string, Record<string, unknown>>;
    expect(layout.title).toMatchObject({ yref: 'container', y: 1, yanchor: 'top' });
    expect(layout.legend).toMatchObject({ yref: 'container', yanchor: 'bottom' });
    expect(layout.legend.y as number).toBeLessThan(0.05);
    expect(layout.margin.b).toBeGreaterThanOrEqual(96);
  });
  it('a fit without its model is a bad call', () => {
    expect(() => spectrumFigure(h, { fit })).toThrow(expect.objectContaining({ code: 'BAD_ARGUMENT' }));
  });
  it('matches its golden spec (5 bins, a Gaussian of fixed σ)', () => {
    const small = new Histogram({ bins: 5, range: [0, 5] }).fill([0.5, 1.5, 1.5, 2.5, 2.5, 2.5, 4.5]);
    const flat = sumShapes({ level: gaussian() });
    const f = fitHistogram(small, flat, { 'level.area': 7, 'level.mean': 2.5, 'level.sigma': 2 }, { fixed: ['level.sigma'] });
    const spec = JSON.stringify(spectrumFigure(small, { fit: f, model: flat, title: 'Golden spectrum', xTitle: 'x [cm]', curvePoints: 6 }), (_, v) => (typeof v === 'number' ? Number(v.toPrecision(6)) : v), 1);
    expectGolden(join(import.meta.dirname, 'golden', 'spectrum-figure.json'), spec + '\n');
  });
});

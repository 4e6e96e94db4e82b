import { describe, expect, it } from 'vitest';
import { addHistograms, binErrors, chi2Survival, Histogram, normaliseHistogram, scaleHistogram } from '../../lib/analysis/index.js';
import { msg } from '../../lib/errors.js';

// Sums, scalings and normalisations of histograms checked against sums worked out here by hand
// from the definitions in the doc comments; error bars against Gehrels, ApJ 303 (1986) 336.
const refusal = (name: string, value: unknown, expected: string) => msg.badArgument(name, value, expected).message;
const counts = (values: number[]) => new Histogram({ bins: 2, range: [0, 2] }).fill(values);

describe('addHistograms', () => {
  it('counts: every total adds; unit weights agree, so the sum stays counts (Σw² = Σw)', () => {
    const s = addHistograms(counts([0.5, -1, NaN]), counts([1.5, 1.5, 3]), counts([0.2]));
    expect(Array.from(s.sumW)).toEqual([2, 2]);
    expect(Array.from(s.sumW2)).toEqual([2, 2]);
    expect([s.underflow, s.overflow, s.nonFinite, s.entries, s.unitWeight, s.isCounts]).toEqual([1, 1, 1, 4, 1, true]);
  });
  it('weighted or of different unit weights: Σw² adds bin by bin, and the sum is no longer counts', () => {
    const a = new Histogram({ bins: 2, range: [0, 2] }).fill([0.5, 1.5], [2, 3]);
    const b = counts([0.5, 0.5]);
    const s = addHistograms(b, a);
    expect(Array.from(s.sumW)).toEqual([4, 3]);
    expect(Array.from(s.sumW2)).toEqual([2 + 4, 9]);
    expect(s.isCounts).toBe(false);
    const scaled = addHistograms(counts([0.5]), scaleHistogram(counts([0.5, 1.5]), 2));
    expect(Array.from(scaled.sumW)).toEqual([3, 2]);
    expect(Array.from(scaled.sumW2)).toEqual([1 + 4, 4]);
    expect(scaled.unitWeight).toBeNaN();
    // Two scaled by the same factor stay counts of that unit.
    const same = addHistograms(scaleHistogram(counts([0.5]), 2), scaleHistogram(counts([1.5]), 2));
    expect([same.unitWeight, same.sumW2[0], same.sumW2[1]]).toEqual([2, 4, 4]);
  });
  it('refuses different edges with the catalogue message (names both binnings)', () => {
    const other = new Histogram({ bins: 2, range: [0, 3] });
    expect(() => addHistograms(counts([]), other)).toThrow(refusal('histogram edges', '2 bins over [0, 3]', 'the same edges as the first histogram (2 bins over [0, 2])'));
    expect(() => addHistograms(counts([]), new Histogram({ bins: 3, range: [0, 2] }))).toThrow(/histogram edges/);
  });
});

describe('scaleHistogram and normaliseHistogram', () => {
  it('scale: Σw × s, Σw² × s², under- and overflow × s; counts and weights alike', () => {
    const w = new Histogram({ bins: 2, range: [0, 2] }).fill([0.5, 1.5, -1, 5], [2, 3, 4, 6]);
    const s = scaleHistogram(w, 0.5);
    expect(Array.from(s.sumW)).toEqual([1, 1.5]);
    expect(Array.from(s.sumW2)).toEqual([1, 2.25]);
    expect([s.underflow, s.overflow, s.nonFinite, s.entries]).toEqual([2, 3, 0, 2]);
    const c = scaleHistogram(counts([0.5, -3, 7, 9]), 3);
    expect([c.underflow, c.overflow, c.unitWeight, c.sumW2[0]]).toEqual([3, 6, 3, 9]);
    expect(() => scaleHistogram(c, Infinity)).toThrow(refusal('factor', Infinity, 'a finite number'));
    expect(() => scaleHistogram(c, NaN)).toThrow(refusal('factor', NaN, 'a finite number'));
  });
  it('density over equal and over variable bins: Σw/(total·width), Σw²/(total·width)², under/overflow / total', () => {
    const eq = normaliseHistogram(counts([0.5, 1.5, 1.5, 1.2, -1]), 'density');
    expect(Array.from(eq.sumW)).toEqual([0.25, 0.75]);
    expect(Array.from(eq.sumW2)).toEqual([1 / 16, 3 / 16]);
    expect([eq.underflow, eq.unitWeight, eq.isCounts]).toEqual([0.25, 0.25, true]);
    const v = new Histogram({ edges: [0, 1, 3] }).fill([0.5, 2, 2, 2, 9]);
    const d = normaliseHistogram(v, 'density');
    expect(Array.from(d.sumW)).toEqual([0.25, 0.375]);
    expect(Array.from(d.sumW2)).toEqual([1 / 16, 3 / 64]);
    expect([d.overflow, d.isCounts]).toEqual([0.25, false]);
    const area = normaliseHistogram(v);
    expect([area.sumW[0], area.sumW[1], area.overflow]).toEqual([0.25, 0.75, 0.25]);
  });
  it('refuses an empty histogram and an unknown normalisation with the catalogue messages', () => {
    expect(() => normaliseHistogram(counts([5]))).toThrow(refusal('histogram', 'Σw = 0', 'a histogram with a finite, non-zero sum of weights to normalise'));
    expect(() => normaliseHistogram(counts([0.5]), 'peak' as never)).toThrow(refusal('to', 'peak', "'unit-area' or 'density'"));
  });
});

describe('binErrors', () => {
  it('counts get the exact (Garwood) interval, scaled by the unit weight; sqrt asks for √Σw²; a bad kind is refused', () => {
    // Gehrels 1986, Table 1 (upper limits at S = 1: n = 0 → 1.841, n = 2 → 4.638) and Table 2 (lower: n = 2 → 0.708) (memory).
    const e = binErrors(counts([1.5, 1.5]));
    expect(e.upper[0]).toBeCloseTo(1.841, 3);
    expect(e.upper[1]).toBeCloseTo(4.638 - 2, 3);
    expect(e.lower[1]).toBeCloseTo(2 - 0.708, 3);
    const s = binErrors(scaleHistogram(counts([1.5, 1.5]), 3));
    expect(s.upper[1] / e.upper[1]).toBeCloseTo(3, 12);
    const r = binErrors(counts([1.5, 1.5, 1.5, 1.5]), { kind: 'sqrt' });
    expect([r.lower[1], r.upper[1], r.upper[0]]).toEqual([2, 2, 0]);
    const wider = binErrors(counts([1.5, 1.5]), { cl: 0.9 });
    expect(wider.upper[1]).toBeGreaterThan(e.upper[1] * 1.3);
    expect(() => binErrors(counts([]), { kind: 'poisson' as never })).toThrow(refusal('kind', 'poisson', "'exact' or 'sqrt'"));
  });
});

describe('chi2Survival at its ends', () => {
  it('1 at χ² ≤ 0, NaN for ndf ≤ 0 or a non-finite χ², the closed form e^(−x/2) for 2 d.o.f.', () => {
    expect([chi2Survival(0, 3), chi2Survival(-2, 3)]).toEqual([1, 1]);
    expect([chi2Survival(1, 0), chi2Survival(1, -1), chi2Survival(NaN, 2), chi2Survival(Infinity, 2), chi2Survival(1, NaN)]).toEqual([NaN, NaN, NaN, NaN, NaN]);
    expect(chi2Survival(3, 2)).toBeCloseTo(Math.exp(-1.5), 14);
    expect(chi2Survival(1e-300, 2)).toBe(1);
  });
});

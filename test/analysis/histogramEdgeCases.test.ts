import { describe, expect, it } from 'vitest';
import { Histogram, Histogram2D } from '../../lib/analysis/index.js';
import { msg } from '../../lib/errors.js';

// Exact bookkeeping of one histogram fill, worked out by hand for each value (definitions of the
// doc comment: half-open bins [eₖ, eₖ₊₁), underflow below the first edge, overflow at or above the
// last, non-finite values and weights counted apart and never binned).
const refusal = (name: string, value: unknown, expected: string) => msg.badArgument(name, value, expected).message;

describe('Histogram: every value accounted for', () => {
  const values = [-1, 0, 0.25, 0.5, 0.999, 1, 1.5, NaN, Infinity, -Infinity, 0.5];
  for (const [label, binning] of [['equal bins', { bins: 4, range: [0, 1] as const }], ['variable bins', { edges: [0, 0.1, 0.5, 0.6, 1] }]] as const) {
    it(`${label}, unweighted: bins, underflow, overflow, non-finite and entries, each exactly`, () => {
      const h = new Histogram(binning).fill(values);
      const want = label === 'equal bins' ? [1, 1, 2, 1] : [1, 1, 2, 1]; // 0 | 0.25 | 0.5, 0.5 | 0.999 (equal); 0 | 0.25 | 0.5, 0.5 | 0.999 (variable)
      expect(Array.from(h.sumW)).toEqual(want);
      expect(Array.from(h.sumW2)).toEqual(want);
      expect([h.underflow, h.overflow, h.nonFinite, h.entries, h.unitWeight, h.isCounts]).toEqual([1, 2, 3, 5, 1, true]);
      expect([h.binOf(0), h.binOf(-1e-300), h.binOf(1), h.binOf(1 - 1e-16), h.binOf(NaN), h.binOf(-Infinity)]).toEqual([0, -1, 4, 3, NaN, NaN]);
    });
    it(`${label}, weighted: Σw and Σw² per bin, under- and overflow as sums of weights, a bad weight or value counted once`, () => {
      const w = [2, 3, 0.5, 4, 1, 7, 9, 5, 6, 8, NaN];
      const h = new Histogram(binning).fill(values, w);
      expect(Array.from(h.sumW)).toEqual([3, 0.5, 4, 1]);
      expect(Array.from(h.sumW2)).toEqual([9, 0.25, 16, 1]);
      expect([h.underflow, h.overflow, h.nonFinite, h.entries, h.isCounts]).toEqual([2, 16, 4, 4, false]);
      // One common weight other than 1 is a weighted fill (only scaleHistogram makes counts of a unit s).
      const c = new Histogram(binning).fill([0.05, 0.05, 2], 3);
      expect([c.sumW[0], c.sumW2[0], c.overflow, c.unitWeight, c.isCounts]).toEqual([6, 18, 3, NaN, false]);
      c.fill([0.05], 3);
      expect([c.sumW[0], c.sumW2[0], c.entries]).toEqual([9, 27, 3]);
      c.fill([0.05], 1);
      expect([c.sumW[0], c.sumW2[0], c.entries]).toEqual([10, 28, 4]);
    });
  }
  it('refuses bad binnings and weights with the catalogue messages', () => {
    expect(() => new Histogram({ edges: [1] })).toThrow(refusal('edges', [1], 'at least two finite, strictly increasing bin edges'));
    expect(() => new Histogram({ edges: [0, NaN, 1] })).toThrow(refusal('edges', [0, NaN, 1], 'at least two finite, strictly increasing bin edges'));
    expect(() => new Histogram({ edges: [0, 1, 1] })).toThrow(refusal('edges', [0, 1, 1], 'at least two finite, strictly increasing bin edges'));
    expect(new Histogram({ edges: [0, 1] }).bins).toBe(1);
    for (const bins of [0, 1.5, undefined]) expect(() => new Histogram({ bins, range: [0, 1] })).toThrow(refusal('bins', bins, 'a whole number ≥ 1 (with range), or edges'));
    for (const range of [undefined, [0, NaN], [NaN, 1], [2, 1]] as const) {
      expect(() => new Histogram({ bins: 2, range: range as never })).toThrow(refusal('range', range, 'finite [low, high] with low < high, in the values\' unit'));
    }
    expect(() => new Histogram({ bins: 2, range: [0, 1] }).fill([0.1, 0.2], [1])).toThrow(refusal('weights', '1 weights', 'one weight per value (2)'));
  });
  it('equal bins from a range: edges at low + k·(high − low)/bins, the last exactly high', () => {
    const h = new Histogram({ bins: 3, range: [0.1, 0.7] });
    expect(Array.from(h.edges)).toEqual([0.1, 0.1 + 0.6 / 3, 0.1 + (0.6 * 2) / 3, 0.7]);
    expect(Array.from(h.widths()).map((w) => Number(w.toFixed(12)))).toEqual([0.2, 0.2, 0.2]);
  });
});

describe('Histogram2D: every pair accounted for', () => {
  const binning = { x: { bins: 2, range: [0, 2] as const }, y: { edges: [0, 1, 3] } };
  it('weighted pairs: Σw and Σw² per cell (row-major by y), outside as a sum of weights per side, non-finite pairs and weights counted', () => {
    const x = [0.5, 1.5, 1.5, -1, 2, 0.5, 0.5, NaN, 0.5];
    const y = [0.5, 2, 2, 0.5, 0.5, -1, 3, 0.5, 0.5];
    const w = [2, 3, 4, 5, 6, 7, 8, 9, Infinity];
    const h = new Histogram2D(binning).fill(x, y, w);
    expect([h.xBins, h.yBins]).toEqual([2, 2]);
    expect(Array.from(h.sumW)).toEqual([2, 0, 0, 7]);
    expect(Array.from(h.sumW2)).toEqual([4, 0, 0, 25]);
    expect([h.at(0, 0), h.at(1, 1), h.outside, h.nonFinite, h.entries]).toEqual([2, 7, 5 + 6 + 7 + 8, 2, 3]);
    const c = new Histogram2D(binning).fill([0.5, 1.5], [2, 2], 3).fill([1.5], [0.2]);
    expect(Array.from(c.sumW)).toEqual([0, 1, 3, 3]);
    expect(Array.from(c.sumW2)).toEqual([0, 1, 9, 9]);
  });
  it('refuses unequal coordinate lists and weights, with the catalogue messages', () => {
    const h = new Histogram2D(binning);
    expect(() => h.fill([1, 2], [1])).toThrow(msg.badArgument('y', '1 values', 'as many values as x (2)').message);
    expect(() => h.fill([1, 2], [1, 2], [1])).toThrow(msg.badArgument('weights', '1 weights', 'one weight per pair (2)').message);
  });
});

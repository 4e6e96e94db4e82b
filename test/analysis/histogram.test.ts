import { describe, expect, it } from 'vitest';
import { addHistograms, binErrors, Histogram, Histogram2D, normaliseHistogram, scaleHistogram } from '../../lib/analysis/index.js';
import { seededRandom } from '../../lib/simulate/rng.js';

const code = (c: string) => expect.objectContaining({ code: c });

describe('Histogram', () => {
  it('fill counts half-open bins, underflow, overflow (the last edge is overflow) and non-finite values, each exactly', () => {
    const h = new Histogram({ bins: 4, range: [0, 2] }).fill(Float64Array.of(0, 0.49, 0.5, 1.99, 2, -0.1, NaN, Infinity, -Infinity, 1.2));
    expect(Array.from(h.sumW)).toEqual([2, 1, 1, 1]);
    expect([h.underflow, h.overflow, h.nonFinite, h.entries]).toEqual([1, 1, 3, 5]);
    expect(Array.from(h.edges)).toEqual([0, 0.5, 1, 1.5, 2]);
    expect(Array.from(h.centres())).toEqual([0.25, 0.75, 1.25, 1.75]);
    expect(h.binOf(2)).toBe(4);
    expect(h.binOf(-3)).toBe(-1);
    expect(h.binOf(NaN)).toBeNaN();
  });
  it('a value a rounding below the upper edge lands in the last bin, not in overflow', () => {
    const h = new Histogram({ bins: 3, range: [0, 0.3] }).fill([0.29999999999999993, 0.2999999999999999]);
    expect(Array.from(h.sumW)).toEqual([0, 0, 2]);
    expect(h.overflow).toBe(0);
  });
  it('variable bins: binary search puts each value in [eₖ, eₖ₊₁)', () => {
    const h = new Histogram({ edges: [0, 1, 3, 10] }).fill([0, 0.99, 1, 2.99, 3, 9.99, 10]);
    expect(Array.from(h.sumW)).toEqual([2, 2, 2]);
    expect(h.overflow).toBe(1);
    expect(Array.from(h.widths())).toEqual([1, 2, 7]);
  });
  it('variable bins through the look-up grid: every value, edges and their neighbours included, lands in the bin a linear scan finds (log, clustered and wide-ratio edges)', () => {
    const rng = seededRandom(20261104, 'histogram guide');
    const layouts = [
      Array.from({ length: 101 }, (_, k) => 1e-3 * 10 ** (6 * k / 100)),           // 6 decades, log-spaced
      [0, 1e-9, 2e-9, 0.5, 0.5 + 1e-12, 0.75, 1],                                     // tiny bins beside wide ones
      Array.from({ length: 301 }, (_, k) => -3 + 6 * (k / 300) ** 3),                 // widths from 7e-5 to 0.06
    ];
    for (const edges of layouts) {
      const lo = edges[0], hi = edges[edges.length - 1];
      const values: number[] = [];
      for (const e of edges) values.push(e, e * (1 - 2 ** -52), e * (1 + 2 ** -52), e - 1e-300, e + 1e-300);
      for (let i = 0; i < 20_000; i++) values.push(lo + (hi - lo) * rng.uniform());
      const h = new Histogram({ edges }).fill(values);
      const expected = new Float64Array(edges.length - 1);
      let under = 0, over = 0;
      for (const v of values) {
        if (v < lo) { under++; continue; }
        if (v >= hi) { over++; continue; }
        let k = 0;
        while (!(edges[k] <= v && v < edges[k + 1])) k++;
        expected[k]++;
      }
      expect(Array.from(h.sumW)).toEqual(Array.from(expected));
      expect([h.underflow, h.overflow]).toEqual([under, over]);
    }
  });
  it('weights: Σw and Σw² per bin, under/overflow as sums of weights, a NaN weight is counted and skipped', () => {
    const h = new Histogram({ bins: 2, range: [0, 2] }).fill([0.5, 0.5, 1.5, 5, 0.2], [2, 3, 0.5, 4, NaN]);
    expect(Array.from(h.sumW)).toEqual([5, 0.5]);
    expect(Array.from(h.sumW2)).toEqual([13, 0.25]);
    expect([h.overflow, h.nonFinite, h.isCounts]).toEqual([4, 1, false]);
  });
  it('shards filled separately add up bit for bit to one fill of all values (100 000 values, 7 shards)', () => {
    const rng = seededRandom(11, 'shards');
    const values = Float64Array.from({ length: 100_000 }, () => 3 * rng.gaussian());
    const whole = new Histogram({ bins: 57, range: [-8, 8] }).fill(values);
    const shards = Array.from({ length: 7 }, (_, s) => new Histogram({ bins: 57, range: [-8, 8] }).fill(values.subarray((s * values.length) / 7, ((s + 1) * values.length) / 7)));
    const sum = addHistograms(shards[0], ...shards.slice(1));
    expect(Array.from(sum.sumW)).toEqual(Array.from(whole.sumW));
    expect([sum.underflow, sum.overflow, sum.entries]).toEqual([whole.underflow, whole.overflow, whole.entries]);
    expect(sum.total() + sum.underflow + sum.overflow).toBe(100_000);
  });
  it('addHistograms refuses different binnings (BAD_ARGUMENT)', () => {
    expect(() => addHistograms(new Histogram({ bins: 2, range: [0, 1] }), new Histogram({ bins: 2, range: [0, 1.0000001] }))).toThrow(code('BAD_ARGUMENT'));
  });
  it('scaleHistogram keeps a count histogram a count histogram (unit weight s), so exact intervals scale with it', () => {
    const h = new Histogram({ bins: 2, range: [0, 2] }).fill([0.5, 0.5, 0.5]);
    const s = scaleHistogram(h, 0.5);
    expect(Array.from(s.sumW)).toEqual([1.5, 0]);
    expect(Array.from(s.sumW2)).toEqual([0.75, 0]);
    expect(s.unitWeight).toBe(0.5);
    const e = binErrors(s), e1 = binErrors(h);
    expect(e.upper[1]).toBeCloseTo(0.5 * e1.upper[1], 14);
    expect(e.lower[0]).toBeCloseTo(0.5 * e1.lower[0], 14);
  });
  it('normaliseHistogram: unit area sums to 1; density integrates to 1 over variable bins', () => {
    const h = new Histogram({ edges: [0, 1, 3] }).fill([0.5, 1.5, 2.5, 2.5]);
    expect(normaliseHistogram(h).total()).toBeCloseTo(1, 15);
    const d = normaliseHistogram(h, 'density');
    expect(Array.from(d.sumW)).toEqual([0.25, 0.375]);
    expect(d.sumW[0] * 1 + d.sumW[1] * 2).toBeCloseTo(1, 15);
    expect(() => normaliseHistogram(new Histogram({ bins: 1, range: [0, 1] }))).toThrow(code('BAD_ARGUMENT'));
  });
  it('binErrors: Garwood intervals for counts (0 → +1.841, 3 → −1.633 / +2.918: Gehrels 1986 Tables 1–2), √Σw² for weights', () => {
    const h = new Histogram({ bins: 2, range: [0, 2] }).fill([1.5, 1.5, 1.5]);
    const e = binErrors(h);
    expect(e.lower[0]).toBe(0);
    expect(Math.abs(e.upper[0] - 1.841)).toBeLessThan(5e-4);
    expect(Math.abs(e.lower[1] - (3 - 1.367))).toBeLessThan(5e-4);
    expect(Math.abs(e.upper[1] - (5.918 - 3))).toBeLessThan(5e-4);
    const s = binErrors(h, { kind: 'sqrt' });
    expect(s.upper[1]).toBeCloseTo(Math.sqrt(3), 15);
    const w = binErrors(new Histogram({ bins: 1, range: [0, 1] }).fill([0.5, 0.5], [3, 4]));
    expect(w.upper[0]).toBe(5);
  });
  it('bad binnings are bad calls naming the argument', () => {
    expect(() => new Histogram({ bins: 0, range: [0, 1] })).toThrow(code('BAD_ARGUMENT'));
    expect(() => new Histogram({ bins: 3, range: [1, 1] })).toThrow(/range/);
    expect(() => new Histogram({ edges: [0, 2, 1] })).toThrow(/edges/);
    expect(() => new Histogram({ bins: 2, range: [0, 1] }).fill([1, 2], [1])).toThrow(/weights/);
  });
});

describe('Histogram2D', () => {
  it('fills cells row-major by y, with outside and non-finite pairs counted', () => {
    const h = new Histogram2D({ x: { bins: 2, range: [0, 2] }, y: { bins: 3, range: [0, 3] } });
    h.fill([0.5, 1.5, 1.5, 5, NaN], [0.5, 2.5, 2.5, 1, 1]);
    expect(h.at(0, 0)).toBe(1);
    expect(h.at(1, 2)).toBe(2);
    expect(h.sumW[2 * 2 + 1]).toBe(2);
    expect([h.outside, h.nonFinite, h.entries]).toEqual([1, 1, 3]);
  });
});

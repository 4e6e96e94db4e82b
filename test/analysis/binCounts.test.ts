import { describe, expect, it } from 'vitest';
import { binCounts } from '../../lib/analysis/index.js';

describe('binCounts', () => {
  it('binCounts([0, 1, 1, 2], 2, [0, 2]) puts the upper edge in the last bin', () => {
    const h = binCounts([0, 1, 1, 2], 2, [0, 2]);
    expect(Array.from(h.edges)).toEqual([0, 1, 2]);
    expect(Array.from(h.counts)).toEqual([1, 3]);
    expect(h.outside).toBe(0);
  });

  it('binCounts counts values outside the range and non-finite values separately', () => {
    const h = binCounts([-1, 0.5, NaN, Infinity, 3], 1, [0, 1]);
    expect(Array.from(h.counts)).toEqual([1]);
    expect(h.outside).toBe(2);
    expect(h.nonFinite).toBe(2);
  });

  it('binCounts(values, 0) is a bad call', () => {
    expect(() => binCounts([1], 0)).toThrow(/bins = 0 is not valid/);
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatSignificant } from '../../lib/io/formatSignificant';

describe('formatSignificant', () => {
  it('writes typical values plainly, without trailing zeros', () => {
    expect(formatSignificant(0.899377374, 10)).toBe('0.899377374');
    expect(formatSignificant(-2.5, 10)).toBe('-2.5');
    expect(formatSignificant(1500, 4)).toBe('1500');
    expect(formatSignificant(1.2e-9, 6)).toBe('1.2e-9');
    expect(formatSignificant(9.9999999, 4)).toBe('10');
    expect(formatSignificant(0.000123456, 3)).toBe('0.000123');
  });
  it('reads back as toPrecision does (same rounding to the stated digits)', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e30, max: 1e30, noNaN: true }).filter((v) => v !== 0 && Math.abs(v) > 1e-30), fc.integer({ min: 1, max: 12 }), (v, d) => {
        const ours = Number(formatSignificant(v, d));
        const ref = Number(v.toPrecision(d));
        expect(Math.abs(ours - ref)).toBeLessThanOrEqual(Math.abs(ref) * 10 ** (1 - d) * 1.0000001);
      }),
      { numRuns: 5000, seed: 7 },
    );
  });
});

import { describe, expect, it } from 'vitest';
import { linearTicks, logTicks, tickLabel } from '../../../lib/plot/static/ticks.js';

describe('axis ticks', () => {
  it('linearTicks(0, 1, 5) steps by 0.2 with one decimal', () => {
    expect(linearTicks(0, 1, 5).map((t) => t.label)).toEqual(['0', '0.2', '0.4', '0.6', '0.8', '1.0']);
  });
  it('linearTicks over negative values uses the minus sign, and 0 exactly', () => {
    expect(linearTicks(-1, 1, 4).map((t) => t.label)).toEqual(['−1.0', '−0.5', '0', '0.5', '1.0']);
  });
  it('tickLabel: very small values as mantissa × 10ⁿ, not 0.000751227', () => {
    expect(tickLabel(0.00075, 0.00005)).toBe('7.5×10⁻⁴');
    expect(tickLabel(250000, 50000)).toBe('2.5×10⁵');
    expect(tickLabel(12.5, 2.5)).toBe('12.5');
  });
  it('logTicks over 4 decades: one per decade, plain numbers', () => {
    expect(logTicks(-1.2, 2.3, 6).map((t) => t.label)).toEqual(['0.1', '1', '10', '100']);
  });
  it('logTicks outside 10⁻³…10⁴: powers of ten', () => {
    expect(logTicks(-7, -3.5, 6).map((t) => t.label)).toEqual(['10⁻⁷', '10⁻⁶', '10⁻⁵', '10⁻⁴']);
  });
  it('logTicks under two decades adds 2 and 5', () => {
    expect(logTicks(0, 1.5, 6).map((t) => t.label)).toEqual(['1', '2', '5', '10', '20']);
  });
});

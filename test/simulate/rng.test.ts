import { describe, expect, it } from 'vitest';
import { SagittaError } from '../../lib/errors.js';
import { provenanceSnapshot } from '../../lib/provenance.js';
import { seededRandom } from '../../lib/simulate/index.js';

describe('seededRandom (pure-rand xoroshiro128+) and its samplers', () => {
  it('the same seed gives the same stream; the seed is recorded for the report', () => {
    const a = seededRandom(123, 'test-rng'), b = seededRandom(123, 'test-rng');
    for (let i = 0; i < 100; i++) expect(a.uniform()).toBe(b.uniform());
    expect(provenanceSnapshot().seeds).toContainEqual({ seed: 123, label: 'test-rng' });
  });

  it('gaussian(): mean 0 and variance 1 within 4σ of their sampling errors (N = 100 000)', () => {
    const r = seededRandom(5);
    const n = 100000;
    let s = 0, s2 = 0, s4 = 0;
    for (let i = 0; i < n; i++) { const g = r.gaussian(); s += g; s2 += g * g; s4 += g ** 4; }
    expect(Math.abs(s / n)).toBeLessThan(4 / Math.sqrt(n));
    expect(Math.abs(s2 / n - 1)).toBeLessThan(4 * Math.sqrt(2 / n));
    // Normal kurtosis: E[g⁴] = 3.
    expect(Math.abs(s4 / n - 3)).toBeLessThan(0.1);
  });

  it('poisson(2.5) and exponential(3) have the right means; fork() gives an independent stream', () => {
    const r = seededRandom(6);
    let sp = 0, se = 0;
    const n = 50000;
    for (let i = 0; i < n; i++) { sp += r.poisson(2.5); se += r.exponential(3); }
    expect(Math.abs(sp / n - 2.5)).toBeLessThan(0.03);
    expect(Math.abs(se / n - 3)).toBeLessThan(0.06);
    const f = r.fork();
    expect(f.uniform()).not.toBe(r.uniform());
  });

  it('a seed that is not a whole number 0…2³²−1 is a bad call', () => {
    expect(() => seededRandom(1.5)).toThrow(SagittaError);
    expect(() => seededRandom(-1)).toThrow(/whole number from 0 to 4294967295/);
  });
});

import { describe, expect, it } from 'vitest';
import { writeInteger, writePrecision } from '../../lib/io/numberBytes.js';
import { seededRandom } from '../../lib/simulate/rng.js';

const buf = new Uint8Array(64);
const precision = (v: number, digits: number): string => Buffer.from(buf.subarray(0, writePrecision(buf, 0, v, digits))).toString('latin1');
const integer = (v: number): string => Buffer.from(buf.subarray(0, writeInteger(buf, 0, v))).toString('latin1');

/** The neighbouring doubles of v, `steps` each way. */
function neighbours(v: number, steps: number): number[] {
  const f = new Float64Array(1);
  const b = new BigInt64Array(f.buffer);
  const out: number[] = [];
  for (const dir of [-1n, 1n]) {
    f[0] = v;
    for (let s = 0; s < steps; s++) {
      b[0] += dir;
      out.push(f[0]);
    }
  }
  return out;
}

describe('numbers written as bytes', () => {
  it('writePrecision(v, digits) gives the bytes of v.toPrecision(digits) for 200 000 random values over 60 decades', () => {
    const rng = seededRandom(13, 'numberBytes');
    const wrong: string[] = [];
    for (let i = 0; i < 200_000; i++) {
      const v = (rng.uniform() < 0.5 ? -1 : 1) * rng.uniform() * 10 ** Math.floor(60 * rng.uniform() - 30);
      for (const d of [1, 2, 4, 6, 10, 12]) if (precision(v, d) !== v.toPrecision(d)) wrong.push(`${v} ${d}`);
    }
    expect(wrong).toEqual([]);
  });
  it('writePrecision is exact at decimal ties, at powers of ten and at their neighbouring doubles', () => {
    const wrong: string[] = [];
    for (let m = -25; m < 25; m++) {
      for (const base of [1, 5, 9.5, 9.95, 9.9999999995, 1.25, 2.5, 0.5, 99999.5, 1.0000000005, 1.000005]) {
        const v = base * 10 ** m;
        for (const u of [v, ...neighbours(v, 3)]) {
          for (let d = 1; d <= 10; d++) {
            if (precision(u, d) !== u.toPrecision(d)) wrong.push(`${u} ${d}`);
            if (precision(-u, d) !== (-u).toPrecision(d)) wrong.push(`${-u} ${d}`);
          }
        }
      }
    }
    expect(wrong).toEqual([]);
  });
  it('writePrecision leaves 0, tiny, huge and long-precision values to toPrecision itself', () => {
    for (const [v, d] of [[0, 10], [5e-324, 10], [1.7976931348623157e308, 4], [Math.PI, 17], [1e-300, 6]] as const) {
      expect(precision(v, d)).toBe(v.toPrecision(d));
    }
  });
  it('writeInteger gives the bytes of String(v), −0 as "0", beyond 2⁵³ through String', () => {
    for (const v of [0, -0, 7, -42, 123456789012345, 2 ** 53 - 1, -(2 ** 53 - 1), 2 ** 53, 1e21]) expect(integer(v)).toBe(String(v));
    const rng = seededRandom(13, 'numberBytes-int');
    for (let i = 0; i < 100_000; i++) {
      const v = Math.floor((rng.uniform() - 0.5) * 2 ** (54 * rng.uniform()));
      if (integer(v) !== String(v)) expect(integer(v)).toBe(String(v));
    }
  });
});

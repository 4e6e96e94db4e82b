import { describe, expect, it } from 'vitest';
import { msg } from '../../lib/errors.js';
import { breitWigner, customShape, exponential, gaussian, isShape, michelSpectrum, polynomial, sumShapes, voigt, type Shape } from '../../lib/analysis/index.js';

// Every shape's exact bin integral against a numerical integral of its own value (composite
// Gauss–Legendre, 5 points on 400 panels, written here: exact to rounding for these smooth
// functions), each read from a parameter vector at an offset (as sums of shapes read them), and
// the normalisations of the definitions (area = integral over all x; common practice).
const G5 = [[-0.9061798459386640, 0.2369268850561891], [-0.5384693101056831, 0.4786286704993665], [0, 0.5688888888888889], [0.5384693101056831, 0.4786286704993665], [0.9061798459386640, 0.2369268850561891]];
function quad(f: (x: number) => number, a: number, b: number, panels = 400): number {
  let s = 0;
  const h = (b - a) / panels;
  for (let k = 0; k < panels; k++) {
    const c = a + (k + 0.5) * h;
    for (const [x, w] of G5) s += w * f(c + 0.5 * h * x);
  }
  return 0.5 * h * s;
}

const AT = 3; // the shape's parameters start at index 3 of the vector
const at = (p: number[]) => Float64Array.from([7, -7, 7, ...p, 9]);

const cases: [string, Shape, number[], [number, number][]][] = [
  ['gaussian', gaussian(), [120, 1.5, 0.4], [[1.0, 1.2], [1.4, 1.7], [1.9, 2.3], [-1, 0], [3.5, 4], [-10, 10], [-2, -1.8], [4.8, 5.2]]],
  ['Breit–Wigner', breitWigner(), [80, 0.9, 0.15], [[0.8, 0.85], [0.85, 1.0], [1.2, 2], [-3, 0], [400, 401], [-401, -400]]],
  ['exponential (origin 2)', exponential({ origin: 2 }), [5, -0.7], [[2, 3], [0, 1], [4, 9]]],
  ['polynomial of degree 2 (origin 1)', polynomial(2, { origin: 1 }), [3, -2, 0.5], [[0, 1], [1, 4], [-2, 0.5]]],
  ['Michel spectrum', michelSpectrum(), [1000, 52.83], [[0, 10], [20, 40], [45, 52.83], [50, 60], [-5, 0], [60, 70]]],
  ['gaussian + flat', sumShapes({ peak: gaussian(), flat: polynomial(0) }), [50, 0, 1, 2], [[-1, 1], [0.5, 3]]],
];

describe('shapes: exact bin integrals and their parameter offsets', () => {
  for (const [name, shape, p, intervals] of cases) {
    it(`${name}: integral(a, b) equals ∫ value over ${intervals.length} intervals (near, across and far from the peak) to 1e-12`, () => {
      const v = at(p);
      for (const [a, b] of intervals) {
        const exact = shape.integral!(a, b, v, AT);
        // Split at the Michel spectrum's ends (its value jumps to 0 there); harmless for the others.
        const cuts = [a, ...[0, 52.83].filter((c) => c > a && c < b), b];
        let numeric = 0;
        for (let k = 1; k < cuts.length; k++) numeric += quad((x) => shape.value(x, v, AT), cuts[k - 1], cuts[k]);
        expect(Math.abs(exact - numeric), `[${a}, ${b}]`).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(numeric)));
        // The same at offset 0.
        expect(shape.integral!(a, b, p)).toBeCloseTo(exact, 12);
        expect(shape.value(0.5 * (a + b), p)).toBe(shape.value(0.5 * (a + b), v, AT));
      }
    });
  }
  it('areas: the peaks and the Michel spectrum integrate to their area over all x; the Voigt\'s numerical integral too', () => {
    expect(gaussian().integral!(-50, 50, [120, 1.5, 0.4])).toBeCloseTo(120, 10);
    expect(michelSpectrum().integral!(0, 52.83, [1000, 52.83])).toBeCloseTo(1000, 9);
    // Breit–Wigner: ∫ over ±L about the peak is area·(2/π)·atan(2L/Γ) (closed form).
    expect(breitWigner().integral!(0.9 - 10, 0.9 + 10, [80, 0.9, 0.15])).toBeCloseTo(80 * (2 / Math.PI) * Math.atan(20 / 0.15), 9);
    expect(quad((x) => voigt().value(x, [10, 0, 0.5, 0.3]), -2000, 2000, 40000)).toBeCloseTo(10 * (2 / Math.PI) * Math.atan(4000 / 0.3), 4);
    expect(quad((x) => voigt().value(x, at([10, 0.2, 0.5, 0]), AT), -8, 8)).toBeCloseTo(10, 10); // width 0: a Gaussian
  });
  it('bad widths and endpoints give NaN (value and integral), a zero-width Voigt is allowed', () => {
    for (const [shape, p] of [[gaussian(), [1, 0, 0]], [gaussian(), [1, 0, -1]], [breitWigner(), [1, 0, 0]], [michelSpectrum(), [1, 0]], [michelSpectrum(), [1, -5]]] as const) {
      expect(shape.value(0.5, p)).toBeNaN();
      expect(shape.integral!(0, 1, p)).toBeNaN();
    }
    expect(voigt().value(0, [1, 0, 0, 1])).toBeNaN();
    expect(voigt().value(0, [1, 0, 1, -0.1])).toBeNaN();
    expect(voigt().value(0, [1, 0, 1, 0])).toBeCloseTo(1 / Math.sqrt(2 * Math.PI), 13);
    expect(voigt().integral).toBeUndefined();
    expect(sumShapes({ a: gaussian(), b: voigt() }).integral).toBeUndefined();
  });
  it('names and parameter names as documented; polynomial degrees 0–20 only', () => {
    expect([gaussian().name, breitWigner().name, voigt().name, michelSpectrum().name, polynomial(2).name]).toEqual(['gaussian', 'Breit–Wigner', 'Voigt', 'Michel spectrum', 'polynomial of degree 2']);
    expect([breitWigner().parameters, polynomial(2).parameters, exponential().parameters]).toEqual([['area', 'peak', 'width'], ['c0', 'c1', 'c2'], ['norm', 'slope']]);
    expect(sumShapes({ peak: gaussian(), flat: polynomial(0) }).parameters).toEqual(['peak.area', 'peak.mean', 'peak.sigma', 'flat.c0']);
    expect(polynomial(0).parameters).toEqual(['c0']);
    expect(polynomial(20).parameters.length).toBe(21);
    for (const d of [-1, 1.5, 21, NaN]) expect(() => polynomial(d)).toThrow(msg.badArgument('degree', d, 'a whole number from 0 to 20').message);
    // A zero width is refused by the integral too (the peak inside the bin would otherwise give the whole area).
    expect(breitWigner().integral!(0, 1, [1, 0.5, 0])).toBeNaN();
  });
  it('isShape tells shapes from plain functions; customShape keeps an integral only when given; a sum names its parts; a flat exponential integrates to norm × width', () => {
    const f = (x: number) => x;
    expect([isShape(gaussian()), isShape(f as never), isShape({ value: f, parameters: [] } as never), isShape({ value: 1, parameters: [] } as never), isShape({ value: f, parameters: 'ab' } as never), isShape(null as never)]).toEqual([true, false, true, false, false, false]);
    const plain = customShape('line', ['k'], (x, p, at = 0) => p[at] * x);
    const exact = customShape('line', ['k'], (x, p, at = 0) => p[at] * x, (a, b, p, at = 0) => 0.5 * p[at] * (b * b - a * a));
    expect(['integral' in plain, exact.integral!(0, 2, [3]), plain.name, plain.parameters]).toEqual([false, 6, 'line', ['k']]);
    expect(sumShapes({ peak: gaussian(), flat: polynomial(0) }).name).toBe('peak: gaussian + flat: polynomial of degree 0');
    expect(() => sumShapes({})).toThrow(msg.badArgument('parts', {}, 'at least one named shape, e.g. { peak: gaussian(), background: exponential() }').message);
    expect(exponential().name).toBe('exponential');
    expect(exponential({ origin: 2 }).integral!(3, 4.5, [5, 0])).toBeCloseTo(7.5, 13);
  });
});

import { msg } from '../../errors.js';
import type { Shape } from './shape.js';

/**
 * The sum of named shapes, e.g. a peak on a background. Parameters are the parts' parameters
 * prefixed with the part's name, in the order given: sumShapes({ peak: gaussian(), background:
 * exponential() }) has [peak.area, peak.mean, peak.sigma, background.norm, background.slope].
 * The integral is exact when every part has one.
 * @example sumShapes({ peak: gaussian(), flat: polynomial(0) }).parameters.length // 4
 */
export function sumShapes(parts: Readonly<Record<string, Shape>>): Shape {
  const names = Object.keys(parts);
  if (names.length === 0) throw msg.badArgument('parts', parts, 'at least one named shape, e.g. { peak: gaussian(), background: exponential() }');
  const shapes = names.map((n) => parts[n]);
  const offsets = new Int32Array(shapes.length);
  const parameters: string[] = [];
  shapes.forEach((s, i) => {
    offsets[i] = parameters.length;
    for (const q of s.parameters) parameters.push(`${names[i]}.${q}`);
  });
  const exact = shapes.every((s) => typeof s.integral === 'function');
  const sum: Shape = {
    name: names.map((n, i) => `${n}: ${shapes[i].name}`).join(' + '),
    parameters: Object.freeze(parameters),
    value(x: number, p: ArrayLike<number>, at = 0): number {
      let v = 0;
      for (let i = 0; i < shapes.length; i++) v += shapes[i].value(x, p, at + offsets[i]);
      return v;
    },
    ...(exact ? {
      integral(a: number, b: number, p: ArrayLike<number>, at = 0): number {
        let v = 0;
        for (let i = 0; i < shapes.length; i++) v += shapes[i].integral!(a, b, p, at + offsets[i]);
        return v;
      },
    } : {}),
  };
  return Object.freeze(sum);
}

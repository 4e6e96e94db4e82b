import { seededRandom } from '../../lib/simulate/rng.js';

/** Seeded standard-normal generator for tests (the library's seeded stream). */
export function gaussian(seed: number): () => number {
  const rng = seededRandom(seed, 'test');
  return () => rng.gaussian();
}

/**
 * Points on a circle (centre, radius R) starting at angle a0 and turning by `span` radians
 * (positive: counter-clockwise), n equally spaced, in travel order.
 */
export function arc(xc: number, yc: number, R: number, a0: number, span: number, n: number): { x: Float64Array; y: Float64Array } {
  const x = new Float64Array(n), y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const a = a0 + (span * i) / (n - 1);
    x[i] = xc + R * Math.cos(a);
    y[i] = yc + R * Math.sin(a);
  }
  return { x, y };
}

import { msg } from '../errors.js';

/** Counts of values in equal-width bins. `edges` has one more entry than `counts`. */
export interface BinnedCounts {
  readonly edges: Float64Array;
  readonly counts: Float64Array;
  /** Finite values outside [edges[0], edges[last]]. */
  readonly outside: number;
  /** NaN and ±Infinity values, which are never counted. */
  readonly nonFinite: number;
}

/**
 * Counts `values` in equal-width bins (the last bin includes its upper edge).
 * @example binCounts([0, 1, 1, 2], 2, [0, 2]) // counts [1, 3]
 */
export function binCounts(values: ArrayLike<number>, bins: number, range?: readonly [number, number]): BinnedCounts {
  if (!Number.isInteger(bins) || bins < 1) throw msg.badArgument('bins', bins, 'a whole number ≥ 1');
  let lo = Infinity, hi = -Infinity, nonFinite = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v)) { nonFinite++; continue; }
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (range) [lo, hi] = range;
  if (!Number.isFinite(lo) || !Number.isFinite(hi) || hi < lo) throw msg.badArgument('range', range ?? [lo, hi], 'finite [low, high] with low ≤ high (or values with at least one finite entry)');
  if (hi === lo) { lo -= 0.5; hi += 0.5; }
  const edges = new Float64Array(bins + 1);
  const width = (hi - lo) / bins;
  for (let k = 0; k <= bins; k++) edges[k] = lo + k * width;
  edges[bins] = hi;
  const counts = new Float64Array(bins);
  let outside = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    if (v < lo || v > hi) { outside++; continue; }
    counts[Math.min(bins - 1, Math.floor((v - lo) / width))]++;
  }
  return { edges, counts, outside, nonFinite };
}

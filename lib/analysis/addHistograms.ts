import { msg } from '../errors.js';
import { Histogram } from './histogram.js';

/**
 * The bin-by-bin sum of histograms with identical edges (every edge bit-for-bit equal): Σw,
 * Σw², under- and overflow, non-finite and entry counts all add. For unweighted counts the sum
 * is exact, so shards filled separately and added equal one fill of all the values.
 * @example addHistograms(shardA, shardB, shardC)
 */
export function addHistograms(first: Histogram, ...rest: readonly Histogram[]): Histogram {
  let edges = first.edges;
  const sumW = Float64Array.from(first.sumW);
  let sumW2: Float64Array | undefined;
  let underflow = first.underflow, overflow = first.overflow, nonFinite = first.nonFinite, entries = first.entries;
  let unitWeight = first.unitWeight;
  const weighted = [first, ...rest].some((h) => h.unitWeight !== first.unitWeight);
  if (weighted) sumW2 = Float64Array.from(first.sumW2);
  for (const h of rest) {
    if (h.edges.length !== edges.length || h.edges.some((e, k) => e !== edges[k])) {
      throw msg.badArgument('histogram edges', `${h.bins} bins over [${h.edges[0]}, ${h.edges[h.bins]}]`, `the same edges as the first histogram (${first.bins} bins over [${edges[0]}, ${edges[first.bins]}])`);
    }
    for (let k = 0; k < sumW.length; k++) sumW[k] += h.sumW[k];
    if (sumW2) { const w2 = h.sumW2; for (let k = 0; k < sumW2.length; k++) sumW2[k] += w2[k]; }
    underflow += h.underflow; overflow += h.overflow; nonFinite += h.nonFinite; entries += h.entries;
    if (h.unitWeight !== unitWeight) unitWeight = NaN;
  }
  edges = Float64Array.from(edges);
  return Histogram.fromParts({ edges, sumW, sumW2, underflow, overflow, nonFinite, entries, unitWeight });
}

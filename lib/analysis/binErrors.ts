import { msg } from '../errors.js';
import type { Histogram } from './histogram.js';
import { ONE_SIGMA_CL, poissonInterval } from './poissonInterval.js';

/** Error bars of each bin, as distances below and above the bin content (both ≥ 0). */
export interface BinErrors {
  readonly lower: Float64Array;
  readonly upper: Float64Array;
}

export interface BinErrorOptions {
  /**
   * `exact` (default): Garwood's exact Poisson interval for count histograms (`poissonInterval`;
   * asymmetric, and non-zero above an empty bin); `sqrt`: ±√Σw². Weighted histograms always get √Σw².
   */
  readonly kind?: 'exact' | 'sqrt';
  /** Confidence level of the exact interval; default that of ±1σ (0.6827). */
  readonly cl?: number;
}

/**
 * Error bars for every bin of `h`. For counts (every entry of the same weight u), the exact
 * interval of n = Σw/u scaled by u; otherwise √Σw² both ways (the usual approximation for a
 * sum of weights; it understates the error of bins with few entries).
 * @example binErrors(h).upper[k] // 1.841 for an empty count bin
 */
export function binErrors(h: Histogram, options: BinErrorOptions = {}): BinErrors {
  const kind = options.kind ?? 'exact';
  if (kind !== 'exact' && kind !== 'sqrt') throw msg.badArgument('kind', kind, "'exact' or 'sqrt'");
  const cl = options.cl ?? ONE_SIGMA_CL;
  const n = h.bins;
  const lower = new Float64Array(n), upper = new Float64Array(n);
  if (kind === 'exact' && h.isCounts && h.unitWeight !== 0) {
    const u = Math.abs(h.unitWeight);
    const cache = new Map<number, { lower: number; upper: number }>();
    for (let k = 0; k < n; k++) {
      const count = Math.round(h.sumW[k] / h.unitWeight);
      let iv = cache.get(count);
      if (!iv) { iv = poissonInterval(count, cl); cache.set(count, iv); }
      lower[k] = (count - iv.lower) * u;
      upper[k] = (iv.upper - count) * u;
    }
    return { lower, upper };
  }
  const w2 = h.sumW2;
  for (let k = 0; k < n; k++) lower[k] = upper[k] = Math.sqrt(w2[k]);
  return { lower, upper };
}

import { msg } from '../errors.js';
import { Figure, baseLayout } from './figure.js';
import { SERIES_COLOURS } from './palette.js';

/** Counts of values in equal-width bins. `edges` has one more entry than `counts`. */
export interface BinnedCounts {
  readonly edges: Float64Array;
  readonly counts: Float64Array;
  /** Finite values outside [edges[0], edges[last]]. */
  readonly outside: number;
  /** NaN and ±Infinity values, which are never counted. */
  readonly nonFinite: number;
}

export interface HistogramOptions {
  /** Number of bins; default by Sturges' rule, ⌈log₂ n⌉ + 1 (Sturges, JASA 21 (1926) 65; common practice). */
  readonly bins?: number;
  /** [low, high] of the binned range in the values' unit; default the finite minimum and maximum. */
  readonly range?: readonly [number, number];
  readonly title?: string;
  /** Axis title, with the unit, e.g. 'p [GeV/c]'. */
  readonly xTitle?: string;
  readonly yTitle?: string;
  /** Legend name of the series. */
  readonly name?: string;
}

const DEFAULTS = Object.freeze({ title: '', xTitle: 'value', yTitle: 'entries per bin', name: 'entries' });

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

/**
 * A histogram figure of `values` (bars at bin centres, widths equal to the bins; counts are
 * computed here, so the figure shows exactly the numbers a test can check).
 * @example histogramFigure(momentaGeV, { title: 'Track momenta', xTitle: 'p [GeV/c]' })
 */
export function histogramFigure(values: ArrayLike<number>, options: HistogramOptions = {}): Figure {
  const o = { ...DEFAULTS, ...options };
  let finite = 0;
  for (let i = 0; i < values.length; i++) if (Number.isFinite(values[i])) finite++;
  const bins = o.bins ?? Math.max(1, Math.ceil(Math.log2(Math.max(1, finite))) + 1);
  const h = binCounts(values, bins, o.range);
  const centres: number[] = [], widths: number[] = [];
  for (let k = 0; k < bins; k++) {
    centres.push((h.edges[k] + h.edges[k + 1]) / 2);
    widths.push(h.edges[k + 1] - h.edges[k]);
  }
  const layout = baseLayout(o.title, o.xTitle, o.yTitle);
  const notes: string[] = [];
  if (h.outside > 0) notes.push(`${h.outside} outside range`);
  if (h.nonFinite > 0) notes.push(`${h.nonFinite} not finite`);
  if (notes.length > 0) {
    layout.annotations = [{ text: notes.join(', '), xref: 'paper', yref: 'paper', x: 1, y: 1, xanchor: 'right', yanchor: 'top', showarrow: false, font: { size: 11 } }];
  }
  return new Figure({
    data: [{
      type: 'bar',
      name: o.name,
      x: centres,
      y: Array.from(h.counts),
      width: widths,
      marker: { color: SERIES_COLOURS[0], line: { color: '#ffffff', width: 0.5 } },
      hovertemplate: '%{x:.4g}: %{y}<extra></extra>',
    }],
    layout,
  });
}

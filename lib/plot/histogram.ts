import { binCounts } from '../analysis/binCounts.js';
import { Figure, baseLayout } from './figure.js';
import { SERIES_COLOURS } from './palette.js';

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

import { Figure, baseLayout, plainNumbers, type PlotTrace } from './figure.js';
import { SERIES_COLOURS } from './palette.js';

/** One series of an x–y figure; values in the units named by the axis titles. */
export interface XYSeries {
  readonly x: ArrayLike<number>;
  readonly y: ArrayLike<number>;
  /** Symmetric 1σ error bars on y, same unit as y. */
  readonly yError?: ArrayLike<number>;
  readonly name?: string;
  /** 'points' (markers), 'line' or 'both'; default 'points'. */
  readonly style?: 'points' | 'line' | 'both';
}

export interface XYOptions {
  readonly title?: string;
  readonly xTitle?: string;
  readonly yTitle?: string;
  /** 'log' for a logarithmic axis (e.g. range against energy). */
  readonly xScale?: 'linear' | 'log';
  readonly yScale?: 'linear' | 'log';
}

/**
 * A scatter or line figure of one or more series (e.g. measured momentum against true momentum,
 * a range–energy curve).
 * @example xyFigure([{ x: pTrue, y: pFit, name: 'fit' }], { xTitle: 'p true [GeV/c]', yTitle: 'p fit [GeV/c]' })
 */
export function xyFigure(series: readonly XYSeries[], options: XYOptions = {}): Figure {
  const layout = baseLayout(options.title ?? '', options.xTitle ?? 'x', options.yTitle ?? 'y');
  if (options.xScale === 'log') (layout.xaxis as Record<string, unknown>).type = 'log';
  if (options.yScale === 'log') (layout.yaxis as Record<string, unknown>).type = 'log';
  const data: PlotTrace[] = series.map((s, i) => {
    const colour = SERIES_COLOURS[i % SERIES_COLOURS.length];
    const style = s.style ?? 'points';
    const trace: PlotTrace = {
      type: 'scatter',
      name: s.name ?? `series ${i + 1}`,
      mode: style === 'points' ? 'markers' : style === 'line' ? 'lines' : 'lines+markers',
      x: plainNumbers(s.x),
      y: plainNumbers(s.y),
      marker: { color: colour, size: 6 },
      line: { color: colour, width: 2 },
    };
    if (s.yError) trace.error_y = { type: 'data', array: plainNumbers(s.yError), visible: true, color: colour, thickness: 1 };
    return trace;
  });
  return new Figure({ data, layout });
}

import { Figure, baseLayout, plainNumbers, type PlotTrace } from './figure.js';
import { legendMargin, logAxisRange } from './axisRange.js';
import { seriesStyle } from './palette.js';

/** One series of an x–y figure; values in the units named by the axis titles. */
export interface XYSeries {
  readonly x: ArrayLike<number>;
  readonly y: ArrayLike<number>;
  /** Symmetric 1σ error bars on y, same unit as y. */
  readonly yError?: ArrayLike<number>;
  readonly name?: string;
  /** 'points' (markers), 'line' or 'both'; default 'points'. */
  readonly style?: 'points' | 'line' | 'both';
  /** Override the series' default colour, marker symbol or line dash (plotly names). */
  readonly colour?: string;
  readonly marker?: string;
  readonly dash?: string;
}

export interface XYOptions {
  readonly title?: string;
  readonly xTitle?: string;
  readonly yTitle?: string;
  /** 'log' for a logarithmic axis (e.g. range against energy); values ≤ 0 are left out of that series and counted in a note. */
  readonly xScale?: 'linear' | 'log';
  readonly yScale?: 'linear' | 'log';
  /** Axis ranges in data units (also for log axes). */
  readonly xRange?: readonly [number, number];
  readonly yRange?: readonly [number, number];
}

/**
 * A scatter or line figure of one or more series (e.g. measured momentum against true momentum,
 * a range–energy curve). Each series has its own colour, marker and dash (`seriesStyle`), so
 * even many series stay apart in colour and in grey print. The legend sits under the plot.
 * @example xyFigure([{ x: pTrue, y: pFit, name: 'fit' }], { xTitle: 'p true [GeV/c]', yTitle: 'p fit [GeV/c]' })
 */
export function xyFigure(series: readonly XYSeries[], options: XYOptions = {}): Figure {
  const layout = baseLayout(options.title ?? '', options.xTitle ?? 'x', options.yTitle ?? 'y');
  const xLog = options.xScale === 'log', yLog = options.yScale === 'log';
  let hidden = 0;
  const data: PlotTrace[] = series.map((s, i) => {
    const base = seriesStyle(i);
    const colour = s.colour ?? base.colour;
    const style = s.style ?? 'points';
    const x = plainNumbers(s.x), y = plainNumbers(s.y);
    for (let k = 0; k < x.length; k++) {
      if ((xLog && !((x[k] ?? 0) > 0)) || (yLog && !((y[k] ?? 0) > 0))) { if (x[k] !== null && y[k] !== null) hidden++; x[k] = null; y[k] = null; }
    }
    const trace: PlotTrace = {
      type: 'scatter',
      name: s.name ?? `series ${i + 1}`,
      mode: style === 'points' ? 'markers' : style === 'line' ? 'lines' : 'lines+markers',
      x, y,
      marker: { color: colour, size: 6, symbol: s.marker ?? base.marker },
      line: { color: colour, width: 2, dash: s.dash ?? base.dash },
    };
    if (s.yError) trace.error_y = { type: 'data', array: plainNumbers(s.yError), visible: true, color: colour, thickness: 1 };
    return trace;
  });
  const xaxis = layout.xaxis as Record<string, unknown>, yaxis = layout.yaxis as Record<string, unknown>;
  if (xLog) { xaxis.type = 'log'; xaxis.range = options.xRange ? options.xRange.map(Math.log10) : logAxisRange(data.flatMap((t) => t.x as (number | null)[]).map((v) => v ?? NaN), 1.2); }
  else if (options.xRange) xaxis.range = [...options.xRange];
  if (yLog) { yaxis.type = 'log'; yaxis.range = options.yRange ? options.yRange.map(Math.log10) : logAxisRange(data.flatMap((t) => t.y as (number | null)[]).map((v) => v ?? NaN), 1.5); }
  else if (options.yRange) yaxis.range = [...options.yRange];
  if (hidden > 0) {
    layout.annotations = [{ text: `${hidden} point${hidden === 1 ? '' : 's'} ≤ 0 not shown on the log axis`, xref: 'paper', yref: 'paper', x: 1, y: 1, xanchor: 'right', yanchor: 'bottom', showarrow: false, font: { size: 11 } }];
  }
  (layout.margin as Record<string, number>).b = legendMargin(data.map((t) => String(t.name))).marginBottom;
  return new Figure({ data, layout });
}

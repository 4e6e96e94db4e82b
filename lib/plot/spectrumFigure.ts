import { binErrors, type BinErrorOptions } from '../analysis/binErrors.js';
import { binIntegrator } from '../analysis/binIntegral.js';
import { binResidual, type BinnedMethod } from '../analysis/fitHistogram.js';
import type { FitResult } from '../analysis/fitResult.js';
import type { Histogram } from '../analysis/histogram.js';
import { isShape, type Model } from '../analysis/shapes/shape.js';
import { msg } from '../errors.js';
import { legendMargin, logAxisRange } from './axisRange.js';
import { Figure, axisStyle, baseLayout, type PlotTrace } from './figure.js';
import { PALETTE, seriesStyle } from './palette.js';

export interface SpectrumFigureOptions {
  readonly title?: string;
  /** x-axis title with its unit, e.g. 'p [MeV/c]'. */
  readonly xTitle?: string;
  /** Default 'entries per bin' (equal bins) or 'entries per unit x' (variable bins, drawn as densities). */
  readonly yTitle?: string;
  /** Legend name of the data; default 'data'. */
  readonly name?: string;
  /** A fit of `model` to this histogram (fitHistogram): draws the model and the pull panel. */
  readonly fit?: FitResult;
  readonly model?: Model;
  /** Legend name of the model curve; default 'fit'. */
  readonly fitName?: string;
  /** The range the fit used (default the whole histogram): the curve and the pulls are drawn there. */
  readonly range?: readonly [number, number];
  /** Lower panel: 'pulls' (default with a fit) — the signed bin contributions whose squares sum to the fit's χ² — 'residuals' (n − μ) or 'none'. */
  readonly panel?: 'pulls' | 'residuals' | 'none';
  readonly yScale?: 'linear' | 'log';
  readonly xRange?: readonly [number, number];
  /** y range in data units (also for a log axis). */
  readonly yRange?: readonly [number, number];
  /** Error bars (default exact Poisson intervals for counts, see binErrors). */
  readonly errors?: BinErrorOptions;
  /** Number of points of the model curve; default 400. */
  readonly curvePoints?: number;
}

/**
 * A spectrum: the histogram's bins as points with error bars (exact Poisson intervals for
 * counts, so empty and sparse bins are honest), the fitted model as a curve, and a pull panel
 * underneath sharing the x axis. On a log y axis, empty bins are drawn as their 1σ upper limit
 * (open down-pointing triangles) and the range is set from the positive contents. Every number
 * a test needs sits in the spec: the points, the curve, the pulls (whose squares add up to the
 * fit's χ²), the axis ranges. Plain plotly traces only: scatter with error_y, lines, bars, two
 * y axes by domain.
 * @example spectrumFigure(h, { fit, model, xTitle: 'p [MeV/c]', title: 'Beam momentum' })
 */
export function spectrumFigure(h: Histogram, options: SpectrumFigureOptions = {}): Figure {
  const fitted = options.fit !== undefined && options.model !== undefined;
  if (options.fit !== undefined && options.model === undefined) throw msg.badArgument('model', undefined, 'the model that was fitted, to draw a fit');
  const panel = fitted ? options.panel ?? 'pulls' : 'none';
  const widths = h.widths(), centres = h.centres();
  const uniform = widths.every((w) => Math.abs(w - widths[0]) <= 1e-9 * widths[0]);
  const perX = (k: number) => (uniform ? 1 : 1 / widths[k]); // content → plotted value
  const log = options.yScale === 'log';
  const err = binErrors(h, options.errors);
  const layout = baseLayout(options.title ?? '', panel === 'none' ? options.xTitle ?? 'x' : '', options.yTitle ?? (uniform ? 'entries per bin' : 'entries per unit x'));
  const data: PlotTrace[] = [];
  const dataStyle = seriesStyle(4); // ink points: data in black, models in colour
  const x: (number | null)[] = [], y: (number | null)[] = [], up: number[] = [], down: number[] = [];
  const limitX: number[] = [], limitY: number[] = [];
  for (let k = 0; k < h.bins; k++) {
    const v = h.sumW[k] * perX(k);
    if (log && !(v > 0)) {
      x.push(null); y.push(null); up.push(0); down.push(0);
      if (h.sumW[k] === 0 && err.upper[k] > 0) { limitX.push(centres[k]); limitY.push(err.upper[k] * perX(k)); }
      continue;
    }
    x.push(centres[k]); y.push(v); up.push(err.upper[k] * perX(k)); down.push(err.lower[k] * perX(k));
  }
  data.push({
    type: 'scatter', mode: 'markers', name: options.name ?? 'data', x, y,
    marker: { color: dataStyle.colour, size: 5, symbol: 'circle' },
    error_y: { type: 'data', symmetric: false, array: up, arrayminus: down, visible: true, color: dataStyle.colour, thickness: 1, width: 0 },
    hovertemplate: '%{x:.4g}: %{y:.4g}<extra></extra>',
  });
  if (limitX.length > 0) {
    data.push({ type: 'scatter', mode: 'markers', name: 'empty bins (1σ upper limit)', x: limitX, y: limitY, marker: { color: PALETTE.muted, size: 7, symbol: 'triangle-down-open' } });
  }
  const [lo, hi] = options.range ?? [h.edges[0], h.edges[h.bins]];
  let pullValues: (number | null)[] = [];
  if (fitted) {
    const fit = options.fit!, model = options.model!;
    const p = Float64Array.from(fit.values);
    const f = isShape(model) ? (v: number) => model.value(v, p, 0) : (v: number) => model(v, p);
    const n = Math.max(2, options.curvePoints ?? 400);
    const cx: number[] = [], cy: (number | null)[] = [];
    for (let i = 0; i < n; i++) {
      const xv = lo + ((hi - lo) * i) / (n - 1);
      const yv = f(xv) * (uniform ? widths[0] : 1);
      cx.push(xv); cy.push(log && !(yv > 0) ? null : yv);
    }
    const style = seriesStyle(0);
    const goodness = Number.isFinite(fit.chi2) ? `: χ²/ndf = ${fit.chi2.toFixed(1)}/${fit.ndf}${fit.method === 'poisson' ? ' (Baker–Cousins)' : ''}${Number.isFinite(fit.pValue) ? `, p = ${fit.pValue.toPrecision(2)}` : ''}` : '';
    data.push({ type: 'scatter', mode: 'lines', name: `${options.fitName ?? 'fit'}${goodness}`, x: cx, y: cy, line: { color: style.colour, width: 2, dash: style.dash } });
    if (panel !== 'none') pullValues = binPulls(h, model, p, fit.method, [lo, hi], panel);
  }
  const yaxis = layout.yaxis as Record<string, unknown>;
  if (log) {
    yaxis.type = 'log';
    yaxis.range = options.yRange ? options.yRange.map(Math.log10) : logAxisRange([...y.map((v, k) => (v ?? NaN) - down[k]), ...y.map((v, k) => (v ?? NaN) + up[k]), ...limitY], 1.6);
    const decades = (yaxis.range as number[])[1] - (yaxis.range as number[])[0];
    if (decades > 2) yaxis.dtick = 1; // one label per decade
  } else if (options.yRange) yaxis.range = [...options.yRange];
  const xaxis = layout.xaxis as Record<string, unknown>;
  xaxis.range = options.xRange ? [...options.xRange] : [h.edges[0], h.edges[h.bins]];
  if (panel !== 'none') {
    yaxis.domain = [0.34, 1];
    xaxis.showticklabels = false;
    xaxis.anchor = 'y';
    layout.xaxis2 = { ...axisStyle(options.xTitle ?? 'x'), anchor: 'y2', matches: 'x', range: xaxis.range };
    const finitePulls = pullValues.filter((v): v is number => v !== null);
    const extent = Math.max(3, ...finitePulls.map((v) => Math.ceil(Math.abs(v))));
    layout.yaxis2 = { ...axisStyle(panel === 'pulls' ? 'pull' : 'n − μ'), domain: [0, 0.24], anchor: 'x2', range: panel === 'pulls' ? [-extent, extent] : undefined, zeroline: true, zerolinecolor: PALETTE.muted };
    data.push({ type: 'bar', name: panel === 'pulls' ? 'pulls' : 'residuals', x: Array.from(centres), y: pullValues, xaxis: 'x2', yaxis: 'y2', width: Array.from(widths, (w) => 0.9 * w), marker: { color: PALETTE.slate }, showlegend: false });
    if (panel === 'pulls') {
      layout.shapes = [-2, 2].map((level) => ({ type: 'line', xref: 'x2 domain', x0: 0, x1: 1, yref: 'y2', y0: level, y1: level, line: { color: PALETTE.muted, width: 1, dash: 'dot' } }));
    }
  }
  const notes: string[] = [];
  if (h.underflow > 0 || h.overflow > 0) notes.push(`underflow ${fmt(h.underflow)}, overflow ${fmt(h.overflow)}`);
  if (h.nonFinite > 0) notes.push(`${h.nonFinite} not finite`);
  if (notes.length > 0) layout.annotations = [{ text: notes.join('; '), xref: 'paper', yref: 'paper', x: 1, y: 1, xanchor: 'right', yanchor: 'bottom', showarrow: false, font: { size: 11, color: PALETTE.muted } }];
  (layout.margin as Record<string, number>).b = legendMargin(data.filter((t) => t.showlegend !== false).map((t) => String(t.name))).marginBottom;
  return new Figure({ data, layout });
}

const fmt = (v: number) => (Number.isInteger(v) ? String(v) : v.toPrecision(4));

/**
 * Per bin inside `range`: the signed residual whose square is the bin's contribution to the
 * fit's objective (deviance residual for poisson, (n − μ)/σ for the χ² methods), or n − μ; null
 * outside the range. For weighted histograms, (Σw − μ)/√Σw².
 */
function binPulls(h: Histogram, model: Model, p: Float64Array, method: FitResult['method'], range: readonly [number, number], panel: 'pulls' | 'residuals'): (number | null)[] {
  const integral = binIntegrator(model);
  const binned: BinnedMethod = method === 'neyman' || method === 'pearson' ? method : 'poisson';
  const out: (number | null)[] = [];
  const w2 = h.sumW2;
  for (let k = 0; k < h.bins; k++) {
    if (h.edges[k] < range[0] || h.edges[k + 1] > range[1]) { out.push(null); continue; }
    const mu = integral(h.edges[k], h.edges[k + 1], p);
    if (panel === 'residuals') { out.push(h.sumW[k] - mu); continue; }
    if (h.isCounts) { const u = Math.abs(h.unitWeight) || 1; out.push(binResidual(binned, h.sumW[k] / u, mu / u)); }
    else out.push(w2[k] > 0 ? (h.sumW[k] - mu) / Math.sqrt(w2[k]) : null);
  }
  return out;
}

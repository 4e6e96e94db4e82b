import type { Histogram2D } from '../analysis/histogram2d.js';
import { Figure, baseLayout } from './figure.js';
import { DENSITY_SCALE, PALETTE } from './palette.js';

export interface Histogram2DFigureOptions {
  readonly title?: string;
  readonly xTitle?: string;
  readonly yTitle?: string;
  /** Colour-bar title; default 'entries per cell'. */
  readonly zTitle?: string;
  /** 'log' colours by log₁₀ of the content (empty cells left blank); default 'linear'. */
  readonly zScale?: 'linear' | 'log';
}

/**
 * A 2-D histogram as a heatmap: cell centres on x and y, contents in `z` (rows by y, as plotly
 * reads them), empty cells blank (null) so the plot background shows where nothing fell, our
 * own paper-to-ink colour scale, and a note of the entries outside the grid.
 * @example histogram2dFigure(h2, { xTitle: 'x [cm]', yTitle: 'y [cm]', title: 'Vertex positions' })
 */
export function histogram2dFigure(h: Histogram2D, options: Histogram2DFigureOptions = {}): Figure {
  const log = options.zScale === 'log';
  const cx = Array.from({ length: h.xBins }, (_, i) => 0.5 * (h.xEdges[i] + h.xEdges[i + 1]));
  const cy = Array.from({ length: h.yBins }, (_, j) => 0.5 * (h.yEdges[j] + h.yEdges[j + 1]));
  const z = cy.map((_, j) => cx.map((__, i) => {
    const v = h.at(i, j);
    return v === 0 ? null : log ? (v > 0 ? Math.log10(v) : null) : v;
  }));
  const layout = baseLayout(options.title ?? '', options.xTitle ?? 'x', options.yTitle ?? 'y');
  (layout.xaxis as Record<string, unknown>).range = [h.xEdges[0], h.xEdges[h.xBins]];
  (layout.yaxis as Record<string, unknown>).range = [h.yEdges[0], h.yEdges[h.yBins]];
  (layout.margin as Record<string, number>).b = 64;
  if (h.outside > 0 || h.nonFinite > 0) {
    layout.annotations = [{ text: `${h.outside} outside the grid${h.nonFinite ? `, ${h.nonFinite} not finite` : ''}`, xref: 'paper', yref: 'paper', x: 1, y: 1, xanchor: 'right', yanchor: 'bottom', showarrow: false, font: { size: 11, color: PALETTE.muted } }];
  }
  return new Figure({
    data: [{
      type: 'heatmap', name: 'entries', x: cx, y: cy, z,
      colorscale: DENSITY_SCALE.map(([a, c]) => [a, c]),
      colorbar: { title: { text: (log ? 'log₁₀ ' : '') + (options.zTitle ?? 'entries per cell') }, outlinecolor: PALETTE.muted },
      hoverongaps: false,
    }],
    layout,
  });
}

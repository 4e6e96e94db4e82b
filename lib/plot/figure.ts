import { asMime, type MimeBundle, type Presentable } from '../display.js';
import { PALETTE } from './palette.js';
import { figureSvg, type FigureSvgOptions } from './static/figureSvg.js';
import { svgToPng } from './static/svgToPng.js';

/** MIME type under which notebook front ends draw a plotly figure from its JSON. */
export const PLOTLY_MIME = 'application/vnd.plotly.v1+json';

/** One plotly trace (plain JSON data: arrays, not typed arrays). */
export type PlotTrace = Record<string, unknown> & { type: string; name?: string };

/** A plotly figure as JSON: what the report and front ends draw. */
export interface PlotSpec {
  readonly data: readonly PlotTrace[];
  readonly layout: Readonly<Record<string, unknown>>;
}

/** Height in pixels of the bottom margin with a one-row legend under the x-axis title. */
const LEGEND_MARGIN = 96;

/**
 * The layout every Sagitta figure starts from (our own look; callers add traces and axes).
 * The title sits in the top margin (container coordinates) and the legend in the bottom margin,
 * under the x-axis title, so a legend of any length never covers the title or the data; a
 * test checks both positions in the spec.
 */
export function baseLayout(title: string, xTitle: string, yTitle: string): Record<string, unknown> {
  return {
    title: { text: title, x: 0, xanchor: 'left', xref: 'paper', y: 1, yanchor: 'top', yref: 'container', pad: { t: 14 }, font: { size: 16, color: PALETTE.ink } },
    font: { family: 'Source Sans 3, Segoe UI, Helvetica, Arial, sans-serif', color: PALETTE.ink, size: 13 },
    paper_bgcolor: PALETTE.paper,
    plot_bgcolor: '#ffffff',
    margin: { l: 64, r: 24, t: 56, b: LEGEND_MARGIN },
    bargap: 0.04,
    xaxis: axisStyle(xTitle),
    yaxis: axisStyle(yTitle),
    legend: { orientation: 'h', x: 0.01, xanchor: 'left', xref: 'container', y: 0.01, yanchor: 'bottom', yref: 'container', bgcolor: 'rgba(0,0,0,0)' },
    height: 400,
  };
}

/** The look of one axis (title, grid, ticks). */
export function axisStyle(text: string): Record<string, unknown> {
  return {
    title: { text },
    gridcolor: PALETTE.grid,
    zerolinecolor: PALETTE.grid,
    linecolor: PALETTE.muted,
    ticks: 'outside',
    tickcolor: PALETTE.muted,
    mirror: true,
  };
}

/**
 * A figure: plotly JSON plus the notebook display methods. In a notebook it shows as an
 * interactive plot (`application/vnd.plotly.v1+json`); every bundle also carries our own static
 * rendering of the same spec — SVG, and PNG rasterised from it (a front end without the plotly
 * renderer, or one that hides SVG in a notebook it does not trust, shows the picture) — and plain
 * text naming what the figure holds, its notes included.
 */
export class Figure implements Presentable {
  readonly data: readonly PlotTrace[];
  readonly layout: Readonly<Record<string, unknown>>;

  constructor(spec: PlotSpec) {
    this.data = spec.data;
    this.layout = spec.layout;
  }

  /** The figure title, or '' when it has none. */
  get title(): string {
    const t = this.layout.title as { text?: unknown } | string | undefined;
    return typeof t === 'string' ? t : typeof t?.text === 'string' ? t.text : '';
  }

  /** Plain JSON (what `JSON.stringify(figure)` writes). */
  toJSON(): PlotSpec {
    return { data: this.data, layout: this.layout };
  }

  /** The figure drawn as a standalone SVG document by our own renderer (no browser). */
  toSvg(options: FigureSvgOptions = {}): string {
    return figureSvg(this.toJSON(), options);
  }

  /** The SVG rasterised to PNG bytes (`scale` 2 for a sharper picture on paper). */
  toPng(options: FigureSvgOptions & { scale?: number } = {}): Uint8Array {
    return svgToPng(this.toSvg(options), options.scale ?? 1);
  }

  /** A one-line-per-trace description with the figure's notes: the text fallback of the figure. */
  describe(): string {
    const lines = this.data.map((t, i) => `  ${t.name ?? `trace ${i + 1}`}: ${t.type}, ${pointCount(t)} points`);
    const notes = (Array.isArray(this.layout.annotations) ? this.layout.annotations as { text?: unknown }[] : [])
      .map((a) => (typeof a.text === 'string' ? `  note: ${a.text}` : '')).filter((s) => s !== '');
    return [`Figure${this.title ? ` "${this.title}"` : ''} (${this.data.length} trace${this.data.length === 1 ? '' : 's'})`, ...lines, ...notes].join('\n');
  }

  [asMime](): MimeBundle {
    const svg = this.toSvg();
    return {
      [PLOTLY_MIME]: JSON.parse(JSON.stringify(this.toJSON())) as unknown,
      'image/svg+xml': svg,
      'image/png': Buffer.from(svgToPng(svg)).toString('base64'),
      'text/plain': this.describe(),
    };
  }
}

function pointCount(t: PlotTrace): number {
  const x = t.x as ArrayLike<unknown> | undefined;
  const y = t.y as ArrayLike<unknown> | undefined;
  return Math.max(x?.length ?? 0, y?.length ?? 0);
}

/** Copies numbers into a plain array, turning non-finite values into null (plotly leaves a gap). */
export function plainNumbers(values: ArrayLike<number>): (number | null)[] {
  const out = new Array<number | null>(values.length);
  for (let i = 0; i < values.length; i++) out[i] = Number.isFinite(values[i]) ? values[i] : null;
  return out;
}

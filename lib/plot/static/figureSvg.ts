import { escapeHtml } from '../../display.js';
import type { PlotSpec } from '../figure.js';
import { PALETTE } from '../palette.js';
import { axisFrames, type Box } from './axisFrames.js';
import { anchorOf, drawAxis } from './drawAxes.js';
import { drawLegend, legendTraces } from './drawLegend.js';
import { drawAnnotations, drawColourBar, drawShapes } from './drawNotes.js';
import { drawTrace, type HeatRange } from './drawTraces.js';
import { f } from './markerPath.js';
import { svgLabel } from './svgLabel.js';

export interface FigureSvgOptions {
  /** Width of the picture in px; default the spec's layout.width or 640. */
  readonly widthPx?: number;
}

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === 'object' ? (v as Obj) : {});
const str = (v: unknown, d: string) => (typeof v === 'string' ? v : d);

/** A CSS font-family list with every name that is not a generic family quoted ("Source Sans 3" unquoted would void the whole list). */
function fontFamilies(list: string): string {
  return list.split(',').map((f) => f.trim()).filter((f) => f !== '')
    .map((f) => (/^['"]/.test(f) || /^(serif|sans-serif|monospace|cursive|fantasy|system-ui)$/.test(f) ? f : `'${f}'`)).join(', ');
}

/** Room right of the plot for a heatmap's colour bar, in px. */
const COLOUR_BAR_ROOM = 92;

/**
 * A figure spec drawn as a standalone SVG document by our own code (no DOM, no browser): bars,
 * points with error bars, lines and steps, heatmaps with a colour bar, linear and log axes (with
 * ticks whose labels carry just enough digits), subplots by axis domain (a pull panel under a
 * spectrum), guide lines, notes, title and a legend under the plot — the same layout numbers the
 * interactive plot reads, so both show the same bins. Every bin is its own element with its
 * numbers in px rounded to 0.01, so tests can read them back.
 * @example figureSvg(histogramFigure(pGeV, { xTitle: 'p [GeV/c]' }).toJSON())
 */
export function figureSvg(spec: PlotSpec, options: FigureSvgOptions = {}): string {
  const layout = spec.layout as Obj;
  const W = options.widthPx ?? (typeof layout.width === 'number' ? layout.width : 640);
  const H = typeof layout.height === 'number' ? layout.height : 400;
  const m = obj(layout.margin);
  const font = obj(layout.font), fontPx = Number(font.size ?? 13) - 1;
  const hasHeat = spec.data.some((t) => t.type === 'heatmap' && t.showscale !== false);
  const plot: Box = {
    left: Number(m.l ?? 64),
    top: Number(m.t ?? 56),
    right: W - Number(m.r ?? 24) - (hasHeat ? COLOUR_BAR_ROOM : 0),
    bottom: H - Number(m.b ?? 64),
  };
  const frames = axisFrames(layout, spec.data, plot);
  const out: string[] = [];
  const title = typeof layout.title === 'string' ? layout.title : str(obj(layout.title).text, '');
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="${escapeHtml(fontFamilies(str(font.family, 'Helvetica, Arial, sans-serif')))}" font-size="${fontPx}" fill="${str(font.color, PALETTE.ink)}">`);
  out.push(`<title>${escapeHtml(title || 'Figure')}</title>`);
  out.push(`<rect width="${W}" height="${H}" fill="${str(layout.paper_bgcolor, PALETTE.paper)}"/>`);
  // One background and clip box per subplot (each x axis with the y axis it is anchored to).
  const subplots = [...frames.values()].filter((a) => a.dir === 'x').map((x) => ({ x, y: anchorOf(x, frames) }));
  const clips: string[] = [];
  subplots.forEach(({ x, y }, k) => {
    const b = { x0: Math.min(x.p0, x.p1), x1: Math.max(x.p0, x.p1), y0: Math.min(y.p0, y.p1), y1: Math.max(y.p0, y.p1) };
    out.push(`<rect class="plot-area" x="${f(b.x0)}" y="${f(b.y0)}" width="${f(b.x1 - b.x0)}" height="${f(b.y1 - b.y0)}" fill="${str(layout.plot_bgcolor, '#ffffff')}"/>`);
    clips.push(`<clipPath id="sg-clip-${k}"><rect x="${f(b.x0)}" y="${f(b.y0)}" width="${f(b.x1 - b.x0)}" height="${f(b.y1 - b.y0)}"/></clipPath>`);
  });
  out.push(`<defs>${clips.join('')}</defs>`);
  const axes = [...frames.values()].map((a) => drawAxis(a, frames, fontPx));
  out.push(...axes.map((g) => g.under));
  let heat: HeatRange | undefined;
  spec.data.forEach((t, i) => {
    const x = frames.get(typeof t.xaxis === 'string' ? t.xaxis : 'x')!, y = frames.get(typeof t.yaxis === 'string' ? t.yaxis : 'y')!;
    const k = subplots.findIndex((s) => s.x.id === x.id);
    const drawn = drawTrace(t, x, y);
    heat ??= drawn.heat;
    out.push(`<g class="trace" data-trace="${i}" clip-path="url(#sg-clip-${Math.max(0, k)})">${drawn.svg}</g>`);
  });
  out.push(drawShapes(layout, plot, frames));
  out.push(...axes.map((g) => g.over));
  out.push(drawAnnotations(layout, plot, frames, fontPx - 1));
  if (heat && hasHeat) out.push(drawColourBar(heat, plot, fontPx));
  if (title) {
    const tf = obj(obj(layout.title).font);
    out.push(`<text class="title" x="${f(plot.left)}" y="${f(14 + Number(tf.size ?? 16))}" font-size="${f(Number(tf.size ?? 16))}" fill="${str(tf.color, PALETTE.ink)}">${svgLabel(title)}</text>`);
  }
  out.push(drawLegend(legendTraces(spec.data, layout), { left: 0.01 * W + 4, bottom: H - 0.01 * H, widthPx: W, fontPx }));
  out.push('</svg>');
  return out.filter((s) => s !== '').join('\n');
}

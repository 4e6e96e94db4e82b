import { PALETTE } from '../palette.js';
import type { AxisFrame, Box } from './axisFrames.js';
import { colourAt } from './colourScale.js';
import type { HeatRange } from './drawTraces.js';
import { dashArray, f } from './markerPath.js';
import { svgLabel } from './svgLabel.js';
import { linearTicks } from './ticks.js';

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === 'object' ? (v as Obj) : {});
const str = (v: unknown, d: string) => (typeof v === 'string' ? v : d);

/** px of a coordinate given its reference: 'paper' (fraction of the plot box), 'x2 domain' (fraction of that axis) or an axis id (data). */
function place(ref: unknown, v: number, dir: 'x' | 'y', plot: Box, frames: ReadonlyMap<string, AxisFrame>): number {
  const r = typeof ref === 'string' ? ref : 'paper';
  if (r === 'paper') return dir === 'x' ? plot.left + v * (plot.right - plot.left) : plot.bottom - v * (plot.bottom - plot.top);
  const domain = / domain$/.test(r);
  const a = frames.get(r.replace(/ domain$/, ''));
  if (!a) return NaN;
  return domain ? a.p0 + v * (a.p1 - a.p0) : a.toPx(v);
}

/** The spec's line shapes (e.g. the ±2 guides of a pull panel). */
export function drawShapes(layout: Readonly<Obj>, plot: Box, frames: ReadonlyMap<string, AxisFrame>): string {
  const shapes = Array.isArray(layout.shapes) ? (layout.shapes as Obj[]) : [];
  return shapes.filter((s) => s.type === 'line').map((s) => {
    const x0 = place(s.xref, Number(s.x0), 'x', plot, frames), x1 = place(s.xref, Number(s.x1), 'x', plot, frames);
    const y0 = place(s.yref, Number(s.y0), 'y', plot, frames), y1 = place(s.yref, Number(s.y1), 'y', plot, frames);
    if (![x0, x1, y0, y1].every(Number.isFinite)) return '';
    const line = obj(s.line), dash = dashArray(line.dash);
    return `<path class="guide" d="M${f(x0)},${f(y0)}L${f(x1)},${f(y1)}" stroke="${str(line.color, PALETTE.muted)}" stroke-width="${f(Number(line.width ?? 1))}"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`;
  }).join('');
}

/** The spec's text annotations (notes such as "3 outside range"), anchored as the spec says. */
export function drawAnnotations(layout: Readonly<Obj>, plot: Box, frames: ReadonlyMap<string, AxisFrame>, fontPx: number): string {
  const notes = Array.isArray(layout.annotations) ? (layout.annotations as Obj[]) : [];
  return notes.map((a) => {
    const x = place(a.xref, Number(a.x), 'x', plot, frames), y = place(a.yref, Number(a.y), 'y', plot, frames);
    if (!Number.isFinite(x) || !Number.isFinite(y)) return '';
    const font = obj(a.font), size = Number(font.size ?? fontPx);
    const anchor = a.xanchor === 'right' ? 'end' : a.xanchor === 'left' ? 'start' : 'middle';
    const dy = a.yanchor === 'top' ? size + 2 : a.yanchor === 'bottom' ? -4 : size * 0.35;
    const dx = a.xanchor === 'right' ? -4 : a.xanchor === 'left' ? 4 : 0;
    return `<text class="note" x="${f(x + dx)}" y="${f(y + dy)}" text-anchor="${anchor}" font-size="${f(size)}" fill="${str(font.color, PALETTE.ink)}">${svgLabel(String(a.text ?? ''))}</text>`;
  }).join('');
}

/** A vertical colour bar right of the plot box, with its ticks and title. */
export function drawColourBar(heat: HeatRange, plot: Box, fontPx: number): string {
  const x = plot.right + 14, w = 14, top = plot.top, bottom = plot.bottom;
  const steps = 48, h = (bottom - top) / steps;
  const cells: string[] = [];
  for (let k = 0; k < steps; k++) cells.push(`<rect x="${f(x)}" y="${f(bottom - (k + 1) * h)}" width="${w}" height="${f(h + 0.3)}" fill="${colourAt(heat.scale, (k + 0.5) / steps)}"/>`);
  const span = heat.zMax - heat.zMin || 1;
  const ticks = linearTicks(heat.zMin, heat.zMax, 5).filter((t) => t.value >= heat.zMin - 1e-9 * span && t.value <= heat.zMax + 1e-9 * span);
  const labels = ticks.map((t) => { const y = bottom - ((t.value - heat.zMin) / span) * (bottom - top); return `<path d="M${f(x + w)},${f(y)}h4" stroke="${PALETTE.muted}"/><text x="${f(x + w + 6)}" y="${f(y + fontPx * 0.35)}">${t.label}</text>`; });
  const title = heat.title ? `<text transform="translate(${f(x + w + 52)},${f((top + bottom) / 2)}) rotate(-90)" text-anchor="middle">${svgLabel(heat.title)}</text>` : '';
  return `<g class="colour-bar" font-size="${fontPx - 1}">${cells.join('')}<rect x="${f(x)}" y="${f(top)}" width="${w}" height="${f(bottom - top)}" fill="none" stroke="${PALETTE.muted}"/>${labels.join('')}${title}</g>`;
}

import { escapeHtml } from '../../display.js';
import type { PlotTrace } from '../figure.js';
import { DENSITY_SCALE, PALETTE } from '../palette.js';
import type { AxisFrame } from './axisFrames.js';
import { colourAt } from './colourScale.js';
import { dashArray, f, markerSvg } from './markerPath.js';

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === 'object' ? (v as Obj) : {});
const nums = (v: unknown): number[] => (Array.isArray(v) ? v.map((x) => (typeof x === 'number' ? x : NaN)) : typeof v === 'number' ? [v] : []);
const str = (v: unknown, d: string) => (typeof v === 'string' ? v : d);

/** The colour range a heatmap's cells span (for its colour bar). */
export interface HeatRange { readonly zMin: number; readonly zMax: number; readonly scale: readonly (readonly [number, string])[]; readonly title: string }

/** Draws one trace as SVG in its axes; heatmaps also report their colour range. */
export function drawTrace(t: PlotTrace, x: AxisFrame, y: AxisFrame): { svg: string; heat?: HeatRange } {
  if (t.visible === false) return { svg: '' };
  if (t.type === 'bar') return { svg: bars(t, x, y) };
  if (t.type === 'heatmap') return heatmap(t, x, y);
  if (t.type === 'scatter') return { svg: scatter(t, x, y) };
  return { svg: `<!-- trace type ${escapeHtml(t.type)} not drawn -->` };
}

function bars(t: PlotTrace, x: AxisFrame, y: AxisFrame): string {
  const xs = nums(t.x), ys = nums(t.y), w = nums(t.width);
  const marker = obj(t.marker), line = obj(marker.line);
  const fill = str(marker.color, PALETTE.copper);
  const gap = xs.length > 1 ? Math.abs(xs[1] - xs[0]) : 1;
  const base = y.log ? Math.max(y.p0, y.p1) : y.toPx(0);
  const out: string[] = [];
  for (let i = 0; i < xs.length; i++) {
    if (!Number.isFinite(ys[i]) || !Number.isFinite(xs[i])) continue;
    const width = w.length > 1 ? w[i] : w[0] ?? gap * 0.96;
    const a = x.toPx(xs[i] - width / 2), b = x.toPx(xs[i] + width / 2), top = y.toPx(ys[i]);
    if (![a, b, top].every(Number.isFinite)) continue;
    out.push(`<rect x="${f(Math.min(a, b))}" y="${f(Math.min(top, base))}" width="${f(Math.abs(b - a))}" height="${f(Math.abs(base - top))}"/>`);
  }
  const stroke = typeof line.color === 'string' && Number(line.width ?? 0) > 0 ? ` stroke="${line.color}" stroke-width="${f(Number(line.width))}"` : '';
  return `<g class="bars" fill="${fill}"${stroke}>${out.join('')}</g>`;
}

function scatter(t: PlotTrace, x: AxisFrame, y: AxisFrame): string {
  const xs = nums(t.x), ys = nums(t.y);
  const mode = str(t.mode, 'markers');
  const marker = obj(t.marker), line = obj(t.line);
  const colour = str(line.color, str(marker.color, PALETTE.ink));
  const mColour = str(marker.color, colour);
  const px = xs.map((v) => x.toPx(v)), py = ys.map((v) => y.toPx(v));
  const ok = (i: number) => Number.isFinite(px[i]) && Number.isFinite(py[i]);
  const parts: string[] = [];
  const ey = obj(t.error_y);
  if (ey.visible !== false && Array.isArray(ey.array)) {
    const up = nums(ey.array), down = ey.symmetric === false ? nums(ey.arrayminus) : up;
    const cap = Number(ey.width ?? 3);
    const d: string[] = [];
    const yBottom = Math.max(y.p0, y.p1);
    for (let i = 0; i < xs.length; i++) {
      if (!ok(i)) continue;
      const hi = y.toPx(ys[i] + (up[i] || 0));
      const loRaw = y.toPx(ys[i] - (down[i] || 0));
      const lo = Number.isFinite(loRaw) ? loRaw : yBottom;
      if (!(Math.abs(lo - hi) > 0.01)) continue;
      d.push(`M${f(px[i])},${f(lo)}V${f(hi)}`);
      if (cap > 0) d.push(`M${f(px[i] - cap)},${f(hi)}h${f(2 * cap)}M${f(px[i] - cap)},${f(lo)}h${f(2 * cap)}`);
    }
    if (d.length > 0) parts.push(`<path class="errors" d="${d.join('')}" stroke="${str(ey.color, mColour)}" stroke-width="${f(Number(ey.thickness ?? 1))}" fill="none"/>`);
  }
  if (mode.includes('lines')) {
    const step = line.shape === 'hvh';
    const d: string[] = [];
    let open = false;
    for (let i = 0; i < xs.length; i++) {
      if (!ok(i)) { open = false; continue; }
      if (!open) { d.push(`M${f(px[i])},${f(py[i])}`); open = true; continue; }
      if (step) { const mid = (px[i - 1] + px[i]) / 2; d.push(`H${f(mid)}V${f(py[i])}H${f(px[i])}`); }
      else d.push(`L${f(px[i])},${f(py[i])}`);
    }
    const dash = dashArray(line.dash);
    if (d.length > 0) parts.push(`<path class="line" d="${d.join('')}" stroke="${colour}" stroke-width="${f(Number(line.width ?? 2))}" fill="none" stroke-linejoin="round"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`);
  }
  if (mode.includes('markers')) {
    const size = Number(marker.size ?? 6), symbol = str(marker.symbol, 'circle');
    const m: string[] = [];
    for (let i = 0; i < xs.length; i++) if (ok(i)) m.push(markerSvg(symbol, px[i], py[i], size, mColour));
    parts.push(`<g class="markers">${m.join('')}</g>`);
  }
  return `<g class="series">${parts.join('')}</g>`;
}

/** Cell edges from centres: midpoints, the outer ones mirrored. */
function edges(c: number[]): number[] {
  if (c.length === 1) return [c[0] - 0.5, c[0] + 0.5];
  const e = [c[0] - (c[1] - c[0]) / 2];
  for (let i = 0; i + 1 < c.length; i++) e.push((c[i] + c[i + 1]) / 2);
  e.push(c[c.length - 1] + (c[c.length - 1] - c[c.length - 2]) / 2);
  return e;
}

function heatmap(t: PlotTrace, x: AxisFrame, y: AxisFrame): { svg: string; heat: HeatRange } {
  const xs = nums(t.x), ys = nums(t.y);
  const z = (Array.isArray(t.z) ? t.z : []).map((row) => nums(row));
  const scale = Array.isArray(t.colorscale) ? (t.colorscale as [number, string][]) : DENSITY_SCALE;
  let zMin = Infinity, zMax = -Infinity;
  for (const row of z) for (const v of row) if (Number.isFinite(v)) { zMin = Math.min(zMin, v); zMax = Math.max(zMax, v); }
  if (typeof t.zmin === 'number') zMin = t.zmin;
  if (typeof t.zmax === 'number') zMax = t.zmax;
  const ex = edges(xs.length ? xs : (z[0] ?? []).map((_, i) => i)), ey = edges(ys.length ? ys : z.map((_, j) => j));
  const cells: string[] = [];
  for (let j = 0; j < z.length; j++) {
    for (let i = 0; i < z[j].length; i++) {
      const v = z[j][i];
      if (!Number.isFinite(v)) continue;
      const a = x.toPx(ex[i]), b = x.toPx(ex[i + 1]), c = y.toPx(ey[j]), d = y.toPx(ey[j + 1]);
      const colour = colourAt(scale, zMax > zMin ? (v - zMin) / (zMax - zMin) : 1);
      cells.push(`<rect x="${f(Math.min(a, b))}" y="${f(Math.min(c, d))}" width="${f(Math.abs(b - a) + 0.3)}" height="${f(Math.abs(d - c) + 0.3)}" fill="${colour}"/>`);
    }
  }
  const title = str(obj(obj(t.colorbar).title).text, '');
  return { svg: `<g class="heatmap">${cells.join('')}</g>`, heat: { zMin: Number.isFinite(zMin) ? zMin : 0, zMax: Number.isFinite(zMax) ? zMax : 1, scale, title } };
}

import { PALETTE } from '../palette.js';
import type { AxisFrame } from './axisFrames.js';
import { f } from './markerPath.js';
import { labelWidth, svgLabel } from './svgLabel.js';
import { linearTicks, logTicks, type Tick } from './ticks.js';

type Obj = Record<string, unknown>;
const str = (v: unknown, d: string) => (typeof v === 'string' ? v : d);
const titleOf = (spec: Obj) => { const t = spec.title; return typeof t === 'string' ? t : str((t as Obj | undefined)?.text, ''); };

/** The ticks an axis shows (about one per 90 px along x, one per 40 px along y, at least three). */
export function axisTicks(a: AxisFrame): Tick[] {
  const length = Math.abs(a.p1 - a.p0);
  const target = Math.max(3, Math.round(length / (a.dir === 'x' ? 90 : 40)));
  const lo = Math.min(a.lo, a.hi), hi = Math.max(a.lo, a.hi);
  if (a.log) return logTicks(lo, hi, a.spec.dtick === 1 ? Math.ceil(hi - lo) : target);
  return linearTicks(lo, hi, target);
}

/** The perpendicular axis an axis is drawn against (its `anchor`, else the first of the other kind). */
export function anchorOf(a: AxisFrame, frames: ReadonlyMap<string, AxisFrame>): AxisFrame {
  const other = a.dir === 'x' ? 'y' : 'x';
  const named = typeof a.spec.anchor === 'string' ? frames.get(a.spec.anchor) : undefined;
  return named ?? frames.get(other)!;
}

/** One axis against its anchor: grid and zero line (drawn under the data), frame, ticks, tick labels and title (over it). */
export function drawAxis(a: AxisFrame, frames: ReadonlyMap<string, AxisFrame>, fontPx: number): { under: string; over: string } {
  const b = anchorOf(a, frames);
  const s = a.spec;
  const grid = str(s.gridcolor, PALETTE.grid), line = str(s.linecolor, PALETTE.muted), tickColour = str(s.tickcolor, line);
  const [c0, c1] = [Math.min(b.p0, b.p1), Math.max(b.p0, b.p1)];
  const ticks = axisTicks(a).map((t) => ({ ...t, px: a.toPx(t.value) })).filter((t) => Number.isFinite(t.px) && t.px >= Math.min(a.p0, a.p1) - 0.5 && t.px <= Math.max(a.p0, a.p1) + 0.5);
  const under: string[] = [];
  const out: string[] = [];
  const gridD = ticks.map((t) => (a.dir === 'x' ? `M${f(t.px)},${f(c0)}V${f(c1)}` : `M${f(c0)},${f(t.px)}H${f(c1)}`)).join('');
  if (s.showgrid !== false && gridD) under.push(`<path class="grid" d="${gridD}" stroke="${grid}" stroke-width="1"/>`);
  if (!a.log && s.zeroline !== false && Math.min(a.lo, a.hi) < 0 && Math.max(a.lo, a.hi) > 0) {
    const z = a.toPx(0);
    under.push(`<path class="zero" d="${a.dir === 'x' ? `M${f(z)},${f(c0)}V${f(c1)}` : `M${f(c0)},${f(z)}H${f(c1)}`}" stroke="${str(s.zerolinecolor, grid)}" stroke-width="1"/>`);
  }
  const edge = a.dir === 'x' ? c1 : c0; // bottom of the subplot, or its left side
  const far = a.dir === 'x' ? c0 : c1;
  const [a0, a1] = [Math.min(a.p0, a.p1), Math.max(a.p0, a.p1)];
  const lineD = a.dir === 'x' ? `M${f(a0)},${f(edge)}H${f(a1)}${s.mirror ? `M${f(a0)},${f(far)}H${f(a1)}` : ''}` : `M${f(edge)},${f(a0)}V${f(a1)}${s.mirror ? `M${f(far)},${f(a0)}V${f(a1)}` : ''}`;
  out.push(`<path class="axis-line" d="${lineD}" stroke="${line}" stroke-width="1" fill="none"/>`);
  const outside = s.ticks === 'outside' ? 5 : 0;
  if (outside > 0 && ticks.length > 0) {
    out.push(`<path class="ticks" d="${ticks.map((t) => (a.dir === 'x' ? `M${f(t.px)},${f(edge)}v${outside}` : `M${f(edge)},${f(t.px)}h${-outside}`)).join('')}" stroke="${tickColour}" stroke-width="1"/>`);
  }
  let labelExtent = 0;
  if (s.showticklabels !== false) {
    const labels = ticks.map((t) => (a.dir === 'x'
      ? `<text x="${f(t.px)}" y="${f(edge + outside + 3 + fontPx)}" text-anchor="middle">${t.label}</text>`
      : `<text x="${f(edge - outside - 4)}" y="${f(t.px + fontPx * 0.35)}" text-anchor="end">${t.label}</text>`));
    out.push(`<g class="tick-labels" font-size="${fontPx}">${labels.join('')}</g>`);
    labelExtent = a.dir === 'x' ? fontPx + 4 : Math.max(0, ...ticks.map((t) => labelWidth(t.label, fontPx))) + 4;
  }
  const title = titleOf(s);
  if (title) {
    const mid = (a0 + a1) / 2;
    out.push(a.dir === 'x'
      ? `<text class="axis-title" x="${f(mid)}" y="${f(edge + outside + labelExtent + fontPx + 10)}" text-anchor="middle" font-size="${fontPx + 1}">${svgLabel(title)}</text>`
      : `<text class="axis-title" transform="translate(${f(edge - outside - labelExtent - 10)},${f(mid)}) rotate(-90)" text-anchor="middle" font-size="${fontPx + 1}">${svgLabel(title)}</text>`);
  }
  return { under: `<g class="grid-${a.id}">${under.join('')}</g>`, over: `<g class="axis axis-${a.id}">${out.join('')}</g>` };
}

import type { PlotTrace } from '../figure.js';
import { PALETTE } from '../palette.js';
import { dashArray, f, markerSvg } from './markerPath.js';
import { labelWidth, svgLabel } from './svgLabel.js';

type Obj = Record<string, unknown>;
const obj = (v: unknown): Obj => (v && typeof v === 'object' ? (v as Obj) : {});
const str = (v: unknown, d: string) => (typeof v === 'string' ? v : d);

/** The traces a legend lists: named, not hidden from it, and more than one (or asked for). */
export function legendTraces(traces: readonly PlotTrace[], layout: Readonly<Obj>): PlotTrace[] {
  const items = traces.filter((t) => t.showlegend !== false && t.type !== 'heatmap' && t.visible !== false);
  if (layout.showlegend === false) return [];
  return items.length >= 2 || layout.showlegend === true ? items : [];
}

function swatch(t: PlotTrace, x: number, y: number): string {
  const marker = obj(t.marker), line = obj(t.line);
  if (t.type === 'bar') return `<rect x="${f(x)}" y="${f(y - 6)}" width="22" height="12" fill="${str(marker.color, PALETTE.copper)}"/>`;
  const mode = str(t.mode, 'markers');
  const colour = str(line.color, str(marker.color, PALETTE.ink));
  const parts: string[] = [];
  if (mode.includes('lines')) {
    const dash = dashArray(line.dash);
    parts.push(`<path d="M${f(x)},${f(y)}h26" stroke="${colour}" stroke-width="${f(Math.min(3, Number(line.width ?? 2)))}"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`);
  }
  if (mode.includes('markers')) parts.push(markerSvg(str(marker.symbol, 'circle'), x + 13, y, Math.min(9, Number(marker.size ?? 6)), str(marker.color, colour)));
  return parts.join('');
}

/**
 * A horizontal legend in rows along the bottom of the picture (where the spec's layout leaves
 * room for it under the x-axis title), wrapping at `widthPx`.
 */
export function drawLegend(items: readonly PlotTrace[], options: { left: number; bottom: number; widthPx: number; fontPx: number }): string {
  if (items.length === 0) return '';
  const rows: { t: PlotTrace; x: number }[][] = [[]];
  let used = 0;
  for (const t of items) {
    const w = 40 + labelWidth(String(t.name ?? ''), options.fontPx);
    if (used > 0 && options.left + used + w > options.widthPx) { rows.push([]); used = 0; }
    rows[rows.length - 1].push({ t, x: options.left + used });
    used += w;
  }
  const out: string[] = [];
  rows.forEach((row, r) => {
    const y = options.bottom - 11 - 22 * (rows.length - 1 - r);
    for (const { t, x } of row) {
      out.push(swatch(t, x, y));
      out.push(`<text x="${f(x + 32)}" y="${f(y + options.fontPx * 0.35)}">${svgLabel(String(t.name ?? ''))}</text>`);
    }
  });
  return `<g class="legend" font-size="${options.fontPx}">${out.join('')}</g>`;
}

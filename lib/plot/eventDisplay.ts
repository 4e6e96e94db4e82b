import { msg } from '../errors.js';
import { asMime, escapeHtml, type MimeBundle, type Presentable } from '../display.js';
import { PALETTE, TRACK_COLOURS, chargeColour } from './palette.js';
import { svgToPng } from './static/svgToPng.js';

/** Hits in the bending plane, metres; `track[i]` is the index of the track hit i belongs to (−1: none). */
export interface DisplayHits {
  readonly xM: ArrayLike<number>;
  readonly yM: ArrayLike<number>;
  readonly track?: ArrayLike<number>;
}

/** A fitted track drawn as a circular arc in the bending plane (metres; charge sign ±1, 0 unknown). */
export interface DisplayTrack {
  readonly centerXM: number;
  readonly centerYM: number;
  readonly radiusM: number;
  readonly charge: number;
  /** Short text drawn at the end of the arc, e.g. '1.23 GeV/c'. */
  readonly label?: string;
}

export interface EventDisplayOptions {
  readonly title?: string;
  /** Field along +z in tesla (drawn as ⊙ for > 0, ⊗ for < 0). */
  readonly fieldT?: number;
  /** Drawn area in metres; default the hits' bounding box with a 5 % margin. */
  readonly extentM?: { readonly xMin: number; readonly xMax: number; readonly yMin: number; readonly yMax: number };
  /** Width of the picture in CSS pixels; the height follows the extent (equal scales on x and y). */
  readonly widthPx?: number;
  /**
   * 'charge' (default): arcs copper for q > 0, teal for q < 0, hits grey. 'track': each track's
   * hits and arc in a colour of its own (TRACK_COLOURS), e.g. to show what a track finder grouped.
   */
  readonly colourBy?: 'charge' | 'track';
}

const DEFAULTS = Object.freeze({ title: 'Event display (bending plane)', widthPx: 640 });
const MARGIN = Object.freeze({ left: 64, right: 20, top: 44, bottom: 48 });

/**
 * An event drawn as SVG: hits as dots, each fitted track as the arc of its circle spanning its own
 * hits (or, with no hits assigned, its circle clipped to the drawn area). x and y share one scale
 * so curvature is not distorted. Axis ticks are in millimetres.
 */
export class EventDisplay implements Presentable {
  readonly svg: string;
  readonly summary: string;
  constructor(svg: string, summary: string) {
    this.svg = svg;
    this.summary = summary;
  }
  [asMime](): MimeBundle {
    return { 'image/svg+xml': this.svg, 'image/png': Buffer.from(svgToPng(this.svg)).toString('base64'), 'text/plain': this.summary };
  }
}

/**
 * Draws hits and fitted tracks in the bending plane.
 * @example eventDisplay({ xM, yM, track }, [{ centerXM: 0, centerYM: 2.1, radiusM: 2.1, charge: 1, label: '0.95 GeV/c' }], { fieldT: 1.5 })
 */
export function eventDisplay(hits: DisplayHits, tracks: readonly DisplayTrack[], options: EventDisplayOptions = {}): EventDisplay {
  const o = { ...DEFAULTS, ...options };
  const byTrack = o.colourBy === 'track';
  const n = hits.xM.length;
  if (hits.yM.length !== n) throw msg.badArgument('hits.yM.length', hits.yM.length, `the same length as hits.xM (${n})`);
  if (hits.track && hits.track.length !== n) throw msg.badArgument('hits.track.length', hits.track.length, `the same length as hits.xM (${n})`);
  const ext = o.extentM ?? boundingBox(hits);
  const spanX = ext.xMax - ext.xMin, spanY = ext.yMax - ext.yMin;
  if (!(spanX > 0) || !(spanY > 0)) throw msg.badArgument('extentM', ext, 'an area with positive width and height in metres');
  const plotW = o.widthPx - MARGIN.left - MARGIN.right;
  const scale = plotW / spanX;
  const plotH = spanY * scale;
  const W = o.widthPx, H = Math.ceil(plotH + MARGIN.top + MARGIN.bottom);
  const px = (x: number) => r2(MARGIN.left + (x - ext.xMin) * scale);
  const py = (y: number) => r2(MARGIN.top + (ext.yMax - y) * scale);

  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="Helvetica, Arial, sans-serif" font-size="12">`);
  parts.push(`<title>${escapeHtml(o.title)}</title>`);
  parts.push(`<rect width="${W}" height="${H}" fill="${PALETTE.paper}"/>`);
  parts.push(`<defs><clipPath id="sg-plot-area"><rect x="${MARGIN.left}" y="${MARGIN.top}" width="${r2(plotW)}" height="${r2(plotH)}"/></clipPath></defs>`);
  parts.push(`<rect x="${MARGIN.left}" y="${MARGIN.top}" width="${r2(plotW)}" height="${r2(plotH)}" fill="#ffffff" stroke="${PALETTE.muted}"/>`);
  parts.push(...axisTicks(ext, px, py, MARGIN.top + plotH, MARGIN.left));
  parts.push(`<text x="${MARGIN.left}" y="24" font-size="15" fill="${PALETTE.ink}">${escapeHtml(o.title)}</text>`);
  if (o.fieldT !== undefined && Number.isFinite(o.fieldT) && o.fieldT !== 0) {
    const sym = o.fieldT > 0 ? '⊙' : '⊗';
    parts.push(`<text x="${W - MARGIN.right}" y="24" text-anchor="end" fill="${PALETTE.ink}">B = ${escapeHtml(Math.abs(o.fieldT).toPrecision(3))} T ${sym}</text>`);
  }
  parts.push(`<g clip-path="url(#sg-plot-area)">`);
  for (let i = 0; i < n; i++) {
    const x = hits.xM[i], y = hits.yM[i];
    if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
    const k = hits.track ? hits.track[i] : 0;
    const assigned = k >= 0;
    const ink = byTrack && assigned ? TRACK_COLOURS[k % TRACK_COLOURS.length] : PALETTE.hit;
    parts.push(`<circle cx="${px(x)}" cy="${py(y)}" r="1.9" fill="${assigned ? ink : 'none'}" stroke="${ink}" stroke-width="0.8"/>`);
  }
  tracks.forEach((t, k) => {
    if (!(t.radiusM > 0) || !Number.isFinite(t.centerXM) || !Number.isFinite(t.centerYM)) return;
    const colour = byTrack ? TRACK_COLOURS[k % TRACK_COLOURS.length] : chargeColour(t.charge);
    const span = hits.track ? arcSpan(hits, k, t) : undefined;
    if (span === undefined) {
      parts.push(`<circle cx="${px(t.centerXM)}" cy="${py(t.centerYM)}" r="${r2(t.radiusM * scale)}" fill="none" stroke="${colour}" stroke-width="1.6" stroke-opacity="0.9"/>`);
    } else {
      parts.push(`<path d="${arcPath(t, span, px, py, scale)}" fill="none" stroke="${colour}" stroke-width="1.6" stroke-opacity="0.9"/>`);
    }
  });
  tracks.forEach((t, k) => {
    if (!t.label || !hits.track) return;
    const span = arcSpan(hits, k, t);
    if (!span) return;
    // Label the arc's end farther from the origin (where a track leaving the target ends).
    const ends = span.map((a) => [t.centerXM + t.radiusM * Math.cos(a), t.centerYM + t.radiusM * Math.sin(a)]);
    const [x, y] = Math.hypot(ends[0][0], ends[0][1]) > Math.hypot(ends[1][0], ends[1][1]) ? ends[0] : ends[1];
    const right = px(x) > MARGIN.left + plotW / 2;
    parts.push(`<text x="${r2(px(x) + (right ? -6 : 6))}" y="${r2(py(y) + (y > (ext.yMin + ext.yMax) / 2 ? 14 : -6))}" text-anchor="${right ? 'end' : 'start'}" fill="${byTrack ? TRACK_COLOURS[k % TRACK_COLOURS.length] : chargeColour(t.charge)}">${escapeHtml(t.label)}</text>`);
  });
  parts.push('</g>');
  parts.push(byTrack ? trackLegend(W - MARGIN.right, H - 14) : legend(W - MARGIN.right, H - 14));
  parts.push('</svg>');
  const assignedHits = hits.track ? Array.from(hits.track).filter((t) => t >= 0).length : n;
  const summary = `Event display: ${n} hits (${assignedHits} on tracks), ${tracks.length} track${tracks.length === 1 ? '' : 's'}` +
    (o.fieldT !== undefined ? `, B = ${o.fieldT} T` : '');
  return new EventDisplay(parts.join('\n'), summary);
}

function r2(v: number): number {
  return Math.round(v * 100) / 100;
}

function boundingBox(hits: DisplayHits): { xMin: number; xMax: number; yMin: number; yMax: number } {
  let xMin = Infinity, xMax = -Infinity, yMin = Infinity, yMax = -Infinity;
  for (let i = 0; i < hits.xM.length; i++) {
    const x = hits.xM[i], y = hits.yM[i];
    if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
    xMin = Math.min(xMin, x); xMax = Math.max(xMax, x); yMin = Math.min(yMin, y); yMax = Math.max(yMax, y);
  }
  if (!Number.isFinite(xMin)) return { xMin: -1, xMax: 1, yMin: -1, yMax: 1 };
  const padX = Math.max((xMax - xMin) * 0.05, 1e-3), padY = Math.max((yMax - yMin) * 0.05, 1e-3);
  return { xMin: xMin - padX, xMax: xMax + padX, yMin: yMin - padY, yMax: yMax + padY };
}

/** [start, end] angles (radians, end > start) of the shortest arc covering track k's hits. */
function arcSpan(hits: DisplayHits, k: number, t: DisplayTrack): [number, number] | undefined {
  const angles: number[] = [];
  for (let i = 0; i < hits.xM.length; i++) {
    if (hits.track![i] !== k) continue;
    angles.push(Math.atan2(hits.yM[i] - t.centerYM, hits.xM[i] - t.centerXM));
  }
  if (angles.length < 2) return undefined;
  angles.sort((a, b) => a - b);
  // The arc is the complement of the largest angular gap between neighbouring hits.
  let gap = angles[0] + 2 * Math.PI - angles[angles.length - 1], start = angles[0];
  for (let i = 1; i < angles.length; i++) {
    const g = angles[i] - angles[i - 1];
    if (g > gap) { gap = g; start = angles[i]; }
  }
  return [start, start + 2 * Math.PI - gap];
}

function arcPath(t: DisplayTrack, [a0, a1]: [number, number], px: (x: number) => number, py: (y: number) => number, scale: number): string {
  const x0 = t.centerXM + t.radiusM * Math.cos(a0), y0 = t.centerYM + t.radiusM * Math.sin(a0);
  const x1 = t.centerXM + t.radiusM * Math.cos(a1), y1 = t.centerYM + t.radiusM * Math.sin(a1);
  const large = a1 - a0 > Math.PI ? 1 : 0;
  // Angles grow counter-clockwise as drawn; in SVG's y-down coordinates that is the negative-angle direction: sweep flag 0.
  const r = r2(t.radiusM * scale);
  return `M ${px(x0)} ${py(y0)} A ${r} ${r} 0 ${large} 0 ${px(x1)} ${py(y1)}`;
}

/** A tick step of 1, 2 or 5 × 10ⁿ giving about five ticks over `span`. */
function niceStep(span: number): number {
  const raw = span / 5;
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * p;
}

function axisTicks(ext: { xMin: number; xMax: number; yMin: number; yMax: number }, px: (x: number) => number, py: (y: number) => number, bottom: number, left: number): string[] {
  const out: string[] = [];
  const fmt = (m: number) => String(Math.round(m * 1e3 * 1e6) / 1e6);
  const sx = niceStep(ext.xMax - ext.xMin);
  for (let v = Math.ceil(ext.xMin / sx) * sx; v <= ext.xMax + 1e-12; v += sx) {
    const x = px(v);
    out.push(`<line x1="${x}" y1="${r2(bottom)}" x2="${x}" y2="${r2(bottom + 5)}" stroke="${PALETTE.muted}"/><text x="${x}" y="${r2(bottom + 18)}" text-anchor="middle" fill="${PALETTE.muted}">${fmt(v)}</text>`);
  }
  const sy = niceStep(ext.yMax - ext.yMin);
  for (let v = Math.ceil(ext.yMin / sy) * sy; v <= ext.yMax + 1e-12; v += sy) {
    const y = py(v);
    out.push(`<line x1="${left - 5}" y1="${y}" x2="${left}" y2="${y}" stroke="${PALETTE.muted}"/><text x="${left - 8}" y="${r2(y + 4)}" text-anchor="end" fill="${PALETTE.muted}">${fmt(v)}</text>`);
  }
  out.push(`<text x="${r2(px((ext.xMin + ext.xMax) / 2))}" y="${r2(bottom + 36)}" text-anchor="middle" fill="${PALETTE.ink}">x [mm]</text>`);
  out.push(`<text x="14" y="${r2(py((ext.yMin + ext.yMax) / 2))}" text-anchor="middle" fill="${PALETTE.ink}" transform="rotate(-90 14 ${r2(py((ext.yMin + ext.yMax) / 2))})">y [mm]</text>`);
  return out;
}

function trackLegend(right: number, y: number): string {
  return `<g font-size="11" fill="${PALETTE.ink}"><text x="${right}" y="${y}" text-anchor="end">● a colour per track  ○ hit on no track</text></g>`;
}

function legend(right: number, y: number): string {
  return `<g font-size="11" fill="${PALETTE.ink}"><text x="${right}" y="${y}" text-anchor="end">` +
    `<tspan fill="${PALETTE.copper}">━ q &gt; 0</tspan>  <tspan fill="${PALETTE.teal}">━ q &lt; 0</tspan>  ● hit on a track  ○ unassigned hit</text></g>`;
}

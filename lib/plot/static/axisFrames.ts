import type { PlotTrace } from '../figure.js';

/** A rectangle in px: left, top, right, bottom. */
export interface Box { readonly left: number; readonly top: number; readonly right: number; readonly bottom: number }

/** One resolved axis of a figure spec: its range, its place in px and its mapping. */
export interface AxisFrame {
  /** 'x', 'x2', 'y', … (what traces name in their xaxis / yaxis fields). */
  readonly id: string;
  readonly dir: 'x' | 'y';
  readonly log: boolean;
  /** Range in data units (linear) or log₁₀ units (log), as the spec writes it. */
  readonly lo: number;
  readonly hi: number;
  /** px of lo and of hi. */
  readonly p0: number;
  readonly p1: number;
  /** The axis' layout object from the spec. */
  readonly spec: Readonly<Record<string, unknown>>;
  /** Data value → px (NaN when the value cannot be shown, e.g. ≤ 0 on a log axis). */
  toPx(v: number): number;
}

type Layout = Readonly<Record<string, unknown>>;

/** Axis ids the traces use, plus every axis the layout declares. */
function axisIds(layout: Layout, traces: readonly PlotTrace[]): string[] {
  const ids = new Set<string>(['x', 'y']);
  for (const key of Object.keys(layout)) { const m = /^([xy])axis(\d*)$/.exec(key); if (m) ids.add(m[1] + m[2]); }
  for (const t of traces) { if (typeof t.xaxis === 'string') ids.add(t.xaxis); if (typeof t.yaxis === 'string') ids.add(t.yaxis); }
  return [...ids].sort();
}

const layoutKey = (id: string) => `${id[0]}axis${id.slice(1)}`;

function numbers(v: unknown): number[] {
  if (Array.isArray(v)) return v.map((x) => (typeof x === 'number' ? x : NaN));
  if (typeof v === 'number') return [v];
  return [];
}

/** The extent of the values a trace puts on each of its axes (bars from 0, error bars included). */
function extents(traces: readonly PlotTrace[]): Map<string, { lo: number; hi: number; pos: number; bar: boolean }> {
  const out = new Map<string, { lo: number; hi: number; pos: number; bar: boolean }>();
  const add = (id: string, v: number, bar = false) => {
    if (!Number.isFinite(v)) return;
    const e = out.get(id) ?? { lo: Infinity, hi: -Infinity, pos: Infinity, bar: false };
    e.lo = Math.min(e.lo, v); e.hi = Math.max(e.hi, v); if (v > 0) e.pos = Math.min(e.pos, v); e.bar ||= bar;
    out.set(id, e);
  };
  for (const t of traces) {
    if (t.visible === false) continue;
    const xid = typeof t.xaxis === 'string' ? t.xaxis : 'x', yid = typeof t.yaxis === 'string' ? t.yaxis : 'y';
    const x = numbers(t.x), y = numbers(t.y);
    if (t.type === 'bar') {
      const w = numbers(t.width);
      x.forEach((v, i) => { const half = (w.length > 1 ? w[i] : w[0] ?? 0) / 2; add(xid, v - half); add(xid, v + half); });
      y.forEach((v) => { if (Number.isFinite(v)) { add(yid, v, true); add(yid, 0, true); } });
      continue;
    }
    x.forEach((v) => add(xid, v));
    const ey = (t.error_y ?? {}) as { array?: unknown; arrayminus?: unknown; symmetric?: unknown };
    const up = numbers(ey.array), down = ey.symmetric === false ? numbers(ey.arrayminus) : up;
    y.forEach((v, i) => { add(yid, v); if (Number.isFinite(v)) { add(yid, v + (up[i] ?? 0)); const d = v - (down[i] ?? 0); if (d > 0 || !(v > 0)) add(yid, d); } });
  }
  return out;
}

/** The range of an axis the spec leaves open: the data's, padded 5 % (bars keep their base at 0). */
function autoRange(log: boolean, e: { lo: number; hi: number; pos: number; bar: boolean } | undefined): [number, number] {
  if (!e) return log ? [-1, 1] : [-1, 1];
  if (log) {
    if (!Number.isFinite(e.pos)) return [-1, 1];
    const a = Math.log10(e.pos), b = Math.log10(Math.max(e.hi, e.pos));
    const pad = Math.max(0.05 * (b - a), 0.1);
    return [a - pad, b + pad];
  }
  let { lo, hi } = e;
  if (hi === lo) { const d = Math.abs(lo) > 0 ? Math.abs(lo) * 0.1 : 1; return [lo - d, hi + d]; }
  const pad = 0.05 * (hi - lo);
  lo = e.bar && lo >= 0 ? lo : lo - pad;
  hi = e.bar && hi <= 0 ? hi : hi + pad;
  return [lo, hi];
}

/**
 * Resolves every axis of a figure spec inside the plot box: domains (fractions of the box),
 * ranges (the spec's, a matched axis' or the data's) and the px mapping.
 */
export function axisFrames(layout: Layout, traces: readonly PlotTrace[], plot: Box): Map<string, AxisFrame> {
  const ext = extents(traces);
  const specs = new Map<string, Record<string, unknown>>();
  for (const id of axisIds(layout, traces)) specs.set(id, (layout[layoutKey(id)] ?? {}) as Record<string, unknown>);
  const ranges = new Map<string, [number, number]>();
  for (const [id, spec] of specs) {
    const log = spec.type === 'log';
    const r = numbers(spec.range);
    ranges.set(id, r.length === 2 && r.every(Number.isFinite) ? [r[0], r[1]] : autoRange(log, ext.get(id)));
  }
  for (const [id, spec] of specs) {
    const m = typeof spec.matches === 'string' ? ranges.get(spec.matches) : undefined;
    if (m && !(Array.isArray(spec.range) && spec.range.length === 2)) ranges.set(id, m);
  }
  const frames = new Map<string, AxisFrame>();
  for (const [id, spec] of specs) {
    const dir = id[0] as 'x' | 'y';
    const log = spec.type === 'log';
    const d = numbers(spec.domain);
    const [d0, d1] = d.length === 2 ? d : [0, 1];
    const [lo, hi] = ranges.get(id)!;
    const p0 = dir === 'x' ? plot.left + d0 * (plot.right - plot.left) : plot.bottom - d0 * (plot.bottom - plot.top);
    const p1 = dir === 'x' ? plot.left + d1 * (plot.right - plot.left) : plot.bottom - d1 * (plot.bottom - plot.top);
    const k = (p1 - p0) / (hi - lo || 1);
    const toPx = log ? (v: number) => (v > 0 ? p0 + (Math.log10(v) - lo) * k : NaN) : (v: number) => (Number.isFinite(v) ? p0 + (v - lo) * k : NaN);
    frames.set(id, { id, dir, log, lo, hi, p0, p1, spec, toPx });
  }
  return frames;
}

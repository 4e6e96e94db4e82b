/**
 * The range of a logarithmic axis (plotly wants log₁₀ units) that shows every positive value
 * given, padded by a factor `pad` each way; values ≤ 0 or not finite are ignored (a log axis
 * cannot show them: callers draw those points another way, e.g. as upper limits). Falls back
 * to [−1, 1] (0.1 to 10) with nothing positive.
 * @example logAxisRange([0.5, 0, 120]) // [log₁₀(0.25), log₁₀(240)]
 */
export function logAxisRange(values: Iterable<number>, pad = 2): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (const v of values) if (v > 0 && Number.isFinite(v)) { if (v < lo) lo = v; if (v > hi) hi = v; }
  if (!(hi > 0)) return [-1, 1];
  return [Math.log10(lo / pad), Math.log10(hi * pad)];
}

/**
 * The legend rows a horizontal legend needs for these names, for a plot `widthPx` wide (about
 * 7 px per character plus 40 px for the symbol and gap; an estimate, since the renderer's font
 * decides), and the bottom margin that holds them under the x-axis title.
 */
export function legendMargin(names: readonly string[], widthPx = 640): { rows: number; marginBottom: number } {
  let rows = names.length > 0 ? 1 : 0, used = 0;
  for (const n of names) {
    const w = 40 + 7 * n.length;
    if (used > 0 && used + w > widthPx) { rows++; used = 0; }
    used += w;
  }
  return { rows, marginBottom: 74 + 22 * Math.max(rows, 1) };
}

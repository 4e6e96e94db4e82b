/** Colour at t ∈ [0, 1] of a colour scale given as [[stop, '#rrggbb'], …] (linear in RGB). */
export function colourAt(scale: readonly (readonly [number, string])[], t: number): string {
  if (scale.length === 0) return '#000000';
  const u = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0));
  let k = 0;
  while (k < scale.length - 2 && u > scale[k + 1][0]) k++;
  const [a, ca] = scale[k], [b, cb] = scale[Math.min(k + 1, scale.length - 1)];
  const w = b > a ? (u - a) / (b - a) : 0;
  const pa = rgb(ca), pb = rgb(cb);
  return `#${pa.map((v, i) => Math.round(v + (pb[i] - v) * Math.min(1, Math.max(0, w))).toString(16).padStart(2, '0')).join('')}`;
}

function rgb(hex: string): [number, number, number] {
  const h = hex.replace('#', '');
  const full = h.length === 3 ? [...h].map((c) => c + c).join('') : h.padEnd(6, '0');
  return [parseInt(full.slice(0, 2), 16), parseInt(full.slice(2, 4), 16), parseInt(full.slice(4, 6), 16)];
}

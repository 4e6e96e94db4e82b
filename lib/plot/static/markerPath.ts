/**
 * SVG for one marker of the static renderer at (x, y) with diameter `size` px, for the symbol
 * names the figure specs use (plotly's names, an open standard of the spec format; "-open"
 * draws the outline only). Unknown names draw a circle.
 */
export function markerSvg(symbol: string, x: number, y: number, size: number, colour: string): string {
  const open = symbol.endsWith('-open');
  const name = open ? symbol.slice(0, -5) : symbol;
  const r = size / 2;
  const paint = open ? `fill="none" stroke="${colour}" stroke-width="1.2"` : `fill="${colour}"`;
  const pts = (list: readonly (readonly [number, number])[]) => `<polygon points="${list.map(([a, b]) => `${f(x + a * r)},${f(y + b * r)}`).join(' ')}" ${paint}/>`;
  switch (name) {
    case 'square': return `<rect x="${f(x - 0.85 * r)}" y="${f(y - 0.85 * r)}" width="${f(1.7 * r)}" height="${f(1.7 * r)}" ${paint}/>`;
    case 'diamond': return pts([[0, -1.2], [1.2, 0], [0, 1.2], [-1.2, 0]]);
    case 'triangle-up': return pts([[0, -1.15], [1.1, 0.75], [-1.1, 0.75]]);
    case 'triangle-down': return pts([[0, 1.15], [1.1, -0.75], [-1.1, -0.75]]);
    case 'cross': return pts([[-0.35, -1], [0.35, -1], [0.35, -0.35], [1, -0.35], [1, 0.35], [0.35, 0.35], [0.35, 1], [-0.35, 1], [-0.35, 0.35], [-1, 0.35], [-1, -0.35], [-0.35, -0.35]]);
    case 'x': return `<path d="M${f(x - r)},${f(y - r)}L${f(x + r)},${f(y + r)}M${f(x - r)},${f(y + r)}L${f(x + r)},${f(y - r)}" stroke="${colour}" stroke-width="${f(Math.max(1.5, r / 2))}" fill="none"/>`;
    case 'star': {
      const list: [number, number][] = [];
      for (let k = 0; k < 10; k++) { const a = -Math.PI / 2 + (k * Math.PI) / 5; const rr = k % 2 === 0 ? 1.25 : 0.5; list.push([rr * Math.cos(a), rr * Math.sin(a)]); }
      return pts(list);
    }
    default: return `<circle cx="${f(x)}" cy="${f(y)}" r="${f(r)}" ${paint}/>`;
  }
}

/** A number rounded to 0.01 px for compact, stable SVG text. */
export function f(v: number): string {
  const r = Math.round(v * 100) / 100;
  return Object.is(r, -0) ? '0' : String(r);
}

/** stroke-dasharray of a dash name (our own spacings). */
export function dashArray(dash: unknown): string | undefined {
  switch (dash) {
    case 'dash': return '7 4';
    case 'dot': return '2 3';
    case 'dashdot': return '7 3 2 3';
    case 'longdash': return '13 5';
    case 'longdashdot': return '13 4 2 4';
    default: return undefined;
  }
}

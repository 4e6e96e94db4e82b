/**
 * Sagitta's own colours for figures and reports: ink on paper with a copper accent for positive
 * tracks and a teal for negative ones (a charge-sign pair that stays distinct in grey print and
 * for the common red–green colour-vision deficiencies), and six more series colours of differing
 * lightness, so neighbouring series also differ in grey.
 */
export const PALETTE = Object.freeze({
  ink: '#1d2433',
  muted: '#6b7280',
  grid: '#e6e1d6',
  paper: '#fbfaf7',
  copper: '#c2571a',
  teal: '#2f6f73',
  plum: '#6d4a7e',
  ochre: '#b8902a',
  slate: '#4a6c9b',
  moss: '#5f7f2e',
  rose: '#a8476b',
  hit: '#7b8190',
});

/** Series colours in the order figures use them (eight; the first five as before). */
export const SERIES_COLOURS: readonly string[] = Object.freeze([PALETTE.copper, PALETTE.teal, PALETTE.plum, PALETTE.ochre, PALETTE.ink, PALETTE.slate, PALETTE.moss, PALETTE.rose]);

/** Marker symbols (plotly names) in the order series use them. */
export const SERIES_MARKERS: readonly string[] = Object.freeze(['circle', 'square', 'diamond', 'triangle-up', 'cross', 'triangle-down', 'x', 'star']);

/** Line dashes (plotly names) in the order series use them. */
export const SERIES_DASHES: readonly string[] = Object.freeze(['solid', 'dash', 'dot', 'dashdot', 'longdash']);

/** How one series is drawn. */
export interface SeriesStyle {
  readonly colour: string;
  readonly marker: string;
  readonly dash: string;
}

/**
 * The default style of series `i`: colour i mod 8, marker (i + ⌊i/8⌋) mod 8, dash i mod 5 —
 * so the first 64 series differ in colour-and-marker, the first 40 in colour-and-dash, and
 * any two neighbours in all three.
 * @example seriesStyle(5) // { colour: '#4a6c9b', marker: 'triangle-down', dash: 'solid' }
 */
export function seriesStyle(i: number): SeriesStyle {
  const n = Math.max(0, Math.floor(i));
  return Object.freeze({
    colour: SERIES_COLOURS[n % SERIES_COLOURS.length],
    marker: SERIES_MARKERS[(n + Math.floor(n / SERIES_MARKERS.length)) % SERIES_MARKERS.length],
    dash: SERIES_DASHES[n % SERIES_DASHES.length],
  });
}

/** Colour for a track of charge sign `q` (+1 copper, −1 teal, 0 or unknown ink). */
export function chargeColour(q: number): string {
  return q > 0 ? PALETTE.copper : q < 0 ? PALETTE.teal : PALETTE.ink;
}

/** Sequential colour scale for 2-D histograms: paper to ink through ochre and copper (plotly colorscale form). */
export const DENSITY_SCALE: readonly (readonly [number, string])[] = Object.freeze([
  [0, '#f3e8c9'], [0.25, '#e6cf8e'], [0.5, PALETTE.ochre], [0.75, PALETTE.copper], [1, PALETTE.ink],
] as const);

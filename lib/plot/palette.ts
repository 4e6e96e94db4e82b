/**
 * Sagitta's own colours for figures and reports: ink on paper with a copper accent for positive
 * tracks and a teal for negative ones (a charge-sign pair that stays distinct in grey print and
 * for the common red–green colour-vision deficiencies).
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
  hit: '#7b8190',
});

/** Series colours in the order figures use them. */
export const SERIES_COLOURS: readonly string[] = Object.freeze([PALETTE.copper, PALETTE.teal, PALETTE.plum, PALETTE.ochre, PALETTE.ink]);

/**
 * Colours that tell neighbouring tracks apart in an event display coloured by track (our own
 * set of twelve, dark enough on the paper colour; the list repeats past twelve tracks).
 */
export const TRACK_COLOURS: readonly string[] = Object.freeze([
  '#c2571a', '#2f6f73', '#6d4a7e', '#b8902a', '#3d5a98', '#9c3d54',
  '#4f7d3a', '#d0782f', '#1f8a8a', '#8a5a2b', '#7a6fb0', '#5b6b1f',
]);

/** Colour for a track of charge sign `q` (+1 copper, −1 teal, 0 or unknown ink). */
export function chargeColour(q: number): string {
  return q > 0 ? PALETTE.copper : q < 0 ? PALETTE.teal : PALETTE.ink;
}

import { msg } from '../errors.js';
import { Histogram } from './histogram.js';

/** What `normaliseHistogram` makes: unit area (Σw = 1) or a density (Σw·width = 1 per unit x). */
export type Normalisation = 'unit-area' | 'density';

/**
 * A copy with every weight multiplied by `factor` (Σw × factor, Σw² × factor²; under- and
 * overflow too). A scaled count histogram stays a count histogram with unit weight `factor`,
 * so exact Poisson intervals still apply.
 * @example scaleHistogram(h, 1 / luminosity)
 */
export function scaleHistogram(h: Histogram, factor: number): Histogram {
  if (!Number.isFinite(factor)) throw msg.badArgument('factor', factor, 'a finite number');
  const sumW = h.sumW.map((v) => v * factor);
  const sumW2 = h.isCounts ? undefined : h.sumW2.map((v) => v * factor * factor);
  return Histogram.fromParts({
    edges: Float64Array.from(h.edges), sumW, sumW2,
    underflow: h.underflow * factor, overflow: h.overflow * factor, nonFinite: h.nonFinite, entries: h.entries,
    unitWeight: h.unitWeight * factor,
  });
}

/**
 * A normalised copy: `unit-area` scales Σw over the bins to 1 (under- and overflow excluded
 * from the sum, scaled alike); `density` also divides each bin by its width, so the bars read
 * in probability per unit x and variable-width bins compare fairly. An empty histogram cannot
 * be normalised (bad call).
 * @example normaliseHistogram(h, 'density')
 */
export function normaliseHistogram(h: Histogram, to: Normalisation = 'unit-area'): Histogram {
  const total = h.total();
  if (!(total !== 0) || !Number.isFinite(total)) throw msg.badArgument('histogram', `Σw = ${total}`, 'a histogram with a finite, non-zero sum of weights to normalise');
  if (to === 'unit-area') return scaleHistogram(h, 1 / total);
  if (to !== 'density') throw msg.badArgument('to', to, "'unit-area' or 'density'");
  const widths = h.widths();
  const sumW = h.sumW.map((v, k) => v / (total * widths[k]));
  const w2 = h.sumW2;
  const sumW2 = w2.map((v, k) => v / (total * widths[k]) ** 2);
  const uniformWidth = widths.every((w) => w === widths[0]);
  return Histogram.fromParts({
    edges: Float64Array.from(h.edges), sumW, sumW2: uniformWidth && h.isCounts ? undefined : sumW2,
    underflow: h.underflow / total, overflow: h.overflow / total, nonFinite: h.nonFinite, entries: h.entries,
    unitWeight: uniformWidth ? h.unitWeight / (total * widths[0]) : NaN,
  });
}

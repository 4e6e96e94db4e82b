import { legendMargin } from '../plot/axisRange.js';
import { baseLayout, type PlotSpec, type PlotTrace } from '../plot/figure.js';
import { PALETTE, SERIES_COLOURS } from '../plot/palette.js';
import type { BinnedMerit, FitLabReport } from './compare.js';

/**
 * Plotly figure specs (plain `{ data, layout }` JSON) of a fit-lab report. Show them in a notebook
 * with lib/plot (`new Figure(spec)`) or hand them to any plotly front end.
 */

const colour = (i: number) => SERIES_COLOURS[i % SERIES_COLOURS.length];

function histogram(values: Float64Array, lo: number, hi: number, bins: number): { centres: number[]; counts: number[]; inRange: number } {
  const counts = new Array<number>(bins).fill(0);
  let inRange = 0;
  const w = (hi - lo) / bins;
  for (const v of values) {
    if (!Number.isFinite(v) || v < lo || v >= hi) continue;
    counts[Math.floor((v - lo) / w)]++;
    inRange++;
  }
  return { centres: counts.map((_, i) => lo + (i + 0.5) * w), counts, inRange };
}

/** The layout with a bottom margin that holds the legend's rows under the x-axis title (long fitter names wrap). */
function withLegendRoom(layout: Record<string, unknown>, data: readonly PlotTrace[]): Record<string, unknown> {
  const { marginBottom } = legendMargin(data.map((t) => String(t.name ?? '')));
  layout.margin = { ...(layout.margin as Record<string, number>), b: marginBottom };
  layout.height = 400 + Math.max(0, marginBottom - 96);
  return layout;
}

/**
 * Pull distributions (κ_fit − κ_true)/σ(κ) of every fitter, with the unit Gaussian they should
 * follow when the covariance is honest (scaled to each fitter's tracks in range).
 */
export function pullFigure(report: FitLabReport, bins = 50, range = 5): PlotSpec {
  const data: PlotTrace[] = [];
  let maxIn = 0;
  report.fitters.forEach((name, i) => {
    const h = histogram(report.perTrack[name].pull, -range, range, bins);
    maxIn = Math.max(maxIn, h.inRange);
    const row = report.summary[i];
    data.push({ type: 'scatter', mode: 'lines', line: { shape: 'hvh', color: colour(i), width: 2 }, name: `${name} (mean ${row.pullMean.toFixed(2)}, width ${row.pullWidth.toFixed(2)})`, x: h.centres, y: h.counts });
  });
  const w = (2 * range) / bins;
  const xs = Array.from({ length: 201 }, (_, i) => -range + (2 * range * i) / 200);
  data.push({ type: 'scatter', mode: 'lines', line: { dash: 'dot', color: PALETTE.muted }, name: 'unit Gaussian', x: xs, y: xs.map((x) => (maxIn * w * Math.exp(-0.5 * x * x)) / Math.sqrt(2 * Math.PI)) });
  return { data, layout: withLegendRoom(baseLayout('Curvature pulls', '(κ_{fit} − κ_{true}) / σ(κ)', 'tracks'), data) };
}

/** p-value distributions of χ²; flat when the hit errors and the track model are right. */
export function pValueFigure(report: FitLabReport, bins = 20): PlotSpec {
  const data: PlotTrace[] = report.fitters.map((name, i) => {
    const h = histogram(report.perTrack[name].pValue, 0, 1 + 1e-12, bins);
    return { type: 'scatter', mode: 'lines', line: { shape: 'hvh', color: colour(i), width: 2 }, name, x: h.centres, y: h.counts };
  });
  const n = report.sample.count;
  data.push({ type: 'scatter', mode: 'lines', line: { dash: 'dot', color: PALETTE.muted }, name: 'flat (expected)', x: [0, 1], y: [n / bins, n / bins] });
  return { data, layout: withLegendRoom(baseLayout('χ² p-values', 'P(χ² ≥ observed)', 'tracks'), data) };
}

type Quantity = 'momentumResolution' | 'momentumBias' | 'kappaResolution' | 'kappaBias' | 'pullWidth' | 'pullMean' | 'failureRate';

const LABEL: Readonly<Record<Quantity, string>> = {
  momentumResolution: 'σ(p)/p',
  momentumBias: 'mean (p_{fit} − p)/p',
  kappaResolution: 'σ(κ) [1/m]',
  kappaBias: 'mean κ_{fit} − κ [1/m]',
  pullWidth: 'pull width',
  pullMean: 'pull mean',
  failureRate: 'failure rate',
};

/**
 * A figure of merit against momentum or track length, one line per fitter.
 * @example meritFigure(report, 'momentum', 'momentumResolution')
 */
export function meritFigure(report: FitLabReport, against: 'momentum' | 'length', quantity: Quantity): PlotSpec {
  const rows: readonly BinnedMerit[] = against === 'momentum' ? report.byMomentum : report.byLength;
  const data: PlotTrace[] = report.fitters.map((name, i) => {
    const mine = rows.filter((r) => r.fitter === name);
    return {
      type: 'scatter', mode: 'lines+markers', name,
      line: { color: colour(i) }, marker: { color: colour(i), size: 7 },
      x: mine.map((r) => r.centre), y: mine.map((r) => (Number.isFinite(r[quantity]) ? r[quantity] : null)),
    };
  });
  const layout = baseLayout(`${LABEL[quantity]} vs ${against === 'momentum' ? 'momentum' : 'track length'}`,
    against === 'momentum' ? 'p [GeV/c]' : 'track length [m]', LABEL[quantity]);
  if (against === 'momentum') (layout.xaxis as Record<string, unknown>).type = 'log';
  return { data, layout: withLegendRoom(layout, data) };
}

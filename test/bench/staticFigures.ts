/**
 * Static figure benchmark (run by `npm run bench -- staticFigures`, or
 * `node --import tsx test/bench/staticFigures.ts`): how long a figure's static renderings add to
 * its display — our SVG from the spec, and the PNG rasterised from it — for a 45-bin histogram
 * (notebook 01's momentum figure) and a spectrum with 400-point fit curve and pull panel.
 * Figures are built before the timed body; the median of seven runs is reported.
 */
import { performance } from 'node:perf_hooks';
import { exponential, fitHistogram, gaussian, Histogram, sumShapes } from '../../lib/analysis/index.js';
import { histogramFigure, spectrumFigure } from '../../lib/plot/index.js';
import { figureSvg } from '../../lib/plot/static/figureSvg.js';
import { svgToPng } from '../../lib/plot/static/svgToPng.js';
import { seededRandom } from '../../lib/simulate/rng.js';

const rng = seededRandom(14, 'bench-static-figures');
const values = Float64Array.from({ length: 5000 }, () => 450 + 120 * rng.gaussian());
const histogram = histogramFigure(values, { bins: 45, range: [0, 900], xTitle: 'p [MeV/c]', title: 'Fitted track momenta' }).toJSON();
const h = new Histogram({ bins: 40, range: [400, 700] });
h.fill(Float64Array.from({ length: 2000 }, () => (rng.uniform() < 0.6 ? 505 + 15 * rng.gaussian() : 400 + 300 * rng.uniform())));
const model = sumShapes({ peak: gaussian(), background: exponential({ origin: 400 }) });
const fit = fitHistogram(h, model, { 'peak.area': 24000, 'peak.mean': 505, 'peak.sigma': 15, 'background.norm': 5, 'background.slope': -0.001 });
const spectrum = spectrumFigure(h, { fit, model, xTitle: 'p [MeV/c]' }).toJSON();

function median(run: () => void, times = 7): number {
  run(); // warm-up (JIT, font loading)
  const ms: number[] = [];
  for (let i = 0; i < times; i++) { const t0 = performance.now(); run(); ms.push(performance.now() - t0); }
  return ms.sort((a, b) => a - b)[times >> 1];
}

for (const [name, spec] of [['45-bin histogram', histogram], ['spectrum with fit and pulls', spectrum]] as const) {
  const svg = figureSvg(spec);
  const svgMs = median(() => { for (let i = 0; i < 20; i++) figureSvg(spec); }) / 20;
  const pngMs = median(() => { svgToPng(svg); });
  process.stdout.write(`${name}: SVG ${svgMs.toFixed(2)} ms (${(svg.length / 1024).toFixed(1)} KiB), PNG ${pngMs.toFixed(1)} ms (${(svgToPng(svg).length / 1024).toFixed(1)} KiB) per figure\n`);
}

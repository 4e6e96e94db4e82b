import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { Histogram, Histogram2D } from '../../../lib/analysis/index.js';
import { baseLayout, histogram2dFigure, histogramFigure, spectrumFigure, xyFigure, type PlotSpec } from '../../../lib/plot/index.js';
import { figureSvg } from '../../../lib/plot/static/figureSvg.js';
import { expectGolden } from '../../expectGolden.js';

const GOLDEN = join(import.meta.dirname, 'golden');

/** The rects of one trace group, as [x, y, width, height] in px. */
function rects(svg: string, trace: number): number[][] {
  const group = new RegExp(`<g class="trace" data-trace="${trace}"[^>]*>([\\s\\S]*?)</g></g>`).exec(svg)?.[1] ?? '';
  return [...group.matchAll(/<rect x="([-\d.]+)" y="([-\d.]+)" width="([-\d.]+)" height="([-\d.]+)"/g)].map((m) => m.slice(1, 5).map(Number));
}

describe('figureSvg (static rendering of figure specs)', () => {
  it('histogram: one bar per bin whose height is proportional to its count (golden, 4 bins)', () => {
    const fig = histogramFigure([0.1, 0.6, 0.7, 1.2, 1.3, 1.4, 1.9], { bins: 4, range: [0, 2], title: 'p', xTitle: 'p [GeV/c]' });
    const svg = figureSvg(fig.toJSON());
    const bars = rects(svg, 0);
    expect(bars).toHaveLength(4);
    const counts = fig.data[0].y as number[];
    const perCount = bars[2][3] / counts[2];
    bars.forEach((b, k) => expect(b[3] / perCount).toBeCloseTo(counts[k], 2));
    expectGolden(join(GOLDEN, 'histogram-bars.svg'), svg);
  });

  it('histogram: the "outside range" note is drawn on the picture and kept in the text fallback', () => {
    const fig = histogramFigure([0.5, 1.5, 7, 9], { bins: 2, range: [0, 2] });
    expect(figureSvg(fig.toJSON())).toContain('>2 outside range</text>');
    expect(fig.describe()).toContain('note: 2 outside range');
  });

  it('points with asymmetric error bars and a dashed line: markers, bars and legend (golden)', () => {
    const spec: PlotSpec = {
      data: [
        { type: 'scatter', mode: 'markers', name: 'data', x: [1, 2, 3], y: [4, 6, 5], marker: { color: '#1d2433', size: 6, symbol: 'square' }, error_y: { type: 'data', symmetric: false, array: [1, 2, 1], arrayminus: [0.5, 1, 0.5], visible: true } },
        { type: 'scatter', mode: 'lines', name: 'model', x: [1, 3], y: [4.5, 5.5], line: { color: '#c2571a', dash: 'dash', width: 2 } },
      ],
      layout: { ...baseLayout('errors', 'x [m]', 'y [m]'), height: 300 },
    };
    const svg = figureSvg(spec);
    expect(svg.match(/<rect x="[^"]+" y="[^"]+" width="5.1" height="5.1"/g)).toHaveLength(3 + 1); // three points and the legend swatch
    expectGolden(join(GOLDEN, 'points-errors-legend.svg'), svg);
  });

  it('log axis: decade ticks labelled as plain numbers, points ≤ 0 left out (golden)', () => {
    const fig = xyFigure([{ x: [0.1, 1, 10, 100], y: [0.002, 0.01, 0.5, 30], style: 'both', name: 'R' }, { x: [1], y: [0], name: 'zero' }], { xScale: 'log', yScale: 'log', xTitle: 'T [MeV]', yTitle: 'R [g/cm²]' });
    const svg = figureSvg(fig.toJSON());
    const xLabels = [...svg.matchAll(/<text x="[^"]+" y="[^"]+" text-anchor="middle">([^<]+)<\/text>/g)].map((m) => m[1]);
    expect(xLabels).toEqual(['0.1', '1', '10', '100']);
    expect(svg).toContain('1 point ≤ 0 not shown on the log axis');
    expectGolden(join(GOLDEN, 'log-axes.svg'), svg);
  });

  it('log spectrum: an empty bin is drawn as its upper-limit marker, never as a bar to −∞', () => {
    const h = new Histogram({ bins: 4, range: [0, 4] });
    h.fill(Float64Array.from([0.5, 0.5, 0.5, 1.5, 3.5]));
    const svg = figureSvg(spectrumFigure(h, { yScale: 'log', xTitle: 'p [MeV/c]' }).toJSON());
    expect(svg).not.toMatch(/NaN|Infinity/);
    const limits = /<g class="trace" data-trace="1"[^>]*>([\s\S]*?)<\/g><\/g>/.exec(svg)![1];
    expect(limits.match(/<polygon [^>]*fill="none"/g)).toHaveLength(1); // one open triangle, for bin 3
  });

  it('pull panel: a second subplot under the spectrum sharing x, with ±2 guides (golden, hand-made spec)', () => {
    const layout = baseLayout('', '', 'entries per bin');
    Object.assign(layout.yaxis as object, { domain: [0.34, 1] });
    Object.assign(layout.xaxis as object, { showticklabels: false, range: [0, 3] });
    Object.assign(layout, {
      height: 360,
      xaxis2: { title: { text: 'p [MeV/c]' }, anchor: 'y2', matches: 'x', ticks: 'outside', mirror: true },
      yaxis2: { title: { text: 'pull' }, domain: [0, 0.24], anchor: 'x2', range: [-3, 3] },
      shapes: [-2, 2].map((v) => ({ type: 'line', xref: 'x2 domain', x0: 0, x1: 1, yref: 'y2', y0: v, y1: v, line: { dash: 'dot' } })),
    });
    const spec: PlotSpec = {
      data: [
        { type: 'scatter', mode: 'markers', name: 'data', x: [0.5, 1.5, 2.5], y: [3, 8, 2] },
        { type: 'bar', name: 'pulls', x: [0.5, 1.5, 2.5], y: [1, -2.5, 0.5], width: [0.9, 0.9, 0.9], xaxis: 'x2', yaxis: 'y2', showlegend: false },
      ],
      layout,
    };
    const svg = figureSvg(spec);
    const pulls = rects(svg, 1);
    expect(pulls).toHaveLength(3);
    expect(pulls[1][3] / pulls[0][3]).toBeCloseTo(2.5, 2);
    expect(svg.match(/class="guide"/g)).toHaveLength(2);
    expectGolden(join(GOLDEN, 'pull-panel.svg'), svg);
  });

  it('2-D histogram: one cell per filled bin coloured by content, empty cells blank, a colour bar (golden, 3 × 2)', () => {
    const h = new Histogram2D({ x: { bins: 3, range: [0, 3] }, y: { bins: 2, range: [0, 2] } });
    h.fill(Float64Array.from([0.5, 1.5, 1.5, 2.5, 2.5, 2.5]), Float64Array.from([0.5, 0.5, 0.5, 1.5, 1.5, 1.5]));
    const svg = figureSvg(histogram2dFigure(h, { xTitle: 'x [cm]', yTitle: 'y [cm]', title: 'cells' }).toJSON());
    expect(rects(svg, 0)).toHaveLength(3);
    expect(svg).toContain('class="colour-bar"');
    expectGolden(join(GOLDEN, 'heatmap-cells.svg'), svg);
  });

  it('step lines (the fit lab\'s pull histograms): horizontal to the midpoint, vertical, horizontal', () => {
    const spec: PlotSpec = { data: [{ type: 'scatter', mode: 'lines', line: { shape: 'hvh' }, x: [0, 1, 2], y: [1, 3, 2] }], layout: { ...baseLayout('', 'pull', 'tracks'), xaxis: { range: [0, 2] }, yaxis: { range: [0, 4] } } };
    const d = /<path class="line" d="([^"]+)"/.exec(figureSvg(spec))![1];
    expect(d).toMatch(/^M64,\d+(\.\d+)?H202V\d+(\.\d+)?H340H478V\d+(\.\d+)?H616$/);
  });

  it('labels: subscripts drawn as shifted text, not a literal p_T; snake_case left alone', () => {
    const svg = figureSvg(xyFigure([{ x: [1, 2], y: [1, 2] }], { xTitle: 'p_T [GeV/c]', yTitle: 'sigma_p_meas_GeV' }).toJSON());
    expect(svg).toContain('p<tspan baseline-shift="sub" font-size="75%">T</tspan> [GeV/c]');
    expect(svg).toContain('>sigma_p_meas_GeV<');
  });
});

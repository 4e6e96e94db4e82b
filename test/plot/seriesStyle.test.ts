import { describe, expect, it } from 'vitest';
import { histogram2dFigure, seriesStyle, SERIES_COLOURS, xyFigure } from '../../lib/plot/index.js';
import { Histogram2D } from '../../lib/analysis/index.js';

describe('series styles', () => {
  it('six series in one figure: six colours and six markers, all different (the old palette reused five colours with one marker)', () => {
    const fig = xyFigure(Array.from({ length: 6 }, (_, i) => ({ x: [1, 2], y: [i, i + 1], style: 'both' as const })));
    const colours = fig.data.map((t) => (t.marker as { color: string }).color);
    const markers = fig.data.map((t) => (t.marker as { symbol: string }).symbol);
    expect(new Set(colours).size).toBe(6);
    expect(new Set(markers).size).toBe(6);
  });
  it('the first 64 series differ in colour-and-marker, the first 40 in colour-and-dash; neighbours differ in all three', () => {
    const styles = Array.from({ length: 64 }, (_, i) => seriesStyle(i));
    expect(new Set(styles.map((s) => `${s.colour}|${s.marker}`)).size).toBe(64);
    expect(new Set(styles.slice(0, 40).map((s) => `${s.colour}|${s.dash}`)).size).toBe(40);
    for (let i = 1; i < 64; i++) {
      expect(styles[i].colour).not.toBe(styles[i - 1].colour);
      expect(styles[i].marker).not.toBe(styles[i - 1].marker);
      expect(styles[i].dash).not.toBe(styles[i - 1].dash);
    }
    expect(SERIES_COLOURS).toHaveLength(8);
  });
  it('per-series overrides and axis ranges reach the spec; log axes drop values ≤ 0 and say how many', () => {
    const fig = xyFigure([{ x: [1, 10, 100], y: [0, 5, 50], colour: '#123456', marker: 'star', dash: 'dot', style: 'both' }], { xScale: 'log', yScale: 'log', xRange: [1, 1000] });
    const t = fig.data[0] as unknown as { x: (number | null)[]; marker: { color: string; symbol: string }; line: { dash: string } };
    expect([t.marker.color, t.marker.symbol, t.line.dash]).toEqual(['#123456', 'star', 'dot']);
    expect(t.x).toEqual([null, 10, 100]);
    expect((fig.layout.xaxis as { range: number[] }).range).toEqual([0, 3]);
    expect((fig.layout.annotations as { text: string }[])[0].text).toContain('1 point ≤ 0');
  });
});

describe('histogram2dFigure', () => {
  it('a heatmap of cell centres with empty cells blank and rows by y', () => {
    const h = new Histogram2D({ x: { bins: 2, range: [0, 2] }, y: { bins: 2, range: [0, 4] } }).fill([0.5, 1.5, 1.5], [1, 3, 3]);
    const t = histogram2dFigure(h, { xTitle: 'x [cm]', yTitle: 'y [cm]' }).data[0] as { type: string; x: number[]; y: number[]; z: (number | null)[][] };
    expect(t.type).toBe('heatmap');
    expect(t.x).toEqual([0.5, 1.5]);
    expect(t.y).toEqual([1, 3]);
    expect(t.z).toEqual([[1, null], [null, 2]]);
  });
});

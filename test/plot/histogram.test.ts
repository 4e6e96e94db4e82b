import { describe, expect, it } from 'vitest';
import { asMime } from '../../lib/display.js';
import { histogramFigure, PLOTLY_MIME } from '../../lib/plot/index.js';

describe('histogramFigure', () => {
  it('uses Sturges\' rule ⌈log₂ n⌉ + 1 for the default bin count (Sturges 1926; common practice)', () => {
    const values = Array.from({ length: 100 }, (_, i) => i / 10);
    const fig = histogramFigure(values, { title: 'p', xTitle: 'p [GeV/c]' });
    expect((fig.data[0].x as number[]).length).toBe(8); // ⌈log₂ 100⌉ + 1 = 7 + 1
    expect((fig.data[0].y as number[]).reduce((a, b) => a + b, 0)).toBe(100);
  });

  it('shows as plotly JSON, with static SVG and PNG renderings (title escaped) and a text fallback', () => {
    const fig = histogramFigure([1, 2, 3], { title: '<script>alert(1)</script>' });
    const bundle = fig[asMime]();
    const spec = bundle[PLOTLY_MIME] as { data: unknown[]; layout: { title: { text: string } } };
    expect(spec.data).toHaveLength(1);
    expect(spec.layout.title.text).toBe('<script>alert(1)</script>');
    expect(bundle['text/html']).toBeUndefined(); // front ends rank HTML above images: the picture must win
    expect(bundle['image/svg+xml']).not.toContain('<script>');
    expect(bundle['image/svg+xml']).toContain('&lt;script&gt;');
    expect(Buffer.from(String(bundle['image/png']), 'base64').subarray(1, 4).toString('latin1')).toBe('PNG');
    expect(bundle['text/plain']).toContain('bar, 3 points');
    expect(JSON.parse(JSON.stringify(fig))).toEqual(spec);
  });
});

import { describe, expect, it } from 'vitest';
import { asMime } from '../../lib/display.js';
import { eventDisplay } from '../../lib/plot/index.js';
import { join } from 'node:path';
import { expectGolden } from '../expectGolden.js';

/** Hits on a circle of radius R about (cx, cy) at the given angles (radians). */
function arcHits(cx: number, cy: number, r: number, angles: number[]): { x: number[]; y: number[] } {
  return { x: angles.map((a) => cx + r * Math.cos(a)), y: angles.map((a) => cy + r * Math.sin(a)) };
}

describe('eventDisplay', () => {
  const a = arcHits(0, 1, 1, [-Math.PI / 2, -1.3, -1.1, -0.9]);
  const b = arcHits(0, -2, 2, [Math.PI / 2, 1.4, 1.3, 1.2]);
  const hits = { xM: [...a.x, ...b.x, 0.3], yM: [...a.y, ...b.y, 0.2], track: [0, 0, 0, 0, 1, 1, 1, 1, -1] };
  const tracks = [
    { centerXM: 0, centerYM: 1, radiusM: 1, charge: 1, label: '0.45 GeV/c' },
    { centerXM: 0, centerYM: -2, radiusM: 2, charge: -1, label: '<b onmouseover=x>0.9</b>' },
  ];

  it('draws each track as the arc over its own hits, ending on its last hit', () => {
    const d = eventDisplay(hits, tracks, { fieldT: 1.5, extentM: { xMin: -0.1, xMax: 0.8, yMin: -0.4, yMax: 0.4 } });
    const paths = [...d.svg.matchAll(/<path d="M ([\d.-]+) ([\d.-]+) A ([\d.]+) [\d.]+ 0 (\d) 0 ([\d.-]+) ([\d.-]+)"/g)];
    expect(paths).toHaveLength(2);
    // Scale: (640 - 64 - 20) px over 0.9 m; radius 1 m → 617.78 px.
    expect(Number(paths[0][3])).toBeCloseTo(556 / 0.9, 1);
    expect(paths[0][4]).toBe('0'); // small arc
    expect(d.svg).toContain('B = 1.50 T ⊙');
  });

  it('escapes labels and titles (a data-derived string never becomes markup)', () => {
    const d = eventDisplay(hits, tracks, { title: 'run <i>7</i>' });
    expect(d.svg).not.toContain('<b onmouseover');
    expect(d.svg).toContain('&lt;b onmouseover=x&gt;');
    expect(d.svg).toContain('run &lt;i&gt;7&lt;/i&gt;');
  });

  it('shows as image/svg+xml with a text summary', () => {
    const bundle = eventDisplay(hits, tracks)[asMime]();
    expect(String(bundle['image/svg+xml'])).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(bundle['text/plain']).toBe('Event display: 9 hits (8 on tracks), 2 tracks');
  });

  it('rejects hit columns of different lengths', () => {
    expect(() => eventDisplay({ xM: [0, 1], yM: [0] }, [])).toThrow(/hits.yM.length = 1/);
  });

  it('matches its golden SVG (fixed input, rounded coordinates)', () => {
    expectGolden(join(import.meta.dirname, 'golden', 'event-display.svg'), eventDisplay(hits, tracks, { fieldT: -0.5 }).svg);
  });
});

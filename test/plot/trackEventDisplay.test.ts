import { describe, expect, it } from 'vitest';
import type { HitTable } from '../../lib/io/hitTable.js';
import { measureTracks } from '../../lib/track/measureTracks.js';
import { eventArcs, trackEventDisplay } from '../../lib/plot/index.js';

/** Noise-free hits on a circle of radius R about (cx, cy), in travel order, plus one noise hit. */
function circleEvent(cx: number, cy: number, r: number, from: number, to: number, n: number): HitTable {
  const x: number[] = [], y: number[] = [];
  for (let i = 0; i < n; i++) {
    const a = from + ((to - from) * i) / (n - 1);
    x.push(cx + r * Math.cos(a));
    y.push(cy + r * Math.sin(a));
  }
  x.push(0.3); y.push(0.3);
  const track = [...Array(n).fill(1), -1];
  return {
    length: n + 1,
    event: new Float64Array(n + 1).fill(7),
    track: Float64Array.from(track),
    x: Float64Array.from(x),
    y: Float64Array.from(y),
    sigmaX: new Float64Array(n + 1).fill(1e-4),
    sigmaY: new Float64Array(n + 1).fill(1e-4),
    source: { file: '(memory)', units: {}, ignoredColumns: [] },
  };
}

describe('trackEventDisplay', () => {
  it('eventArcs rebuilds the circle of a fitted track (centre and radius to 1e-6 m)', () => {
    const hits = circleEvent(0.1, 1.2, 1.2, -Math.PI / 2, -Math.PI / 2 + 0.6, 30);
    const tracks = measureTracks(hits, { fieldT: 1.5 });
    const { drawn, rows } = eventArcs(hits, tracks, 7);
    expect(rows).toHaveLength(31);
    expect(drawn).toHaveLength(1);
    expect(drawn[0].centerXM).toBeCloseTo(0.1, 6);
    expect(drawn[0].centerYM).toBeCloseTo(1.2, 6);
    expect(drawn[0].radiusM).toBeCloseTo(1.2, 6);
    // p_T = 0.299792458 · B · R (follows from c; common practice) = 0.5396 GeV/c → "540 MeV/c".
    expect(drawn[0].label).toBe('540 MeV/c');
  });

  it('draws the hits, the noise hit as an open circle and one arc; unknown event is a bad call', () => {
    const hits = circleEvent(0, 1, 1, -Math.PI / 2, -Math.PI / 2 + 0.5, 20);
    const tracks = measureTracks(hits, { fieldT: 1 });
    const d = trackEventDisplay(hits, tracks, 7);
    expect(d.summary).toBe('Event display: 21 hits (20 on tracks), 1 track, B = 1 T');
    expect(d.svg.match(/<path d="M/g)).toHaveLength(1);
    expect(d.svg.match(/fill="none" stroke="#7b8190"/g)).toHaveLength(1);
    expect(() => trackEventDisplay(hits, tracks, 8)).toThrow(/event = 8 is not valid/);
  });
});

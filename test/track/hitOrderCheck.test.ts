import { describe, expect, it } from 'vitest';
import { parseHitsCsv } from '../../lib/io/parseHitsCsv.js';
import { checkHitOrder } from '../../lib/track/hitOrderCheck.js';
import { measureTracks } from '../../lib/track/measureTracks.js';
import { consumeWarnings } from '../../lib/warnings.js';

/** Hits on a circle of radius rMm through the origin, at the given turning angles [rad], as CSV rows. */
function arc(track: number, rMm: number, angles: readonly number[]): string[] {
  return angles.map((a) => `1,${track},${(rMm * Math.sin(a)).toFixed(4)},${(rMm - rMm * Math.cos(a)).toFixed(4)}`);
}

function tracksOf(rows: string[]) {
  return measureTracks(parseHitsCsv(new TextEncoder().encode(['event,track,x[mm],y[mm]', ...rows].join('\n') + '\n'), 'order.csv'), { fieldT: 1, hitErrorM: 1e-4 });
}

/** The same rows with z (so helix fits, which keep their arc lengths), z rising 2 mm a hit. */
function helicesOf(rows: string[]) {
  const withZ = rows.map((r, i) => `${r},${2 * i}`);
  return measureTracks(parseHitsCsv(new TextEncoder().encode(['event,track,x[mm],y[mm],z[mm]', ...withZ].join('\n') + '\n'), 'order.csv'), { fieldT: 1, hitErrorM: 1e-4 });
}

describe('checkHitOrder (exact geometry, no smearing)', () => {
  it('leaves hits in travel order alone, either sense of travel', () => {
    consumeWarnings();
    const t = tracksOf([...arc(1, 100, [0, 0.3, 0.6, 0.9, 1.2, 1.5]), ...arc(2, 100, [1.5, 1.2, 0.9, 0.6, 0.3, 0])]);
    expect(checkHitOrder(t)).toEqual([]);
    expect(consumeWarnings()).toEqual([]);
  });

  it('flags a track whose first hits run backwards (two halves joined head to head), with one HIT_ORDER warning', () => {
    consumeWarnings();
    const t = tracksOf([...arc(1, 100, [0, 0.3, 0.6, 0.9, 1.2]), ...arc(2, 100, [0.9, 0.6, 0.3, 0, 1.2, 1.5, 1.8])]);
    expect(checkHitOrder(t)).toEqual([1]);
    const w = consumeWarnings();
    expect(w.map((x) => x.code)).toEqual(['HIT_ORDER']);
    expect(w[0].message).toMatch(/^1 track \(first: event 1, track 2\) have hits that run backwards part of the way/);
  });

  it('does not judge a looper of a full turn or a curl-up sampled coarser than 60° a hit', () => {
    const turn = Array.from({ length: 30 }, (_, i) => (2.2 * Math.PI * i) / 29);
    const coarse = [0, 1.3, 2.6, 1.9, 3.9];
    expect(checkHitOrder(tracksOf([...arc(1, 50, turn), ...arc(2, 20, coarse)]))).toEqual([]);
    consumeWarnings();
  });

  it('judges helix fits from the arc lengths the fit kept, with the same verdicts as measuring them again', () => {
    const rows = [...arc(1, 100, [0, 0.3, 0.6, 0.9, 1.2]), ...arc(2, 100, [0.9, 0.6, 0.3, 0, 1.2, 1.5, 1.8]), ...arc(3, 100, [1.5, 1.2, 0.9, 0.6, 0.3, 0])];
    const t = helicesOf(rows);
    expect(t.arcLengthM).toHaveLength(t.hits.length);
    expect(checkHitOrder(t)).toEqual([1]);
    expect(checkHitOrder({ ...t, arcLengthM: undefined })).toEqual([1]);
    consumeWarnings();
  });
});

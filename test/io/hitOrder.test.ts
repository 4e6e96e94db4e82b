import { describe, expect, it } from 'vitest';
import { indexTracks, parseHitsCsv, parseHitsJsonl } from '../../lib/io/index.js';
import { SagittaError } from '../../lib/errors.js';

const bytes = (text: string) => new TextEncoder().encode(text);

describe('hit_order and files without a track column', () => {
  it('reads hit_order and puts each track\'s rows in that order (ties keep the file order)', () => {
    const t = parseHitsCsv(bytes('event,track,x[m],y[m],hit_order\n1,1,3,0,2\n1,2,9,9,0\n1,1,1,0,0\n1,1,2,0,1\n1,2,8,8,1\n'), 'h.csv');
    expect(Array.from(t.hitOrder!)).toEqual([2, 0, 0, 1, 1]);
    const { table, index, rows } = indexTracks(t);
    expect(Array.from(index.offsets)).toEqual([0, 3, 5]);
    expect(Array.from(table.x)).toEqual([1, 2, 3, 9, 8]);
    expect(Array.from(rows!)).toEqual([2, 3, 0, 1, 4]);
  });

  it('reorders a contiguous track whose hit_order runs backwards', () => {
    const t = parseHitsCsv(bytes('event,track,x,y,hit_order\n1,1,3,0,0\n1,1,2,0,1\n1,1,1,0,2\n'), 'h.csv');
    expect(Array.from(indexTracks(t).table.x)).toEqual([0.003, 0.002, 0.001]);
    const back = parseHitsCsv(bytes('event,track,x,y,hit_order\n1,1,3,0,2\n1,1,2,0,1\n1,1,1,0,0\n'), 'h.csv');
    expect(Array.from(indexTracks(back).table.x)).toEqual([0.001, 0.002, 0.003]);
  });

  it('accepts a file without track only when asked, marking every row −1 and saying so', () => {
    const text = 'event,x,y\n1,0,0\n1,1,1\n';
    let err: unknown;
    try { parseHitsCsv(bytes(text), 'h.csv'); } catch (e) { err = e; }
    expect((err as SagittaError).code).toBe('MISSING_COLUMN');
    const t = parseHitsCsv(bytes(text), 'h.csv', { trackOptional: true });
    expect(Array.from(t.track)).toEqual([-1, -1]);
    expect(t.source.absentColumns).toEqual(['track']);
    const j = parseHitsJsonl(bytes('{"event":1,"x":0,"y":0}\n{"event":1,"x":1,"y":2}\n'), 'h.jsonl', { trackOptional: true });
    expect(Array.from(j.track)).toEqual([-1, -1]);
  });
});

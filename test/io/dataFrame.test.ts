import { describe, expect, it } from 'vitest';
import { parseHitsCsv } from '../../lib/io/parseHitsCsv.js';
import { hitsToDataFrame } from '../../lib/io/hitsToDataFrame.js';
import { columnTableToDataFrame } from '../../lib/io/columnTable.js';
import { measureTracks } from '../../lib/track/measureTracks.js';
import { trackTableColumns } from '../../lib/track/trackTableColumns.js';

const hits = parseHitsCsv(new TextEncoder().encode('event,track,x[cm],y[cm],z[cm]\n1,1,0,0,0\n1,1,10,1,1\n1,1,20,4,2\n1,1,30,9,3\n'), 'h.csv');

describe('DataFrames for notebooks', () => {
  it('hitsToDataFrame names its unit in the columns and converts from metres', () => {
    const df = hitsToDataFrame(hits, 'cm');
    expect(df.columns).toEqual(['event', 'track', 'x_cm', 'y_cm', 'z_cm']);
    expect((df['x_cm'].values as number[])[3]).toBeCloseTo(30, 9);
  });
  it('the track table becomes a DataFrame with the same columns as the CLI output', () => {
    const table = trackTableColumns(measureTracks(hits, { fieldT: 1 }));
    const df = columnTableToDataFrame(table);
    expect(df.columns).toEqual(table.columns.map((c) => c.name));
    expect(df.shape).toEqual([1, table.columns.length]);
    expect((df['status'].values as string[])[0]).toBe('ok');
  });
});

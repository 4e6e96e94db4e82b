import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseHitsCsv } from '../../lib/io/parseHitsCsv.js';
import { parseHitsJsonl } from '../../lib/io/parseHitsJsonl.js';
import { readHits } from '../../lib/io/readHits.js';
import { indexTracks } from '../../lib/io/indexTracks.js';
import { scanNumber } from '../../lib/io/scanNumber.js';
import { SagittaError } from '../../lib/errors.js';
import { measureTracks } from '../../lib/track/measureTracks.js';

const enc = (s: string) => new TextEncoder().encode(s);
const csv = (s: string, lengthUnit?: string) => parseHitsCsv(enc(s), 'hits.csv', { lengthUnit });

function errorOf(f: () => unknown): SagittaError {
  try {
    f();
  } catch (e) {
    if (e instanceof SagittaError) return e;
    throw e;
  }
  throw new Error('expected a SagittaError');
}

describe('parseHitsCsv', () => {
  it('reads columns, converting the default unit (mm) to metres', () => {
    const t = csv('event,track,x,y,z,sigma\n1,1,10,20,30,0.2\n1,1,11,21,31,0.2\n');
    expect(t.length).toBe(2);
    expect(Array.from(t.x)).toEqual([0.01, 0.011]);
    expect(t.z![1]).toBeCloseTo(0.031, 15);
    expect(t.sigmaX![0]).toBeCloseTo(2e-4, 15);
    expect(t.sigmaY).toBe(t.sigmaX);
    expect(t.source.units).toEqual({ x: 'mm', y: 'mm', z: 'mm', sigma: 'mm' });
  });

  it('honours units written in the header, per column', () => {
    const t = csv('event,track,x[cm],y [cm],z(m),sigma[um]\n1,2,1.5,2,0.5,300\n');
    expect(t.x[0]).toBeCloseTo(0.015, 15);
    expect(t.y[0]).toBeCloseTo(0.02, 15);
    expect(t.z![0]).toBeCloseTo(0.5, 15);
    expect(t.sigmaX![0]).toBeCloseTo(3e-4, 15);
    expect(t.source.units.x).toBe('cm');
  });

  it('accepts a UTF-8 BOM, CRLF line ends, blank lines, tabs and ignored quoted text columns', () => {
    const t = csv('\ufeffevent,track,x,y,label\r\n1,1,1,2,"a, b"\r\n\r\n1,1,2,3,"<script>alert(1)</script>"\r\n');
    expect(t.length).toBe(2);
    expect(t.source.ignoredColumns).toEqual(['label']);
    const tab = csv('event\ttrack\tx\ty\n1\t1\t1\t2\n');
    expect(tab.y[0]).toBeCloseTo(0.002, 15);
  });

  it('names file, line and column for a value that is not a number', () => {
    const e = errorOf(() => csv('event,track,x,y\n1,1,1,2\n1,1,abc,2\n'));
    expect(e.code).toBe('BAD_NUMBER');
    expect(e.message).toBe(`hits.csv:3, column 'x': "abc" is not a finite number; fix the value (NaN, Inf and empty cells are not accepted in hit tables)`);
  });

  it('refuses NaN, Inf and empty cells', () => {
    for (const bad of ['NaN', 'Inf', '-Infinity', '', '1e999']) {
      expect(errorOf(() => csv(`event,track,x,y\n1,1,${bad},2\n`)).code).toBe('BAD_NUMBER');
    }
  });

  it('reports a missing column with the header it found', () => {
    const e = errorOf(() => csv('event,x,y\n1,1,2\n'));
    expect(e.code).toBe('MISSING_COLUMN');
    expect(e.message).toContain("required column 'track' is missing; the header has 'event', 'x', 'y'");
  });

  it('reports a duplicated header name, and a header repeated inside the data', () => {
    expect(errorOf(() => csv('event,track,x,y,x\n1,1,1,2,3\n')).code).toBe('DUPLICATE_COLUMN');
    const e = errorOf(() => csv('event,track,x,y\n1,1,1,2\nevent,track,x,y\n1,1,3,4\n'));
    expect(e.message).toContain('hits.csv:3');
    expect(e.message).toContain('repeats the header');
  });

  it('reports empty files, header-only files and rows with the wrong number of fields', () => {
    expect(errorOf(() => csv('')).code).toBe('EMPTY_FILE');
    expect(errorOf(() => csv('\n\n')).code).toBe('EMPTY_FILE');
    expect(errorOf(() => csv('event,track,x,y\n')).code).toBe('EMPTY_FILE');
    expect(errorOf(() => csv('event,track,x,y\n1,1,2\n')).message).toContain('hits.csv:2: row has 3 fields but the header has 4');
    expect(errorOf(() => csv('event,track,x,y\n1,1,2,3,4\n')).message).toContain('more fields than the 4');
  });

  it('rejects an unknown header unit and a half-given sigma_x/sigma_y pair', () => {
    expect(errorOf(() => csv('event,track,x[furlong],y\n1,1,2,3\n')).code).toBe('UNKNOWN_UNIT');
    expect(errorOf(() => csv('event,track,x,y,sigma_x\n1,1,2,3,4\n')).code).toBe('BAD_ROW');
  });
});

describe('scanNumber agrees with Number() to the last bit (Clinger fast path + fallback)', () => {
  it('for doubles written by toString, toExponential and toFixed', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer({ min: 0, max: 2 }), (v, style) => {
        const text = style === 0 ? String(v) : style === 1 ? v.toExponential(12) : Math.abs(v) < 1e15 ? v.toFixed(6) : String(v);
        const bytes = enc(text + ',');
        const parsed = scanNumber(bytes, 0, bytes.length, 44);
        expect(Object.is(parsed, Number(text)) || (parsed === 0 && Number(text) === 0)).toBe(true);
      }),
      { numRuns: 3000, seed: 42 },
    );
  });
});

describe('parseHitsJsonl', () => {
  it('reads the same table as the CSV reader', () => {
    const j = parseHitsJsonl(enc('{"event":1,"track":1,"x[cm]":1.5,"y":2}\r\n\n{"event":1,"track":1,"x[cm]":2,"y":3}\n'), 'h.jsonl');
    expect(j.length).toBe(2);
    expect(j.x[1]).toBeCloseTo(0.02, 15);
    expect(j.y[1]).toBeCloseTo(0.003, 15);
  });
  it('names the line of a bad object or value', () => {
    expect(errorOf(() => parseHitsJsonl(enc('{"event":1,"track":1,"x":1,"y":2}\n{"event":1,"track":1,"x":"a","y":2}\n'), 'h.jsonl')).message).toMatch(/^h\.jsonl:2, column 'x'/);
    expect(errorOf(() => parseHitsJsonl(enc('{"event":1,\n'), 'h.jsonl')).message).toMatch(/^h\.jsonl:1: not a JSON object/);
  });
});

describe('readHits and track grouping', () => {
  const dir = mkdtempSync(join(tmpdir(), 'sagitta-io-'));

  it('chooses the reader by extension and refuses unknown ones or missing files', () => {
    const p = join(dir, 'a.csv');
    writeFileSync(p, 'event,track,x,y\n1,1,1,2\n');
    expect(readHits(p).length).toBe(1);
    expect(errorOf(() => readHits(join(dir, 'a.xlsx'))).code).toBe('FILE_NOT_FOUND');
    writeFileSync(join(dir, 'a.xlsx'), 'x');
    expect(errorOf(() => readHits(join(dir, 'a.xlsx'))).code).toBe('UNKNOWN_FORMAT');
  });

  it('regroups scattered rows of a track, keeping their order, and drops no row', () => {
    const t = csv('event,track,x,y\n1,1,0,0\n1,2,5,5\n1,1,1,1\n1,2,6,6\n1,1,2,2\n');
    const { table, index } = indexTracks(t);
    expect(index.count).toBe(2);
    expect(Array.from(index.offsets)).toEqual([0, 3, 5]);
    expect(Array.from(table.x).map((v) => v * 1000)).toEqual([0, 1, 2, 5, 6]);
    expect(Array.from(table.source.line!)).toEqual([2, 4, 6, 3, 5]);
  });

  it('a track that cannot be fitted stays in the output with its status', () => {
    const t = csv('event,track,x,y\n1,1,0,0\n1,1,1,1\n2,1,0,0\n2,1,0,0\n2,1,0,0\n3,1,0,0\n3,1,10,1\n3,1,20,4\n');
    const m = measureTracks(t, { fieldT: 1 });
    expect(m.count).toBe(3);
    expect(m.status).toEqual(['too-few-hits', 'degenerate', 'ok']);
    expect(m.statusCounts).toMatchObject({ ok: 1, 'too-few-hits': 1, degenerate: 1 });
  });
});

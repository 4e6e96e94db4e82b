import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const BIN = fileURLToPath(new URL('../../kernel/bin/sagitta.js', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'sagitta-find-'));

function sagitta(...args: string[]) {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', cwd: dir });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/**
 * Two helices of R = 0.5 m from the origin in a 1 T field along +z (p_T = 0.2998·1·0.5 =
 * 0.1499 GeV/c, common practice), one positive (clockwise) and one negative, 30 hits 10 mm
 * apart, written in reverse travel order and interleaved, with a stale track column, a label
 * column and one noise hit.
 */
function writeHits(): string {
  const rows: string[] = [];
  for (const q of [1, -1]) {
    const phi0 = q > 0 ? 0.3 : 2.4;
    // Centre to the right of travel for q > 0 (clockwise), to the left for q < 0.
    const cx = 0.5 * q * Math.sin(phi0), cy = -0.5 * q * Math.cos(phi0);
    for (let i = 29; i >= 0; i--) {
      const a = Math.atan2(-cy, -cx) - (q * 0.01 * (i + 1)) / 0.5;
      rows.push(`7,99,${(1000 * (cx + 0.5 * Math.cos(a))).toFixed(4)},${(1000 * (cy + 0.5 * Math.sin(a))).toFixed(4)},${(3 * (i + 1)).toFixed(4)},0.05,"q=${q}"`);
    }
  }
  const mixed = rows.flatMap((_, i) => (i % 2 === 0 ? [rows[i >> 1]] : [rows[30 + (i >> 1)]]));
  mixed.splice(17, 0, '7,99,400,-300,100,0.05,"noise"');
  const p = join(dir, 'hits.csv');
  writeFileSync(p, ['event,track,x,y,z,sigma,label', ...mixed].join('\n') + '\n');
  return p;
}

describe('sagitta find', () => {
  const hits = writeHits();

  it('labels every row in input order with track and hit_order, ignoring the old track column, and feeds sagitta fit', () => {
    const r = sagitta('find', hits, '--field', '1 T', '--origin', '0,0,0 mm', '--out', 'labelled.csv');
    expect(r.code).toBe(0);
    expect(r.stderr).toContain('found 2 tracks');
    expect(r.stderr).toContain('1 hits on no track');
    expect(r.stderr).toContain('the track column of the input was ignored');
    const lines = readFileSync(join(dir, 'labelled.csv'), 'utf8').trim().split('\n');
    expect(lines[0]).toBe('event,x,y,z,sigma,label,track,hit_order');
    expect(lines).toHaveLength(62);
    const input = readFileSync(hits, 'utf8').trim().split('\n');
    for (let i = 1; i < input.length; i++) {
      const cells = input[i].split(',');
      expect(lines[i].startsWith([cells[0], ...cells.slice(2)].join(','))).toBe(true);
    }
    expect(lines[18]).toMatch(/"noise",-1,-1$/);
    // Hits were written last-first: the hit nearest the origin (z = 3 mm) must be hit_order 0.
    const first = lines.filter((l) => l.split(',')[3] === '3.0000');
    expect(first).toHaveLength(2);
    for (const l of first) expect(l.endsWith(',0')).toBe(true);

    const f = sagitta('fit', 'labelled.csv', '--field', '1 T', '--out', 'tracks.csv');
    expect(f.code).toBe(0);
    const rows = readFileSync(join(dir, 'tracks.csv'), 'utf8').trim().split('\n').map((l) => l.split(','));
    const h = rows.shift()!;
    expect(rows).toHaveLength(2);
    const charges = rows.map((row) => Number(row[h.indexOf('charge')])).sort();
    expect(charges).toEqual([-1, 1]);
    for (const row of rows) expect(Number(row[h.indexOf('pt_GeV_c')])).toBeCloseTo(0.1499, 3);
  });

  it('writes JSON Lines for JSON Lines input, and refuses a CSV output for it (exit 2)', () => {
    const p = join(dir, 'hits.jsonl');
    const csv = readFileSync(hits, 'utf8').trim().split('\n').slice(1);
    writeFileSync(p, csv.map((l) => { const c = l.split(','); return JSON.stringify({ event: 7, x: Number(c[2]), y: Number(c[3]), z: Number(c[4]), sigma: Number(c[5]) }); }).join('\n') + '\n');
    const r = sagitta('find', p, '--field', '1 T', '--out', 'labelled.jsonl');
    expect(r.stderr).toContain('found 2 tracks');
    expect(r.code).toBe(0);
    const out = readFileSync(join(dir, 'labelled.jsonl'), 'utf8').trim().split('\n').map((l) => JSON.parse(l));
    expect(out).toHaveLength(61);
    expect(out[17]).toMatchObject({ track: -1, hit_order: -1 });
    expect(sagitta('find', p, '--field', '1 T', '--out', 'labelled.csv').code).toBe(2);
  });

  it('exits 1 with file:line for unusable input and 2 for bad usage; never writes over the input', () => {
    const bad = join(dir, 'bad.csv');
    writeFileSync(bad, 'event,x,y\n1,0,0\n1,x,1\n');
    const r = sagitta('find', bad, '--field', '1 T');
    expect(r.code).toBe(1);
    expect(r.stderr).toContain(`bad.csv:3, column 'x'`);
    expect(sagitta('find', hits).code).toBe(2);
    expect(sagitta('find', hits, '--field', '1.5').code).toBe(2);
    expect(sagitta('find', hits, '--field', '1 T', '--origin', 'somewhere').code).toBe(2);
    expect(sagitta('find', hits, '--field', '1 T', '--out', hits).code).toBe(2);
  });

  it('has --help that says how the direction of travel is decided', () => {
    const r = sagitta('find', '--help');
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('Direction of travel');
  });
});

import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { arc } from '../fit/helpers.js';

const BIN = fileURLToPath(new URL('../../kernel/bin/sagitta.js', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'sagitta-cli-'));

function sagitta(...args: string[]) {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', cwd: dir });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/**
 * A small hand-made hit file in centimetres: event 1 is a positive track (clockwise in +B),
 * event 2 a negative one (counter-clockwise), both R = 2 m with tan λ = 0.25, plus a 2-hit
 * stub and a noise hit (track −1).
 */
function writeHits(): string {
  const lines = ['event,track,x[cm],y[cm],z[cm],sigma[um]'];
  for (const [event, span] of [[1, -0.6], [2, 0.6]] as const) {
    const a = arc(0, -200, 200, Math.PI / 2, span, 20);
    for (let i = 0; i < 20; i++) lines.push(`${event},1,${a.x[i]},${a.y[i]},${0.25 * 200 * Math.abs(span) * i / 19},100`);
  }
  lines.push('3,1,0,0,0,100', '3,1,1,1,1,100', '3,-1,5,5,5,100');
  const p = join(dir, 'hits.csv');
  writeFileSync(p, lines.join('\n') + '\n');
  return p;
}

describe('sagitta fit', () => {
  const hits = writeHits();

  it('fits a field given in kG and writes one row per track, failures included', () => {
    const r = sagitta('fit', hits, '--field', '15 kG', '--out', 'out.csv');
    expect(r.code).toBe(0);
    const rows = readFileSync(join(dir, 'out.csv'), 'utf8').trim().split('\n').map((l) => l.split(','));
    const header = rows.shift()!;
    for (const c of ['event', 'track', 'n_hits', 'charge', 'radius_m', 'pt_GeV_c', 'p_GeV_c', 'tan_lambda', 'sigma_pt_GeV_c', 'chi2', 'ndf', 'status']) {
      expect(header).toContain(c);
    }
    const col = (row: string[], name: string) => row[header.indexOf(name)];
    expect(rows).toHaveLength(3);
    // p_T = 0.299792458 · 1.5 T · 2 m (common practice), p = p_T·√(1 + 0.25²).
    expect(Number(col(rows[0], 'pt_GeV_c'))).toBeCloseTo(0.899377374, 6);
    expect(Number(col(rows[0], 'p_GeV_c'))).toBeCloseTo(0.899377374 * Math.sqrt(1.0625), 6);
    expect(col(rows[0], 'charge')).toBe('1');
    expect(col(rows[1], 'charge')).toBe('-1');
    expect(col(rows[2], 'status')).toBe('too-few-hits');
    expect(r.stderr).toContain('fitted 2, failed 1 (too-few-hits 1)');
    expect(r.stderr).toContain('42 hits on 3 tracks, 1 unassigned hits (track < 0) set aside');
    expect(r.stderr).toContain('field 1.5 T');
  });

  it('writes JSON with the run description', () => {
    const r = sagitta('fit', hits, '--field', '1.5 T', '--fitter', 'taubin', '--out', 'out.json');
    expect(r.code).toBe(0);
    const json = JSON.parse(readFileSync(join(dir, 'out.json'), 'utf8'));
    expect(json.meta.fitter).toBe('taubin');
    expect(json.meta.field_T).toBe(1.5);
    expect(json.meta.counts).toMatchObject({ hits: 43, tracks: 3, track_hits: 42, unassigned_hits: 1, status_ok: 2 });
    expect(json.meta.counts['status_too-few-hits']).toBe(1);
    expect(json.tracks).toHaveLength(3);
    expect(json.tracks[2].pt_GeV_c).toBeNull();
  });

  it('refuses a field without a unit, naming the option and an example (bad usage: exit 2)', () => {
    const r = sagitta('fit', hits, '--field', '1.5');
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--field "1.5" has no unit; write it with one, e.g. "1.5 T"');
  });

  it('exits 1 with file:line and column for unusable input, and 2 for bad usage', () => {
    const bad = join(dir, 'bad.csv');
    writeFileSync(bad, 'event,track,x,y\n1,1,0,0\n1,1,x,1\n');
    const r = sagitta('fit', bad, '--field', '1 T');
    expect(r.code).toBe(1);
    expect(r.stderr).toContain(`bad.csv:3, column 'x': "x" is not a finite number`);
    expect(sagitta('fit', hits).code).toBe(2);
    expect(sagitta('fit', hits, '--field', '1 T', '--fitter', 'nope').code).toBe(2);
  });

  it('has --help', () => {
    const r = sagitta('fit', '--help');
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('positive particles turn clockwise');
  });
});

import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { seededRandom } from '../../lib/simulate/rng.js';
import { CHUNK_BYTES } from '../../kernel/batch/chunkBytes.js';

const BIN = fileURLToPath(new URL('../../kernel/bin/sagitta.js', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'sagitta-threads-'));

function sagitta(...args: string[]) {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8', cwd: dir, timeout: 120_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/**
 * Helices of 20 hits in mm, 4 tracks an event (seed 13), every 97th track a 2-hit stub that
 * cannot be fitted and a noise hit (track −1) in every event: several chunks of input.
 */
function writeHits(tracks: number): string {
  const rng = seededRandom(13, 'fit-threads');
  const lines = ['event,track,x,y,z'];
  for (let k = 0; k < tracks; k++) {
    const R = 300 + 3000 * rng.uniform(), a0 = 2 * Math.PI * rng.uniform(), span = (rng.uniform() < 0.5 ? -1 : 1) * (0.2 + 0.4 * rng.uniform());
    const event = 1 + Math.floor(k / 4);
    const hits = k % 97 === 0 ? 2 : 20;
    for (let i = 0; i < hits; i++) {
      const a = a0 + (span * i) / 19;
      lines.push(`${event},${k % 4},${(R * Math.cos(a) - R * Math.cos(a0)).toFixed(3)},${(R * Math.sin(a) - R * Math.sin(a0)).toFixed(3)},${(20 * i + 0.2 * rng.gaussian()).toFixed(3)}`);
    }
    if (k % 4 === 3) lines.push(`${event},-1,1.5,2.5,3.5`);
  }
  const p = join(dir, 'hits.csv');
  writeFileSync(p, lines.join('\n') + '\n');
  return p;
}

describe('sagitta fit with worker threads', () => {
  const hits = writeHits(16_000);

  it('the input spans several chunks, so the workers and this thread each work some', () => {
    expect(statSync(hits).size).toBeGreaterThan(2 * CHUNK_BYTES);
  });
  it('gives the same CSV and JSON bytes with --threads 1, 2 and 3, and the same counts', () => {
    const outs = ['1', '2', '3'].map((t) => {
      const r = sagitta('fit', hits, '--field', '1.5 T', '--threads', t, '--out', `t${t}.csv`);
      expect(r.code, r.stderr).toBe(0);
      const j = sagitta('fit', hits, '--field', '1.5 T', '--threads', t, '--quiet', '--out', `t${t}.json`);
      expect(j.code, j.stderr).toBe(0);
      return { csv: readFileSync(join(dir, `t${t}.csv`)), json: readFileSync(join(dir, `t${t}.json`), 'utf8'), summary: r.stderr };
    });
    expect(outs[0].csv.toString('utf8').split('\n')).toHaveLength(16_000 + 2);
    for (const o of outs.slice(1)) {
      expect(o.csv.equals(outs[0].csv)).toBe(true);
      expect(o.json).toBe(outs[0].json);
      expect(o.summary.match(/fitted \d+, failed \d+/)?.[0]).toBe(outs[0].summary.match(/fitted \d+, failed \d+/)?.[0]);
    }
    expect(outs[0].summary).toMatch(/fitted 15835, failed 165/);
  });
  it('a bad number deep in the file is reported at its own line with --threads 1, 2 and 3 (parsed in this thread or in a worker), nothing written', () => {
    const lines = readFileSync(hits, 'utf8').split('\n');
    const bad = Math.floor(lines.length * 0.8); // well past the first chunks
    const cells = lines[bad].split(',');
    cells[2] = '12.5x';
    lines[bad] = cells.join(',');
    const broken = join(dir, 'broken.csv');
    writeFileSync(broken, lines.join('\n'));
    for (const t of ['1', '2', '3']) {
      const r = sagitta('fit', broken, '--field', '1.5 T', '--threads', t, '--quiet', '--out', `broken-${t}.csv`);
      expect(r.code, r.stderr).toBe(1);
      expect(r.stderr).toContain(`broken.csv:${bad + 1}`);
      expect(r.stderr).toContain('12.5x');
      expect(existsSync(join(dir, `broken-${t}.csv`))).toBe(false);
    }
  });
  it('a usage error after the worker threads have started (with the command) ends at once, exit 2, nothing written', () => {
    const r = sagitta('fit', hits, '--field', 'bad', '--threads', '2', '--out', 'never.csv');
    expect(r.code, r.stderr).toBe(2);
    expect(r.stderr).toMatch(/--field/);
    expect(existsSync(join(dir, 'never.csv'))).toBe(false);
  });
});

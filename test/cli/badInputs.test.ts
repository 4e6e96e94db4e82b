import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BAD_CASES_FILE, BAD_RUNNER, type BadCase, type BadCaseResult } from './badCases.js';

/**
 * The catalogue of bad inputs and faults (test/fixtures/bad/cases.json): every case runs through
 * the command line's `main` in one spawned process (test/cli/badInputRunner.ts), each in a fresh
 * folder, and must give its exact one-line message and exit code — 1 for an input that cannot be
 * used, 2 for a command line that is wrong — and leave every file of the folder as it was (no
 * output written, nothing overwritten, no temporary file left). Faults that need a real process
 * (a closed pipe, a signal, a full disk) are spawned one by one below.
 */
const cases = JSON.parse(readFileSync(BAD_CASES_FILE, 'utf8')) as BadCase[];
const CLI = 'kernel/bin/sagitta.js';
let results = new Map<string, BadCaseResult>();
const scratch = mkdtempSync(join(tmpdir(), 'sagitta-bad-test-'));

beforeAll(() => {
  const file = join(scratch, 'results.json');
  const r = spawnSync(process.execPath, ['--import', 'tsx', BAD_RUNNER, file], { encoding: 'utf8', timeout: 110_000 });
  if (r.status !== 0) throw new Error(`the catalogue runner failed (${r.status}): ${r.stderr}`);
  results = new Map((JSON.parse(readFileSync(file, 'utf8')) as BadCaseResult[]).map((x) => [x.name, x]));
}, 120_000);
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('the bad-input catalogue', () => {
  it('holds at least 60 cases with unique names, each with its message, exit code and reason', () => {
    expect(cases.length).toBeGreaterThanOrEqual(60);
    expect(new Set(cases.map((c) => c.name)).size).toBe(cases.length);
    for (const c of cases) {
      expect([1, 2], c.name).toContain(c.exit);
      expect(c.stderr.length, c.name).toBeGreaterThan(0);
      expect(c.why.length, c.name).toBeGreaterThan(0);
    }
  });

  it.each(cases.map((c) => [c.name, c] as const))('%s', (_name, c) => {
    const r = results.get(c.name)!;
    expect(r, 'case was run').toBeDefined();
    expect(r.stderr.trimEnd()).toBe(c.stderr);
    expect(r.exit).toBe(c.exit);
    expect(r.stdout).toBe('');
    // Refused: nothing in the folder changed, appeared (no output, no temporary) or went missing.
    expect(r.changed).toEqual([]);
    // One line from sagitta; the option parser's own refusals are one line plus hints in parentheses.
    const lines = r.stderr.trimEnd().split('\n');
    if (lines[0].startsWith('error: ')) expect(lines.slice(1).every((l) => l.startsWith('('))).toBe(true);
    else expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^(sagitta: |error: )/);
    expect(r.stderr).not.toMatch(/\n\s+at |UNCAUGHT|TypeError|ReferenceError/);
  });
});

/** Runs the real binary with a shell pipeline or signal; returns its status and output. */
function sh(script: string, cwd: string, timeout = 60_000) {
  return spawnSync('bash', ['-c', script], { cwd, encoding: 'utf8', timeout, env: { ...process.env, SAGITTA: `${process.execPath} ${join(process.cwd(), CLI)}` } });
}

function bigHits(dir: string, events: number): string {
  const rows = ['event,track,x[mm],y[mm]'];
  for (let e = 1; e <= events; e++) for (let t = 1; t <= 4; t++) for (let i = 0; i < 12; i++) {
    const a = 0.05 * i + t;
    rows.push(`${e},${t},${(200 * Math.sin(a)).toFixed(3)},${(200 - 200 * Math.cos(a)).toFixed(3)}`);
  }
  const file = join(dir, 'big.csv');
  writeFileSync(file, rows.join('\n') + '\n');
  return file;
}

describe('faults that need a real process', () => {
  it('| head: a reader that stops early ends the command quietly with 0 (fit and range)', () => {
    const dir = mkdtempSync(join(scratch, 'pipe-'));
    bigHits(dir, 4000);
    const fit = sh('set -o pipefail; $SAGITTA fit big.csv --field "1 T" --hit-error "1 mm" | head -1', dir);
    expect(fit.stdout).toMatch(/^event,track,/);
    expect(fit.stderr).not.toMatch(/EPIPE|\n\s+at /);
    expect(fit.status).toBe(0);
    const range = sh('set -o pipefail; $SAGITTA range --particle proton --material water --table --points 5000 | head -1', dir);
    expect(range.stderr).toBe('');
    expect(range.status).toBe(0);
  });

  it('an interrupted fit (SIGINT, SIGTERM) writes nothing and leaves no temporary file', async () => {
    const dir = mkdtempSync(join(scratch, 'signal-'));
    bigHits(dir, 40_000);
    for (const signal of ['SIGINT', 'SIGTERM'] as const) {
      const child = spawn(process.execPath, [join(process.cwd(), CLI), 'fit', 'big.csv', '--field', '1 T', '--hit-error', '1 mm', '--threads', '1', '--out', 'tracks.csv'], { cwd: dir });
      let err = '';
      child.stderr.on('data', (d) => (err += d));
      // Stop it once it has opened its temporary output (the run is then well under way).
      for (let i = 0; i < 400 && !readdirSync(dir).some((f) => f.endsWith('.tmp')); i++) await new Promise((r) => setTimeout(r, 25));
      child.kill(signal);
      const code = await new Promise<number | null>((r) => child.on('exit', (c) => r(c)));
      expect(code).toBe(signal === 'SIGINT' ? 130 : 143);
      expect(err).toContain(`stopped by ${signal}; no output was written`);
      expect(readdirSync(dir).sort()).toEqual(['big.csv']);
    }
  }, 60_000);

  const root = process.getuid?.() === 0;
  it.skipIf(!root && !process.env.CI)('a full disk is one line, exit 1, and no output or temporary is left (a 64 KiB tmpfs; root only)', () => {
    if (!root) throw new Error('the full-disk test needs root to mount a small tmpfs (CI runs as root)');
    const dir = mkdtempSync(join(scratch, 'disk-'));
    bigHits(dir, 200);
    const small = join(dir, 'small');
    mkdirSync(small);
    const mounted = spawnSync('mount', ['-t', 'tmpfs', '-o', 'size=64k', 'tmpfs', small]);
    if (mounted.status !== 0) throw new Error(`cannot mount a tmpfs: ${mounted.stderr}`);
    try {
      const fit = sh('$SAGITTA fit big.csv --field "1 T" --hit-error "1 mm" --out small/tracks.csv', dir);
      expect(fit.stderr.trim()).toBe('sagitta: small/tracks.csv: cannot write here (the disk is full); free some space or write elsewhere');
      expect(fit.status).toBe(1);
      expect(readdirSync(small)).toEqual([]);
      // The demo scenario's hits (about 2 MB) do not fit in 64 KiB.
      const scenario = join(process.cwd(), 'notebooks/data/brindlemoor.scenario.json');
      const sim = sh(`$SAGITTA simulate ${scenario} --out small/h.csv --truth small/t.csv`, dir);
      expect(sim.stderr.trim()).toMatch(/^sagitta: small\/(h|t)\.csv: cannot write here \(the disk is full\); free some space or write elsewhere$/);
      expect(sim.status).toBe(1);
      expect(readdirSync(small)).toEqual([]);
    } finally {
      spawnSync('umount', [small]);
    }
  });

  it.skipIf(!root && !process.env.CI)('an unreadable hit file and an unwritable folder are one line each (run as user nobody; root only)', () => {
    if (!root) throw new Error('the permission test needs root to run the command as another user (CI runs as root)');
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-perm-'));
    try {
      writeFileSync(join(dir, 'hits.csv'), readFileSync('test/fixtures/bad/inputs/hits.csv'));
      mkdirSync(join(dir, 'ro'));
      spawnSync('chmod', ['777', dir]);
      spawnSync('chmod', ['555', join(dir, 'ro')]);
      const asNobody = (args: string[]) => spawnSync('setpriv', ['--reuid=65534', '--regid=65534', '--clear-groups', process.execPath, join(process.cwd(), CLI), ...args], { cwd: dir, encoding: 'utf8', timeout: 60_000 });
      spawnSync('chmod', ['000', join(dir, 'hits.csv')]);
      const unreadable = asNobody(['fit', 'hits.csv', '--field', '1 T']);
      expect(unreadable.stderr.trim()).toBe("sagitta: hits.csv: cannot read (permission denied); check the file's permissions");
      expect(unreadable.status).toBe(1);
      spawnSync('chmod', ['644', join(dir, 'hits.csv')]);
      const unwritable = asNobody(['fit', 'hits.csv', '--field', '1 T', '--out', 'ro/tracks.csv']);
      expect(unwritable.stderr.trim()).toBe('sagitta: ro/tracks.csv: cannot write here (permission denied); choose a folder you can write into');
      expect(unwritable.status).toBe(2);
      expect(readdirSync(join(dir, 'ro'))).toEqual([]);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('simulate writes hits, truth and run record together (all three appear, no temporary left)', () => {
    const dir = mkdtempSync(join(scratch, 'sim-'));
    writeFileSync(join(dir, 's.json'), readFileSync('test/fixtures/bad/inputs/tiny.scenario.json'));
    const r = sh('$SAGITTA simulate s.json --seed 3 --out h.csv --truth t.csv', dir);
    expect(r.status).toBe(0);
    expect(readdirSync(dir).sort()).toEqual(['h.csv', 'h.run.json', 's.json', 't.csv']);
    expect(JSON.parse(readFileSync(join(dir, 'h.run.json'), 'utf8')).seed).toBe(3);
    expect(existsSync(join(dir, 'h.csv'))).toBe(true);
  });
});

import { spawnSync } from 'node:child_process';
import { browserIt, chromiumAvailable, openReport } from './reportBrowser.js';
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCommand } from '../../kernel/cli/commands/run.js';
import type { Notebook } from '../../kernel/notebook/types.js';
import { nbformatValidator } from './nbSchema.js';
import { checkLine, EXAMPLE_CHECKS } from './exampleChecks.js';

const NOTEBOOKS = resolve(import.meta.dirname, '..', '..', 'notebooks');
const examples = readdirSync(NOTEBOOKS).filter((f) => f.endsWith('.ipynb')).sort();
const validate = nbformatValidator();

// STYLE.md §11: every example notebook is executed by the test suite and must finish without error.
describe.each(examples)('example notebook %s', (name) => {
  let report: { dir: string; html: string } | undefined;
  it('runs headlessly without error; executed notebook is valid nbformat 4.5; the report shows its provenance', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-example-'));
    const source = join(NOTEBOOKS, name);
    const before = readFileSync(source);
    expect(validate(JSON.parse(before.toString('utf8'))).errors).toEqual([]); // the file as shipped is nbformat 4.5 too
    const executed = join(dir, 'executed.ipynb');
    const html = join(dir, 'report.html');
    const r = await runCommand(source, { cellTimeout: '300s', set: [], executed, html });
    expect(r.reason).toBeUndefined();
    expect(r.exitCode).toBe(0);
    expect(readFileSync(source)).toEqual(before);
    const nb = JSON.parse(readFileSync(executed, 'utf8')) as Notebook;
    expect(validate(nb).errors).toEqual([]);
    const errors = nb.cells.flatMap((c) => (c.cell_type === 'code' ? c.outputs.filter((o) => o.output_type === 'error') : []));
    expect(errors).toEqual([]);
    const page = readFileSync(html, 'utf8');
    // Provenance: the data files the notebook read, relative to it, with their SHA-256 and origin
    // (simulated when a run record beside them says so); no absolute path.
    // A notebook that simulates its tracks in a cell reads no file: its report lists the seeds instead.
    if (/\bread(Hits|Truth|NumberColumns)\(|readFileSync\(/.test(before.toString('utf8'))) {
      expect(page).toMatch(/[\w./-]+\.(csv|json)<\/td><td class="sg-num">[\d.]+ (B|KiB|MiB)<\/td><td>(<b class="sg-sim">simulated<\/b>[^<]*|as given)<\/td><td class="sg-hash">[0-9a-f]{64}/);
    } else {
      expect(page).toMatch(/<td>[^<]+<\/td><td class="sg-hash">\d+<\/td>/);
    }
    expect(page).not.toContain(NOTEBOOKS);
    if (name.startsWith('01-')) {
      // Its hits come from the simulator (the run record says so), with the record's seed; its knobs are listed.
      expect(page).toMatch(/<td>data\/brindlemoor-hits\.csv<\/td><td class="sg-num">[\d.]+ (KiB|MiB)<\/td><td><b class="sg-sim">simulated<\/b> \(brindlemoor\)<\/td>/);
      expect(page).toContain('<b>Simulated data.</b>');
      expect(page).toContain('<td class="sg-hash">20260401</td>');
      expect(page).toContain('<td>field</td><td class="sg-hash">1.5 T <span class="sg-muted">(used in T)</span></td>');
    }
    // A notebook with its own check (its results against published values) passes it.
    const check = EXAMPLE_CHECKS[name];
    if (check) {
      const results = checkLine(nb.cells);
      expect(results, `${name} prints no sagitta-check line`).toBeDefined();
      check(results!);
    }
    report = { dir, html };
  }, 300_000);
  browserIt('its report draws every figure in headless Chromium with no console error', async () => {
    expect(chromiumAvailable()).toBe(true);
    if (report === undefined) throw new Error(`the headless run of ${name} above failed, so there is no report to open`);
    const { dir, html } = report;
    const opened = await openReport(html);
    try {
      const { tab, problems } = opened;
      const counts = await tab.evaluate(() => ({
        figures: document.querySelectorAll('[data-sg-figure]').length,
        drawn: Array.from(document.querySelectorAll('[data-sg-figure]')).filter((n) => n.querySelector('svg.main-svg .cartesianlayer .trace') && n.getBoundingClientRect().height > 100).length,
        images: document.querySelectorAll('img.sg-image').length,
        loaded: Array.from(document.querySelectorAll<HTMLImageElement>('img.sg-image')).filter((i) => i.complete && i.naturalWidth > 0).length,
      }));
      expect(problems).toEqual([]);
      expect(counts.figures).toBeGreaterThan(0);
      expect(counts.drawn).toBe(counts.figures);
      expect(counts.loaded).toBe(counts.images);
      const shot = join(dir, 'report.png');
      await tab.screenshot({ path: shot, fullPage: true });
      process.stdout.write(`${name}: report ${html}, screenshot ${shot}\n`);
    } finally {
      await opened.close();
    }
  }, 300_000);
});

describe('sagitta demo (npm run demo)', () => {
  it('runs the first example notebook and writes report.html in the folder it was started from, saying where', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-demo-'));
    const bin = resolve(import.meta.dirname, '..', '..', 'kernel', 'bin', 'sagitta.js');
    const res = spawnSync(process.execPath, [bin, 'demo'], { cwd: dir, encoding: 'utf8', timeout: 280_000, env: { ...process.env, INIT_CWD: dir } });
    expect(res.stderr).toContain('01-brindlemoor-bending.ipynb');
    expect(res.status).toBe(0);
    expect(res.stdout.trim()).toBe(`Report written to ${join(dir, 'report.html')} — one self-contained file; open it in any browser, no network needed.`);
    expect(readFileSync(join(dir, 'report.html'), 'utf8')).toContain('<title>Bending in the Brindlemoor chamber</title>');
  }, 300_000);
});

import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { browserIt, chromiumAvailable, openReport } from './reportBrowser.js';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCommand } from '../../kernel/cli/commands/run.js';

/**
 * End to end: hostile labels in a CSV file and hostile raw HTML in a markdown cell travel
 * through a real run (table, figure, event display, raw HTML output, printed text) into the
 * report, which is then opened in Chromium. Every payload would set window.__sgXss if it ran.
 */
const CSV = 'label,value\n<script>window.__sgXss=1</script>,1.5\n<img src=x onerror=window.__sgXss=2>,2.5\n<svg onload=window.__sgXss=3>,3.5\n<a href=javascript:window.__sgXss=4>plotly link</a>,4.5\n';

const MARKDOWN = [
  '# Label drill',
  '',
  '<script>window.__sgXss = 10</script>',
  '<img src="x" onerror="window.__sgXss = 11">',
  '<iframe src="javascript:window.__sgXss = 12"></iframe>',
  '[a link](javascript:window.__sgXss=13) and <a href="javascript:window.__sgXss=14">another</a>',
  '<div style="background:url(javascript:alert(1))" onclick="window.__sgXss=15">styled</div>',
].join('\n');

const CELLS = [
  "import { readFileSync } from 'node:fs';\nimport { histogramFigure, eventDisplay, present, asMime } from 'sagitta-tracks';\nimport { DataFrame } from 'danfojs-node';\nconst rows = readFileSync('labels.csv', 'utf8').trim().split('\\n').slice(1).map((l) => l.split(','));\nconst labels = rows.map((r) => r[0]);\nconst values = rows.map((r) => Number(r[1]));\nconsole.log(labels.join(' | '));",
  'new DataFrame({ label: labels, value: values })',
  "histogramFigure(values, { title: labels[0] + ' ' + labels[3], name: labels[1], xTitle: labels[2], bins: 3 })",
  "eventDisplay({ xM: [0, 0.1, 0.2], yM: [0, 0.01, 0.04], track: [0, 0, 0] }, [{ centerXM: 0, centerYM: 0.5, radiusM: 0.5, charge: 1, label: labels[1] }], { title: labels[0] })",
  "present({ [asMime]: () => ({ 'text/html': `<p>${labels.join('</p><p>')}</p>`, 'text/plain': 'labels' }) });",
  'throw new Error(labels[0])',
];

describe('XSS payloads through a real run', () => {
  let dir: string | undefined, html: string | undefined;
  it('a <script> label in a CSV and raw HTML in a markdown cell stay inert in the report page', async () => {
    dir = mkdtempSync(join(tmpdir(), 'sagitta-xss-'));
    writeFileSync(join(dir, 'labels.csv'), CSV);
    const nbFile = join(dir, 'drill.ipynb');
    writeFileSync(nbFile, JSON.stringify({ nbformat: 4, nbformat_minor: 5, metadata: {}, cells: [
      { id: 'm', cell_type: 'markdown', metadata: {}, source: MARKDOWN },
      ...CELLS.map((source, i) => ({ id: `c${i}`, cell_type: 'code', metadata: {}, execution_count: null, outputs: [], source })),
    ] }));
    const out = join(dir, 'report.html');
    const r = await runCommand(nbFile, { cellTimeout: '120s', set: [], executed: join(dir, 'out.ipynb'), html: out, keepGoing: true });
    expect(r.reason).toMatch(/^step 6 failed: Error: <script>window.__sgXss=1<\/script> \(all steps ran/);
    const page = readFileSync(out, 'utf8');
    const body = page.slice(page.indexOf('<body'), page.indexOf('<script type="application/json"'));
    expect(body.match(/<script|<iframe|<svg|<img[^>]*onerror|<[^>]*\b(href|src|action)\s*=\s*["']?\s*javascript:/gi)).toBeNull();
    expect(body).not.toMatch(/<[^>]*\son[a-z]+\s*=/i);
    html = out;
  }, 300_000);
  browserIt('and stay inert in headless Chromium: hovering and clicking every label runs none of them', async () => {
    expect(chromiumAvailable()).toBe(true);
    if (html === undefined || dir === undefined) throw new Error('the run in the test above failed, so there is no report to open');
    const report = await openReport(html);
    try {
      const { tab, problems } = report;
      // Hover and click everything that carries a label, in case a handler survived somewhere.
      for (const sel of ['.sg-html td', '.sg-html p', '.sg-prose a', '.sg-prose div', '.sg-figure .gtitle', '.sg-figure .gtitle a', '.sg-figure .legendtext']) {
        for (const el of await tab.locator(sel).all()) {
          await el.hover({ force: true, timeout: 2000 }).catch(() => undefined);
          await el.click({ force: true, timeout: 2000, noWaitAfter: true }).catch(() => undefined);
        }
      }
      await tab.waitForTimeout(300);
      const state = await tab.evaluate(() => ({
        xss: (window as unknown as { __sgXss?: number }).__sgXss,
        scripts: document.scripts.length,
        figures: document.querySelectorAll('[data-sg-figure]').length,
        tableText: document.querySelector('.sg-html table')?.textContent ?? '',
      }));
      expect(state.xss).toBeUndefined();
      expect(problems).toEqual([]);
      expect(state.scripts).toBe(state.figures + 2); // figure JSON blocks, plotly, the page's own script
      expect(state.tableText).toContain('<script>window.__sgXss=1</script>'); // shown as text, not run
      await tab.screenshot({ path: join(dir, 'report.png'), fullPage: true });
      process.stdout.write(`XSS drill report: ${html}, screenshot ${join(dir, 'report.png')}\n`);
    } finally {
      await report.close();
    }
  }, 300_000);
});

import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { asMime } from '../../lib/display.js';
import { histogramFigure } from '../../lib/plot/index.js';
import { openChromium, renderReport, type HeadlessChromium } from '../../kernel/report/index.js';
import { executedFixture } from './reportFixture.js';
import { chromiumAvailable, openReport } from './reportBrowser.js';

const OUT = mkdtempSync(join(tmpdir(), 'sagitta-static-'));
const file = join(OUT, 'report.html');
writeFileSync(file, renderReport(executedFixture()));

/** Bar heights relative to the tallest, and bar centres relative to the first and last, in page order. */
type Bars = { heights: number[]; centres: number[] };

function relative(boxes: { x: number; width: number; height: number }[]): Bars {
  const tallest = Math.max(...boxes.map((b) => b.height));
  const c = boxes.map((b) => b.x + b.width / 2);
  return { heights: boxes.map((b) => b.height / tallest), centres: c.map((v) => (v - c[0]) / (c[c.length - 1] - c[0])) };
}

// Chromium is required in CI (chromiumAvailable throws there); elsewhere a missing browser skips, said by the test name.
describe.skipIf(!chromiumAvailable())('static figure renderings in headless Chromium (skipped without /usr/bin/chromium outside CI)', () => {
  let browser: HeadlessChromium | undefined;
  afterAll(async () => { await browser?.close(); });

  it('the static SVG shows the same bins as the interactive plot (heights and centres within 0.5 %)', async () => {
    const fig = histogramFigure([0.41, 0.52, 0.55, 0.61, 0.62, 0.66, 0.7, 0.74, 0.81, 0.93, 1.2, 1.25], { bins: 6, range: [0.4, 1.3], xTitle: 'p [GeV/c]' });
    const bundle = fig[asMime]();
    const report = await openReport(file);
    let interactive: Bars;
    try {
      // Draw this figure with the page's plotly, as the report does, and measure its bars.
      const boxes = await report.tab.evaluate(async (spec) => {
        const w = window as unknown as { Plotly: { newPlot(n: Element, d: unknown, l: unknown): Promise<unknown> } };
        const node = document.createElement('div');
        document.body.appendChild(node);
        await w.Plotly.newPlot(node, (spec as { data: unknown }).data, (spec as { layout: unknown }).layout);
        return Array.from(node.querySelectorAll('.trace.bars .point path'), (p) => { const r = p.getBoundingClientRect(); return { x: r.x, width: r.width, height: r.height }; });
      }, bundle['application/vnd.plotly.v1+json']);
      interactive = relative(boxes);
    } finally {
      await report.close();
    }
    browser = await openChromium();
    const page = await browser.context.newPage();
    await page.setContent(`<!doctype html><body style="margin:0">${String(bundle['image/svg+xml'])}</body>`);
    const still = relative(await page.evaluate(() => Array.from(document.querySelectorAll('g.trace[data-trace="0"] rect'), (r) => { const b = r.getBoundingClientRect(); return { x: b.x, width: b.width, height: b.height }; })));
    expect(still.heights).toHaveLength(6);
    expect(interactive.heights).toHaveLength(6);
    still.heights.forEach((h, k) => expect(Math.abs(h - interactive.heights[k])).toBeLessThan(0.005));
    still.centres.forEach((c, k) => expect(Math.abs(c - interactive.centres[k])).toBeLessThan(0.005));
  });

  it('with scripting disabled the report shows each figure as its static picture, with its description as text', async () => {
    const noScript = await openChromium({ width: 1100, height: 900 }, { javaScriptEnabled: false });
    try {
      const page = await noScript.context.newPage();
      await page.goto(pathToFileURL(file).href);
      const figures = await page.evaluate(() => Array.from(document.querySelectorAll('[data-sg-figure]'), (n) => {
        const img = n.querySelector('img.sg-figure-static') as HTMLImageElement | null;
        return { width: img?.naturalWidth ?? 0, shown: (img?.getBoundingClientRect().height ?? 0) > 100, text: n.querySelector('.sg-figure-text')?.textContent ?? '' };
      }));
      expect(figures.length).toBeGreaterThan(0);
      for (const f of figures) {
        expect(f.width).toBe(640);
        expect(f.shown).toBe(true);
        expect(f.text).toContain('bar, 6 points');
      }
    } finally {
      await noScript.close();
    }
  });
});

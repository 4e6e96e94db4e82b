import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { chromiumAvailable } from './reportBrowser.js';
import { expectGolden } from '../expectGolden.js';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { inflateSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { collapseCarriageReturns, highlightTypeScript, openChromium, printReportPdf, renderMarkdown, renderReport, type HeadlessChromium } from '../../kernel/report/index.js';
import { executedFixture, XSS } from './reportFixture.js';

const OUT = mkdtempSync(join(tmpdir(), 'sagitta-report-'));

describe('renderReport (static checks)', () => {
  const html = renderReport(executedFixture());

  it('inlines plotly.js exactly once and writes each figure as JSON', () => {
    expect(html.split('Plotly.newPlot').length - 1).toBeGreaterThanOrEqual(1);
    expect(html.match(/plotly\.js v\d/g) ?? []).toHaveLength(1);
    expect(html).toContain('<script type="application/json" id="sg-fig-0">');
    expect(html).not.toMatch(/<script[^>]+src=/);
    expect(html).not.toMatch(/<link[^>]+href=/);
  });

  it('never lets a payload through as markup (escaped or sanitized everywhere)', () => {
    const body = html.slice(html.indexOf('<body'), html.indexOf('<script type="application/json"'));
    expect(body).not.toContain('<script');
    expect(body).not.toMatch(/<[^>]*\son[a-z]+\s*=/i); // no event-handler attribute inside any tag
    expect(body).not.toMatch(/href\s*=\s*["']?\s*javascript:/i);
    expect(body).not.toContain('<iframe');
    expect(body).toContain('&lt;script&gt;');
  });

  it('carries the provenance card: notebook hash, library commit and lockfile, cell compiler, knobs, data files (simulated marked, with the run record seed), modules, seeds, per-step times', () => {
    const card = html.slice(html.indexOf('aria-label="Provenance"'));
    expect(card).toContain('a'.repeat(64));
    expect(card).toContain('b'.repeat(64));
    expect(card).toContain(`Sagitta 0.1.0 · commit <span class="sg-hash">${'e'.repeat(40)}</span>`);
    expect(card).toContain('f'.repeat(64));
    expect(card).toContain('<td>Cells compiled by</td><td>TypeScript 5.0.4 · run on Node.js 20.19.0</td>');
    expect(card).toContain('<td>field</td><td class="sg-hash">0.5 T <span class="sg-muted">(used in T)</span></td><td class="sg-hash">1.5 T</td><td>this run (--set)</td>');
    expect(card).toMatch(/<td>data\/hits&lt;script&gt;.*<b class="sg-sim">simulated<\/b> \(check\)/);
    expect(card).toContain('<td>helpers.ts</td>');
    expect(card).toContain('<td>simulate</td>');
    expect(card).toContain('20260401');
    expect(card).toContain('40 ms');
  });

  it('numbers code cells one way: step 1 … step 6 in the notes, the provenance steps and the reason line', () => {
    expect([...html.matchAll(/<aside class="sg-note"><b>(step \d+)<\/b>/g)].map((m) => m[1])).toEqual(['step 1', 'step 2', 'step 3', 'step 4', 'step 5', 'step 6']);
    const body = html.slice(html.indexOf("<body"), html.indexOf("<script type=\"application/json\""));
    expect(body).not.toMatch(/CELL \d|cell \d|\[\d\]/);
    expect(html).toContain('step 5 failed: RangeError');
  });

  it('banners simulated inputs and carries the clinical caution when ranges or stopping powers were used', () => {
    expect(html).toContain('<b>Simulated data.</b>');
    expect(html).toMatch(/<b>Caution\.<\/b>.*not for treatment planning/);
    const plain = renderReport({ ...executedFixture(), run: { ...executedFixture().run, usesStoppingPower: false, inputs: [] } });
    expect(plain).not.toContain('<b>Caution.</b>');
    expect(plain).not.toContain('Simulated data.');
  });

  it('writes no absolute path and renders subscripts in figure labels (p_T → p<sub>T</sub>)', () => {
    expect(html).not.toMatch(/"\/(x|tmp|home|work)\//);
    expect(html).toContain('p\\u003csub>T\\u003c/sub> [GeV/c]');
  });

  it('matches its golden file (the page body, without the stylesheet and scripts; static figure pictures have goldens of their own)', () => {
    const body = html.slice(html.indexOf('<body'), html.indexOf('<script type="application/json"')).replace(/(<img class="sg-image sg-figure-static" alt="" src=")data:[^"]+/g, '$1data:…');
    expectGolden(join(import.meta.dirname, 'report-golden', 'fixture-body.html'), body);
  });

  it('renderMarkdown embeds attachment: images and image files in the notebook folder as data URLs; names the rest', () => {
    const png = 'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==';
    const dir = mkdtempSync(join(tmpdir(), 'sagitta-img-'));
    mkdirSync(join(dir, 'nb', 'figs'), { recursive: true });
    writeFileSync(join(dir, 'nb', 'figs', 'dot.png'), Buffer.from(png, 'base64'));
    writeFileSync(join(dir, 'secret.png'), 'not for the report');
    const out = renderMarkdown('![dot](attachment:dot.png) ![local](figs/dot.png) ![far](https://example.org/x.png) ![up](../secret.png) ![gone](figs/none.png)', { 'dot.png': { 'image/png': png } }, join(dir, 'nb'));
    expect(out).toContain(`<img src="data:image/png;base64,${png}" alt="dot" />`);
    expect(out).toContain(`<img src="data:image/png;base64,${png}" alt="local" />`);
    expect(out).not.toContain('<img src="https');
    expect(out).toContain('[image “far” not embedded: remote images are not loaded by a self-contained report]');
    expect(out).toContain("[image “up” not embedded: outside the notebook's folder]");
    expect(out).toContain('[image “gone” not embedded: file not found]');
  });

  it('highlightTypeScript colours tokens and escapes every character exactly once', () => {
    const code = 'const s = "<b>"; // a < b & c\nlet n = 1.5e3; /* x */ `t ${1}`';
    const out = highlightTypeScript(code);
    expect(out).toBe('<span class="sg-k">const</span> s = <span class="sg-s">&quot;&lt;b&gt;&quot;</span>; <span class="sg-c">// a &lt; b &amp; c</span>\n<span class="sg-k">let</span> n = <span class="sg-n">1.5e3</span>; <span class="sg-c">/* x */</span> <span class="sg-s">`t ${1}`</span>');
    const text = out.replace(/<[^>]+>/g, '').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&');
    expect(text).toBe(code);
  });

  it('collapseCarriageReturns keeps what a terminal would show', () => {
    expect(collapseCarriageReturns('10%\r50%\r100%\nnext\r\nend')).toBe('100%\nnext\nend');
  });

  it('renderMarkdown typesets $…$ as MathML and strips raw <script> and handlers', () => {
    const out = renderMarkdown(`Curvature $\\kappa = 1/R$.\n\n${XSS}`);
    expect(out).toContain('<math');
    expect(out).toContain('<mi>κ</mi>');
    expect(out).not.toContain('<script');
    expect(out).not.toContain('onerror');
  });
});

describe.skipIf(!chromiumAvailable())('report in headless Chromium', () => {
  let browser: HeadlessChromium;
  const file = join(OUT, 'report.html');
  beforeAll(async () => {
    writeFileSync(file, renderReport(executedFixture()));
    browser = await openChromium();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('draws every plot, raises no console error, keeps the XSS payloads inert; screenshot saved', async () => {
    const page = await browser.context.newPage();
    const problems: string[] = [];
    page.on('console', (m) => { if (m.type() === 'error' || m.type() === 'warning') problems.push(`${m.type()}: ${m.text()}`); });
    page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
    page.on('request', (r) => { if (!r.url().startsWith('file:') && !r.url().startsWith('data:')) problems.push(`request: ${r.url()}`); });
    await page.goto(pathToFileURL(file).href, { timeout: 120_000 });
    await page.waitForSelector('body[data-figures="drawn"]', { state: 'attached', timeout: 30_000 });
    const state = await page.evaluate(() => ({
      figures: document.querySelectorAll('[data-sg-figure]').length,
      drawn: Array.from(document.querySelectorAll('[data-sg-figure]')).filter((n) => n.querySelector('svg.main-svg') && n.getBoundingClientRect().height > 100).length,
      heights: Array.from(document.querySelectorAll('[data-sg-figure]')).map((n) => [n.getBoundingClientRect().height, n.innerHTML.slice(0, 200)]),
      bars: document.querySelectorAll('[data-sg-figure] .barlayer .point').length,
      images: Array.from(document.images).filter((i) => i.complete && i.naturalWidth > 0).length,
      xss: (window as unknown as { __sgXss?: number }).__sgXss,
      scripts: document.scripts.length,
    }));
    expect(problems).toEqual([]);
    await page.screenshot({ path: join(OUT, 'report.png'), fullPage: true });
    process.stdout.write(`report screenshot: ${join(OUT, 'report.png')} ${JSON.stringify(state.heights)}\n`);
    expect(state.figures).toBe(1);
    expect(state.drawn).toBe(1);
    expect(state.bars).toBe(6);
    expect(state.images).toBe(1); // the event display SVG
    expect(state.xss).toBeUndefined();
    expect(state.scripts).toBe(3); // figure JSON, plotly, the page's own script
    await page.screenshot({ path: join(OUT, 'report.png'), fullPage: true });
    expect(readFileSync(join(OUT, 'report.png')).length).toBeGreaterThan(10_000);
    process.stdout.write(`report screenshot: ${join(OUT, 'report.png')}\n`);
  });

  it('the code switch hides and shows code; --hide-code gives the same page (screen and print) as pressing it', { timeout: 240_000 }, async () => {
    const page = await browser.context.newPage();
    await page.goto(pathToFileURL(file).href, { timeout: 120_000 });
    await page.click('#sg-code-switch');
    expect(await page.locator('.sg-code > details').first().isVisible()).toBe(false);
    const pressed = { body: await page.evaluate(() => document.body.className), button: await page.textContent('#sg-code-switch') };
    await page.waitForSelector('body[data-figures="drawn"]', { state: 'attached', timeout: 120_000 });
    await page.emulateMedia({ media: 'print' });
    // What a printed page shows: every entry's place and size, and whether its code is shown.
    const layout = () => Array.from(document.querySelectorAll('.sg-entry'), (n) => { const b = n.getBoundingClientRect(); const d = n.querySelector('details'); return [Math.round(b.top), Math.round(b.height), d ? d.getBoundingClientRect().height > 0 : null]; });
    const pressedLayout = await page.evaluate(layout);
    await page.emulateMedia({ media: 'screen' });
    await page.click('#sg-code-switch');
    expect(await page.locator('.sg-code > details').first().isVisible()).toBe(true);
    const hiddenFile = join(OUT, 'hidden.html');
    writeFileSync(hiddenFile, renderReport({ ...executedFixture(), codeOpen: false }));
    const hidden = await browser.context.newPage();
    await hidden.goto(pathToFileURL(hiddenFile).href, { timeout: 120_000 });
    await hidden.waitForSelector('body[data-figures="drawn"]', { state: 'attached', timeout: 120_000 });
    expect({ body: await hidden.evaluate(() => document.body.className), button: await hidden.textContent('#sg-code-switch') }).toEqual(pressed);
    await hidden.emulateMedia({ media: 'print' });
    expect(await hidden.evaluate(layout)).toEqual(pressedLayout);
    expect(pressedLayout.filter((e) => e[2] === true)).toEqual([]);
  });

  it('display math shows no scrollbar and long code lines wrap in print; the figure toolbar is slim', { timeout: 240_000 }, async () => {
    const page = await browser.context.newPage();
    await page.goto(pathToFileURL(file).href, { timeout: 120_000 });
    await page.waitForSelector('body[data-figures="drawn"]', { state: 'attached', timeout: 120_000 });
    // A scrollbar can show only where content overflows a box that scrolls on that axis (MathML runs a pixel taller than its line).
    const math = await page.evaluate(() => Array.from(document.querySelectorAll('.sg-math'), (n) => ({ wide: n.scrollWidth > n.clientWidth, tall: n.scrollHeight > n.clientHeight && getComputedStyle(n).overflowY !== 'hidden' })));
    expect(math.length).toBeGreaterThan(0);
    expect(math).toEqual(math.map(() => ({ wide: false, tall: false })));
    const buttons = await page.evaluate(() => Array.from(document.querySelectorAll('.modebar-btn'), (b) => b.getAttribute('data-title')));
    expect(buttons).toEqual(['Download plot as a PNG', 'Zoom', 'Pan', 'Reset axes']);
    await page.emulateMedia({ media: 'print' });
    const overflow = await page.evaluate(() => Array.from(document.querySelectorAll('.sg-code pre'), (n) => n.scrollWidth - n.clientWidth));
    expect(overflow.every((d) => d <= 0)).toBe(true);
  });

  it('--pdf: prints a PDF whose pages carry the drawn figure (vector paths in the page content)', async () => {
    const pdf = join(OUT, 'report.pdf');
    await printReportPdf(file, pdf);
    const bytes = readFileSync(pdf);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // Inflate the page content streams and count filled rectangles/paths: the histogram's bars
    // and the plot frame add many; a report whose figure failed to draw has only text and rules.
    const text = bytes.toString('latin1');
    let paths = 0;
    for (const m of text.matchAll(/stream\r?\n/g)) {
      const start = m.index! + m[0].length;
      const end = text.indexOf('endstream', start);
      try {
        const content = inflateSync(bytes.subarray(start, end)).toString('latin1');
        paths += (content.match(/\bre\b|\bh\b\s*f\b|\bf\*?\n/g) ?? []).length;
      } catch { /* not a deflated stream (fonts, images) */ }
    }
    expect(paths).toBeGreaterThan(20);
    // The same check on print media in the browser: every figure has its bars laid out.
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 794, height: 1123 });
    await page.goto(pathToFileURL(file).href, { timeout: 120_000 });
    await page.waitForSelector('body[data-figures="drawn"]', { state: 'attached', timeout: 120_000 });
    await page.emulateMedia({ media: 'print' });
    const widths = await page.evaluate(() => Array.from(document.querySelectorAll('[data-sg-figure] .barlayer .point')).map((p) => p.getBoundingClientRect().width));
    expect(widths.length).toBe(6);
    expect(widths.every((w) => w > 0)).toBe(true);
  });
});

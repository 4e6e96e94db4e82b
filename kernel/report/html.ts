import { createHash } from 'node:crypto';
import { basename, dirname, resolve } from 'node:path';
import type { Cell, SagittaCellMeta } from '../notebook/types.js';
import { joinSource } from '../notebook/source.js';
import { plotlySource } from './assets.js';
import { escapeHtml } from '../../lib/display.js';
import { jsonForScript } from './escape.js';
import { highlightTypeScript } from './highlight.js';
import { renderMarkdown } from './markdown.js';
import { FigureStore, renderOutput } from './outputs.js';
import { REPORT_CSS } from './style.js';
import type { ReportInput, ReportRun } from './types.js';

/**
 * The page's own script: draws each figure from its JSON block, marks the body
 * `data-figures="drawn"` when all are drawn (the PDF printer and the tests wait for it), wires
 * the show/hide-code switch and redraws figures at print width.
 */
const BOOT = `(function () {
  var body = document.body;
  var nodes = Array.prototype.slice.call(document.querySelectorAll('[data-sg-figure]'));
  var config = { displaylogo: false, modeBarButtonsToRemove: ['sendDataToCloud', 'select2d', 'lasso2d'] };
  var drawing = nodes.map(function (node) {
    var spec = JSON.parse(document.getElementById(node.getAttribute('data-sg-figure')).textContent);
    node.textContent = '';
    return Plotly.newPlot(node, spec.data, spec.layout || {}, config);
  });
  Promise.all(drawing).then(function () { body.setAttribute('data-figures', 'drawn'); },
    function (err) { body.setAttribute('data-figures', 'failed'); console.error(err); });
  var button = document.getElementById('sg-code-switch');
  if (button) button.addEventListener('click', function () {
    var hidden = body.classList.toggle('sg-hide-code');
    button.textContent = hidden ? 'Show code' : 'Hide code';
  });
  function fit() { nodes.forEach(function (n) { Plotly.Plots.resize(n); }); }
  window.addEventListener('beforeprint', fit);
  window.addEventListener('resize', fit);
})();`;

/** Makes script text safe to place between <script> tags (only inside string or regex literals do these sequences occur). */
function scriptText(js: string): string {
  return js.replace(/<\/script/gi, '<\\/script').replace(/<!--/g, '\\x3C!--');
}

function cspHash(js: string): string {
  return `'sha256-${createHash('sha256').update(js, 'utf8').digest('base64')}'`;
}

/**
 * Renders an executed notebook as one self-contained HTML page: no request leaves the page
 * (a Content-Security-Policy allows only its own two scripts, inline styles and data: images),
 * plotly.js is inlined once and every figure is drawn from its JSON.
 */
export function renderReport(input: ReportInput): string {
  const { notebook, run } = input;
  const figures = new FigureStore();
  const metaTitle = typeof notebook.metadata.title === 'string' && notebook.metadata.title.trim() ? notebook.metadata.title.trim() : undefined;
  const title = input.title ?? metaTitle ?? firstHeading(notebook.cells) ?? basename(run.source.path).replace(/\.ipynb$/i, '');
  // The masthead shows the title; the notebook's own first heading saying the same is not repeated.
  let headingShown = false;
  const codeOpen = input.codeOpen ?? true;
  const imageDir = input.imageDir ?? dirname(resolve(run.source.path));
  const entries: string[] = [];
  let codeNo = 0;
  notebook.cells.forEach((cell, i) => {
    const meta = (cell.metadata.sagitta ?? {}) as SagittaCellMeta;
    if (cell.cell_type === 'markdown') {
      let text = joinSource(cell.source);
      if (!headingShown) {
        const m = /^\s*#\s+(.+?)\s*#*\s*(\n|$)/.exec(text);
        if (m && m[1].replace(/[*_`]/g, '') === title) text = text.slice(m[0].length);
        headingShown = true;
      }
      if (text.trim()) entries.push(`<section class="sg-entry sg-prose">${renderMarkdown(text, cell.attachments, imageDir)}</section>`);
    } else if (cell.cell_type === 'raw') {
      const text = joinSource(cell.source);
      if (text.trim()) entries.push(`<section class="sg-entry"><pre class="sg-out">${escapeHtml(text)}</pre></section>`);
    } else {
      codeNo++;
      const outs = cell.outputs.map((o) => renderOutput(o, figures)).join('\n');
      const classes = ['sg-entry', 'sg-code'];
      if (meta.injected) classes.push('sg-injected');
      if (meta.outcome === 'not-run') classes.push('sg-skipped');
      const label = meta.injected ? 'values set for this run' : `code · cell ${i + 1}`;
      entries.push(
        `<section class="${classes.join(' ')}" id="cell-${escapeHtml(cell.id ?? String(i + 1))}">` +
          `<aside class="sg-note"><b>[${codeNo}]</b>${noteText(meta)}</aside>` +
          `<details${codeOpen ? ' open' : ''}><summary>${escapeHtml(label)}</summary><pre><code>${highlightTypeScript(joinSource(cell.source))}</code></pre></details>` +
          (outs ? `<div class="sg-outputs">${outs}</div>` : '') +
          '</section>',
      );
    }
  });

  const figureBlocks = figures.specs.map((spec, k) => `<script type="application/json" id="sg-fig-${k}">${jsonForScript(spec)}</script>`).join('\n');
  const scripts: string[] = [];
  if (figures.specs.length > 0) scripts.push(scriptText(plotlySource()));
  scripts.push(scriptText(figures.specs.length > 0 ? BOOT : BOOT.replace(/Plotly\.newPlot[^;]*;/, 'null;')));
  const csp = [
    "default-src 'none'",
    `script-src ${scripts.map(cspHash).join(' ')}`,
    "style-src 'unsafe-inline'",
    'img-src data:',
    'font-src data:',
    "base-uri 'none'",
    "form-action 'none'",
  ].join('; ');

  return [
    '<!doctype html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="${escapeHtml(csp)}">`,
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<meta name="generator" content="Sagitta ${escapeHtml(run.versions.sagitta)}">`,
    `<title>${escapeHtml(title)}</title>`,
    `<style>${REPORT_CSS}</style>`,
    '</head>',
    `<body data-figures="${figures.specs.length > 0 ? 'pending' : 'drawn'}" data-figure-count="${figures.specs.length}">`,
    '<div class="sg-sheet">',
    masthead(title, run, notebook.cells, codeOpen),
    `<main>\n${entries.join('\n')}\n</main>`,
    provenanceCard(run, notebook.cells),
    '</div>',
    figureBlocks,
    ...scripts.map((s) => `<script>${s}</script>`),
    '</body>',
    '</html>',
    '',
  ].join('\n');
}

function firstHeading(cells: readonly Cell[]): string | undefined {
  for (const c of cells) {
    if (c.cell_type !== 'markdown') continue;
    const m = /^#\s+(.+?)\s*#*\s*$/m.exec(joinSource(c.source));
    if (m) return m[1].replace(/[*_`]/g, '');
  }
  return undefined;
}

function noteText(meta: SagittaCellMeta): string {
  if (meta.outcome === 'not-run') return '';
  const parts: string[] = [];
  if (meta.wallMs !== undefined) parts.push(formatMs(meta.wallMs));
  if (meta.outcome === 'failed') parts.push('<span class="sg-failed">failed</span>');
  return parts.map((p) => `<span>${p}</span>`).join(' ');
}

export function formatMs(ms: number): string {
  if (ms < 1000) return `${Math.round(ms)} ms`;
  if (ms < 60_000) return `${(ms / 1000).toFixed(2)} s`;
  return `${Math.floor(ms / 60_000)} min ${((ms % 60_000) / 1000).toFixed(0)} s`;
}

function formatBytes(n: number): string {
  return n < 1024 ? `${n} B` : n < 1024 ** 2 ? `${(n / 1024).toFixed(1)} KiB` : `${(n / 1024 ** 2).toFixed(2)} MiB`;
}

function masthead(title: string, run: ReportRun, cells: readonly Cell[], codeOpen: boolean): string {
  const code = cells.filter((c) => c.cell_type === 'code');
  const ran = code.filter((c) => ((c.metadata.sagitta ?? {}) as SagittaCellMeta).outcome !== 'not-run').length;
  const ok = run.status === 'complete';
  const state = ok ? 'complete' : run.status === 'stopped' ? 'stopped' : 'finished with errors';
  const item = (k: string, v: string) => `<div><dt>${k}</dt><dd>${v}</dd></div>`;
  return `<header class="sg-masthead">
<div class="sg-kicker">Sagitta analysis record</div>
<h1>${escapeHtml(title)}</h1>
<dl class="sg-runline">
<div><dd><span class="sg-state${ok ? '' : ' sg-bad'}">${escapeHtml(state)}</span></dd></div>
${item('Notebook', escapeHtml(basename(run.source.path)))}
${item('Started', escapeHtml(run.startedAt))}
${item('Wall time', formatMs(run.wallMs))}
${item('Cells run', `${ran} of ${code.length}`)}
</dl>
${run.reason ? `<p class="sg-reason">${escapeHtml(run.reason)}</p>` : ''}
<div class="sg-tools"><button type="button" id="sg-code-switch">${codeOpen ? 'Hide code' : 'Show code'}</button></div>
</header>`;
}

function provenanceCard(run: ReportRun, cells: readonly Cell[]): string {
  const rows = (r: string[][]) => r.map((cols) => `<tr>${cols.join('')}</tr>`).join('');
  const td = (v: string, cls = '') => `<td${cls ? ` class="${cls}"` : ''}>${v}</td>`;
  const params = Object.entries(run.parameters);
  const inputs = run.provenance.inputs;
  const seeds = run.provenance.seeds;
  const timing = cells
    .map((c, i) => ({ c, i, m: (c.metadata.sagitta ?? {}) as SagittaCellMeta }))
    .filter(({ c }) => c.cell_type === 'code');
  return `<section class="sg-card" aria-label="Provenance">
<h2>Provenance</h2>
<table><tbody>${rows([
    [td('Notebook'), td(`${escapeHtml(run.source.path)} (${formatBytes(run.source.sizeBytes)})`)],
    [td('Notebook SHA-256'), td(escapeHtml(run.source.sha256), 'sg-hash')],
    [td('Started'), td(escapeHtml(run.startedAt))],
    [td('Wall time'), td(formatMs(run.wallMs))],
    [td('Versions'), td(`Sagitta ${escapeHtml(run.versions.sagitta)} · Node ${escapeHtml(run.versions.node)} · TypeScript ${escapeHtml(run.versions.typescript)}`)],
  ])}</tbody></table>
<h3>Parameters set for this run</h3>
${params.length === 0 ? '<p>None: the notebook ran with its own defaults.</p>' : `<table><thead><tr><th>name</th><th>value</th></tr></thead><tbody>${rows(params.map(([k, v]) => [td(escapeHtml(k)), td(escapeHtml(JSON.stringify(v)), 'sg-hash')]))}</tbody></table>`}
<h3>Data files read</h3>
${inputs.length === 0 ? '<p>None recorded.</p>' : `<table><thead><tr><th>file</th><th>size</th><th>SHA-256</th></tr></thead><tbody>${rows(inputs.map((f) => [td(escapeHtml(f.name)), td(formatBytes(f.sizeBytes), 'sg-num'), td(escapeHtml(f.sha256), 'sg-hash')]))}</tbody></table>`}
<h3>Seeds</h3>
${seeds.length === 0 ? '<p>None recorded.</p>' : `<table><thead><tr><th>used by</th><th>seed</th></tr></thead><tbody>${rows(seeds.map((s) => [td(escapeHtml(s.label)), td(escapeHtml(String(s.seed)), 'sg-hash')]))}</tbody></table>`}
<h3>Cells</h3>
<table><thead><tr><th>cell</th><th>started</th><th>wall time</th><th>outcome</th></tr></thead><tbody>${rows(timing.map(({ i, m }) => [
    td(String(i + 1), 'sg-num'),
    td(escapeHtml(m.startedAt ?? '—')),
    td(m.wallMs !== undefined ? formatMs(m.wallMs) : '—', 'sg-num'),
    td(escapeHtml(m.outcome ?? '—') + (m.injected ? ' (injected values)' : '')),
  ]))}</tbody></table>
<p class="sg-foot">Written by Sagitta ${escapeHtml(run.versions.sagitta)}. Hashes let a reader check that the same notebook and the same data files give this record.</p>
</section>`;
}

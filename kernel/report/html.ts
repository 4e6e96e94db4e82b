import { createHash } from 'node:crypto';
import { escapeHtml } from '../../lib/internal.js';
import type { Cell, SagittaCellMeta } from '../notebook/types.js';
import { joinSource } from '../notebook/source.js';
import type { RunRecord } from '../runner/runRecord.js';
import { plotlySource } from './assets.js';
import { jsonForScript } from './escape.js';
import { withRichLabels } from './figureLabels.js';
import { formatMs } from './formatNumbers.js';
import { highlightTypeScript } from './highlight.js';
import { renderMarkdown } from './markdown.js';
import { FigureStore, renderOutput } from './outputs.js';
import { provenanceCard } from './provenanceCard.js';
import { REPORT_CSS } from './style.js';
import type { ReportInput } from './types.js';

/**
 * The page's own script: draws each figure from its JSON block with a slim toolbar (save as
 * image, zoom, pan, reset — what a reader of a record needs), marks the body
 * `data-figures="drawn"` when all are drawn (the PDF printer and the tests wait for it), wires
 * the show/hide-code switch and redraws figures at print width.
 */
const BOOT = `(function () {
  var body = document.body;
  var nodes = Array.prototype.slice.call(document.querySelectorAll('[data-sg-figure]'));
  var config = { displaylogo: false, modeBarButtons: [['toImage', 'zoom2d', 'pan2d', 'resetScale2d']] };
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
 * plotly.js is inlined once and every figure is drawn from its JSON. Code cells are numbered as
 * steps (step N is the cell the executed notebook counts N); hidden code (`codeOpen: false`) is
 * the page's own hidden state, so the HTML and its PDF look as after pressing "Hide code".
 */
export function renderReport(input: ReportInput): string {
  const { notebook, run } = input;
  const figures = new FigureStore();
  const metaTitle = typeof notebook.metadata.title === 'string' && notebook.metadata.title.trim() ? notebook.metadata.title.trim() : undefined;
  const title = input.title ?? metaTitle ?? firstHeading(notebook.cells) ?? run.source.path.replace(/\.ipynb$/i, '');
  // The masthead shows the title; the notebook's own first heading saying the same is not repeated.
  let headingShown = false;
  const codeOpen = input.codeOpen ?? true;
  const entries: string[] = [];
  let step = 0;
  notebook.cells.forEach((cell, i) => {
    if (cell.cell_type === 'markdown') {
      let text = joinSource(cell.source);
      if (!headingShown) {
        const m = /^\s*#\s+(.+?)\s*#*\s*(\n|$)/.exec(text);
        if (m && m[1].replace(/[*_`]/g, '') === title) text = text.slice(m[0].length);
        headingShown = true;
      }
      if (text.trim()) entries.push(`<section class="sg-entry sg-prose">${renderMarkdown(text, cell.attachments, input.imageDir)}</section>`);
    } else if (cell.cell_type === 'raw') {
      const text = joinSource(cell.source);
      if (text.trim()) entries.push(`<section class="sg-entry"><pre class="sg-out">${escapeHtml(text)}</pre></section>`);
    } else {
      step++;
      const meta = (cell.metadata.sagitta ?? {}) as SagittaCellMeta;
      const outs = cell.outputs.map((o) => renderOutput(o, figures)).join('\n');
      const classes = ['sg-entry', 'sg-code'];
      if (meta.outcome === 'not-run') classes.push('sg-skipped');
      entries.push(
        `<section class="${classes.join(' ')}" id="step-${step}" data-cell-id="${escapeHtml(cell.id ?? String(i + 1))}">` +
          `<aside class="sg-note"><b>step ${step}</b>${noteText(meta)}</aside>` +
          `<details open><summary>code</summary><pre><code>${highlightTypeScript(joinSource(cell.source))}</code></pre></details>` +
          (outs ? `<div class="sg-outputs">${outs}</div>` : '') +
          '</section>',
      );
    }
  });

  const figureBlocks = figures.specs.map((spec, k) => `<script type="application/json" id="sg-fig-${k}">${jsonForScript(withRichLabels(spec))}</script>`).join('\n');
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
    `<meta name="generator" content="Sagitta ${escapeHtml(run.library.version)}">`,
    `<title>${escapeHtml(title)}</title>`,
    `<style>${REPORT_CSS}</style>`,
    '</head>',
    `<body${codeOpen ? '' : ' class="sg-hide-code"'} data-figures="${figures.specs.length > 0 ? 'pending' : 'drawn'}" data-figure-count="${figures.specs.length}">`,
    '<div class="sg-sheet">',
    masthead(title, run, notebook.cells, codeOpen),
    cautions(run),
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

/** Banners a reader must see before the results: simulated inputs, and the clinical caution for ranges and stopping powers. */
function cautions(run: RunRecord): string {
  const out: string[] = [];
  const simulated = run.inputs.filter((f) => f.simulated);
  if (simulated.length > 0) {
    out.push(`<p class="sg-banner sg-sim-banner"><b>Simulated data.</b> ${simulated.map((f) => escapeHtml(f.path)).join(', ')} ${simulated.length === 1 ? 'was' : 'were'} made by Sagitta's seeded simulator, not recorded by a detector; the results describe the simulation.</p>`);
  }
  if (run.usesStoppingPower) {
    out.push('<p class="sg-banner sg-caution"><b>Caution.</b> This record uses computed ranges or stopping powers. They are for analysis and teaching of track data, not for treatment planning, dosimetry or any clinical decision; such use needs validated clinical tools, local codes and licensed medical-physics practice.</p>');
  }
  return out.join('\n');
}

function masthead(title: string, run: RunRecord, cells: readonly Cell[], codeOpen: boolean): string {
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
${item('Notebook', escapeHtml(run.source.path))}
${item('Started', escapeHtml(run.startedAt))}
${item('Wall time', formatMs(run.wallMs))}
${item('Steps run', `${ran} of ${code.length}`)}
</dl>
${run.reason ? `<p class="sg-reason">${escapeHtml(run.reason)}</p>` : ''}
<div class="sg-tools"><button type="button" id="sg-code-switch">${codeOpen ? 'Hide code' : 'Show code'}</button></div>
</header>`;
}



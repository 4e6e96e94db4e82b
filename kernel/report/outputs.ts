import type { Output } from '../notebook/types.js';
import { joinSource } from '../notebook/source.js';
import { escapeHtml, PLOTLY_MIME } from '../../lib/internal.js';
import { stripAnsi } from './escape.js';
import { renderMarkdown, renderTex } from './markdown.js';
import { sanitize } from './sanitize.js';

/** Collects the plotly figures of a report; each is written once as JSON and drawn by the page. */
export class FigureStore {
  readonly specs: unknown[] = [];
  add(spec: unknown): string {
    this.specs.push(spec);
    return `sg-fig-${this.specs.length - 1}`;
  }
}

/**
 * Text as a terminal would leave it: a carriage return (progress counters) starts its line over,
 * so only what follows the last one on each line remains.
 * @example collapseCarriageReturns('10%\r50%\r100%\n') // '100%\n'
 */
export function collapseCarriageReturns(text: string): string {
  return text.replace(/\r\n/g, '\n').split('\n').map((line) => line.slice(line.lastIndexOf('\r') + 1)).join('\n');
}

/** The richest representation we can show safely, in this order. */
const MIME_ORDER = [PLOTLY_MIME, 'image/svg+xml', 'image/png', 'image/jpeg', 'image/gif', 'text/html', 'text/markdown', 'text/latex', 'application/json', 'text/plain'] as const;

/** Renders one output of a code cell. Every string taken from the output is escaped or sanitized. */
export function renderOutput(o: Output, figures: FigureStore): string {
  switch (o.output_type) {
    case 'stream':
      return `<pre class="sg-out sg-${o.name === 'stderr' ? 'stderr' : 'stdout'}">${escapeHtml(collapseCarriageReturns(stripAnsi(joinSource(o.text))))}</pre>`;
    case 'error': {
      const trace = o.traceback.map(stripAnsi).join('\n');
      return `<div class="sg-out sg-error" role="alert"><div class="sg-error-head"><b>${escapeHtml(o.ename)}</b>: ${escapeHtml(o.evalue)}</div>` +
        (trace.trim() ? `<pre>${escapeHtml(trace)}</pre>` : '') + '</div>';
    }
    case 'display_data':
    case 'execute_result':
      return renderBundle(o.data, figures, o.output_type === 'execute_result');
  }
}

function renderBundle(data: Record<string, unknown>, figures: FigureStore, isResult: boolean): string {
  const mime = MIME_ORDER.find((m) => data[m] !== undefined);
  const cls = `sg-out sg-rich${isResult ? ' sg-result' : ''}`;
  const text = (m: string) => { const v = data[m]; return Array.isArray(v) ? v.join('') : String(v); };
  switch (mime) {
    case PLOTLY_MIME: {
      const id = figures.add(data[PLOTLY_MIME]);
      const fallback = data['text/plain'] !== undefined ? text('text/plain') : 'figure';
      return `<div class="${cls} sg-figure" data-sg-figure="${id}"><pre class="sg-figure-fallback">${escapeHtml(fallback)}</pre></div>`;
    }
    case 'image/svg+xml':
      return `<div class="${cls}"><img class="sg-image" alt="${escapeHtml(data['text/plain'] !== undefined ? text('text/plain') : 'figure')}" src="data:image/svg+xml;base64,${Buffer.from(text('image/svg+xml'), 'utf8').toString('base64')}"></div>`;
    case 'image/png':
    case 'image/jpeg':
    case 'image/gif': {
      const b64 = text(mime).replace(/\s+/g, '');
      if (!/^[A-Za-z0-9+/]*={0,2}$/.test(b64)) return `<pre class="${cls}">[${escapeHtml(mime)} output is not valid base64]</pre>`;
      return `<div class="${cls}"><img class="sg-image" alt="${escapeHtml(data['text/plain'] !== undefined ? text('text/plain') : 'image')}" src="data:${mime};base64,${b64}"></div>`;
    }
    case 'text/html':
      return `<div class="${cls} sg-html">${sanitize(text('text/html'))}</div>`;
    case 'text/markdown':
      return `<div class="${cls} sg-md">${renderMarkdown(text('text/markdown'))}</div>`;
    case 'text/latex':
      return `<div class="${cls} sg-math">${renderTex(text('text/latex').trim().replace(/^\$+|\$+$/g, ''), true)}</div>`;
    case 'application/json':
      return `<pre class="${cls}">${escapeHtml(JSON.stringify(data['application/json'], null, 2) ?? 'null')}</pre>`;
    case 'text/plain':
      return `<pre class="${cls}">${escapeHtml(stripAnsi(text('text/plain')))}</pre>`;
    default:
      return `<pre class="${cls}">[output in ${escapeHtml(Object.keys(data).join(', ') || 'no format')} — not shown]</pre>`;
  }
}

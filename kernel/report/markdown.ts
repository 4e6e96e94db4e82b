import katex from 'katex';
import MarkdownIt, { type StateBlock, type StateInline } from 'markdown-it';
import { escapeHtml } from './escape';
import { sanitize } from './sanitize';

/**
 * Markdown cells to HTML: CommonMark (markdown-it) with tables and strikethrough, TeX math
 * between `$…$` (inline) and `$$…$$` (display) typeset to MathML by KaTeX (no fonts or styles to
 * ship: the browser lays MathML out itself), `attachment:` images resolved to data URLs, and the
 * result — including any raw HTML the author wrote — passed through the sanitizer.
 */
export function renderMarkdown(text: string, attachments?: Record<string, Record<string, string>>): string {
  const env = { attachments: attachments ?? {} };
  return sanitize(md.render(text, env));
}

/** TeX to MathML; a TeX error is shown as the escaped source in an error span, never thrown. */
export function renderTex(tex: string, displayMode: boolean): string {
  try {
    return katex.renderToString(tex, { output: 'mathml', displayMode, throwOnError: true, strict: 'ignore', trust: false });
  } catch {
    return `<span class="sg-tex-error" title="could not typeset this TeX">${escapeHtml(tex)}</span>`;
  }
}

const md = new MarkdownIt({ html: true, linkify: false, typographer: false });
md.inline.ruler.after('escape', 'sg_math_inline', mathInline);
md.block.ruler.after('blockquote', 'sg_math_block', mathBlock, { alt: ['paragraph', 'reference', 'blockquote', 'list'] });
md.renderer.rules.sg_math_inline = (tokens, i) => renderTex(tokens[i].content, tokens[i].markup === '$$');
md.renderer.rules.sg_math_block = (tokens, i) => `<div class="sg-math">${renderTex(tokens[i].content, true)}</div>\n`;

const defaultImage = md.renderer.rules.image!;
md.renderer.rules.image = (tokens, idx, options, env, self) => {
  const token = tokens[idx];
  const src = String(token.attrGet('src') ?? '');
  const attached = ((env as { attachments?: Record<string, Record<string, string>> } | undefined)?.attachments) ?? {};
  if (src.startsWith('attachment:')) {
    const bundle = attached[decodeURIComponent(src.slice('attachment:'.length))];
    const mime = bundle && Object.keys(bundle).find((m) => m.startsWith('image/'));
    if (bundle && mime) token.attrSet('src', `data:${mime};base64,${String(bundle[mime]).replace(/\s+/g, '')}`);
  }
  return defaultImage(tokens, idx, options, env, self);
};

/** `$…$` inline (content must not start or end with a space, as in common TeX-in-markdown practice) and `$$…$$`. */
function mathInline(state: StateInline, silent: boolean): boolean {
  const src = state.src;
  const start = state.pos;
  if (src.charCodeAt(start) !== 0x24 /* $ */) return false;
  const display = src.charCodeAt(start + 1) === 0x24;
  const open = display ? 2 : 1;
  let end = start + open;
  for (;;) {
    end = src.indexOf(display ? '$$' : '$', end);
    if (end < 0) return false;
    if (src.charCodeAt(end - 1) === 0x5c /* \ */) { end++; continue; }
    break;
  }
  const content = src.slice(start + open, end);
  if (content.length === 0 || (!display && (/^\s/.test(content) || /\s$/.test(content)))) return false;
  if (!display && /\d/.test(src.charAt(end + 1))) return false; // "$5 and $6" is money, not math
  if (!silent) {
    const token = state.push('sg_math_inline', 'math', 0);
    token.content = content;
    token.markup = display ? '$$' : '$';
  }
  state.pos = end + open;
  return true;
}

function mathBlock(state: StateBlock, startLine: number, endLine: number, silent: boolean): boolean {
  let pos = state.bMarks[startLine] + state.tShift[startLine];
  let max = state.eMarks[startLine];
  if (pos + 2 > max || state.src.slice(pos, pos + 2) !== '$$') return false;
  pos += 2;
  let first = state.src.slice(pos, max);
  let last = '';
  let line = startLine;
  let found = false;
  if (first.trim().endsWith('$$')) {
    first = first.trim().slice(0, -2);
    found = true;
  }
  if (silent) return true;
  while (!found) {
    line++;
    if (line >= endLine) break;
    pos = state.bMarks[line] + state.tShift[line];
    max = state.eMarks[line];
    const text = state.src.slice(pos, max);
    if (text.trim().endsWith('$$')) {
      last = text.trim().slice(0, -2);
      found = true;
    }
  }
  if (!found) return false;
  const middle = line > startLine + 1 ? state.getLines(startLine + 1, line, state.tShift[startLine], true) : '';
  state.line = line + 1;
  const token = state.push('sg_math_block', 'math', 0);
  token.block = true;
  token.content = [first, middle, last].filter((s) => s.trim() !== '').join('\n');
  token.map = [startLine, state.line];
  token.markup = '$$';
  return true;
}

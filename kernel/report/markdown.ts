import { existsSync, readFileSync, realpathSync, statSync } from 'node:fs';
import { extname, resolve, sep } from 'node:path';
import katex from 'katex';
import MarkdownIt, { type StateBlock, type StateInline } from 'markdown-it';
import { escapeHtml } from '../../lib/internal.js';
import { sanitize } from './sanitize.js';

/**
 * Markdown cells to HTML: CommonMark (markdown-it) with tables and strikethrough, TeX math
 * between `$…$` (inline) and `$$…$$` (display) typeset to MathML by KaTeX (no fonts or styles to
 * ship: the browser lays MathML out itself), images embedded as data URLs (`attachment:` images
 * from the cell, and image files given by a relative path inside `imageDir`, the notebook's
 * folder), and the result — including any raw HTML the author wrote — passed through the
 * sanitizer. Images that cannot be embedded (remote, missing, outside the folder) are named in
 * place of the picture, since a self-contained report must not load anything.
 */
export function renderMarkdown(text: string, attachments?: Record<string, Record<string, string>>, imageDir?: string): string {
  const env: MarkdownEnv = { attachments: attachments ?? {}, imageDir };
  return sanitize(md.render(text, env as unknown as Record<string, unknown>));
}

interface MarkdownEnv {
  attachments: Record<string, Record<string, string>>;
  imageDir?: string;
}

const IMAGE_TYPES: Readonly<Record<string, string>> = Object.freeze({
  '.png': 'image/png', '.jpg': 'image/jpeg', '.jpeg': 'image/jpeg', '.gif': 'image/gif', '.webp': 'image/webp', '.svg': 'image/svg+xml',
});

/** Largest local image embedded (bytes); bigger files are named instead. */
const MAX_IMAGE_BYTES = 8 * 1024 * 1024;

/** A data URL for an image file under `dir` (never outside it), or a reason it cannot be embedded. */
function localImage(src: string, dir: string): { url?: string; why?: string } {
  const path = decodeURIComponent(src.split(/[?#]/)[0]);
  const type = IMAGE_TYPES[extname(path).toLowerCase()];
  if (!type) return { why: 'not an image file type' };
  if (!existsSync(dir)) return { why: 'notebook folder not found' };
  const root = realpathSync(dir);
  const file = resolve(root, path);
  if (!existsSync(file)) return { why: 'file not found' };
  const real = realpathSync(file);
  if (real !== root && !real.startsWith(root + sep)) return { why: "outside the notebook's folder" };
  if (statSync(real).size > MAX_IMAGE_BYTES) return { why: 'larger than 8 MiB' };
  return { url: `data:${type};base64,${readFileSync(real).toString('base64')}` };
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
  const e = (env ?? { attachments: {} }) as unknown as MarkdownEnv;
  const alt = self.renderInlineAsText(token.children ?? [], options, env);
  const missing = (why: string) => `<span class="sg-missing-image">[image “${escapeHtml(alt || src)}” not embedded: ${escapeHtml(why)}]</span>`;
  if (src.startsWith('attachment:')) {
    const bundle = e.attachments[decodeURIComponent(src.slice('attachment:'.length))];
    const mime = bundle && Object.keys(bundle).find((m) => m.startsWith('image/'));
    if (!bundle || !mime) return missing('no such attachment in the cell');
    token.attrSet('src', `data:${mime};base64,${String(bundle[mime]).replace(/\s+/g, '')}`);
  } else if (src.startsWith('data:')) {
    // kept as written; the sanitizer allows only image data URLs
  } else if (/^[a-z][a-z0-9+.-]*:|^\/\//i.test(src)) {
    return missing('remote images are not loaded by a self-contained report');
  } else {
    if (e.imageDir === undefined) return missing('no notebook folder to read it from');
    const local = localImage(src, e.imageDir);
    if (!local.url) return missing(local.why ?? 'unreadable');
    token.attrSet('src', local.url);
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

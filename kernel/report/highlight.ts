import { escapeHtml } from '../../lib/internal.js';

/**
 * Light TypeScript colouring for the report's code panels: comments, strings, numbers and
 * keywords get a class each; everything is escaped. A lexer this small is wrong on rare inputs
 * (a regular-expression literal containing a quote, say) — the cost is a wrong colour, never
 * lost or unescaped text, because every character lands in exactly one escaped piece.
 */
const TOKEN = new RegExp(
  [
    String.raw`(\/\/[^\n]*|\/\*[\s\S]*?\*\/)`,
    String.raw`(\x60(?:\\[\s\S]|[^\\\x60])*\x60|'(?:\\.|[^\\'\n])*'|"(?:\\.|[^\\"\n])*")`,
    String.raw`\b(\d[\d_]*(?:\.\d+)?(?:[eE][+-]?\d+)?n?)\b`,
    String.raw`\b(const|let|var|function|return|if|else|for|while|do|of|in|new|import|from|export|await|async|class|extends|interface|type|true|false|null|undefined|throw|try|catch|finally|typeof|instanceof|as|void|break|continue|switch|case|default|this)\b`,
  ].join('|'),
  'g',
);

const CLASSES = ['sg-c', 'sg-s', 'sg-n', 'sg-k'] as const;

/** Escaped HTML of `code` with spans for comments (sg-c), strings (sg-s), numbers (sg-n), keywords (sg-k). */
export function highlightTypeScript(code: string): string {
  let out = '';
  let last = 0;
  for (const m of code.matchAll(TOKEN)) {
    const at = m.index!;
    out += escapeHtml(code.slice(last, at));
    const group = m.slice(1).findIndex((g) => g !== undefined);
    out += `<span class="${CLASSES[group]}">${escapeHtml(m[0])}</span>`;
    last = at + m[0].length;
  }
  return out + escapeHtml(code.slice(last));
}

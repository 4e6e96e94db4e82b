/**
 * Escaping for the report's page. HTML text and attributes use the library's one `escapeHtml`
 * (lib/display.ts); what is particular to a page with inline scripts lives here.
 */

/**
 * JSON for a `<script type="application/json">` block: `<` is written as \u003c so no data can
 * close the block, and U+2028/U+2029 are escaped for older parsers.
 */
export function jsonForScript(value: unknown): string {
  return JSON.stringify(value).replace(/</g, '\\u003c').replace(/\u2028/g, '\\u2028').replace(/\u2029/g, '\\u2029');
}

/** Removes ANSI terminal escape sequences (colours in tracebacks) before text is shown. */
export function stripAnsi(text: string): string {
  // eslint-disable-next-line no-control-regex
  return text.replace(/\u001b\[[0-9;?]*[A-Za-z]|\u001b\][^\u0007]*\u0007/g, '');
}

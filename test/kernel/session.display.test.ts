/** The display channel (lib/plot/display.ts) the session installs its sink into. */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { asMime, escapeHtml, mimeBundleOf, present, refresh, setDisplaySink, type MimeBundle } from '../../lib/display.js';
import '../../lib/table/tableDisplay.js'; // installs the table display, as lib/index.ts and lib/internal.ts do

afterEach(() => {
  setDisplaySink(undefined);
  vi.restoreAllMocks();
});

describe('mimeBundleOf', () => {
  it('uses an object\'s asMime method and adds text/plain when it lacks one', () => {
    const spectrum = { [asMime]: (): MimeBundle => ({ 'image/svg+xml': '<svg/>' }) };
    const bundle = mimeBundleOf(spectrum);
    expect(bundle['image/svg+xml']).toBe('<svg/>');
    expect(typeof bundle['text/plain']).toBe('string');
  });
  it('shows strings as they are and other values as inspected text', () => {
    expect(mimeBundleOf('1.5 T')).toEqual({ 'text/plain': '1.5 T' });
    expect(mimeBundleOf({ pGeV: 1.2 })).toEqual({ 'text/plain': '{ pGeV: 1.2 }' });
  });
  it('asMime is the registered symbol, so copies of the module agree', () => {
    expect(asMime).toBe(Symbol.for('sagitta.asMime'));
  });
  it('a danfojs DataFrame becomes our own escaped HTML table (rows keyed by track, no index column) plus text', async () => {
    const dfd = await import('danfojs-node');
    const df = new dfd.DataFrame({ track: [1, 2], label: ['<script>alert(1)</script>', 'mu-'] });
    const bundle = mimeBundleOf(df);
    const html = String(bundle['text/html']);
    expect(html).toContain('<table');
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).not.toContain('<script>');
    expect(html).toContain('<th scope="row">1</th>');
    expect(html).not.toContain('<th></th>');
    expect(String(bundle['text/plain'])).toMatch(/^2 rows\n/);
  }, 60_000);
});

describe('present / refresh', () => {
  it('go to the installed sink with the display id', () => {
    const seen: unknown[] = [];
    setDisplaySink((bundle, options) => seen.push([bundle, options]));
    present(42, { id: 'n' });
    refresh('n', 43);
    expect(seen).toEqual([
      [{ 'text/plain': '42' }, { displayId: 'n' }],
      [{ 'text/plain': '43' }, { displayId: 'n', update: true }],
    ]);
  });
  it('print the text form when no sink is installed (a plain Node script)', () => {
    const write = vi.spyOn(process.stdout, 'write').mockImplementation(() => true);
    present('hello');
    expect(write).toHaveBeenCalledWith('hello\n');
  });
  it('escapeHtml escapes the five HTML-special characters', () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;');
  });
});

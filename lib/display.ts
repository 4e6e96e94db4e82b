/**
 * The display channel: how any value becomes a notebook output, and how library code or a cell
 * shows something before the cell ends.
 *
 * - An object says how it displays itself by implementing the method keyed by `asMime`
 *   (`Symbol.for('sagitta.asMime')`), returning a MIME bundle such as
 *   `{ 'application/vnd.plotly.v1+json': spec, 'text/html': '…', 'text/plain': '…' }`.
 * - `mimeBundleOf(value)` turns any value into a bundle: objects with that method, danfojs
 *   DataFrame / Series (an HTML table plus text), everything else as `text/plain`.
 * - `present(value, { id })` shows a value now; `refresh(id, value)` replaces what an earlier
 *   `present(…, { id })` showed; `clearOutput({ wait })` clears what the cell has shown so far;
 *   `ask(prompt)` asks the person running the notebook for a line of text (a front end that
 *   allows input shows a prompt; a headless run has no one to ask and refuses). Inside a kernel or the headless runner these go to the sink the
 *   session installs (`setDisplaySink`); in a plain Node script they print the text form.
 *
 * No DOM and no kernel imports here (lib never imports kernel). The sink lives on globalThis
 * under a registered symbol, so two copies of this module (e.g. one loaded by the kernel, one by a
 * cell importing "sagitta-tracks") still share it.
 */
import { inspect } from 'node:util';

/** One output in several representations, keyed by MIME type. */
export type MimeBundle = Record<string, unknown>;

/** The method key by which an object describes its own display. */
export const asMime: unique symbol = Symbol.for('sagitta.asMime');

/** An object that knows how it displays itself. */
export interface Presentable {
  [asMime](): MimeBundle;
}

/** Where displays go while a session runs a cell. `update` marks a replacement of `displayId`. */
export type DisplaySink = (bundle: MimeBundle, options: { displayId?: string; update?: boolean }) => void;

const SINK_KEY = Symbol.for('sagitta.displaySink');

type SinkHolder = { [SINK_KEY]?: DisplaySink };

/** Installs the sink displays go to (or removes it with `undefined`); returns the previous one. */
export function setDisplaySink(sink: DisplaySink | undefined): DisplaySink | undefined {
  const holder = globalThis as SinkHolder;
  const previous = holder[SINK_KEY];
  if (sink === undefined) delete holder[SINK_KEY];
  else holder[SINK_KEY] = sink;
  return previous;
}

/** The sink in place, if any. */
export function displaySink(): DisplaySink | undefined {
  return (globalThis as SinkHolder)[SINK_KEY];
}

/** What a running cell can ask of the front end besides showing things. */
export interface CellChannel {
  clear(wait: boolean): void;
  ask(prompt: string, password: boolean): Promise<string>;
}

const CHANNEL_KEY = Symbol.for('sagitta.cellChannel');

type ChannelHolder = { [CHANNEL_KEY]?: CellChannel };

/** Installs the cell channel (or removes it with `undefined`); returns the previous one. */
export function setCellChannel(channel: CellChannel | undefined): CellChannel | undefined {
  const holder = globalThis as ChannelHolder;
  const previous = holder[CHANNEL_KEY];
  if (channel === undefined) delete holder[CHANNEL_KEY];
  else holder[CHANNEL_KEY] = channel;
  return previous;
}

/**
 * Clears the outputs the running cell has shown so far — for a progress display that redraws
 * itself. With `wait: true` the old outputs stay until the next output arrives, so nothing
 * flickers. Outside a notebook it does nothing.
 * @example for (const n of [10, 20, 30]) { clearOutput({ wait: true }); present(`fitted ${n} %`); }
 */
export function clearOutput(options: { wait?: boolean } = {}): void {
  (globalThis as ChannelHolder)[CHANNEL_KEY]?.clear(options.wait === true);
}

/**
 * Asks the person running the notebook for one line of text and resolves with it. A front end
 * that allows input shows `prompt` (hiding what is typed when `password` is set); a headless run
 * (`sagitta run`) or a front end without input rejects with INPUT_UNAVAILABLE — use a knob for
 * values a run must be given. In a plain Node script it reads a line from the terminal.
 * @example const runLabel = await ask('Run label: ');
 */
export async function ask(prompt: string, options: { password?: boolean } = {}): Promise<string> {
  const channel = (globalThis as ChannelHolder)[CHANNEL_KEY];
  if (channel) return channel.ask(prompt, options.password === true);
  const { createInterface } = await import('node:readline/promises');
  const lines = createInterface({ input: process.stdin, output: process.stdout });
  try {
    return await lines.question(prompt);
  } finally {
    lines.close();
  }
}

/** True when `value` implements the `asMime` method. */
export function isPresentable(value: unknown): value is Presentable {
  return (
    value !== null &&
    (typeof value === 'object' || typeof value === 'function') &&
    typeof (value as Partial<Presentable>)[asMime] === 'function'
  );
}

/** Rows shown for a table before it is cut (the text says how many were left out). */
const TABLE_ROWS = Object.freeze({ head: 20, tail: 5 });

/**
 * The MIME bundle of any value. Every bundle has `text/plain`, so a front end that understands
 * nothing richer still shows something. Strings are shown as they are (no quotes), as a printed
 * value would be.
 * @example mimeBundleOf(42) // { 'text/plain': '42' }
 */
export function mimeBundleOf(value: unknown): MimeBundle {
  if (isPresentable(value)) {
    const bundle = { ...value[asMime]() };
    if (typeof bundle['text/plain'] !== 'string') bundle['text/plain'] = plainText(value);
    return bundle;
  }
  const frame = asFrame(value);
  if (frame !== undefined) return { 'text/html': frameHtml(frame), 'text/plain': frameText(frame) };
  return { 'text/plain': plainText(value) };
}

/** Shows `value` now, as a separate output. With `id`, a later `refresh(id, …)` can replace it. */
export function present(value: unknown, options: { id?: string } = {}): void {
  const bundle = mimeBundleOf(value);
  const sink = displaySink();
  if (sink) sink(bundle, options.id === undefined ? {} : { displayId: options.id });
  else process.stdout.write(`${String(bundle['text/plain'])}\n`);
}

/** Replaces the output an earlier `present(…, { id })` showed (e.g. a progress line or a live plot). */
export function refresh(id: string, value: unknown): void {
  const bundle = mimeBundleOf(value);
  const sink = displaySink();
  if (sink) sink(bundle, { displayId: id, update: true });
  else process.stdout.write(`${String(bundle['text/plain'])}\n`);
}

/** Escapes text for HTML element content and attribute values. */
export function escapeHtml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

function plainText(value: unknown): string {
  if (typeof value === 'string') return value;
  return inspect(value, { depth: 4, maxArrayLength: 50, breakLength: 100, colors: false });
}

/** The parts of a danfojs DataFrame or Series we read (duck-typed: lib does not load danfojs). */
interface FrameLike {
  columns: string[];
  index: Array<string | number>;
  rows: unknown[][];
}

function asFrame(value: unknown): FrameLike | undefined {
  if (value === null || typeof value !== 'object') return undefined;
  const v = value as { ndim?: unknown; columns?: unknown; index?: unknown; values?: unknown; $isSeries?: unknown };
  if (!('$isSeries' in v) || !Array.isArray(v.index) || !Array.isArray(v.values) || !Array.isArray(v.columns)) return undefined;
  const index = v.index as Array<string | number>;
  const columns = (v.columns as unknown[]).map(String);
  if (v.ndim === 2) return { columns, index, rows: v.values as unknown[][] };
  if (v.ndim === 1) return { columns, index, rows: (v.values as unknown[]).map((x) => [x]) };
  return undefined;
}

function cell(value: unknown): string {
  if (typeof value === 'number') return Number.isInteger(value) ? String(value) : String(Number(value.toPrecision(6)));
  if (value === null || value === undefined) return '';
  return String(value);
}

/** Row numbers to show: all, or the first `head` and last `tail` with a gap marker (-1). */
function shownRows(n: number): number[] {
  if (n <= TABLE_ROWS.head + TABLE_ROWS.tail) return Array.from({ length: n }, (_, i) => i);
  const head = Array.from({ length: TABLE_ROWS.head }, (_, i) => i);
  const tail = Array.from({ length: TABLE_ROWS.tail }, (_, i) => n - TABLE_ROWS.tail + i);
  return [...head, -1, ...tail];
}

function frameHtml(frame: FrameLike): string {
  const n = frame.rows.length;
  const head = `<tr><th></th>${frame.columns.map((c) => `<th>${escapeHtml(c)}</th>`).join('')}</tr>`;
  const body = shownRows(n)
    .map((i) =>
      i < 0
        ? `<tr><th>…</th>${frame.columns.map(() => '<td>…</td>').join('')}</tr>`
        : `<tr><th>${escapeHtml(String(frame.index[i]))}</th>${frame.rows[i].map((x) => `<td>${escapeHtml(cell(x))}</td>`).join('')}</tr>`,
    )
    .join('');
  const caption = `<caption>${n} row${n === 1 ? '' : 's'} × ${frame.columns.length} column${frame.columns.length === 1 ? '' : 's'}</caption>`;
  return `<table class="sagitta-table">${caption}<thead>${head}</thead><tbody>${body}</tbody></table>`;
}

function frameText(frame: FrameLike): string {
  const rows = shownRows(frame.rows.length).map((i) =>
    i < 0 ? ['…', ...frame.columns.map(() => '…')] : [String(frame.index[i]), ...frame.rows[i].map(cell)],
  );
  const all = [['', ...frame.columns], ...rows];
  const widths = all[0].map((_, j) => Math.max(...all.map((r) => [...r[j]].length)));
  const line = (r: string[]) => r.map((s, j) => s.padStart(widths[j])).join('  ').trimEnd();
  const n = frame.rows.length;
  return [...all.map(line), `[${n} row${n === 1 ? '' : 's'} × ${frame.columns.length} column${frame.columns.length === 1 ? '' : 's'}]`].join('\n');
}

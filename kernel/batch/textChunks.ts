import { closeSync, openSync, readSync } from 'node:fs';
import { type CsvLayout, type HeaderField, jsonlFields, msg, readCsvLayout } from '../../lib/internal.js';
import { CHUNK_BYTES } from './chunkBytes.js';

/** A piece of a CSV or JSON Lines hit file holding whole events, ready to be parsed anywhere. */
export interface TextChunk {
  readonly kind: 'csv' | 'jsonl';
  /** The chunk's bytes: a view of an ArrayBuffer no other chunk shares, so it can be moved to a worker. */
  readonly bytes: Uint8Array;
  /** Byte offset of the chunk in the file. */
  readonly positionBase: number;
  readonly layout?: CsvLayout;
  readonly fields?: readonly HeaderField[];
}

const LF = 10, QUOTE = 34;
export { CHUNK_BYTES };

/**
 * Reads a text hit file in chunks of about CHUNK_BYTES that end at an event boundary: a chunk
 * never splits an event, so each can be parsed and fitted on its own. Memory stays bounded by a
 * few chunks whatever the file size (one event larger than a chunk makes that chunk larger).
 * `onBytes` reports progress.
 */
export function* textChunks(path: string, kind: 'csv' | 'jsonl', lengthUnit: string, onBytes?: (done: number) => void): Generator<TextChunk> {
  const fd = openSync(path, 'r');
  try {
    let carry: Uint8Array = new Uint8Array(0);
    let fileOffset = 0; // file offset of carry[0]
    let eof = false;
    let layout: CsvLayout | undefined;
    let fields: readonly HeaderField[] | undefined;
    let eventField = -1;
    let first = true;
    while (!eof || carry.length > 0) {
      let want = CHUNK_BYTES;
      let buf: Uint8Array = carry;
      let cut = -1;
      for (;;) {
        buf = new Uint8Array(new ArrayBuffer(carry.length + (eof ? 0 : want)));
        buf.set(carry);
        let filled = carry.length;
        while (!eof && filled < buf.length) {
          const got = readSync(fd, buf, filled, buf.length - filled, null);
          if (got === 0) eof = true;
          filled += got;
        }
        buf = filled === buf.length ? buf : buf.slice(0, filled);
        if (first) {
          if (kind === 'csv') {
            layout = readCsvLayout(buf, path, lengthUnit, eof);
            if (layout === undefined) { carry = buf; want *= 2; continue; }
            eventField = layout.fields.findIndex((f) => f.column === 'event');
          } else {
            const start = buf.length >= 3 && buf[0] === 0xef && buf[1] === 0xbb && buf[2] === 0xbf ? 3 : 0;
            const found = firstJsonLine(buf, start, eof);
            if (found === undefined) { carry = buf; want *= 2; continue; }
            if (found === null) throw msg.emptyFile(path, 'one JSON object per line');
            fields = jsonlFields(found.text, path, found.line, lengthUnit);
          }
        }
        cut = eof ? buf.length : eventBoundary(buf, kind, layout, eventField, first ? (layout?.bodyStart ?? 0) : 0);
        if (cut > 0 || eof) break;
        // One event fills the whole buffer: read more.
        carry = buf;
        want *= 2;
      }
      let start = 0;
      if (first && layout) start = layout.bodyStart;
      else if (first) start = buf.length >= 3 && buf[0] === 0xef && buf[1] === 0xbb && buf[2] === 0xbf ? 3 : 0;
      // The chunk is a view of the buffer just read (no copy; the buffer is the chunk's alone
      // once the part after the cut is copied out as the next carry).
      const chunk = buf.subarray(start, cut);
      carry = buf.slice(cut);
      yield { kind, bytes: chunk, positionBase: fileOffset + start, ...(layout ? { layout } : {}), ...(fields ? { fields } : {}) };
      fileOffset += cut;
      onBytes?.(fileOffset);
      first = false;
      if (eof && carry.length === 0) break;
    }
    if (first) throw msg.emptyFile(path, kind === 'csv' ? "a header line such as 'event,track,x,y,z,sigma'" : 'one JSON object per line');
  } finally {
    closeSync(fd);
  }
}

/** The first non-blank line of a JSON Lines buffer (undefined: need more bytes; null: none at all). */
function firstJsonLine(buf: Uint8Array, start: number, eof: boolean): { text: string; line: number } | undefined | null {
  let i = start, line = 1;
  for (;;) {
    let e = buf.indexOf(LF, i);
    if (e < 0) {
      if (!eof) return undefined;
      e = buf.length;
    }
    const text = new TextDecoder().decode(buf.subarray(i, e)).trim();
    if (text !== '') return { text, line };
    if (e >= buf.length) return null;
    i = e + 1;
    line++;
  }
}

/**
 * Where the last event that starts in `buf` begins (so everything before it is whole events), or
 * −1 when the buffer holds only part of one event. Lines are compared by their event id's value.
 */
function eventBoundary(buf: Uint8Array, kind: 'csv' | 'jsonl', layout: CsvLayout | undefined, eventField: number, bodyStart: number): number {
  let end = buf.lastIndexOf(LF);
  if (end < bodyStart) return -1;
  // end: index of the LF closing the last complete line. Walk back over lines of the same event.
  let lineEnd = end;
  let lineStart = previousLf(buf, lineEnd - 1) + 1;
  let last: number | undefined;
  while (lineStart >= bodyStart) {
    const id = eventOf(buf, lineStart, lineEnd, kind, layout, eventField);
    if (id !== undefined) {
      if (last === undefined) last = id;
      else if (id !== last) return lineEnd + 1;
    }
    if (lineStart <= bodyStart) break;
    lineEnd = lineStart - 1;
    lineStart = previousLf(buf, lineEnd - 1) + 1;
  }
  return -1;
}

/** Index of the last LF at or before `from` (−1: none). */
function previousLf(buf: Uint8Array, from: number): number {
  return from < 0 ? -1 : buf.lastIndexOf(LF, from);
}

/** The event id of one line as a number (NaN when unreadable: the parser reports it), undefined for a blank line. */
function eventOf(buf: Uint8Array, start: number, end: number, kind: 'csv' | 'jsonl', layout: CsvLayout | undefined, eventField: number): number | undefined {
  if (kind === 'jsonl') {
    const text = new TextDecoder().decode(buf.subarray(start, end)).trim();
    if (text === '') return undefined;
    try {
      const obj = JSON.parse(text) as Record<string, unknown>;
      const key = Object.keys(obj).find((k) => k.trim().toLowerCase().replace(/\s*[[(].*$/, '') === 'event');
      const v = key === undefined ? NaN : Number(obj[key]);
      return Number.isNaN(v) ? -Infinity : v;
    } catch {
      return -Infinity;
    }
  }
  const delimiter = layout!.delimiter;
  let i = start, f = 0;
  if (end > start && buf[end - 1] === 13) end--;
  if (end <= start) return undefined;
  while (f < eventField && i < end) {
    if (buf[i] === QUOTE) {
      i++;
      while (i < end && !(buf[i] === QUOTE && buf[i + 1] !== QUOTE)) i += buf[i] === QUOTE ? 2 : 1;
      i++;
    }
    while (i < end && buf[i] !== delimiter) i++;
    i++;
    f++;
  }
  let e = i;
  while (e < end && buf[e] !== delimiter) e++;
  let s = '';
  for (let q = i; q < e; q++) s += String.fromCharCode(buf[q]);
  s = s.trim().replace(/^"(.*)"$/, '$1');
  // Two different ids beyond 2^53 may read as one double: that only moves the cut earlier.
  const v = Number(s);
  return Number.isNaN(v) ? -Infinity : v;
}

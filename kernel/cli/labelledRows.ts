import { type HitTable } from '../../lib/index.js';

const LF = 10, CR = 13, QUOTE = 34;

/**
 * The input rows again, in the input order, each with its `track` replaced (or added) and a
 * `hit_order` column replacing any the file had — every other field exactly as written. CSV rows
 * are found by their line numbers (`table.source.line`) and split on the separator, honouring
 * quotes; JSON Lines rows are parsed, given the two keys and written back.
 */
export function labelledCsv(bytes: Uint8Array, table: HitTable, delimiter: number, headerLine: number, track: Int32Array, hitOrder: Int32Array): Uint8Array {
  const lines = lineStarts(bytes);
  const sep = String.fromCharCode(delimiter);
  const decoder = new TextDecoder();
  const lineText = (line: number): string => {
    const a = lines[line - 1];
    let b = line < lines.length ? lines[line] - 1 : bytes.length;
    if (b > a && bytes[b - 1] === CR) b--;
    let t = decoder.decode(bytes.subarray(a, b));
    if (line === 1 && t.charCodeAt(0) === 0xfeff) t = t.slice(1);
    return t;
  };
  const header = splitFields(lineText(headerLine), sep);
  const base = (name: string) => name.trim().replace(/^"(.*)"$/, '$1').replace(/\s*[[(].*$/, '').trim().toLowerCase();
  const trackAt = header.findIndex((h) => base(h) === 'track');
  const orderAt = header.findIndex((h) => base(h) === 'hit_order');
  const keep = header.map((_, i) => i !== orderAt && i !== trackAt);
  const out: string[] = [[...header.filter((_, i) => keep[i]), 'track', 'hit_order'].join(sep)];
  const lineOf = table.source.line!;
  for (let r = 0; r < table.length; r++) {
    const fields = splitFields(lineText(lineOf[r]), sep);
    out.push([...fields.filter((_, i) => keep[i]), String(track[r]), String(hitOrder[r])].join(sep));
  }
  return new TextEncoder().encode(out.join('\n') + '\n');
}

export function labelledJsonl(bytes: Uint8Array, table: HitTable, track: Int32Array, hitOrder: Int32Array): Uint8Array {
  const lines = lineStarts(bytes);
  const decoder = new TextDecoder();
  const lineOf = table.source.line!;
  const out: string[] = [];
  for (let r = 0; r < table.length; r++) {
    const line = lineOf[r];
    const a = lines[line - 1], b = line < lines.length ? lines[line] - 1 : bytes.length;
    let text = decoder.decode(bytes.subarray(a, b)).trim();
    if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
    const record = JSON.parse(text) as Record<string, unknown>;
    for (const key of Object.keys(record)) {
      const k = key.replace(/\s*[[(].*$/, '').trim().toLowerCase();
      if (k === 'track' || k === 'hit_order') delete record[key];
    }
    record.track = track[r];
    record.hit_order = hitOrder[r];
    out.push(JSON.stringify(record));
  }
  return new TextEncoder().encode(out.join('\n') + '\n');
}

/** Byte index of the start of every line (line k, 1-based, starts at starts[k − 1]). */
function lineStarts(bytes: Uint8Array): Int32Array {
  let count = 1;
  for (let i = 0; i < bytes.length; i++) if (bytes[i] === LF) count++;
  const starts = new Int32Array(count);
  for (let i = 0, k = 1; i < bytes.length; i++) if (bytes[i] === LF) starts[k++] = i + 1;
  return starts;
}

/** Fields of one CSV line, quotes kept as written. */
function splitFields(text: string, sep: string): string[] {
  const out: string[] = [];
  let start = 0, quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === QUOTE) quoted = !quoted;
    else if (!quoted && text[i] === sep) { out.push(text.slice(start, i)); start = i + 1; }
  }
  out.push(text.slice(start));
  return out;
}

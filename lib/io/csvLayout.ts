import { msg } from '../errors.js';
import { parseHeader, type HeaderField } from './hitColumns.js';

/**
 * What a CSV hit file's header says: its fields, the separator, and where the data rows start.
 * Read once per file; the row parser (`parseCsvRows`) then reads any slice of whole rows with it,
 * which is how a large file is read in pieces by several threads.
 */
export interface CsvLayout {
  readonly fields: readonly HeaderField[];
  /** Separator byte: comma, semicolon or tab. */
  readonly delimiter: number;
  /** The header line as text (a repeat of it inside the data is reported as such). */
  readonly headerText: string;
  /** Byte index of the first data row, and its 1-based line number. */
  readonly bodyStart: number;
  readonly bodyLine: number;
  /** Unit of length columns whose header carries none. */
  readonly lengthUnit: string;
}

const COMMA = 44, SEMICOLON = 59, TAB = 9, CR = 13, LF = 10, SPACE = 32;

/**
 * Reads the header of CSV bytes (BOM and blank lines before it allowed). `complete` says the
 * bytes hold the whole file; when false and no line end was found yet, returns undefined (the
 * caller reads more).
 */
export function readCsvLayout(bytes: Uint8Array, file: string, lengthUnit: string, complete = true, trackOptional = false): CsvLayout | undefined {
  const n = bytes.length;
  let i = 0;
  if (n >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) i = 3;
  let line = 1;
  while (i < n && (bytes[i] === LF || bytes[i] === CR || bytes[i] === SPACE)) {
    if (bytes[i] === LF) line++;
    i++;
  }
  if (i >= n) {
    if (!complete) return undefined;
    throw msg.emptyFile(file, "a header line such as 'event,track,x,y,z,sigma'");
  }
  let headerEnd = bytes.indexOf(LF, i);
  if (headerEnd < 0) {
    if (!complete) return undefined;
    headerEnd = n;
  }
  const headerText = new TextDecoder().decode(bytes.subarray(i, headerEnd)).replace(/\r$/, '');
  if (headerText.includes('\u0000') || /[\u0001-\u0008\u000e-\u001f]/.test(headerText)) {
    throw msg.badRow(file, line, 'the header holds control characters: this does not look like a CSV text file (a binary or compressed file?)');
  }
  const delimiter = headerText.includes(',') ? COMMA : headerText.includes('\t') ? TAB : headerText.includes(';') ? SEMICOLON : COMMA;
  const fields = parseHeader(splitHeader(headerText, String.fromCharCode(delimiter)), file, lengthUnit, line, trackOptional);
  return { fields, delimiter, headerText, bodyStart: Math.min(n, headerEnd + 1), bodyLine: line + 1, lengthUnit };
}

function splitHeader(text: string, delimiter: string): string[] {
  const out: string[] = [];
  let cur = '';
  let quoted = false;
  for (const ch of text) {
    if (ch === '"') quoted = !quoted;
    else if (ch === delimiter && !quoted) {
      out.push(cur);
      cur = '';
    } else cur += ch;
  }
  out.push(cur);
  return out;
}

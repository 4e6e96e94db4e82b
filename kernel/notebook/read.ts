import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { msg } from '../../lib/internal.js';
import type { Notebook } from './types.js';
import { validateNotebook } from './validate.js';

/** A notebook as read from disk, with the bytes' hash for the report's provenance block. */
export interface LoadedNotebook {
  readonly notebook: Notebook;
  readonly path: string;
  /** SHA-256 of the file's bytes, lower-case hex. */
  readonly sha256: string;
  readonly sizeBytes: number;
}

/** Reads and validates an nbformat 4 file. Throws BAD_NOTEBOOK / FILE_NOT_FOUND naming the file. */
export function readNotebook(path: string): LoadedNotebook {
  let bytes: Buffer;
  try {
    bytes = readFileSync(path);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'ENOENT') throw msg.fileNotFound(path);
    throw err;
  }
  return { notebook: parseNotebook(bytes.toString('utf8'), path), path, sha256: createHash('sha256').update(bytes).digest('hex'), sizeBytes: bytes.length };
}

/** Parses notebook text; a JSON syntax error (e.g. a truncated file) is reported with its line. */
export function parseNotebook(text: string, file: string): Notebook {
  if (text.trim() === '') throw msg.emptyFile(file, 'a notebook (nbformat 4 JSON)');
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (err) {
    const detail = (err as Error).message;
    const pos = /position (\d+)/.exec(detail);
    const line = pos ? text.slice(0, Number(pos[1])).split('\n').length : /end of JSON input/i.test(detail) ? text.split('\n').length : undefined;
    const where = line !== undefined ? ` near line ${line}` : '';
    throw msg.badNotebook(file, `is not valid JSON${where} (${detail}); the file may be truncated or hand-edited — restore it from a saved copy`);
  }
  return validateNotebook(value, file);
}

import { writeFileAtomic } from '../../lib/internal.js';
import type { Notebook } from './types.js';

/** Notebook JSON as notebook editors write it: one-space indent, keys in insertion order, final newline. */
export function serializeNotebook(nb: Notebook): string {
  return `${JSON.stringify(nb, null, 1)}\n`;
}

/** Serializes and writes a notebook atomically (temporary file, fsync, rename). */
export function writeNotebook(path: string, nb: Notebook): void {
  writeFileAtomic(path, serializeNotebook(nb));
}

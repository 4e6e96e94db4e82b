import { closeSync, fsyncSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import type { Notebook } from './types.js';

/** Notebook JSON as notebook editors write it: one-space indent, keys in insertion order, final newline. */
export function serializeNotebook(nb: Notebook): string {
  return `${JSON.stringify(nb, null, 1)}\n`;
}

/**
 * Writes text to `path` atomically: into a temporary file in the same folder, flushed to disk,
 * then renamed over the target. A reader never sees a half-written file, and a crash leaves the
 * old file in place.
 */
export function writeFileAtomic(path: string, text: string | Uint8Array): void {
  const tmp = join(dirname(path), `.${basename(path)}.${process.pid}.${Date.now().toString(36)}.tmp`);
  let fd: number | undefined;
  try {
    fd = openSync(tmp, 'w', 0o644);
    writeSync(fd, typeof text === 'string' ? Buffer.from(text, 'utf8') : text);
    fsyncSync(fd);
    closeSync(fd);
    fd = undefined;
    renameSync(tmp, path);
  } catch (err) {
    if (fd !== undefined) closeSync(fd);
    rmSync(tmp, { force: true });
    throw err;
  }
}

/** Serializes and writes a notebook atomically. */
export function writeNotebook(path: string, nb: Notebook): void {
  writeFileAtomic(path, serializeNotebook(nb));
}

import { closeSync, fsyncSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/**
 * Writes text or bytes to `path` atomically: into a temporary file in the same folder, flushed
 * to disk (fsync), then renamed over the target. A reader never sees a half-written file, and a
 * crash or a full disk leaves the old file in place and no temporary file behind.
 * @example writeFileAtomic('fits.csv', 'event,track\n1,1\n')
 */
export function writeFileAtomic(path: string, data: string | Uint8Array): void {
  const tmp = join(dirname(path), `.${basename(path)}.${process.pid}.${Date.now().toString(36)}.tmp`);
  let fd: number | undefined;
  try {
    fd = openSync(tmp, 'w', 0o644);
    const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
    for (let at = 0; at < bytes.byteLength; ) at += writeSync(fd, bytes, at);
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

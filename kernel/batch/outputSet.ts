import { closeSync, fsyncSync, ftruncateSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { msg } from '../../lib/internal.js';
import type { PlannedOutput } from './outputPlan.js';
import { registerTemp, unregisterTemp } from './tempFiles.js';

interface OpenOutput {
  readonly planned: PlannedOutput;
  readonly tmp: string | undefined;
  fd: number | undefined;
  /** Next write position in a regular file (null: a pipe or device, written in order). */
  position: number | null;
}

/**
 * The files one command writes, all or nothing: each regular output is written to a hidden
 * temporary file beside it, and `commit` flushes them and renames them into place one after the
 * other in one synchronous step (no signal handler can run in between), so either every output
 * appears or — after an error, `abandon` or an interrupt — none does and no temporary is left.
 * Outputs that are not regular files (a pipe, /dev/stdout) are written in place.
 */
export class OutputSet {
  private readonly open = new Map<string, OpenOutput>();
  private done = false;

  constructor(outputs: readonly PlannedOutput[]) {
    try {
      for (const planned of outputs) {
        const tmp = planned.regular ? join(dirname(planned.real), `.${basename(planned.real)}.${process.pid}.${Date.now().toString(36)}.tmp`) : undefined;
        if (tmp) registerTemp(tmp);
        const fd = openSync(tmp ?? planned.real, 'w', 0o644);
        this.open.set(planned.flag, { planned, tmp, fd, position: tmp ? 0 : null });
      }
    } catch (err) {
      this.abandon();
      throw writeError(err, outputs[this.open.size]?.path ?? '');
    }
  }

  /** Appends bytes to the output named by its flag. */
  write(flag: string, bytes: Uint8Array | string): void {
    const o = this.open.get(flag);
    if (o === undefined || o.fd === undefined) throw new Error(`internal: no open output ${flag}`);
    const data = typeof bytes === 'string' ? Buffer.from(bytes, 'utf8') : bytes;
    try {
      let off = 0;
      while (off < data.byteLength) {
        const wrote = writeSync(o.fd, data, off, data.byteLength - off, o.position);
        off += wrote;
        if (o.position !== null) o.position += wrote;
      }
    } catch (err) {
      this.abandon();
      throw writeError(err, o.planned.path);
    }
  }

  /** Empties one output to write it again from the start (regular files only). */
  restart(flag: string): void {
    const o = this.open.get(flag);
    if (o === undefined || o.fd === undefined || o.position === null) throw new Error(`internal: cannot restart ${flag}`);
    ftruncateSync(o.fd, 0);
    o.position = 0;
  }

  /** Flushes and closes every output, then renames them all into place. */
  commit(): void {
    if (this.done) return;
    try {
      for (const o of this.open.values()) {
        if (o.fd === undefined) continue;
        if (o.tmp) fsyncSync(o.fd);
        closeSync(o.fd);
        o.fd = undefined;
      }
    } catch (err) {
      const path = [...this.open.values()].find((o) => o.fd !== undefined)?.planned.path ?? '';
      this.abandon();
      throw writeError(err, path);
    }
    for (const o of this.open.values()) {
      if (o.tmp) {
        renameSync(o.tmp, o.planned.real);
        unregisterTemp(o.tmp);
      }
    }
    this.done = true;
  }

  /** Closes and removes every temporary file; nothing is written. */
  abandon(): void {
    if (this.done) return;
    this.done = true;
    for (const o of this.open.values()) {
      if (o.fd !== undefined) {
        try {
          closeSync(o.fd);
        } catch {
          // already closed
        }
        o.fd = undefined;
      }
      if (o.tmp) {
        rmSync(o.tmp, { force: true });
        unregisterTemp(o.tmp);
      }
    }
  }
}

/** An I/O failure while writing, as a one-line catalogue error. */
export function writeError(err: unknown, path: string): Error {
  const code = (err as { code?: string }).code;
  const reasons: Record<string, [string, string]> = {
    ENOSPC: ['the disk is full', 'free some space or write elsewhere'],
    EDQUOT: ['the disk quota is used up', 'free some space or write elsewhere'],
    EACCES: ['permission denied', 'choose a folder you can write into'],
    EPERM: ['permission denied', 'choose a folder you can write into'],
    EROFS: ['read-only file system', 'write elsewhere'],
    EISDIR: ['it is a folder', 'give a file name'],
    ENOENT: ['the folder does not exist', 'create it first or choose another path'],
    EIO: ['an input/output error', 'check the disk'],
  };
  const r = code !== undefined ? reasons[code] : undefined;
  if (r === undefined) return err instanceof Error ? err : new Error(String(err));
  return msg.cannotWrite(path, r[0], r[1]);
}

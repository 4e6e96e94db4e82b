import { accessSync, constants, realpathSync, statSync, type Stats } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { msg } from '../../lib/internal.js';

/** A path a command reads or writes, with the flag (or argument name) it came from. */
export interface NamedPath {
  readonly flag: string;
  readonly path: string;
}

/** A checked output: where to write, and whether it is a regular file (else a device or pipe, written in place). */
export interface PlannedOutput extends NamedPath {
  /** Absolute path with symbolic links of its folder resolved. */
  readonly real: string;
  /** False for /dev/stdout, a named pipe or another non-regular file: no temporary file, no rename. */
  readonly regular: boolean;
}

/**
 * Checks every output of a command before anything runs: each must be a file (not a folder) in
 * an existing folder we may write into, and none may be the same file as an input or as another
 * output — whatever the spelling (relative, `./`, `..`, symbolic links, hard links).
 * Throws the catalogue's error naming both flags; returns the outputs with their resolved paths.
 */
export function planOutputs(inputs: readonly NamedPath[], outputs: readonly NamedPath[]): PlannedOutput[] {
  const seen: { named: NamedPath; real: string; stat?: Stats }[] = [];
  for (const input of inputs) {
    const real = realOf(input.path);
    seen.push({ named: input, real, stat: statOrUndefined(real) });
  }
  const planned: PlannedOutput[] = [];
  for (const out of outputs) {
    const real = realOf(out.path);
    const stat = statOrUndefined(real);
    if (stat?.isDirectory()) throw msg.cannotWrite(out.path, 'it is a folder', `give ${out.flag} a file name inside it, e.g. ${join(out.path, 'results.csv')}`);
    const folder = dirname(real);
    const folderStat = statOrUndefined(folder);
    if (folderStat === undefined) throw msg.cannotWrite(out.path, `the folder ${dirname(out.path)} does not exist`, 'create it first or choose another path');
    if (!folderStat.isDirectory()) throw msg.cannotWrite(out.path, `${dirname(out.path)} is not a folder`, 'choose a path inside a folder');
    const regular = stat === undefined || stat.isFile();
    try {
      // A regular output is written beside itself and renamed, so its folder must be writable.
      accessSync(regular ? folder : real, constants.W_OK);
    } catch {
      throw msg.cannotWrite(out.path, 'permission denied', 'choose a folder you can write into');
    }
    for (const other of seen) {
      if (other.real === real || (stat && other.stat && stat.ino === other.stat.ino && stat.dev === other.stat.dev && stat.isFile())) {
        throw msg.outputClash(out.flag, out.path, other.named.flag, other.named.path);
      }
    }
    seen.push({ named: out, real, stat });
    planned.push({ ...out, real, regular });
  }
  return planned;
}

/** The real path of a file that may not exist yet: its folder's real path plus its name. */
export function realOf(path: string): string {
  const abs = resolve(path);
  try {
    return realpathSync(abs);
  } catch {
    try {
      return join(realpathSync(dirname(abs)), basename(abs));
    } catch {
      return abs;
    }
  }
}

function statOrUndefined(path: string): Stats | undefined {
  try {
    return statSync(path);
  } catch {
    return undefined;
  }
}

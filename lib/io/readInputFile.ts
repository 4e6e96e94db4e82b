import { readFileSync } from 'node:fs';
import { msg } from '../errors.js';

/**
 * Reads a whole input file, with one catalogue line instead of a system error when it cannot be
 * read: FILE_NOT_FOUND for a missing path, CANNOT_READ for a folder, no permission or an I/O error.
 * `kind` names what the file should be ("the scenario file"), for the fix in the message.
 * @example readInputFile('notebooks/data/brindlemoor.scenario.json', 'the scenario file')
 */
export function readInputFile(path: string, kind = 'the file'): Buffer {
  try {
    return readFileSync(path);
  } catch (err) {
    throw inputError(err, path, kind);
  }
}

/** A system error met while opening or reading an input, as a catalogue error. */
export function inputError(err: unknown, path: string, kind = 'the file'): Error {
  const code = (err as { code?: string }).code;
  if (code === 'ENOENT' || code === 'ENOTDIR') return msg.fileNotFound(path);
  if (code === 'EISDIR') return msg.cannotRead(path, 'it is a folder', `give ${kind} inside it`);
  if (code === 'EACCES' || code === 'EPERM') return msg.cannotRead(path, 'permission denied', "check the file's permissions");
  if (code === 'EIO') return msg.cannotRead(path, 'an input/output error', 'check the disk');
  if (code === 'EMFILE' || code === 'ENFILE') return msg.cannotRead(path, 'too many open files', 'close other programs and try again');
  return err instanceof Error ? err : new Error(String(err));
}

/**
 * The one catalogue of errors Sagitta throws for a bad call or unusable input.
 *
 * Numerical trouble is never thrown: it is a `status` field on a result (see STYLE.md §5–6).
 * Every message names the bad value, where it came from and what would fix it, so that a
 * physicist reading a terminal or a notebook can act on it without opening the source.
 * Tests compare against these builders rather than against free text.
 */

/** Stable machine-readable codes; one per kind of mistake. */
export type SagittaErrorCode =
  | 'BAD_QUANTITY'
  | 'WRONG_DIMENSION'
  | 'MISSING_UNIT'
  | 'UNKNOWN_UNIT'
  | 'BAD_ARGUMENT'
  | 'UNKNOWN_PARTICLE'
  | 'UNKNOWN_MATERIAL'
  | 'FILE_NOT_FOUND'
  | 'EMPTY_FILE'
  | 'MISSING_COLUMN'
  | 'DUPLICATE_COLUMN'
  | 'BAD_NUMBER'
  | 'BAD_ROW'
  | 'UNKNOWN_FORMAT'
  | 'BAD_SCENARIO'
  | 'BAD_NOTEBOOK'
  | 'BAD_MATERIAL_FILE'
  | 'OUTSIDE_VALIDITY'
  | 'CANNOT_WRITE'
  | 'CANNOT_READ'
  | 'BAD_ID'
  | 'OUTPUT_CLASH'
  | 'BAD_CONNECTION_FILE'
  | 'KERNEL_STATE'
  | 'INPUT_UNAVAILABLE'
  | 'BAD_KNOB';

/** Where in an input a problem sits; all fields optional so callers fill what they know. */
export interface SourceLocation {
  readonly file?: string;
  /** 1-based line number in the file as a text editor counts it. */
  readonly line?: number;
  /** Column name (for tables) or 1-based character column. */
  readonly column?: string | number;
}

export class SagittaError extends Error {
  readonly code: SagittaErrorCode;
  readonly where: SourceLocation;
  constructor(code: SagittaErrorCode, message: string, where: SourceLocation = {}) {
    super(message);
    this.name = 'SagittaError';
    this.code = code;
    this.where = where;
  }
}

/** "file:line, column x" — the prefix every located message starts with. */
export function formatLocation(where: SourceLocation): string {
  const parts: string[] = [];
  if (where.file !== undefined) parts.push(where.line !== undefined ? `${where.file}:${where.line}` : where.file);
  else if (where.line !== undefined) parts.push(`line ${where.line}`);
  if (where.column !== undefined) parts.push(`column ${typeof where.column === 'string' ? `'${where.column}'` : where.column}`);
  return parts.join(', ');
}

function located(where: SourceLocation, text: string): string {
  const at = formatLocation(where);
  return at ? `${at}: ${text}` : text;
}

/** Message builders. Each returns a ready SagittaError; callers `throw msg.x(...)`. */
export const msg = {
  badQuantity: (text: string, what: string, example: string, where: SourceLocation = {}) =>
    new SagittaError('BAD_QUANTITY', located(where, `cannot read ${what} from ${JSON.stringify(text)}; write a number and a unit, e.g. "${example}"`), where),

  wrongDimension: (text: string, what: string, expected: string, example: string, where: SourceLocation = {}) =>
    new SagittaError('WRONG_DIMENSION', located(where, `${JSON.stringify(text)} is not ${expected}, which ${what} needs; e.g. "${example}"`), where),

  missingUnit: (text: string, what: string, example: string, where: SourceLocation = {}) =>
    new SagittaError('MISSING_UNIT', located(where, `${what} ${JSON.stringify(text)} has no unit; write it with one, e.g. "${example}"`), where),

  unknownUnit: (unit: string, what: string, known: string, where: SourceLocation = {}) =>
    new SagittaError('UNKNOWN_UNIT', located(where, `unknown unit ${JSON.stringify(unit)} for ${what}; use one of ${known}`), where),

  badArgument: (name: string, value: unknown, expected: string) =>
    new SagittaError('BAD_ARGUMENT', `${name} = ${describe(value)} is not valid: expected ${expected}`),

  unknownParticle: (name: string, known: readonly string[]) =>
    new SagittaError('UNKNOWN_PARTICLE', `unknown particle ${JSON.stringify(name)}; known: ${known.join(', ')}`),

  unknownMaterial: (name: string, known: readonly string[]) =>
    new SagittaError('UNKNOWN_MATERIAL', `unknown material ${JSON.stringify(name)}; known: ${known.join(', ')} (or define a compound or mixture)`),

  fileNotFound: (file: string) =>
    new SagittaError('FILE_NOT_FOUND', `${file}: no such file; check the path (relative paths are taken from the current folder)`, { file }),

  emptyFile: (file: string, expected: string) =>
    new SagittaError('EMPTY_FILE', `${file}: the file is empty; expected ${expected}`, { file }),

  missingColumn: (file: string, column: string, found: readonly string[], line = 1) =>
    new SagittaError('MISSING_COLUMN', located({ file, line }, `required column '${column}' is missing; the header has ${found.map((c) => `'${c}'`).join(', ') || 'no columns'}. Add it or rename the column that holds it`), { file, line, column }),

  duplicateColumn: (file: string, column: string, line = 1) =>
    new SagittaError('DUPLICATE_COLUMN', located({ file, line, column }, `column '${column}' appears twice in the header; remove or rename one of them`), { file, line, column }),

  badNumber: (file: string, line: number, column: string, text: string) =>
    new SagittaError('BAD_NUMBER', located({ file, line, column }, `${JSON.stringify(text)} is not a finite number; fix the value (NaN, Inf and empty cells are not accepted in hit tables)`), { file, line, column }),

  badRow: (file: string, line: number, detail: string) =>
    new SagittaError('BAD_ROW', located({ file, line }, detail), { file, line }),

  unknownFormat: (file: string, known: readonly string[]) =>
    new SagittaError('UNKNOWN_FORMAT', `${file}: cannot tell the format from the file name; use one of ${known.join(', ')}`, { file }),

  badScenario: (file: string, detail: string) =>
    new SagittaError('BAD_SCENARIO', `${file}: ${detail}`, { file }),

  /** A user material file (lib/matter/materialFile.ts) that cannot be read as one: file:line and what to write. */
  badMaterialFile: (file: string, line: number, detail: string) =>
    new SagittaError('BAD_MATERIAL_FILE', located({ file, line }, detail), { file, line }),

  badNotebook: (file: string, detail: string) =>
    new SagittaError('BAD_NOTEBOOK', `${file}: ${detail}`, { file }),

  /** An output that cannot be written where asked (missing folder, not writable, a directory). */
  cannotWrite: (path: string, reason: string, fix: string) =>
    new SagittaError('CANNOT_WRITE', `${path}: cannot write here (${reason}); ${fix}`, { file: path }),

  /** An input that exists but cannot be read (a folder, no permission, an I/O error). */
  cannotRead: (path: string, reason: string, fix: string) =>
    new SagittaError('CANNOT_READ', `${path}: cannot read (${reason}); ${fix}`, { file: path }),

  badId: (file: string, line: number, column: string, text: string, why: string) =>
    new SagittaError('BAD_ID', located({ file, line, column }, `${JSON.stringify(text)} ${why}`), { file, line, column }),

  /** A hit file streamed to standard output whose events turned out not to be grouped. */
  notGrouped: (file: string) =>
    new SagittaError('BAD_ROW', `${file}: the hits of an event are not together (an event appears again after others), so the file cannot be streamed to standard output; write the results to a file with --out, or sort the file by event (the rows printed so far are incomplete)`, { file }),

  /** Two paths of one command that are the same file (an output over an input, or two outputs). */
  outputClash: (flag: string, path: string, other: string, otherPath: string) =>
    new SagittaError('OUTPUT_CLASH', `${flag} ${path} is the same file as ${other} ${otherPath}; choose another path (nothing was written)`, { file: path }),

  badConnectionFile: (file: string, detail: string) =>
    new SagittaError('BAD_CONNECTION_FILE', `${file}: ${detail}; the front end writes this file when it starts the kernel — start the kernel from the front end`, { file }),

  /** A kernel or runner asked to do something its state does not allow (a closed session, a failed start). */
  kernelState: (action: string, detail: string) =>
    new SagittaError('KERNEL_STATE', `cannot ${action}: ${detail}`),

  inputUnavailable: (where: string, fix: string) =>
    new SagittaError('INPUT_UNAVAILABLE', `a cell asked for input, but ${where}; ${fix}`),

  /** A notebook knob (lib/knob.ts) declared or given wrongly. */
  badKnob: (name: string, detail: string) =>
    new SagittaError('BAD_KNOB', `knob ${JSON.stringify(name)}: ${detail}`),

  /** A request a formula cannot answer (e.g. a range below the stopping-power cutoff); library code returns NaN + a warning instead, the CLI turns that into this error. */
  outsideValidity: (what: string, value: string, valid: string) =>
    new SagittaError('OUTSIDE_VALIDITY', `${what} ${value} is outside the validity range ${valid}; choose a value inside it`),
} as const;

function describe(value: unknown): string {
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number' || typeof value === 'boolean' || value === null || value === undefined) return String(value);
  try {
    return JSON.stringify(value);
  } catch {
    return Object.prototype.toString.call(value);
  }
}

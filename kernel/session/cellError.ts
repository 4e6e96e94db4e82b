import { inspect } from 'node:util';
import type { CellSourceMap } from './cellSourceMap.js';
import type { CellError } from './types.js';

/** Stack frames from the machinery that runs a cell; they tell the reader nothing about their code. */
const MACHINERY = [/node_modules[\\/]tslab[\\/]/, /kernel[\\/]session[\\/]/, /node:internal/, /node_modules[\\/]tsx[\\/]/];

/** "(label:line:column)" or "label:line:column" at the end of a stack frame. */
const FRAME_PLACE = /(\(?)([^()]+):(\d+):(\d+)(\)?)$/;

/**
 * A thrown value as the protocol's error triple. Frames in a cell are shown at the cell's own
 * line and column ("at fit (cell 3, line 4, column 11)") when `mapOf` knows the cell's maps.
 */
export function errorFromThrown(thrown: unknown, mapOf?: (label: string) => CellSourceMap | undefined): CellError {
  if (thrown instanceof Error) {
    const ename = thrown.name || thrown.constructor?.name || 'Error';
    const evalue = thrown.message;
    const all = (thrown.stack ?? '').split('\n').filter((line) => /^\s+at /.test(line));
    // Everything from the frame that started the cell down is the kernel's own call chain.
    const entry = all.findIndex((line) => /runInThisContext|node:vm/.test(line));
    const frames = (entry >= 0 ? all.slice(0, entry) : all)
      .filter((line) => !MACHINERY.some((re) => re.test(line)))
      .map((line) => (mapOf ? atCellPosition(line, mapOf) : line))
      .filter((line, i, lines) => i === 0 || line !== lines[i - 1]);
    return { ename, evalue, traceback: [`${ename}: ${evalue}`, ...frames] };
  }
  const evalue = inspect(thrown, { depth: 2 });
  return { ename: 'Thrown', evalue, traceback: [`Thrown (not an Error): ${evalue}`] };
}

/** One stack frame with a compiled-cell position replaced by the cell's line and column. */
function atCellPosition(frame: string, mapOf: (label: string) => CellSourceMap | undefined): string {
  const m = FRAME_PLACE.exec(frame);
  if (!m) return frame;
  const [whole, open, label, line, column, close] = m;
  // Without a function name the frame is "    at label:line:column", and the label group holds the "at".
  const lead = /^\s*(at )?/.exec(label)![0];
  const name = label.slice(lead.length);
  const map = mapOf(name);
  if (!map) return frame;
  // The executor puts the cell after one header line of its own.
  const at = map.original(Number(line) - 1, Number(column));
  const place = at ? `${name}, line ${at.line}, column ${at.column}` : `${name}, compiled code`;
  return frame.slice(0, frame.length - whole.length) + lead + `${open}${place}${close}`;
}

/** Compile-time (type or syntax) errors that kept a cell from running. */
export function errorFromDiagnostics(lines: readonly string[]): CellError {
  const first = lines[0] ?? 'the cell did not compile';
  return {
    ename: 'CompileError',
    evalue: first,
    traceback: ['CompileError: the cell was not run because it does not compile', ...lines],
  };
}

/** The error reported when a cell was stopped on request. */
export function interruptedError(): CellError {
  return { ename: 'Interrupted', evalue: 'the cell was interrupted', traceback: ['Interrupted: the cell was interrupted'] };
}

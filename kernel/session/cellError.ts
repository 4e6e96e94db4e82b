import { inspect } from 'node:util';
import type { CellError } from './types.js';

/** Stack frames from the machinery that runs a cell; they tell the reader nothing about their code. */
const MACHINERY = [/node_modules[\\/]tslab[\\/]/, /kernel[\\/]session[\\/]/, /node:internal/, /node_modules[\\/]tsx[\\/]/];

/** A thrown value as the protocol's error triple. */
export function errorFromThrown(thrown: unknown): CellError {
  if (thrown instanceof Error) {
    const ename = thrown.name || thrown.constructor?.name || 'Error';
    const evalue = thrown.message;
    const all = (thrown.stack ?? '').split('\n').filter((line) => /^\s+at /.test(line));
    // Everything from the frame that started the cell down is the kernel's own call chain.
    const entry = all.findIndex((line) => /runInThisContext|node:vm/.test(line));
    const frames = (entry >= 0 ? all.slice(0, entry) : all)
      .filter((line) => !MACHINERY.some((re) => re.test(line)))
      .map((line) => line.replace(/evalmachine\.<anonymous>:\d+:\d+/g, 'cell (compiled)'))
      .filter((line, i, lines) => i === 0 || line !== lines[i - 1]);
    return { ename, evalue, traceback: [`${ename}: ${evalue}`, ...frames] };
  }
  const evalue = inspect(thrown, { depth: 2 });
  return { ename: 'Thrown', evalue, traceback: [`Thrown (not an Error): ${evalue}`] };
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

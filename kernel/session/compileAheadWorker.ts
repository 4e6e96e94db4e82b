/**
 * The ahead check's thread (compileAhead.ts): it builds its own tslab converter at once, and
 * once given the notebook's cells (`plan`) compiles them one after the other, each against the declarations the one before it leaves (as the
 * executor would carry them when every cell runs to its end), and posts each compiled cell as
 * soon as it is done. A `restart` message puts it back at a cell with the declarations the
 * running notebook really has there — with `fresh`, on a new converter, which reads every file
 * again.
 *
 * Local files (outside node_modules) the compiler reads are reported with their size and time
 * of change as read, so the running side can tell whether a cell changed one since.
 */
import { statSync } from 'node:fs';
import { parentPort, workerData } from 'node:worker_threads';
import type { Converter } from 'tslab/dist/converter.js';
import { createCellConverter } from './cellConverter.js';
import { compiledCellOf } from './compiledCell.js';
import { expandShorthandProperties } from './expandShorthand.js';
import { addCompilerRoot, tslabTs } from './moduleRoot.js';
import type { FileStamp, FromAheadThread, ToAheadThread } from './compileAhead.js';

const { workDir } = workerData as { workDir: string };
const port = parentPort!;
let cells: string[] = [];

// The compiler's working folder is the notebook's (a worker thread cannot change the process's).
tslabTs.sys.getCurrentDirectory = () => workDir;
addCompilerRoot(workDir);
let reads: FileStamp[] = [];
const readFile = tslabTs.sys.readFile.bind(tslabTs.sys);
tslabTs.sys.readFile = (p, encoding) => {
  // Stamped before reading, so a change made while the file is read counts as a change.
  if (!/(^|[\\/])node_modules[\\/]/.test(p)) reads.push(stampOf(p));
  return readFile(p, encoding);
};

let converter: Converter = createCellConverter(workDir);
let epoch = 0;
let generation = 0;
let next = 0;
let prevDecl = '';
let scheduled = false;
post({ kind: 'ready' });

port.on('message', (m: ToAheadThread) => {
  if (m.kind === 'close') {
    converter.close();
    port.close();
    return;
  }
  if (m.kind === 'plan') {
    cells = [...m.cells];
    next = 0;
    prevDecl = '';
    schedule();
    return;
  }
  generation = m.generation;
  cells[m.index] = m.code;
  next = m.index;
  prevDecl = m.prevDecl;
  if (m.fresh) {
    converter.close();
    converter = createCellConverter(workDir);
    epoch++;
  }
  schedule();
});

function schedule(): void {
  if (scheduled || next >= cells.length) return;
  scheduled = true;
  // One cell per turn of the event loop, so a restart is heard between two cells.
  setImmediate(() => {
    scheduled = false;
    compileNext();
    schedule();
  });
}

function compileNext(): void {
  const index = next++;
  reads = [];
  const cell = compiledCellOf(converter.convert(prevDecl, expandShorthandProperties(cells[index])));
  post({ kind: 'compiled', generation, epoch, index, prevDecl, cell, reads });
  // As the executor carries declarations on: a cell that does not compile leaves them as they were.
  if (cell.diagnostics.length === 0) prevDecl = cell.declOutput ?? '';
}

function stampOf(p: string): FileStamp {
  try {
    const s = statSync(p);
    return { path: p, stamp: `${s.size}:${s.mtimeMs}` };
  } catch {
    return { path: p, stamp: 'missing' };
  }
}

function post(m: FromAheadThread): void {
  port.postMessage(m);
}

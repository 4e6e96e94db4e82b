/**
 * The ahead check: a headless run knows all its cells before the first one runs, so a second
 * thread (compileAheadWorker.ts) type-checks and compiles them in order while earlier cells run,
 * and a cell usually finds its compiled code waiting. The compiler is the same (tslab's
 * converter, set up as in this thread) and each cell is compiled from the same declarations the
 * cells before it leave, so a cell runs the same code and a type error reads the same, at the
 * same line and column, as when it is compiled here just before it runs. A cell still never runs
 * before it has been checked: the run stops at the first cell with a type error, after the cells
 * before it ran.
 *
 * Where compiling ahead could see something other than compiling just in time, the cell is
 * compiled again at its turn:
 * - the declarations differ from the ones the thread assumed (a cell threw part-way, under
 *   --keep-going): compiled again from the real ones, and the thread goes on from there;
 * - a local file the compiler read (a .ts module, a JSON file next to the notebook) changed since
 *   (an earlier cell wrote it), or the ahead check's error is about a module that cannot be found
 *   or lacks a name (an earlier cell may have written it): compiled again on a new converter,
 *   which reads the files as they are now.
 * If the thread fails, the cells from there on are compiled in this thread (`fallback`).
 */
import { statSync } from 'node:fs';
import { Worker } from 'node:worker_threads';
import type { SideOutput } from 'tslab/dist/converter.js';
import { workerUrl } from '../packageMode.js';
import type { CellCompiler, CompiledCell } from './compiledCell.js';

/** A file as the compiler read it: "size:mtimeMs", or "missing". */
export interface FileStamp {
  readonly path: string;
  readonly stamp: string;
}

export type ToAheadThread =
  /** Compile from cell `index` (its source `code`) on, starting from `prevDecl`; `fresh`: on a new converter. */
  | { kind: 'restart'; generation: number; index: number; code: string; prevDecl: string; fresh: boolean }
  | { kind: 'close' };

export type FromAheadThread =
  | { kind: 'ready'; typescript: string }
  /** `epoch` counts the thread's converters; `reads`: local files read while compiling this cell. */
  | { kind: 'compiled'; generation: number; epoch: number; index: number; prevDecl: string; cell: CompiledCell; reads: FileStamp[] };

type Compiled = Extract<FromAheadThread, { kind: 'compiled' }>;

export interface CompileAhead extends CellCompiler {
  /** Resolves once the thread's compiler is built (the first cell is then being compiled). */
  readonly ready: Promise<void>;
}

export interface CompileAheadOptions {
  readonly workDir: string;
  /** The code cells' sources, in the order they will be compiled. */
  readonly cells: readonly string[];
  /** The compiler used in this thread if the ahead thread fails (the caller closes it). */
  readonly fallback: () => CellCompiler;
}

const ENTRY = workerUrl('kernel/session/compileAheadWorker');

/**
 * Starts the ahead check of `cells`. `compile` must then be called for the cells in their order
 * (another cell in their place is compiled at its turn, and the thread goes on from there).
 */
export function startCompileAhead(options: CompileAheadOptions): CompileAhead {
  const cells = [...options.cells];
  const worker = new Worker(ENTRY, { workerData: { workDir: options.workDir, cells } });
  let generation = 0;
  let epoch = 0;
  let position = 0;
  let failure: Error | undefined;
  let fallback: CellCompiler | undefined;
  let closed = false;
  const results = new Map<number, Compiled>();
  const waiters = new Set<() => void>();
  /** Side outputs not yet handed to a cell: each module is emitted once per converter, whichever cell asked. */
  let sideOutputs: SideOutput[] = [];
  /** Local files the thread's current converter has read, as it read them. */
  const stamps = new Map<string, string>();

  let markReady!: () => void;
  const ready = new Promise<void>((resolve) => (markReady = resolve));
  const wake = () => {
    for (const w of [...waiters]) w();
  };
  worker.on('message', (m: FromAheadThread) => {
    if (m.kind === 'ready') {
      markReady();
      return;
    }
    sideOutputs.push(...(m.cell.sideOutputs ?? []));
    if (m.epoch === epoch) for (const r of m.reads) if (!stamps.has(r.path)) stamps.set(r.path, r.stamp);
    if (m.generation === generation) {
      results.set(m.index, m);
      wake();
    }
  });
  const fail = (err: Error) => {
    failure ??= err;
    markReady();
    wake();
  };
  worker.on('error', fail);
  worker.on('exit', (code) => {
    if (!closed) fail(new Error(`the ahead check's thread stopped (exit code ${code})`));
  });
  // The thread must not keep the process alive on its own.
  worker.unref();

  function resultFor(index: number): Promise<Compiled | undefined> {
    return new Promise((resolve) => {
      const check = () => {
        const r = results.get(index);
        if (r === undefined && failure === undefined) return;
        waiters.delete(check);
        resolve(r);
      };
      waiters.add(check);
      check();
    });
  }

  function restart(index: number, code: string, prevDecl: string, fresh: boolean): void {
    generation++;
    results.clear();
    if (fresh) {
      epoch++;
      stamps.clear();
    }
    worker.postMessage({ kind: 'restart', generation, index, code, prevDecl, fresh } satisfies ToAheadThread);
  }

  function changedFiles(): boolean {
    for (const [path, stamp] of stamps) {
      let now = 'missing';
      try {
        const s = statSync(path);
        now = `${s.size}:${s.mtimeMs}`;
      } catch {
        // gone: 'missing'
      }
      if (now !== stamp) return true;
    }
    return false;
  }

  async function compile(prevDecl: string, code: string): Promise<CompiledCell> {
    const index = position++;
    if (failure === undefined && (index >= cells.length || cells[index] !== code)) {
      cells[index] = code;
      restart(index, code, prevDecl, false);
    }
    // True once a converter was built for this cell at its turn: its answer stands.
    let fresh = false;
    for (let attempt = 1; failure === undefined; attempt++) {
      const r = await resultFor(index);
      if (r === undefined) break;
      // A file that keeps changing (a cell's timer writing it) is taken as the third converter read it.
      const changed = attempt < 3 && changedFiles();
      const unsure: boolean = !fresh && r.cell.diagnostics.length > 0 && r.cell.fromFiles === true;
      if (r.prevDecl === prevDecl && !changed && !unsure) return handOver(r.cell);
      fresh = changed || unsure;
      restart(index, code, prevDecl, fresh);
    }
    fallback ??= options.fallback();
    return fallback.compile(prevDecl, code);
  }

  /** The cell with every side output emitted so far that no cell has taken yet. */
  function handOver(cell: CompiledCell): CompiledCell {
    const out = { ...cell, sideOutputs };
    sideOutputs = [];
    return out;
  }

  return {
    ready,
    compile,
    close() {
      if (closed) return;
      closed = true;
      worker.postMessage({ kind: 'close' } satisfies ToAheadThread);
      void worker.terminate();
    },
  };
}

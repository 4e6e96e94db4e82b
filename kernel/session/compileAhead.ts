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
 * If the thread fails, `compile` answers undefined and the caller compiles the cell itself.
 *
 * The thread is started before the cells are known (`plan` gives them), so that it builds its
 * compiler while the process is still loading the library.
 */
import { statSync } from 'node:fs';
import { Worker } from 'node:worker_threads';
import type { SideOutput } from 'tslab/dist/converter.js';
import { workerUrl } from '../packageMode.js';
import type { CompiledCell } from './compiledCell.js';

/** A file as the compiler read it: "size:mtimeMs", or "missing". */
export interface FileStamp {
  readonly path: string;
  readonly stamp: string;
}

export type ToAheadThread =
  /** The cells to compile, in order, from the start. */
  | { kind: 'plan'; cells: readonly string[] }
  /** Compile from cell `index` (its source `code`) on, starting from `prevDecl`; `fresh`: on a new converter. */
  | { kind: 'restart'; generation: number; index: number; code: string; prevDecl: string; fresh: boolean }
  | { kind: 'close' };

export type FromAheadThread =
  | { kind: 'ready' }
  /** `epoch` counts the thread's converters; `reads`: local files read while compiling this cell. */
  | { kind: 'compiled'; generation: number; epoch: number; index: number; prevDecl: string; cell: CompiledCell; reads: FileStamp[] };

type Compiled = Extract<FromAheadThread, { kind: 'compiled' }>;

export interface CompileAhead {
  /** The folder the cells run in (the thread's compiler resolves from it). */
  readonly workDir: string;
  /** Resolves once the thread's compiler is built (or the thread failed). */
  readonly ready: Promise<void>;
  /** The code cells' sources, in the order they will be compiled (once, before the first `compile`). */
  plan(cells: readonly string[]): void;
  /**
   * The next cell, compiled against `prevDecl`; undefined when the thread has failed (compile it
   * in this thread then). Called for the planned cells in their order; another cell in a
   * planned cell's place is compiled at its turn, and the thread goes on from there.
   */
  compile(prevDecl: string, code: string): Promise<CompiledCell | undefined>;
  /** Stops the thread (it keeps the process alive until then). */
  close(): void;
}

const ENTRY = workerUrl('kernel/session/compileAheadWorker');

/** Starts the ahead check's thread for cells run in `workDir`. */
export function startCompileAhead(workDir: string): CompileAhead {
  let cells: string[] = [];
  const worker = new Worker(ENTRY, { workerData: { workDir } });
  let generation = 0;
  let epoch = 0;
  let position = 0;
  let failure: Error | undefined;
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

  async function compile(prevDecl: string, code: string): Promise<CompiledCell | undefined> {
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
    return undefined;
  }

  /** The cell with every side output emitted so far that no cell has taken yet. */
  function handOver(cell: CompiledCell): CompiledCell {
    const out = { ...cell, sideOutputs };
    sideOutputs = [];
    return out;
  }

  return {
    workDir,
    ready,
    plan(planned) {
      cells = [...planned];
      worker.postMessage({ kind: 'plan', cells } satisfies ToAheadThread);
    },
    compile,
    close() {
      if (closed) return;
      closed = true;
      worker.postMessage({ kind: 'close' } satisfies ToAheadThread);
      void worker.terminate();
    },
  };
}

/**
 * The contract between the protocol server (kernel/protocol), the headless runner (kernel/runner)
 * and the in-process execution session (kernel/session/session.ts). Plain data in, plain data out:
 * nothing here knows about sockets or child processes.
 */
import { type MimeBundle } from '../../lib/index.js';
import type { CompileAhead } from './compileAhead.js';

/** Callbacks a running cell uses to emit output while it runs. */
export interface CellHooks {
  /** Text written to process.stdout / process.stderr (or console.*) by the cell. */
  stream(name: 'stdout' | 'stderr', text: string): void;
  /** A rich output; `update: true` replaces the earlier output carrying the same `displayId`. */
  display(bundle: MimeBundle, options: { displayId?: string; update?: boolean }): void;
  /** Clears the cell's outputs so far; with `wait`, only once the next output arrives. */
  clear(wait: boolean): void;
  /** Asks the person running the notebook for a line of text; rejects where no one can answer. */
  ask(prompt: string, password: boolean): Promise<string>;
}

/** A failed cell: the exception's class name, message and a readable traceback (one line per entry). */
export interface CellError {
  ename: string;
  evalue: string;
  traceback: string[];
}

/** How a cell ended. `result` is the bundle of the last expression's value, when it has one. */
export interface CellOutcome {
  status: 'ok' | 'error';
  result?: MimeBundle;
  error?: CellError;
}

export interface CompletionReply {
  matches: string[];
  /** Code-point offsets into the cell text of the range the matches replace. */
  cursorStart: number;
  cursorEnd: number;
}

export type Completeness = 'complete' | 'incomplete' | 'invalid' | 'unknown';

export interface ExecuteOptions {
  /** How stack traces name this cell, e.g. "cell 3" (default "cell run N"). */
  readonly label?: string;
}

/** An execution context that keeps variables between cells. `cursorPos` values are code points. */
export interface Session {
  execute(code: string, hooks: CellHooks, options?: ExecuteOptions): Promise<CellOutcome>;
  complete(code: string, cursorPos: number): Promise<CompletionReply>;
  inspect(code: string, cursorPos: number, detailLevel: number): Promise<MimeBundle | undefined>;
  isComplete(code: string): Promise<Completeness>;
  /** Asks the running cell to stop (resolves a pending await with an error; see session.ts). */
  interrupt(): void;
  close(): void;
  /** Compiled files of the local modules (.ts next to the notebook) the cells have loaded. */
  localModules?(): string[];
  /**
   * Optional: loads the library and builds the compiler's view of it ahead of the first cell
   * (the kernel calls it while the front end is idle). Changes no state a cell can see.
   */
  warmUp?(): Promise<void>;
}

export interface SessionOptions {
  /** Folder of the notebook: relative imports and files resolve from here. */
  workDir: string;
  /** Shared flag the session keeps up to date with the cell's phase (kernel/session/phase.ts). */
  phase?: Int32Array;
  /**
   * The ahead check of a headless run, its cells planned (compileAhead.ts): cells are then
   * type-checked and compiled on its thread while earlier cells run, and `execute` must be given
   * them in their order. `warmUp()` then waits for the library and that thread's compiler.
   * The session closes it.
   */
  ahead?: CompileAhead;
}

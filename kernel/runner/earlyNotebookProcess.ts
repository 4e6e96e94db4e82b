/**
 * The notebook process of `sagitta run <notebook.ipynb> …`, started as the command starts, before
 * it loads its own modules (the library, commander, the runner: seconds from source through tsx),
 * so that the child boots — library, cell compiler — meanwhile. Read from the command line as
 * given (node, script, "run", notebook, …); anything unusual (options before the notebook, no such
 * file) starts none, and the command starts its own once its options are checked. The run adopts
 * it (`adoptEarlyNotebookProcess`); one not adopted (a usage error, a refused knob) is stopped by
 * `stopEarlyNotebookProcess` when the command ends. This file loads nothing of the library.
 */
import { statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { startNotebookProcess, type NotebookProcess } from './notebookProcess.js';

let early: NotebookProcess | undefined;

/** Starts the notebook process for `sagitta run <notebook> …` (the ahead check on, as `sagitta run` runs). */
export function startEarlyNotebookProcess(argv: readonly string[]): void {
  const [, , command, notebook] = argv;
  if (command !== 'run' || notebook === undefined || notebook.startsWith('-') || !/\.ipynb$/i.test(notebook)) return;
  try {
    if (!statSync(notebook).isFile()) return;
  } catch {
    return;
  }
  early = startNotebookProcess(dirname(resolve(notebook)), true);
}

/** The process started early, if it was started for `workDir` with `compileAhead` and still runs; it is the caller's then. */
export function adoptEarlyNotebookProcess(workDir: string, compileAhead: boolean): NotebookProcess | undefined {
  const started = early;
  early = undefined;
  if (started === undefined) return undefined;
  if (started.workDir === workDir && started.compileAhead === compileAhead && started.child.exitCode === null && started.child.signalCode === null && started.child.connected) return started;
  started.child.kill('SIGKILL');
  return undefined;
}

/** Stops a process started early that no run took. */
export function stopEarlyNotebookProcess(): void {
  early?.child.kill('SIGKILL');
  early = undefined;
}

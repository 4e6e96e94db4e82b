/**
 * Starting the notebook process (child.ts) — on its own, so that a caller can start it before it
 * loads the rest of the runner: `sagitta run` forks it as soon as its options are checked, and the
 * child boots (library, cell compiler) while this process loads the runner and report modules.
 * Nothing here loads the library.
 */
import { fork, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { childExecArgv, moduleUrl } from '../packageMode.js';
import { COMPILE_AHEAD_FLAG } from './messages.js';

const CHILD = fileURLToPath(moduleUrl('kernel/runner/child'));

/** A notebook process started for cells run in `workDir`, with or without the ahead check. */
export interface NotebookProcess {
  readonly child: ChildProcess;
  readonly workDir: string;
  readonly compileAhead: boolean;
}

/** Forks the notebook process in `workDir` (an absolute folder); it waits for the runner's `start` message. */
export function startNotebookProcess(workDir: string, compileAhead: boolean): NotebookProcess {
  const child = fork(CHILD, compileAhead ? [COMPILE_AHEAD_FLAG] : [], {
    cwd: workDir,
    execArgv: childExecArgv(),
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
    env: { ...process.env, FORCE_COLOR: '0' },
  });
  // A failed start (a folder that vanished) is reported through 'exit' to the run's channel; until
  // the run attaches it, an 'error' event must not end this process.
  child.on('error', () => {});
  return { child, workDir, compileAhead };
}

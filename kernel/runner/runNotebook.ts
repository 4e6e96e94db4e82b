import path, { dirname, resolve } from 'node:path';
import { SagittaError } from '../../lib/index.js';
import { msg, type KnobRecord, type ProvenanceSnapshot } from '../../lib/internal.js';
import type { DisplayDataOutput, Notebook, SagittaCellMeta } from '../notebook/types.js';
import { runCell } from './cellRecorder.js';
import { pushStream } from './cellRecorder.js';
import { ChildChannel } from './childChannel.js';
import { exitOutput, exitText, firstLine, formatLimit, lastLine, stepName, stoppedOutput, timeoutOutput } from './failureText.js';
import { libraryRecord } from './libraryRecord.js';
import { startNotebookProcess, type NotebookProcess } from './notebookProcess.js';
import { prepareNotebook } from './prepare.js';
import { describeInputs } from './simulatedInputs.js';
import type { ModuleRecord, RunRecord } from './runRecord.js';

/** What `onProgress` hears: the run starting, and each step starting and ending. */
export type RunProgress =
  | { readonly kind: 'started'; readonly steps: number }
  | { readonly kind: 'step'; readonly step: number; readonly steps: number }
  | { readonly kind: 'stepDone'; readonly step: number; readonly steps: number; readonly wallMs: number; readonly outcome: 'done' | 'failed' };

export interface RunNotebookOptions {
  /** Longest a single cell may run, ms (Infinity: no limit). Default 120 s. */
  readonly cellTimeoutMs?: number;
  /** Run the remaining cells after a cell raises an error (default: stop at the first error). */
  readonly keepGoing?: boolean;
  /** Knob values for this run, as text (`--set name=value`), checked against the notebook's knobs before any cell runs. */
  readonly knobs?: ReadonlyMap<string, string>;
  /** Longest the notebook process may take to start, ms. Default 120 s. */
  readonly startTimeoutMs?: number;
  /** Folder cells run in (relative paths, local imports). Default: the notebook's folder. */
  readonly workDir?: string;
  /**
   * Type-check and compile the cells on a second thread while earlier cells run (default true;
   * kernel/session/compileAhead.ts). The run is the same either way: a cell runs only once it is
   * checked, and the first cell with a type error stops it with the same error.
   */
  readonly compileAhead?: boolean;
  /**
   * A notebook process the caller started already (startNotebookProcess), so that it boots while
   * the caller loads the rest; it must have been started in this run's folder with this run's
   * `compileAhead`. The run takes it over (and stops it if the notebook cannot be read).
   */
  readonly process?: NotebookProcess;
  readonly onProgress?: (event: RunProgress) => void;
}

/** The result of a run: the executed notebook, its record, and the exit status. */
export interface NotebookRun {
  readonly notebook: Notebook;
  readonly run: RunRecord;
  /** 0 when every code cell ran without error; 1 otherwise. */
  readonly exitCode: 0 | 1;
  /** One line saying why the run is not complete. */
  readonly reason?: string;
  /** Milliseconds from fork to the child's first idle moment (compiler built). */
  readonly startMs: number;
  /** Per completed cell: runner wall time minus the session's own time for it (IPC, bookkeeping), ms. */
  readonly overheadMs: readonly number[];
}

const DEFAULTS = Object.freeze({ cellTimeoutMs: 120_000, keepGoing: false, startTimeoutMs: 120_000, compileAhead: true });
/** Signals to `sagitta run` itself that stop the run (the notebook process is stopped, the record still written). */
const STOP_SIGNALS: readonly NodeJS.Signals[] = ['SIGINT', 'SIGTERM', 'SIGHUP'];

/**
 * Runs a notebook's code cells in order in a child process and returns the executed notebook.
 * The source file is only read. A cell that raises gets an `error` output; a cell that runs past
 * the timeout, or ends or crashes the process, gets an `error` output saying so, the child is
 * stopped (SIGKILL) and the cells after it are marked not run (their state would be gone). A
 * signal to this process (SIGINT, SIGTERM, SIGHUP) stops the child the same way and the run
 * returns its record, marked stopped. Knob values that do not fit the notebook's knobs are a bad
 * call (BAD_KNOB), reported before any cell runs.
 */
export async function runNotebook(path: string, options: RunNotebookOptions = {}): Promise<NotebookRun> {
  const o = { ...DEFAULTS, ...options };
  const workDir = resolve(options.workDir ?? dirname(resolve(path)));
  const started = options.process;
  if (started && (started.workDir !== workDir || started.compileAhead !== o.compileAhead)) {
    started.child.kill('SIGKILL');
    throw msg.badArgument('process', started.workDir, `a notebook process started in ${workDir} with compileAhead ${o.compileAhead}`);
  }
  let prepared: ReturnType<typeof prepareNotebook>;
  try {
    prepared = prepareNotebook(path);
  } catch (err) {
    started?.child.kill('SIGKILL');
    throw err;
  }
  const { loaded, notebook: nb, code } = prepared;
  const startedAt = new Date();
  const t0 = performance.now();
  const library = libraryRecord();
  const { child } = started ?? startNotebookProcess(workDir, o.compileAhead);
  const channel = new ChildChannel(child);
  let stoppedBy: NodeJS.Signals | undefined;
  const onSignal = (signal: NodeJS.Signals) => {
    stoppedBy ??= signal;
    channel.kill();
  };
  for (const s of STOP_SIGNALS) process.on(s, onSignal);
  let provenance: ProvenanceSnapshot = { inputs: [], seeds: [] };
  let knobs: readonly KnobRecord[] = [];
  let modules: ModuleRecord[] = [];
  let typescript = 'unknown';
  let startMs = NaN;
  let reason: string | undefined;
  const failures: string[] = [];
  const overheadMs: number[] = [];
  const steps = code.length;

  try {
    channel.send({ kind: 'start', workDir, cells: code, knobs: [...(options.knobs ?? new Map<string, string>())] });
    const ready = await channel.waitFor((m) => m.kind === 'ready' || m.kind === 'refused' || m.kind === 'fault', o.startTimeoutMs);
    // Each problem is already a BAD_KNOB message naming its knob.
    if (ready.kind === 'message' && ready.message.kind === 'refused') throw new SagittaError('BAD_KNOB', ready.message.problems.join('; '));
    if (ready.kind !== 'message' || ready.message.kind !== 'ready') {
      const why = stoppedBy ? `was stopped (${stoppedBy})`
        : ready.kind === 'timeout' ? `did not start within ${formatLimit(o.startTimeoutMs)}`
        : ready.kind === 'exit' ? `ended while starting (${exitText(ready.code, ready.signal)})`
        : `could not start: ${(ready.message as { message?: string }).message ?? ''}`;
      reason = `the notebook process ${why}${lastLine(channel.stray)}`;
      markNotRun(nb, 0);
    } else {
      typescript = ready.message.typescript;
      startMs = ready.message.startMs;
      channel.stray = '';
      const displays = new Map<string, DisplayDataOutput[]>();
      o.onProgress?.({ kind: 'started', steps });
      for (let k = 0; k < code.length; k++) {
        const { index } = code[k];
        const step = k + 1;
        const cell = nb.cells[index];
        if (cell.cell_type !== 'code') continue;
        const meta = cell.metadata.sagitta as SagittaCellMeta;
        const started = new Date();
        const c0 = performance.now();
        cell.execution_count = step;
        o.onProgress?.({ kind: 'step', step, steps });
        const end = await runCell(channel, cell, { index, step }, o.cellTimeoutMs, displays);
        const wallMs = performance.now() - c0;
        meta.startedAt = started.toISOString();
        meta.wallMs = Math.round(wallMs * 10) / 10;
        cell.metadata.execution = { 'iopub.execute_input': started.toISOString(), 'shell.execute_reply': new Date().toISOString() };
        if (channel.stray) {
          pushStream(cell, 'stderr', channel.stray);
          channel.stray = '';
        }
        if (end.kind === 'done') {
          ({ provenance, knobs, modules } = end.message);
          overheadMs.push(wallMs - end.message.execMs);
          meta.outcome = end.message.outcome.status === 'ok' ? 'done' : 'failed';
          o.onProgress?.({ kind: 'stepDone', step, steps, wallMs, outcome: meta.outcome });
          if (meta.outcome === 'done') continue;
          const e = end.message.outcome.error!;
          failures.push(`${stepName(step)} failed: ${e.ename}: ${firstLine(e.evalue)}`);
          if (o.keepGoing) continue;
          reason = `${failures[0]}; the steps after it were not run (use --keep-going to run them anyway)`;
          markNotRun(nb, index + 1);
          break;
        }
        meta.outcome = 'failed';
        o.onProgress?.({ kind: 'stepDone', step, steps, wallMs, outcome: 'failed' });
        if (stoppedBy) {
          cell.outputs.push(stoppedOutput(stoppedBy));
          reason = `the run was stopped (${stoppedBy}) during ${stepName(step)}; the steps after it were not run`;
        } else if (end.kind === 'timeout') {
          cell.outputs.push(timeoutOutput(o.cellTimeoutMs));
          reason = `${stepName(step)} ran longer than the ${formatLimit(o.cellTimeoutMs)} limit and was stopped; the steps after it were not run`;
        } else {
          cell.outputs.push(exitOutput(end.code, end.signal));
          reason = `${stepName(step)} ended the notebook process (${exitText(end.code, end.signal)}); the steps after it were not run`;
        }
        markNotRun(nb, index + 1);
        break;
      }
      if (!reason && failures.length > 0) {
        reason = failures.length === 1 ? `${failures[0]} (all steps ran: --keep-going)` : `${failures.length} steps failed, first ${failures[0]} (all steps ran: --keep-going)`;
      }
    }
  } finally {
    for (const s of STOP_SIGNALS) process.off(s, onSignal);
    await channel.close();
  }

  const notebookDir = dirname(resolve(path));
  const status: RunRecord['status'] = reason === undefined ? 'complete' : failures.length > 0 && o.keepGoing && !nb.cells.some(isNotRun) ? 'errors' : 'stopped';
  return {
    notebook: nb,
    exitCode: reason === undefined ? 0 : 1,
    reason,
    startMs,
    overheadMs,
    run: {
      source: { path: basenameOf(path), sha256: loaded.sha256, sizeBytes: loaded.sizeBytes },
      startedAt: startedAt.toISOString(),
      wallMs: Math.round((performance.now() - t0) * 10) / 10,
      status,
      reason,
      knobs,
      inputs: describeInputs(provenance.inputs, notebookDir),
      seeds: provenance.seeds,
      usesStoppingPower: (provenance.cautions ?? []).includes('stopping-power'),
      modules,
      library: await library,
      versions: { node: process.versions.node, cellCompiler: typescript },
    },
  };
}

function basenameOf(file: string): string {
  return path.basename(file);
}


function markNotRun(nb: Notebook, from: number): void {
  for (let j = from; j < nb.cells.length; j++) {
    const c = nb.cells[j];
    if (c.cell_type === 'code') (c.metadata.sagitta as SagittaCellMeta).outcome = 'not-run';
  }
}

function isNotRun(c: Notebook['cells'][number]): boolean {
  return c.cell_type === 'code' && ((c.metadata.sagitta ?? {}) as SagittaCellMeta).outcome === 'not-run';
}

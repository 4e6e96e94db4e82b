import { fork, type ChildProcess } from 'node:child_process';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { msg } from '../../lib/errors.js';
import type { ProvenanceSnapshot } from '../../lib/provenance.js';
import { sagittaVersion } from '../version.js';
import { readNotebook } from '../notebook/read.js';
import { joinSource } from '../notebook/source.js';
import type { CodeCell, DisplayDataOutput, Notebook, Output, SagittaCellMeta } from '../notebook/types.js';
import { upgradeNotebook } from '../notebook/upgrade.js';
import type { ReportRun } from '../report/types.js';
import type { FromChild, ToChild } from './messages.js';
import { injectParameters } from './parameters.js';

export interface RunNotebookOptions {
  /** Longest a single cell may run, ms (Infinity: no limit). Default 120 s. */
  readonly cellTimeoutMs?: number;
  /** Run the remaining cells after a cell raises an error (default: stop at the first error). */
  readonly keepGoing?: boolean;
  /** Values for `--set`, injected after the cell tagged `sagitta-knobs`. */
  readonly parameters?: Readonly<Record<string, unknown>>;
  /** Longest the notebook process may take to start, ms. Default 120 s. */
  readonly startTimeoutMs?: number;
  /** Folder cells run in (relative paths, local imports). Default: the notebook's folder. */
  readonly workDir?: string;
}

/** The result of a run: the executed notebook, what the report needs, and the exit status. */
export interface NotebookRun {
  readonly notebook: Notebook;
  readonly run: ReportRun;
  /** 0 when every code cell ran without error; 1 otherwise. */
  readonly exitCode: 0 | 1;
  /** One line saying why the run is not complete. */
  readonly reason?: string;
  /** Milliseconds from fork to the child's first idle moment (compiler built). */
  readonly startMs: number;
  /** Per completed cell: runner wall time minus the session's own time for it (IPC, bookkeeping), ms. */
  readonly overheadMs: readonly number[];
}

const DEFAULTS = Object.freeze({ cellTimeoutMs: 120_000, keepGoing: false, startTimeoutMs: 120_000 });

const CHILD = fileURLToPath(new URL('./child.ts', import.meta.url));
/** tsx's loader, resolved from this package (the child's working folder may be anywhere). */
const TSX_LOADER = import.meta.resolve('tsx');

/** How the wait for a cell ended. */
type CellEnd =
  | { kind: 'done'; message: Extract<FromChild, { kind: 'done' }> }
  | { kind: 'timeout' }
  | { kind: 'exit'; code: number | null; signal: NodeJS.Signals | null };

/**
 * Runs a notebook's code cells in order in a child process and returns the executed notebook.
 * The source file is only read. A cell that raises gets an `error` output; a cell that runs past
 * the timeout, or ends or crashes the process, gets an `error` output saying so, the child is
 * stopped (SIGKILL) and the cells after it are marked not run (their state would be gone).
 */
export async function runNotebook(path: string, options: RunNotebookOptions = {}): Promise<NotebookRun> {
  const o = { ...DEFAULTS, ...options };
  const loaded = readNotebook(path);
  checkLanguage(loaded.notebook, path);
  const parameters = { ...(options.parameters ?? {}) };
  const nb = injectParameters(upgradeNotebook(loaded.notebook), parameters, path);
  for (const cell of nb.cells) {
    if (cell.cell_type !== 'code') continue;
    cell.outputs = [];
    cell.execution_count = null;
    const meta = (cell.metadata.sagitta ?? {}) as SagittaCellMeta;
    cell.metadata.sagitta = meta.injected ? { injected: true } : {};
    delete cell.metadata.execution;
  }
  const workDir = resolve(options.workDir ?? dirname(resolve(path)));
  const startedAt = new Date();
  const t0 = performance.now();

  const child = fork(CHILD, [], {
    cwd: workDir,
    execArgv: ['--import', TSX_LOADER],
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
    env: { ...process.env, FORCE_COLOR: '0' },
  });
  const channel = new ChildChannel(child);
  let provenance: ProvenanceSnapshot = { inputs: [], seeds: [] };
  let typescript = 'unknown';
  let startMs = NaN;
  let reason: string | undefined;
  const failures: string[] = [];
  const overheadMs: number[] = [];

  try {
    channel.send({ kind: 'start', workDir });
    const ready = await channel.waitFor((m) => m.kind === 'ready' || m.kind === 'fault', o.startTimeoutMs);
    if (ready.kind !== 'message' || ready.message.kind !== 'ready') {
      const why = ready.kind === 'timeout' ? `did not start within ${o.startTimeoutMs / 1000} s`
        : ready.kind === 'exit' ? `ended while starting (${exitText(ready.code, ready.signal)})`
        : `could not start: ${(ready.message as { message?: string }).message ?? ''}`;
      reason = `the notebook process ${why}${tail(channel.stray)}`;
      markNotRun(nb, 0);
    } else {
      typescript = ready.message.typescript;
      startMs = ready.message.startMs;
      channel.stray = '';
      let count = 0;
      const displays = new Map<string, DisplayDataOutput[]>();
      for (let i = 0; i < nb.cells.length; i++) {
        const cell = nb.cells[i];
        if (cell.cell_type !== 'code') continue;
        const n = i + 1;
        const meta = cell.metadata.sagitta as SagittaCellMeta;
        const started = new Date();
        const c0 = performance.now();
        cell.execution_count = ++count;
        const end = await runCell(channel, cell, i, o.cellTimeoutMs, displays, count);
        const wallMs = performance.now() - c0;
        meta.startedAt = started.toISOString();
        meta.wallMs = Math.round(wallMs * 10) / 10;
        cell.metadata.execution = { 'iopub.execute_input': started.toISOString(), 'shell.execute_reply': new Date().toISOString() };
        if (channel.stray) {
          pushStream(cell, 'stderr', channel.stray);
          channel.stray = '';
        }
        if (end.kind === 'done') {
          provenance = end.message.provenance;
          overheadMs.push(wallMs - end.message.execMs);
          if (end.message.outcome.status === 'ok') {
            meta.outcome = 'done';
            continue;
          }
          meta.outcome = 'failed';
          const e = end.message.outcome.error!;
          failures.push(`cell ${n} failed: ${e.ename}: ${firstLine(e.evalue)}`);
          if (o.keepGoing) continue;
          reason = `${failures[0]}; the cells after it were not run (use --keep-going to run them anyway)`;
          markNotRun(nb, i + 1);
          break;
        }
        meta.outcome = 'failed';
        const limit = formatLimit(o.cellTimeoutMs);
        const error: Output = end.kind === 'timeout'
          ? { output_type: 'error', ename: 'CellTimeout', evalue: `the cell ran longer than the ${limit} limit (--cell-timeout) and its process was stopped`, traceback: [`CellTimeout: the cell ran longer than ${limit}; the notebook process was stopped, so the cells after it were not run`] }
          : { output_type: 'error', ename: 'ProcessExit', evalue: `the notebook process ended while this cell ran (${exitText(end.code, end.signal)})`, traceback: [`ProcessExit: the notebook process ended (${exitText(end.code, end.signal)}), e.g. by process.exit() or a crash; the cells after it were not run`] };
        cell.outputs.push(error);
        reason = end.kind === 'timeout'
          ? `cell ${n} ran longer than the ${limit} limit and was stopped; the cells after it were not run`
          : `cell ${n} ended the notebook process (${exitText(end.code, end.signal)}); the cells after it were not run`;
        markNotRun(nb, i + 1);
        break;
      }
      if (!reason && failures.length > 0) {
        reason = failures.length === 1 ? `${failures[0]} (all cells ran: --keep-going)` : `${failures.length} cells failed, first ${failures[0]} (all cells ran: --keep-going)`;
      }
    }
  } finally {
    await channel.close();
  }

  const status: ReportRun['status'] = reason === undefined ? 'complete' : failures.length > 0 && o.keepGoing && !nb.cells.some(isNotRun) ? 'errors' : 'stopped';
  return {
    notebook: nb,
    exitCode: reason === undefined ? 0 : 1,
    reason,
    startMs,
    overheadMs,
    run: {
      source: { path, sha256: loaded.sha256, sizeBytes: loaded.sizeBytes },
      startedAt: startedAt.toISOString(),
      wallMs: Math.round((performance.now() - t0) * 10) / 10,
      status,
      reason,
      parameters,
      provenance,
      versions: { sagitta: sagittaVersion(), node: process.versions.node, typescript },
    },
  };
}

async function runCell(channel: ChildChannel, cell: CodeCell, index: number, timeoutMs: number, displays: Map<string, DisplayDataOutput[]>, count: number): Promise<CellEnd> {
  const listener = (m: FromChild) => {
    if (m.kind === 'stream' && m.index === index) pushStream(cell, m.name, m.text);
    else if (m.kind === 'stream') pushStream(cell, m.name, m.text); // late output of an earlier cell's timers shows where it appeared
    else if (m.kind === 'display') {
      if (m.update && m.displayId !== undefined) {
        for (const out of displays.get(m.displayId) ?? []) out.data = m.bundle;
        return;
      }
      const out: DisplayDataOutput = { output_type: 'display_data', data: m.bundle, metadata: {} };
      cell.outputs.push(out);
      if (m.displayId !== undefined) displays.set(m.displayId, [...(displays.get(m.displayId) ?? []), out]);
    }
  };
  channel.listeners.add(listener);
  try {
    channel.send({ kind: 'cell', index, code: joinSource(cell.source) });
    const end = await channel.waitFor((m) => m.kind === 'done' && m.index === index, timeoutMs);
    if (end.kind === 'timeout') return { kind: 'timeout' };
    if (end.kind === 'exit') return end;
    const done = end.message as Extract<FromChild, { kind: 'done' }>;
    const { outcome } = done;
    if (outcome.status === 'ok' && outcome.result) {
      cell.outputs.push({ output_type: 'execute_result', execution_count: count, data: outcome.result, metadata: {} });
    } else if (outcome.status === 'error' && outcome.error) {
      cell.outputs.push({ output_type: 'error', ename: outcome.error.ename, evalue: outcome.error.evalue, traceback: outcome.error.traceback });
    }
    return { kind: 'done', message: done };
  } finally {
    channel.listeners.delete(listener);
  }
}

/** Appends stream text, merging with the previous output when it is the same stream (as front ends do). */
function pushStream(cell: CodeCell, name: 'stdout' | 'stderr', text: string): void {
  const last = cell.outputs[cell.outputs.length - 1];
  if (last && last.output_type === 'stream' && last.name === name) last.text = joinSource(last.text) + text;
  else cell.outputs.push({ output_type: 'stream', name, text });
}

/** A notebook written for another language (its kernelspec or language_info says so) is refused before anything runs. */
function checkLanguage(nb: Notebook, path: string): void {
  const meta = nb.metadata as { kernelspec?: { language?: unknown }; language_info?: { name?: unknown } };
  const language = meta.kernelspec?.language ?? meta.language_info?.name;
  if (typeof language === 'string' && !/^(typescript|javascript|ts|js)$/i.test(language)) {
    throw msg.badNotebook(path, `is written for ${language}; sagitta runs TypeScript notebooks (metadata.kernelspec.language "typescript")`);
  }
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

function firstLine(text: string): string {
  const line = text.split('\n')[0];
  return line.length > 160 ? `${line.slice(0, 157)}…` : line;
}

function exitText(code: number | null, signal: NodeJS.Signals | null): string {
  return signal ? `signal ${signal}` : `exit code ${code}`;
}

function formatLimit(ms: number): string {
  return ms % 1000 === 0 ? `${ms / 1000} s` : `${ms} ms`;
}

function tail(text: string): string {
  const t = text.trim().split('\n').slice(-1)[0];
  return t ? `: ${t.slice(0, 200)}` : '';
}

type Waited =
  | { kind: 'message'; message: FromChild }
  | { kind: 'timeout' }
  | { kind: 'exit'; code: number | null; signal: NodeJS.Signals | null };

/** The IPC link to the child: message listeners, a wait with timeout, exit tracking, clean close. */
class ChildChannel {
  readonly listeners = new Set<(m: FromChild) => void>();
  /** Output the child wrote outside a cell's capture (e.g. a crash message). */
  stray = '';
  private exited: { code: number | null; signal: NodeJS.Signals | null } | undefined;
  private readonly exitWaiters = new Set<() => void>();

  constructor(private readonly child: ChildProcess) {
    child.on('message', (m) => {
      for (const l of [...this.listeners]) l(m as FromChild);
    });
    child.stdout?.setEncoding('utf8').on('data', (s: string) => { this.stray += s; });
    child.stderr?.setEncoding('utf8').on('data', (s: string) => { this.stray += s; });
    child.on('exit', (code, signal) => {
      this.exited = { code, signal };
      for (const w of [...this.exitWaiters]) w();
    });
    child.on('error', () => { /* reported through 'exit' */ });
  }

  send(m: ToChild): void {
    if (this.exited === undefined && this.child.connected) this.child.send(m);
  }

  waitFor(match: (m: FromChild) => boolean, timeoutMs: number): Promise<Waited> {
    if (this.exited) return Promise.resolve({ kind: 'exit', ...this.exited });
    return new Promise((resolveWait) => {
      let timer: NodeJS.Timeout | undefined;
      const finish = (w: Waited) => {
        if (timer) clearTimeout(timer);
        this.listeners.delete(onMessage);
        this.exitWaiters.delete(onExit);
        resolveWait(w);
      };
      const onMessage = (m: FromChild) => { if (match(m)) finish({ kind: 'message', message: m }); };
      const onExit = () => {
        // Let stdout/stderr already in flight arrive before reporting the exit.
        setTimeout(() => finish({ kind: 'exit', ...this.exited! }), 20);
      };
      this.listeners.add(onMessage);
      this.exitWaiters.add(onExit);
      if (Number.isFinite(timeoutMs)) {
        timer = setTimeout(() => {
          this.child.kill('SIGKILL');
          finish({ kind: 'timeout' });
        }, timeoutMs);
      }
    });
  }

  /** Asks the child to close its session and exit; kills it if it has not within 3 s. */
  async close(): Promise<void> {
    if (this.exited) return;
    const gone = new Promise<void>((r) => this.exitWaiters.add(r));
    this.send({ kind: 'close' });
    const timer = setTimeout(() => this.child.kill('SIGKILL'), 3000);
    await gone;
    clearTimeout(timer);
  }
}

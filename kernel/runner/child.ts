/**
 * The runner's child process: one notebook session, fed one cell at a time over IPC. Living in
 * its own process is what lets the runner stop a cell that never ends (SIGKILL) or survive a cell
 * that ends the process, without losing what earlier cells produced.
 */
import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { knobSnapshot, msg, provenanceSnapshot, supplyKnobs } from '../../lib/internal.js';
import { tslabTs } from '../session/compilerShim.js';
import { createSession } from '../session/index.js';
import type { Session } from '../session/types.js';
import { checkSuppliedKnobs, findKnobs } from './findKnobs.js';
import type { FromChild, ToChild } from './messages.js';
import type { ModuleRecord } from './runRecord.js';

const t0 = performance.now();

let session: Session | undefined;
let workDir = process.cwd();
let current = -1;

function send(m: FromChild): void {
  process.send?.(m);
}

// Errors thrown later by a cell's timers or promises must not end the run: they are shown as
// stderr of the cell that is running (or ran last), as a console would show them.
const late = (label: string) => (err: unknown) => {
  const text = err instanceof Error ? (err.stack ?? `${err.name}: ${err.message}`) : String(err);
  send({ kind: 'stream', index: current, name: 'stderr', text: `${label}: ${text}\n` });
};
process.on('uncaughtException', late('uncaught exception'));
process.on('unhandledRejection', late('unhandled promise rejection'));

process.on('message', (raw) => {
  const m = raw as ToChild;
  void handle(m).catch((err: unknown) => send({ kind: 'fault', message: err instanceof Error ? err.message : String(err) }));
});

// Without this, an idle child whose parent died would wait forever.
process.on('disconnect', () => process.exit(0));

const noInput = () => Promise.reject(msg.inputUnavailable('a headless run (sagitta run) has no one to answer', 'declare a knob and give the value with --set'));

async function handle(m: ToChild): Promise<void> {
  if (m.kind === 'start') {
    workDir = m.workDir;
    // Knob values are checked against the notebook's knob(…) calls before anything runs.
    const problems = checkSuppliedKnobs(findKnobs(m.cells), new Map(m.knobs));
    if (problems.length > 0) {
      send({ kind: 'refused', problems });
      return;
    }
    supplyKnobs(new Map(m.knobs));
    // All cells are known: a second thread type-checks and compiles them ahead while earlier cells
    // run (kernel/session/compileAhead.ts). Ready once the library is loaded and that thread's
    // compiler is built, so a cell's time still holds its own compile, as when compiled here.
    if (m.compileAhead) {
      session = createSession({ workDir, cellsAhead: m.cells.map((c) => c.code) });
      await session.warmUp?.();
    } else {
      session = createSession({ workDir });
      // Compile and run an empty cell so the compiler is built before the first timed cell. (The
      // session's warmUp() is not called here: it builds completion lists for the whole library.)
      await session.execute('', { stream() {}, display() {}, clear() {}, ask: noInput });
    }
    send({ kind: 'ready', typescript: tslabTs.version, startMs: performance.now() - t0 });
  } else if (m.kind === 'cell') {
    if (!session) throw msg.kernelState('run a cell', 'the notebook process has not started');
    current = m.index;
    const index = m.index;
    const c0 = performance.now();
    const outcome = await session.execute(m.code, {
      stream: (name, text) => send({ kind: 'stream', index, name, text }),
      display: (bundle, options) => send({ kind: 'display', index, bundle, displayId: options.displayId, update: options.update }),
      clear: (wait) => send({ kind: 'clear', index, wait }),
      ask: noInput,
    }, { label: `step ${m.step}` });
    const execMs = performance.now() - c0;
    send({ kind: 'done', index, outcome, provenance: provenanceSnapshot(), knobs: knobSnapshot(), modules: localModules(session), execMs });
  } else {
    session?.close();
    process.disconnect?.();
  }
}

/** The local .ts modules the cells imported so far, hashed, by path relative to the notebook's folder. */
function localModules(s: Session): ModuleRecord[] {
  return (s.localModules?.() ?? []).flatMap((compiled) => {
    const source = ['.ts', '.tsx', '.mts', '.js'].map((ext) => compiled.replace(/\.js$/, ext)).find((f) => existsSync(f));
    if (!source) return [];
    const bytes = readFileSync(source);
    return [{ path: path.relative(workDir, source).replace(/\\/g, '/'), sha256: createHash('sha256').update(bytes).digest('hex'), sizeBytes: bytes.length }];
  });
}

/**
 * The runner's child process: one notebook session, fed one cell at a time over IPC. Living in
 * its own process is what lets the runner stop a cell that never ends (SIGKILL) or survive a cell
 * that ends the process, without losing what earlier cells produced.
 *
 * With the ahead check (COMPILE_AHEAD_FLAG in its arguments) its thread is started first, before
 * this process loads the library and the compiler, so that it builds its compiler meanwhile; the
 * rest is loaded with dynamic imports for that reason.
 */
import { startCompileAhead, type CompileAhead } from '../session/compileAhead.js';
import type { Session } from '../session/types.js';
import { COMPILE_AHEAD_FLAG, type FromChild, type ToChild } from './messages.js';
import type { ModuleRecord } from './runRecord.js';

const t0 = performance.now();
// The runner starts this process in the notebook's folder.
let ahead: CompileAhead | undefined = process.argv.includes(COMPILE_AHEAD_FLAG) ? startCompileAhead(process.cwd()) : undefined;
const [{ createHash }, { existsSync, readFileSync }, { default: path }, { knobSnapshot, msg, provenanceSnapshot, supplyKnobs }, { tslabTs }, { createSession }, { checkSuppliedKnobs, findKnobs }] = await Promise.all([
  import('node:crypto'),
  import('node:fs'),
  import('node:path'),
  import('../../lib/internal.js'),
  import('../session/compilerShim.js'),
  import('../session/index.js'),
  import('./findKnobs.js'),
]);

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
      ahead?.close();
      send({ kind: 'refused', problems });
      return;
    }
    supplyKnobs(new Map(m.knobs));
    // All cells are known: a second thread type-checks and compiles them ahead while earlier cells
    // run (kernel/session/compileAhead.ts). Ready once the library is loaded and that thread's
    // compiler is built, so a cell's time still holds its own compile, as when compiled here.
    if (ahead) {
      if (ahead.workDir !== workDir) {
        ahead.close();
        ahead = startCompileAhead(workDir);
      }
      ahead.plan(m.cells.map((c) => c.code));
      session = createSession({ workDir, ahead });
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
    if (session) session.close();
    else ahead?.close();
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

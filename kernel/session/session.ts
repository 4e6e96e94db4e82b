/**
 * In-process execution of TypeScript cells on tslab's converter (type check + compile) and
 * executor (run in this realm, variables kept between cells). We use only those two parts of
 * tslab; the messaging layer is ours (kernel/protocol).
 *
 * What a session adds around the executor:
 * - output capture: from the first cell until `close()`, process.stdout/stderr writes and the
 *   global console go to the running cell's hooks as `stream` output, and the display channel
 *   (lib/plot/display.ts) to `hooks.display`; output a cell's timers or promises produce after
 *   it ended goes to the hooks of the cell that ran last, as a notebook shows it under that cell;
 * - the value of the last expression comes back as a MIME bundle (`mimeBundleOf`), not printed;
 * - errors come back as { ename, evalue, traceback }, type errors as `CompileError`;
 * - "sagitta" is importable from a notebook in any folder (see moduleRoot.ts);
 * - cursor positions are Unicode code points, as the messaging protocol counts them.
 *
 * Interrupts: `interrupt()` stops a cell that is waiting (an `await`); a cell that blocks the
 * event loop with synchronous code is stopped only by a SIGINT to the process (the cell runs with
 * `breakOnSigint`) — sent by the front end in signal mode, or raised by the kernel's control
 * thread for an interrupt_request (kernel/protocol/controlThread.ts).
 *
 * A session changes the process's working directory to `workDir` (so data files next to the
 * notebook open by relative path); there should be one live session per process.
 */
import { Console } from 'node:console';
import { Writable } from 'node:stream';
import { createRequire } from 'node:module';
import path from 'node:path';
import { format } from 'node:util';
import { mimeBundleOf, setDisplaySink } from '../../lib/display.js';
import { consumeWarnings, formatWarning } from '../../lib/warnings.js';
import { errorFromDiagnostics, errorFromThrown, interruptedError } from './cellError.js';
import { addCompilerRoot, holdRequireHook, loadLibrary, packageRoot, releaseRequireHook, tslabTs } from './moduleRoot.js';
import { codePointToUtf16, utf16ToCodePoint } from './positions.js';
import { expandShorthandProperties } from './expandShorthand.js';
import { jsonSafeBundle } from './jsonSafeBundle.js';
import type { MimeBundle } from '../../lib/display.js';
import type { CellHooks, CellOutcome, Completeness, CompletionReply, Session, SessionOptions } from './types.js';

type ConverterModule = typeof import('tslab/dist/converter.js');
type ExecutorModule = typeof import('tslab/dist/executor.js');

const requireHere = createRequire(path.join(packageRoot, 'package.json'));
const { createConverter, isCompleteCode } = requireHere('tslab/dist/converter.js') as ConverterModule;
const { createExecutor } = requireHere('tslab/dist/executor.js') as ExecutorModule;

/** What the executor reports through its console while running one cell. */
interface Capture {
  value?: { present: true; value: unknown };
  thrown?: { value: unknown };
  diagnostics: string[];
}

/** tslab prints compile diagnostics with exactly this format string. */
const DIAGNOSTIC_FORMAT = '%s%d:%d - %s';

/** Message of the error vm throws when SIGINT breaks a synchronous script. */
const SIGINT_BREAK = /Script execution was interrupted by `SIGINT`/;

export function createSession(options: SessionOptions): Session {
  const workDir = path.resolve(options.workDir);
  process.chdir(workDir);
  addCompilerRoot(workDir);
  holdRequireHook();
  const libraryReady = loadLibrary();

  let capture: Capture = { diagnostics: [] };
  const executorConsole = {
    log(value?: unknown): void {
      capture.value = { present: true, value };
    },
    error(first?: unknown, ...rest: unknown[]): void {
      if (first === DIAGNOSTIC_FORMAT) capture.diagnostics.push(format(first, ...rest));
      else capture.thrown = { value: first };
    },
  };

  // No file or folder watchers for tslab's compiler. A watcher that fires between two cells (any
  // process touching a watched file: an edited module next to the notebook, a library file) leaves
  // the converter with a pending rebuild that it then refuses for every later cell ("Unexpected
  // pending rebuildTimer") — a kernel that no cell can run in any more. Without watchers a cell is
  // compiled against the sources as first read, as imported modules stay loaded until a restart.
  const noWatcher = () => ({ close() {} });
  tslabTs.sys.watchFile = noWatcher;
  tslabTs.sys.watchDirectory = noWatcher;
  // The compiler reads the working directory when it is created; it was just set to workDir.
  const converter = createConverter();
  const executor = createExecutor(workDir, { node: converter, browser: converter, close: () => converter.close() }, executorConsole);

  let running = false;
  let currentHooks: CellHooks | undefined;
  let restoreOutput: (() => void) | undefined;
  let interruptRequested = false;
  let closed = false;

  async function execute(code: string, hooks: CellHooks): Promise<CellOutcome> {
    if (closed) throw new Error('execute() on a closed session');
    await libraryReady;
    capture = { diagnostics: [] };
    interruptRequested = false;
    currentHooks = hooks;
    restoreOutput ??= redirectOutput(() => currentHooks);
    running = true;
    let ok: boolean;
    try {
      ok = await executor.execute(expandShorthandProperties(code));
    } catch (err) {
      capture.thrown = { value: err };
      ok = false;
    } finally {
      running = false;
    }
    // Warnings belong to the cell that raised them: drained and shown under it, never carried on.
    const warnings = consumeWarnings();
    if (warnings.length > 0) hooks.stream('stderr', warnings.map((w) => formatWarning(w) + '\n').join(''));
    if (ok) {
      if (capture.value === undefined) return { status: 'ok' };
      try {
        return { status: 'ok', result: jsonSafeBundle(mimeBundleOf(capture.value.value)) };
      } catch (err) {
        return { status: 'error', error: errorFromThrown(err) };
      }
    }
    if (capture.diagnostics.length > 0) return { status: 'error', error: errorFromDiagnostics(capture.diagnostics) };
    const thrown = capture.thrown?.value;
    const wasInterrupt =
      thrown instanceof Error && (SIGINT_BREAK.test(thrown.message) || (interruptRequested && thrown.message === 'Interrupted asynchronously'));
    if (wasInterrupt) return { status: 'error', error: interruptedError() };
    return { status: 'error', error: errorFromThrown(capture.thrown ? thrown : new Error('the cell failed without saying why')) };
  }

  async function complete(code: string, cursorPos: number): Promise<CompletionReply> {
    await libraryReady;
    const at = codePointToUtf16(code, cursorPos);
    const info = executor.complete(code, at);
    return {
      matches: info.candidates,
      cursorStart: utf16ToCodePoint(code, info.start),
      cursorEnd: utf16ToCodePoint(code, info.end),
    };
  }

  async function inspect(code: string, cursorPos: number, detailLevel: number): Promise<MimeBundle | undefined> {
    await libraryReady;
    let at = codePointToUtf16(code, cursorPos);
    // A cursor just after a name (the usual place when asking for help) inspects that name.
    if (at > 0 && !/[\w$]/.test(code[at] ?? '') && /[\w$]/.test(code[at - 1])) at -= 1;
    const info = executor.inspect(code, at);
    if (!info) return undefined;
    const signature = tslabTs.displayPartsToString(info.displayParts);
    const docs = tslabTs.displayPartsToString(info.documentation);
    const tags = (info.tags ?? [])
      .filter((t) => detailLevel > 0 || t.name === 'example' || t.name === 'deprecated')
      .map((t) => `@${t.name} ${tslabTs.displayPartsToString(t.text)}`.trimEnd());
    const plain = [signature.trim(), docs, ...tags].filter((s) => s.length > 0).join('\n\n');
    if (plain.length === 0) return undefined;
    const markdown = ['```typescript\n' + signature.trim() + '\n```', docs, ...tags].filter((s) => s.length > 0).join('\n\n');
    return { 'text/plain': plain, 'text/markdown': markdown };
  }

  async function isComplete(code: string): Promise<Completeness> {
    if (code.trim() === '') return 'complete';
    try {
      return isCompleteCode(code).completed ? completeOrInvalid(code) : 'incomplete';
    } catch {
      return 'unknown';
    }
  }

  function interrupt(): void {
    interruptRequested = true;
    if (running) executor.interrupt();
  }

  async function warmUp(): Promise<void> {
    await libraryReady;
    if (closed || running) return;
    const probe = 'import * as sagitta from "sagitta";\nsagitta.';
    executor.complete(probe, probe.length);
  }

  function close(): void {
    if (closed) return;
    closed = true;
    restoreOutput?.();
    restoreOutput = undefined;
    executor.close();
    releaseRequireHook();
  }

  return { execute, complete, inspect, isComplete, interrupt, close, warmUp };
}

/** A finished cell with syntax errors (not merely unfinished) is 'invalid'. */
function completeOrInvalid(code: string): Completeness {
  const file = tslabTs.createSourceFile('cell.ts', code, tslabTs.ScriptTarget.Latest, false, tslabTs.ScriptKind.TS);
  const parseErrors = (file as unknown as { parseDiagnostics?: unknown[] }).parseDiagnostics ?? [];
  return parseErrors.length > 0 ? 'invalid' : 'complete';
}

/**
 * Sends stdout/stderr writes, console output and displays to the hooks `current()` returns
 * until the returned function is called.
 */
function redirectOutput(current: () => CellHooks | undefined): () => void {
  const out = process.stdout as unknown as { write: unknown };
  const err = process.stderr as unknown as { write: unknown };
  const savedOut = out.write;
  const savedErr = err.write;
  const savedConsole = globalThis.console;
  const writer = (name: 'stdout' | 'stderr') =>
    function write(chunk: unknown, encoding?: unknown, callback?: unknown): boolean {
      const text = typeof chunk === 'string' ? chunk : Buffer.from(chunk as Uint8Array).toString(typeof encoding === 'string' ? (encoding as BufferEncoding) : 'utf8');
      if (text.length > 0) current()?.stream(name, text);
      const done = typeof encoding === 'function' ? encoding : callback;
      if (typeof done === 'function') queueMicrotask(() => (done as () => void)());
      return true;
    };
  out.write = writer('stdout');
  err.write = writer('stderr');
  const sink = (name: 'stdout' | 'stderr') =>
    new Writable({
      decodeStrings: false,
      write(chunk: unknown, _encoding, done) {
        const text = typeof chunk === 'string' ? chunk : Buffer.from(chunk as Uint8Array).toString('utf8');
        if (text.length > 0) current()?.stream(name, text);
        done();
      },
    });
  globalThis.console = new Console({ stdout: sink('stdout'), stderr: sink('stderr'), colorMode: false });
  const savedSink = setDisplaySink((bundle, options) => current()?.display(jsonSafeBundle(bundle), options));
  return () => {
    out.write = savedOut;
    err.write = savedErr;
    globalThis.console = savedConsole;
    setDisplaySink(savedSink);
  };
}

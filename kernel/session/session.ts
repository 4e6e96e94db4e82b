/**
 * In-process execution of TypeScript cells: tslab's converter type-checks and compiles each cell
 * against the declarations of the cells before it, and our executor (cellExecutor.ts) runs it in
 * this realm, variables kept between cells. The messaging layer is ours too (kernel/protocol).
 * Given the ahead check of a headless run (`ahead`), cells are compiled on its thread while earlier
 * cells run (compileAhead.ts); otherwise each cell is compiled here as it comes.
 *
 * What a session adds around the executor:
 * - output capture: from the first cell until `close()`, process.stdout/stderr writes, the global
 *   console, the display channel (lib/display.ts: present, refresh, clearOutput, ask) go to the
 *   running cell's hooks; output a cell's timers or promises produce after it ended goes to the
 *   hooks of the cell that ran last, as a notebook shows it under that cell;
 * - the value of the last expression comes back as a MIME bundle (`mimeBundleOf`), not printed;
 * - errors come back as { ename, evalue, traceback } with stack frames at the cell's line and
 *   column, type errors as `CompileError`; a cell's warnings are drained and shown under it;
 * - "sagitta-tracks" is importable from a notebook in any folder (see moduleRoot.ts);
 * - cursor positions are Unicode code points, as the messaging protocol counts them.
 *
 * Interrupts: `interrupt()` stops a cell that is waiting (an `await`); a cell that blocks the
 * event loop with synchronous code is stopped only by a SIGINT to the process (the cell runs with
 * `breakOnSigint`), or — busy after an await — by the kernel's control thread (controlThread.ts).
 *
 * A session changes the process's working directory to `workDir` (so data files next to the
 * notebook open by relative path); there should be one live session per process.
 */
import path from 'node:path';
import type { Converter } from 'tslab/dist/converter.js';
import { consumeWarnings, formatWarning, type MimeBundle } from '../../lib/index.js';
import { mimeBundleOf, msg } from '../../lib/internal.js';
import { converterCompiler, createCellConverter } from './cellConverter.js';
import { createCellExecutor } from './cellExecutor.js';
import type { CellCompiler } from './compiledCell.js';
import { errorFromDiagnostics, errorFromThrown, interruptedError } from './cellError.js';
import { requireFromPackage } from '../packageMode.js';
import { addCompilerRoot, holdRequireHook, loadLibrary, releaseRequireHook, tslabTs } from './moduleRoot.js';
import { codePointToUtf16, utf16ToCodePoint } from './positions.js';
import { jsonSafeBundle } from './jsonSafeBundle.js';
import { redirectOutput } from './redirectOutput.js';
import type { CellHooks, CellOutcome, Completeness, CompletionReply, ExecuteOptions, Session, SessionOptions } from './types.js';

type ConverterModule = typeof import('tslab/dist/converter.js');

const { isCompleteCode } = requireFromPackage('tslab/dist/converter.js') as ConverterModule;

export function createSession(options: SessionOptions): Session {
  const workDir = path.resolve(options.workDir);
  process.chdir(workDir);
  addCompilerRoot(workDir);
  holdRequireHook();
  const libraryReady = loadLibrary();

  // The compiler reads the working directory when it is created; it was just set to workDir. With
  // the cells ahead, this thread builds one only for completion and inspection, or if the ahead
  // check's thread fails.
  const { ahead } = options;
  let converter: Converter | undefined = ahead ? undefined : createCellConverter(workDir);
  const converterHere = () => (converter ??= createCellConverter(workDir));
  const compiler: CellCompiler = ahead
    ? { compile: async (prevDecl, code) => (await ahead.compile(prevDecl, code)) ?? converterCompiler(converterHere()).compile(prevDecl, code), close: () => ahead.close() }
    : converterCompiler(converterHere());
  const executor = createCellExecutor({ workDir, compiler, phase: options.phase });

  let running = false;
  let currentHooks: CellHooks | undefined;
  let restoreOutput: (() => void) | undefined;
  let closed = false;
  let runs = 0;

  async function execute(code: string, hooks: CellHooks, execOptions: ExecuteOptions = {}): Promise<CellOutcome> {
    if (closed) throw msg.kernelState('execute', 'the session is closed; restart the kernel');
    await libraryReady;
    currentHooks = hooks;
    restoreOutput ??= redirectOutput(() => currentHooks);
    running = true;
    const label = execOptions.label ?? `cell run ${++runs}`;
    let result;
    try {
      result = await executor.run(code, label);
    } finally {
      running = false;
    }
    // Warnings belong to the cell that raised them: drained and shown under it, never carried on.
    const warnings = consumeWarnings();
    if (warnings.length > 0) hooks.stream('stderr', warnings.map((w) => formatWarning(w) + '\n').join(''));
    if (result.kind === 'ok') {
      if (result.value === undefined) return { status: 'ok' };
      try {
        return { status: 'ok', result: jsonSafeBundle(mimeBundleOf(result.value.value)) };
      } catch (err) {
        return { status: 'error', error: errorFromThrown(err, executor.sourceMap) };
      }
    }
    if (result.kind === 'compile-error') return { status: 'error', error: errorFromDiagnostics(result.diagnostics) };
    if (result.interrupted) return { status: 'error', error: interruptedError() };
    return { status: 'error', error: errorFromThrown(result.thrown, executor.sourceMap) };
  }

  async function complete(code: string, cursorPos: number): Promise<CompletionReply> {
    await libraryReady;
    const at = codePointToUtf16(code, cursorPos);
    const info = converterHere().complete(executor.declarations, code, at);
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
    const info = converterHere().inspect(executor.declarations, code, at);
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
    if (running) executor.interrupt();
  }

  async function warmUp(): Promise<void> {
    await libraryReady;
    if (ahead) return ahead.ready;
    if (closed || running) return;
    const probe = 'import * as sagitta from "sagitta-tracks";\nsagitta.';
    converterHere().complete(executor.declarations, probe, probe.length);
  }

  function close(): void {
    if (closed) return;
    closed = true;
    restoreOutput?.();
    restoreOutput = undefined;
    executor.close();
    if (ahead) converter?.close();
    releaseRequireHook();
  }

  return { execute, complete, inspect, isComplete, interrupt, close, warmUp, localModules: () => executor.localModules() };
}

/** A finished cell with syntax errors (not merely unfinished) is 'invalid'. */
function completeOrInvalid(code: string): Completeness {
  const file = tslabTs.createSourceFile('cell.ts', code, tslabTs.ScriptTarget.Latest, false, tslabTs.ScriptKind.TS);
  const parseErrors = (file as unknown as { parseDiagnostics?: unknown[] }).parseDiagnostics ?? [];
  return parseErrors.length > 0 ? 'invalid' : 'complete';
}

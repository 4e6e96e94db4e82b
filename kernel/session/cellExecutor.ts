/**
 * Runs compiled cells in this realm, keeping variables between cells — our replacement for
 * tslab's executor (we keep tslab's converter, which type-checks and compiles a cell against the
 * declarations of the cells before it, here or ahead on a second thread: compiledCell.ts). Ours
 * differs where tslab's fell short:
 * - a cell that throws (or is interrupted) part-way keeps what it declared before that point —
 *   imports, constants, functions — for later cells, in the type checker and at run time; names it
 *   never reached are dropped, and an earlier cell's value of the same name comes back;
 * - each cell runs under a file name of its own with its source maps kept, so a run-time error
 *   can be shown at the cell's line and column (cellError.ts);
 * - it says where it is (compiling, running, waiting on an await) through an optional shared
 *   flag, which the kernel's control thread reads to decide how to stop a cell (see phase.ts).
 * It is small enough (and specific enough) that owning it is simpler than patching tslab's.
 */
import Module from 'node:module';
import path from 'node:path';
import vm from 'node:vm';
import type { SideOutput } from 'tslab/dist/converter.js';
import { cellSourceMap, type CellSourceMap } from './cellSourceMap.js';
import type { CellCompiler } from './compiledCell.js';
import { keepDeclarations } from './keepDeclarations.js';
import { CellPhase, setPhase } from './phase.js';

/** How one cell ended. `value` is the last expression's value when the cell ends in one. */
export type CellRunResult =
  | { readonly kind: 'ok'; readonly value?: { readonly value: unknown } }
  | { readonly kind: 'compile-error'; readonly diagnostics: readonly string[] }
  | { readonly kind: 'thrown'; readonly thrown: unknown; readonly interrupted: boolean };

export interface CellExecutor {
  /** Compiles and runs one cell (its source as written); `label` names it in stack traces ("cell 3"). */
  run(code: string, label: string): Promise<CellRunResult>;
  /** The source map of the cell compiled under `label`, for mapping stack frames. */
  sourceMap(label: string): CellSourceMap | undefined;
  /** Compiled files of the local modules loaded so far. */
  localModules(): string[];
  /** Makes a cell waiting on an await stop with an "interrupted" error. */
  interrupt(): void;
  /** The declarations carried into the next cell (for completion and inspection). */
  readonly declarations: string;
  close(): void;
}

export interface CellExecutorOptions {
  readonly workDir: string;
  readonly compiler: CellCompiler;
  /** Shared flag the executor keeps up to date (phase.ts); optional. */
  readonly phase?: Int32Array;
}

const GLOBAL_KEY = Symbol.for('sagitta.cellScope');
/** The error an interrupted await rejects with. */
export const INTERRUPTED = new Error('the cell was interrupted while it waited');

export function createCellExecutor(options: CellExecutorOptions): CellExecutor {
  const { compiler, phase } = options;
  const values: Record<string, unknown> = Object.create(null) as Record<string, unknown>;
  /** Assignments per exported name during the running cell: 1 is only the compiler's `= void 0`. */
  let assigned = new Map<string, number>();
  const count = (name: string, n: number) => assigned.set(name, (assigned.get(name) ?? 0) + n);
  const exportsProxy = new Proxy(values, {
    // The compiler writes imports as defineProperty with a getter; take the value at once, so
    // imported names can be reassigned like any other cell variable.
    defineProperty(_t, prop, attrs) {
      if (prop === '__esModule' || typeof prop !== 'string') return true;
      values[prop] = attrs.get ? (attrs.get as () => unknown)() : attrs.value;
      count(prop, 2);
      return true;
    },
    set(_t, prop, value) {
      if (typeof prop !== 'string') return true;
      values[prop] = value;
      count(prop, 1);
      return true;
    },
  });
  const sideOutputs = new Map<string, string>();
  const sideModules = new Map<string, Module>();
  const require = scopedRequire(Module.createRequire(path.join(options.workDir, 'cell.js')), options.workDir, sideOutputs, sideModules);
  (globalThis as Record<symbol, unknown>)[GLOBAL_KEY] = { exports: exportsProxy, require };
  const maps = new Map<string, CellSourceMap | undefined>();
  let prevDecl = '';
  let rejectWait: ((err: Error) => void) | undefined;

  async function run(code: string, label: string): Promise<CellRunResult> {
    setPhase(phase, CellPhase.Compiling);
    try {
      const converted = await compiler.compile(prevDecl, code);
      for (const out of converted.sideOutputs ?? []) updateSide(out);
      if (converted.diagnostics.length > 0) return { kind: 'compile-error', diagnostics: converted.diagnostics };
      if (!converted.output) {
        prevDecl = converted.declOutput ?? '';
        return { kind: 'ok' };
      }
      maps.set(label, cellSourceMap(converted.output));
      const before = new Map(Object.entries(values));
      assigned = new Map();
      const head = converted.hasToplevelAwait ? '(async function (exports, require) {' : '(function (exports, require) {';
      const script = `${head}\n${converted.output}\n})(globalThis[Symbol.for('sagitta.cellScope')].exports, globalThis[Symbol.for('sagitta.cellScope')].require)`;
      let thrown: { value: unknown } | undefined;
      let interrupted = false;
      try {
        setPhase(phase, CellPhase.Running);
        const returned: unknown = vm.runInThisContext(script, { filename: label, breakOnSigint: true });
        if (converted.hasToplevelAwait) {
          setPhase(phase, CellPhase.Waiting);
          await new Promise<void>((resolve, reject) => {
            rejectWait = reject;
            (returned as Promise<unknown>).then(() => resolve(), reject);
          });
        }
      } catch (err) {
        thrown = { value: err };
        interrupted = err === INTERRUPTED || (err instanceof Error && /Script execution was interrupted by `SIGINT`/.test(err.message));
      } finally {
        rejectWait = undefined;
      }
      const last = converted.lastExpressionVar;
      const value = last !== undefined && values[last] !== undefined && values[last] !== null ? { value: values[last] } : undefined;
      if (last !== undefined) delete values[last];
      if (thrown === undefined) {
        prevDecl = converted.declOutput ?? '';
        return value ? { kind: 'ok', value } : { kind: 'ok' };
      }
      prevDecl = declarationsAfterThrow(converted.declOutput ?? '', before);
      return { kind: 'thrown', thrown: thrown.value, interrupted };
    } finally {
      setPhase(phase, CellPhase.Idle);
    }
  }

  /** Names the cell never reached keep their earlier value and declaration, or go. */
  function declarationsAfterThrow(declOutput: string, before: Map<string, unknown>): string {
    const unreached = new Set([...assigned].filter(([name, n]) => n === 1 && values[name] === undefined).map(([name]) => name));
    const restored = new Set<string>();
    for (const name of unreached) {
      if (before.has(name)) {
        values[name] = before.get(name);
        restored.add(name);
      } else {
        delete values[name];
      }
    }
    return keepDeclarations(declOutput, { keep: (name) => !unreached.has(name), types: true }) + keepDeclarations(prevDecl, { keep: (name) => restored.has(name), types: false });
  }

  function updateSide(out: SideOutput): void {
    sideModules.delete(out.path);
    sideOutputs.set(out.path, out.data);
  }

  return {
    run,
    sourceMap: (label) => maps.get(label),
    localModules: () => [...sideModules.keys()],
    interrupt: () => rejectWait?.(INTERRUPTED),
    get declarations() {
      return prevDecl;
    },
    close() {
      delete (globalThis as Record<symbol, unknown>)[GLOBAL_KEY];
      compiler.close();
    },
  };
}

/**
 * `require` for cells: local .ts modules the converter compiled ("side outputs") load from their
 * compiled text, everything else resolves from the notebook's folder.
 */
function scopedRequire(base: NodeJS.Require, dir: string, sideOutputs: Map<string, string>, sideModules: Map<string, Module>): NodeJS.Require {
  const fromSide = (id: string): unknown => {
    let file = path.resolve(dir, id).replace(/\\/g, '/');
    if (path.extname(file) === '') file += '.js';
    const cached = sideModules.get(file);
    if (cached) return cached.exports;
    const text = sideOutputs.get(file);
    if (text === undefined) return undefined;
    const mod = new Module(file) as Module & { _compile(code: string, file: string): void };
    mod.filename = file;
    mod.paths = (Module as unknown as { _nodeModulePaths(d: string): string[] })._nodeModulePaths(path.dirname(file));
    mod.require = scopedRequire(mod.require.bind(mod) as NodeJS.Require, path.dirname(file), sideOutputs, sideModules);
    sideModules.set(file, mod);
    mod._compile(text, file);
    return mod.exports;
  };
  return new Proxy(base, {
    apply(_target, thisArg, args: unknown[]) {
      if (args.length === 1 && typeof args[0] === 'string' && args[0].startsWith('.')) {
        const side = fromSide(args[0]);
        if (side !== undefined) return side;
      }
      return Reflect.apply(base, thisArg, args);
    },
  });
}

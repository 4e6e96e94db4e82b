import type { ConvertResult, Diagnostic, SideOutput } from 'tslab/dist/converter.js';

/**
 * One cell as the cell compiler (tslab's converter) left it: plain data, so it can come from the
 * converter in this thread or from the ahead check on a second thread (compileAhead.ts) alike.
 * When `diagnostics` is not empty the cell does not compile and only `sideOutputs` may be set.
 */
export interface CompiledCell {
  /** The cell as CommonJS, with its two source maps (cellSourceMap.ts). */
  readonly output?: string;
  /** The declarations carried into the next cell. */
  readonly declOutput?: string;
  /** Type and syntax errors, as the cell shows them: "2:7 - Type 'string' is not assignable …". */
  readonly diagnostics: readonly string[];
  readonly hasToplevelAwait?: boolean;
  /** The variable the compiled cell stores its last expression's value in. */
  readonly lastExpressionVar?: string;
  /** Compiled local .ts modules the cell imports (each emitted once per compiler). */
  readonly sideOutputs?: readonly SideOutput[];
  /**
   * True when a diagnostic may depend on files an earlier cell writes: a module that cannot be
   * found or lacks a name, or an error inside a local module.
   */
  readonly fromFiles?: boolean;
}

/** Compiles one cell against the declarations of the cells before it. */
export interface CellCompiler {
  compile(prevDecl: string, code: string): CompiledCell | Promise<CompiledCell>;
  close(): void;
}

/**
 * TypeScript's codes for "Cannot find module" (2307, 2792), "is not a module" (2306) and "has no
 * exported member" (2305, 2614, 2724): what a module written by an earlier cell would change.
 */
const FILE_CODES = new Set([2305, 2306, 2307, 2614, 2724, 2792]);

/** The converter's result as a `CompiledCell`. */
export function compiledCellOf(converted: ConvertResult): CompiledCell {
  const { output, declOutput, hasToplevelAwait, lastExpressionVar, sideOutputs } = converted;
  const diagnostics = converted.diagnostics.map(formatDiagnostic);
  if (diagnostics.length > 0) {
    const fromFiles = converted.diagnostics.some((d) => d.fileName !== undefined || FILE_CODES.has(d.code));
    return { diagnostics, sideOutputs, fromFiles };
  }
  return { output, declOutput, diagnostics, hasToplevelAwait, lastExpressionVar, sideOutputs };
}

/** "2:7 - Type 'string' is not assignable …", with the file for errors in a local module. */
function formatDiagnostic(d: Diagnostic): string {
  return `${d.fileName ? `${d.fileName} ` : ''}${d.start.line + 1}:${d.start.character + 1} - ${d.messageText}`;
}

import { originalPositionFor, TraceMap, type EncodedSourceMap } from '@jridgewell/trace-mapping';

/**
 * Where a position in a compiled cell came from. A cell is compiled in two steps (TypeScript →
 * ES module → CommonJS, see compilerShim.ts); the output carries both steps' source maps as
 * trailing comments, and a position is traced back through both. The compiler sees the cell
 * after a one-line prefix (`export {};`), which is taken off here, so lines and columns are the
 * cell's own, 1-based as editors count them.
 */

/** The comment that carries the first step's map (a name of our own; the second is the standard one). */
export const ESM_MAP_MARK = '//# sagitta-cell-esm-map=';
const ESM_MAP = /\/\/# sagitta-cell-esm-map=([A-Za-z0-9+/=]+)/;
const CJS_MAP = /\/\/# sourceMappingURL=data:application\/json;base64,([A-Za-z0-9+/=]+)/;

/** Lines the converter puts before the cell's source. */
const PREFIX_LINES = 1;

export interface CellPosition {
  /** 1-based line in the cell. */
  readonly line: number;
  /** 1-based column in the cell. */
  readonly column: number;
}

export interface CellSourceMap {
  /** The cell position of a 1-based line and column in the compiled code, if the maps know it. */
  original(line: number, column: number): CellPosition | undefined;
}

function decode(base64: string): TraceMap {
  return new TraceMap(JSON.parse(Buffer.from(base64, 'base64').toString('utf8')) as EncodedSourceMap);
}

/** The maps a compiled cell carries, or undefined when it has none. */
export function cellSourceMap(compiled: string): CellSourceMap | undefined {
  const esm = ESM_MAP.exec(compiled)?.[1];
  const cjs = CJS_MAP.exec(compiled)?.[1];
  if (esm === undefined || cjs === undefined) return undefined;
  const first = decode(esm);
  const second = decode(cjs);
  return {
    original(line, column) {
      const mid = originalPositionFor(second, { line, column: column - 1 });
      if (mid.line === null || mid.column === null) return undefined;
      const src = originalPositionFor(first, { line: mid.line, column: mid.column });
      if (src.line === null || src.column === null || src.line <= PREFIX_LINES) return undefined;
      return { line: src.line - PREFIX_LINES, column: src.column + 1 };
    },
  };
}

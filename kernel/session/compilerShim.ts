/**
 * tslab's bundled TypeScript — the compiler that checks and compiles cells — and the two changes
 * we make to the copy tslab's converter sees. tslab's converter reads the compiler through
 * `require`, so it gets the module object registered here, in which:
 *
 * 1. The library's own sources are not re-checked or "emitted": `getPreEmitDiagnosticsOfFiles` and
 *    the builder's `getAllDependencies` leave out files under node_modules. Cells are checked
 *    against the library's types, but the library was checked by the package's own type check
 *    (with a newer compiler and module resolution); an error found by the older one would block
 *    every cell, and emitting a package file type-checks it in full, for seconds.
 * 2. Cells carry source maps, so a run-time error points at the cell's line and column: the cell
 *    is emitted with an inline map (ESM), and the ESM → CommonJS step tslab runs after it
 *    (`transpileModule` on "custom.js") gets a map too. Both maps travel with the output as two
 *    trailing comments (see cellSourceMap.ts), so nothing is kept on the side.
 *
 * Must run before tslab/dist/converter is first loaded (moduleRoot.ts imports this module first).
 */
import { createRequire } from 'node:module';
import { requireFromPackage } from '../packageMode.js';
import { ESM_MAP_MARK } from './cellSourceMap.js';

/** tslab's bundled TypeScript. */
export type TslabTs = typeof import('@tslab/typescript-for-tslab');

const requireFromTslab = createRequire(requireFromPackage.resolve('tslab/package.json'));
export const tslabTs: TslabTs = requireFromTslab('@tslab/typescript-for-tslab') as TslabTs;

/** The file name tslab gives the ESM output it turns into CommonJS. */
const CONVERTED_NAME = 'custom.js';
const INLINE_MAP = /\n?\/\/# sourceMappingURL=data:application\/json;base64,([A-Za-z0-9+/=]+)\s*$/;

const cellFolders = new Set<string>();

/**
 * Folders cells run in. A notebook may itself sit inside a node_modules folder (the installed
 * package's example notebooks): below such a folder only a further node_modules holds packages.
 */
export function addCellFolder(folder: string): void {
  cellFolders.add(folder.replace(/\\/g, '/').replace(/\/$/, ''));
}

const IN_NODE_MODULES = /(^|\/)node_modules\//;

/** True for compiler paths inside a node_modules folder (the library and its dependencies). */
function isPackageFile(fileName: string): boolean {
  const f = fileName.replace(/\\/g, '/');
  for (const folder of cellFolders) if (f.startsWith(`${folder}/`)) return IN_NODE_MODULES.test(f.slice(folder.length + 1));
  return IN_NODE_MODULES.test(f);
}

type Builder = { getAllDependencies(sourceFile: unknown): readonly string[] };
type WatchHost = { createProgram: (...args: unknown[]) => Builder };
type TranspileOutput = { outputText: string; sourceMapText?: string };

function install(): void {
  const file = requireFromTslab.resolve('@tslab/typescript-for-tslab');
  const entry = requireFromTslab.cache[file];
  if (!entry || (entry.exports as { __sagittaShim?: boolean }).__sagittaShim) return;
  const real = tslabTs as unknown as Record<string, unknown>;
  const shim: Record<string, unknown> = {};
  for (const key of Object.keys(real)) {
    Object.defineProperty(shim, key, { enumerable: true, configurable: true, get: () => real[key] });
  }
  const define = (key: string, value: unknown) => Object.defineProperty(shim, key, { enumerable: true, value });

  const preEmit = tslabTs.getPreEmitDiagnosticsOfFiles as (p: unknown, f: unknown, t?: unknown) => unknown;
  define('getPreEmitDiagnosticsOfFiles', (program: unknown, files: ReadonlyArray<{ fileName: string }>, token?: unknown) =>
    preEmit(program, files.filter((f) => !isPackageFile(f.fileName)), token));

  const createWatchCompilerHost = tslabTs.createWatchCompilerHost as unknown as (...args: unknown[]) => WatchHost;
  define('createWatchCompilerHost', (...args: unknown[]) => {
    const options = args[1] as Record<string, unknown> | undefined;
    if (options) options.inlineSourceMap = true;
    const host = createWatchCompilerHost(...args);
    const createProgram = host.createProgram;
    host.createProgram = (...programArgs: unknown[]) => {
      const builder = createProgram(...programArgs);
      const getAllDependencies = builder.getAllDependencies.bind(builder);
      builder.getAllDependencies = (sourceFile) => getAllDependencies(sourceFile).filter((f) => !isPackageFile(f));
      return builder;
    };
    return host;
  });

  const transpileModule = tslabTs.transpileModule as unknown as (input: string, options: { fileName?: string; compilerOptions?: Record<string, unknown> }) => TranspileOutput;
  define('transpileModule', (input: string, options: { fileName?: string; compilerOptions?: Record<string, unknown> }) => {
    if (options.fileName !== CONVERTED_NAME) return transpileModule(input, options);
    const esmMap = INLINE_MAP.exec(input)?.[1];
    const source = esmMap === undefined ? input : input.slice(0, input.length - INLINE_MAP.exec(input)![0].length);
    const out = transpileModule(source, { ...options, compilerOptions: { ...options.compilerOptions, sourceMap: true, inlineSourceMap: false } });
    const body = out.outputText.replace(/\n?\/\/# sourceMappingURL=\S+\s*$/, '');
    if (esmMap === undefined || out.sourceMapText === undefined) return { ...out, outputText: body };
    const cjsMap = Buffer.from(out.sourceMapText, 'utf8').toString('base64');
    return { ...out, outputText: `${body}\n${ESM_MAP_MARK}${esmMap}\n//# sourceMappingURL=data:application/json;base64,${cjsMap}\n` };
  });

  Object.defineProperty(shim, '__esModule', { value: true });
  Object.defineProperty(shim, '__sagittaShim', { value: true });
  entry.exports = shim;
}
install();

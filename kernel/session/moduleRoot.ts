/**
 * How a cell in any folder sees this package as "sagitta" — for the type checker and at run time —
 * without files, links or path tricks in the notebook's folder.
 *
 * tslab's compiler resolves modules like Node 10 from the folder it was created in, and its
 * loader requires from there too; so a notebook outside this repository could not import the
 * package, and one inside it could not either (a package never sits in its own node_modules).
 *
 * - Compile time: the compiler reads files through `ts.sys` of tslab's TypeScript. Paths under
 *   `<workDir>/node_modules/sagitta/` are served from this package's root, and any other
 *   `<workDir>/node_modules/<name>` the folder lacks is served from this package's own
 *   node_modules (so the library's dependencies and @types resolve as they do in the repo). The
 *   library stays an external library to the compiler: it is type-checked, never re-emitted. In a
 *   checkout its lib/ folder is served from the declarations emitted from it
 *   (libraryDeclarations.ts), so the compiler reads types, not function bodies.
 * - Run time: `require("sagitta")` from compiled cells and from local .ts modules returns the
 *   library loaded once through the ordinary ESM loader (the same instance the kernel uses, so the
 *   display sink and provenance registry are shared); a bare name the notebook's folder cannot
 *   resolve falls back to this package's dependencies.
 */
import { existsSync } from 'node:fs';
import Module, { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { FROM_SOURCE, libraryEntry, packageRoot, requireFromPackage } from '../packageMode.js';
import { addCellFolder, tslabTs } from './compilerShim.js';
import { libraryDeclarations } from './libraryDeclarations.js';

/** The name notebooks import the library by (package.json "name"). */
export const PACKAGE_NAME = 'sagitta-tracks';

export { packageRoot };

const requireHere = requireFromPackage;
const OWN_MANIFEST = path.join(packageRoot, 'package.json').replace(/\\/g, '/');

export { tslabTs, type TslabTs } from './compilerShim.js';

const virtualRoots = new Set<string>();

/** Where a compiler path really lives, or the path itself when it is not under a virtual root. */
export function forwardPath(p: string): string {
  const norm = p.replace(/\\/g, '/');
  for (const root of virtualRoots) {
    if (norm !== root && !norm.startsWith(`${root}/`)) continue;
    const rel = norm.slice(root.length + 1);
    if (rel === PACKAGE_NAME || rel.startsWith(`${PACKAGE_NAME}/`)) {
      const inPackage = rel.slice(PACKAGE_NAME.length);
      // A checkout's lib/ is seen as its emitted declarations (only .d.ts files), where there are.
      const declarations = FROM_SOURCE && (inPackage === '/lib' || inPackage.startsWith('/lib/')) ? libraryDeclarations() : undefined;
      return path.join(declarations ?? packageRoot, inPackage).replace(/\\/g, '/');
    }
    if (rel !== '' && !existsSync(p)) return path.join(packageRoot, 'node_modules', rel).replace(/\\/g, '/');
  }
  return p;
}

/**
 * danfojs-node's declarations import `Config` and `Layout` (options of its browser plotting) from
 * "plotly.js-dist-min", a package danfojs-node does not depend on: they resolve only because this
 * package installs plotly.js-dist-min for its reports, and then pull 1.8 MB of plotly's declarations
 * into every cell's program. For that one import the compiler is shown what danfojs-node gets
 * where it is installed on its own — nothing typed (a package with \`any\` for both names) — by a
 * stand-in inside danfojs-node's own node_modules, which module resolution tries first. Cells that
 * import plotly.js-dist-min themselves still get its real declarations.
 */
const PLOTLY_STAND_IN = /\/node_modules\/danfojs-node\/node_modules\/plotly\.js-dist-min(\/(package\.json|index\.d\.ts))?$/;
const STAND_IN_FILES: Record<string, string> = {
  'package.json': '{ "name": "plotly.js-dist-min", "types": "index.d.ts" }\n',
  'index.d.ts': '// Stand-in for the compiler (kernel/session/moduleRoot.ts): what danfojs-node types see without plotly installed.\nexport type Config = any;\nexport type Layout = any;\n',
};

function standIn(p: string): string | undefined {
  const m = PLOTLY_STAND_IN.exec(p.replace(/\\/g, '/'));
  return m?.[2] === undefined ? undefined : STAND_IN_FILES[m[2]];
}

let sysPatched = false;

function patchCompilerSys(): void {
  if (sysPatched) return;
  sysPatched = true;
  const sys = tslabTs.sys;
  const readFile = sys.readFile.bind(sys);
  const fileExists = sys.fileExists.bind(sys);
  const directoryExists = sys.directoryExists.bind(sys);
  const getDirectories = sys.getDirectories.bind(sys);
  const readDirectory = sys.readDirectory.bind(sys);
  sys.readFile = (p, encoding) => {
    const stood = standIn(p);
    if (stood !== undefined) return stood;
    const real = forwardPath(p);
    const text = readFile(real, encoding);
    return FROM_SOURCE && text !== undefined && real === OWN_MANIFEST && real !== p.replace(/\\/g, '/') ? sourceManifest(text) : text;
  };
  sys.fileExists = (p) => standIn(p) !== undefined || fileExists(forwardPath(p));
  sys.directoryExists = (p) => PLOTLY_STAND_IN.test(p.replace(/\\/g, '/')) || directoryExists(forwardPath(p));
  sys.getDirectories = (p) => getDirectories(forwardPath(p));
  sys.readDirectory = (p, ext, exclude, include, depth) => readDirectory(forwardPath(p), ext, exclude, include, depth);
  if (sys.getModifiedTime) {
    const getModifiedTime = sys.getModifiedTime.bind(sys);
    sys.getModifiedTime = (p) => getModifiedTime(forwardPath(p));
  }
  if (sys.watchFile) {
    const watchFile = sys.watchFile.bind(sys);
    sys.watchFile = (p, cb, interval, options) => watchFile(forwardPath(p), (_f, kind, time) => cb(p, kind, time), interval, options);
  }
}

/**
 * In a checkout the build may not exist or be stale: the compiler is shown a manifest whose types
 * are lib/index.d.ts — declarations emitted from the library's sources as they are now, served
 * in the sources' place (see forwardPath) — or lib/index.ts itself when those cannot be made.
 * (The installed package's manifest names dist/lib/index.d.ts.)
 */
function sourceManifest(text: string): string {
  const manifest = JSON.parse(text) as Record<string, unknown>;
  return JSON.stringify({ ...manifest, types: libraryDeclarations() === undefined ? './lib/index.ts' : './lib/index.d.ts', typings: undefined });
}

/** Makes `<workDir>/node_modules/sagitta-tracks` visible to tslab's compiler. */
export function addCompilerRoot(workDir: string): void {
  patchCompilerSys();
  addCellFolder(path.resolve(workDir));
  virtualRoots.add(path.join(path.resolve(workDir), 'node_modules').replace(/\\/g, '/'));
}

// ---- run time -------------------------------------------------------------------------------

type Namespace = Record<string, unknown>;

let library: Namespace | undefined;
let libraryError: unknown;
let libraryLoading: Promise<void> | undefined;

/** Loads the library once (through the ESM loader, i.e. tsx in the kernel); never rejects. */
export function loadLibrary(): Promise<void> {
  libraryLoading ??= import(libraryEntry.href).then(
    (ns: Namespace) => {
      library = ns;
    },
    (err: unknown) => {
      libraryError = err;
    },
  );
  return libraryLoading;
}

let hookUsers = 0;
let originalRequire: ((id: string) => unknown) | undefined;

function isBareName(id: string): boolean {
  return !id.startsWith('.') && !path.isAbsolute(id) && !id.startsWith('node:');
}

/** Installs the `require("sagitta")` hook (reference-counted; undo with `releaseRequireHook`). */
export function holdRequireHook(): void {
  if (hookUsers++ > 0) return;
  const proto = Module.prototype as unknown as { require: (id: string) => unknown };
  const original = proto.require;
  originalRequire = original;
  proto.require = function sagittaRequire(this: unknown, id: string): unknown {
    if (id === PACKAGE_NAME) {
      if (library) return library;
      throw libraryError instanceof Error
        ? new Error(`the sagitta library failed to load: ${libraryError.message}`, { cause: libraryError })
        : new Error('the sagitta library is not loaded yet; run the cell again');
    }
    try {
      return original.call(this, id);
    } catch (err) {
      if (isBareName(id) && (err as { code?: string }).code === 'MODULE_NOT_FOUND') return requireHere(id);
      throw err;
    }
  };
}

export function releaseRequireHook(): void {
  if (hookUsers === 0 || --hookUsers > 0) return;
  if (originalRequire) (Module.prototype as unknown as { require: unknown }).require = originalRequire;
  originalRequire = undefined;
}

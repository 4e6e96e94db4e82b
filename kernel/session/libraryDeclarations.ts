/**
 * The library's declaration files for the cell compiler, in a checkout.
 *
 * Cells that `import … from "sagitta-tracks"` are type-checked against the library's types. From
 * the sources (lib/**\/*.ts) the cell compiler (tslab's TypeScript 5.0) parses every function body
 * and infers what the library leaves implicit before it can check a cell: seconds per run, the
 * largest part of a notebook's start-up (test/bench/runner.ts). The installed package ships
 * declarations (dist/lib/*.d.ts); a checkout may have no build, or a stale one. So the compiler of
 * a checkout is given declarations emitted from the sources as they are now, once, into a cache
 * folder named by a hash of everything they depend on:
 *
 *   <package root>/node_modules/.cache/sagitta-tracks/declarations/<hash>/lib/index.d.ts
 *
 * The hash covers every file under lib/ (path and bytes), tsconfig.json (the compiler options),
 * the lockfile (the dependencies' types shape inferred types) and the emitting compiler's version,
 * so a changed source gives a new folder and never a stale type; nothing has to be run by hand.
 * The folder is built the first time a compiler needs it: the package's own TypeScript (the
 * devDependency a checkout installs) emits declarations only, without a type check (`noCheck`:
 * the package's type check is `npm run typecheck`; the emitted files are the same either way),
 * into a temporary folder renamed into place, so processes building at once cannot leave a
 * partial folder. Folders of other hashes are left alone (other checkouts may share node_modules).
 *
 * Where the declarations cannot be made (no TypeScript installed, a read-only node_modules, an
 * emit error) the compiler reads the sources as before: slower, never wrong.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { packageRoot, requireFromPackage } from '../packageMode.js';

/** Bumped when the way the folder is made changes (part of the hash). */
const LAYOUT = 'sagitta-declarations-1';

/** Where the declaration folders live. */
export const DECLARATIONS_CACHE: string = path.join(packageRoot, 'node_modules', '.cache', 'sagitta-tracks', 'declarations');

type Ts = typeof import('typescript');

/** Every file under `dir`, as paths relative to the package root with forward slashes, sorted. */
function filesUnder(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string) => {
    for (const e of readdirSync(d, { withFileTypes: true })) {
      const full = path.join(d, e.name);
      if (e.isDirectory()) walk(full);
      else if (e.isFile()) out.push(path.relative(packageRoot, full).replace(/\\/g, '/'));
    }
  };
  walk(dir);
  return out.sort();
}

/** The hash naming the declaration folder of the library as it is now (hex, 20 digits). */
export function libraryDeclarationsKey(tsVersion: string): string {
  const h = createHash('sha256');
  const add = (name: string, bytes: Buffer | string) => {
    h.update(`${name}\0${bytes.length}\0`);
    h.update(bytes);
  };
  add('layout', LAYOUT);
  add('compiler', tsVersion);
  for (const f of ['tsconfig.json', 'package-lock.json']) add(f, existsSync(path.join(packageRoot, f)) ? readFileSync(path.join(packageRoot, f)) : 'missing');
  for (const f of filesUnder(path.join(packageRoot, 'lib'))) add(f, readFileSync(path.join(packageRoot, f)));
  return h.digest('hex').slice(0, 20);
}

/** The installed emitting compiler's version, read from its manifest (loading it takes a while). */
function typescriptVersion(): string | undefined {
  try {
    return (JSON.parse(readFileSync(requireFromPackage.resolve('typescript/package.json'), 'utf8')) as { version?: string }).version;
  } catch {
    return undefined;
  }
}

/** Emits the declarations of lib/index.ts (and what it reaches) into `outDir`; false on any error. */
function emitDeclarations(ts: Ts, outDir: string): boolean {
  const configFile = path.join(packageRoot, 'tsconfig.json');
  const parsed = ts.getParsedCommandLineOfConfigFile(configFile, { noEmit: false }, { ...ts.sys, onUnRecoverableConfigFileDiagnostic: () => {} });
  if (!parsed) return false;
  const options = {
    ...parsed.options,
    noEmit: false,
    declaration: true,
    emitDeclarationOnly: true,
    noCheck: true,
    sourceMap: false,
    declarationMap: false,
    rootDir: packageRoot,
    outDir,
  };
  const program = ts.createProgram({ rootNames: [path.join(packageRoot, 'lib', 'index.ts')], options });
  const result = program.emit();
  return !result.emitSkipped && result.diagnostics.length === 0 && existsSync(path.join(outDir, 'lib', 'index.d.ts'));
}

let memo: { folder: string | undefined } | undefined;

/**
 * The folder holding the library's declarations (lib/index.d.ts and the rest, laid out as lib/ is)
 * for the sources as they are now, built if missing; undefined when they cannot be made (use the
 * sources then). Found once per thread: a process keeps the library it loaded at start, and its
 * compiler keeps the matching types.
 */
export function libraryDeclarations(): string | undefined {
  memo ??= { folder: findOrBuild() };
  return memo.folder;
}

function findOrBuild(): string | undefined {
  const version = typescriptVersion();
  if (version === undefined) return undefined;
  let key: string;
  try {
    key = libraryDeclarationsKey(version);
  } catch {
    return undefined;
  }
  const folder = path.join(DECLARATIONS_CACHE, key);
  const entry = path.join(folder, 'lib', 'index.d.ts');
  if (existsSync(entry)) return folder;
  const temporary = `${folder}.${process.pid}.${Math.random().toString(36).slice(2)}.tmp`;
  try {
    const ts = requireFromPackage('typescript') as Ts;
    mkdirSync(temporary, { recursive: true });
    if (ts.version !== version || !emitDeclarations(ts, temporary)) return undefined;
    writeFileSync(path.join(temporary, 'made-by.json'), JSON.stringify({ key, compiler: ts.version, layout: LAYOUT }) + '\n');
    try {
      renameSync(temporary, folder);
    } catch (err) {
      // Another process put the same folder in place first: theirs is as good as ours.
      if (!existsSync(entry)) throw err;
    }
    return folder;
  } catch {
    return existsSync(entry) ? folder : undefined;
  } finally {
    rmSync(temporary, { recursive: true, force: true });
  }
}

/**
 * Where this package's files are, whether it runs from its TypeScript sources (a checkout, through
 * tsx) or from its build (an installed package, plain Node): the one place that knows the two
 * layouts.
 *
 *   source: <root>/kernel/packageMode.ts        modules are <root>/<room>/<name>.ts
 *   build:  <root>/dist/kernel/packageMode.js   modules are <root>/dist/<room>/<name>.js
 *
 * Assets that are not compiled (notebooks, package.json, the lockfile) sit at <root> in both.
 */
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

/** True when this module was loaded from its .ts source (a checkout), false from dist/. */
export const FROM_SOURCE: boolean = import.meta.url.endsWith('.ts');

/** The package's root folder (where package.json is). */
export const packageRoot: string = path.resolve(fileURLToPath(new URL(FROM_SOURCE ? '../' : '../../', import.meta.url)));

/**
 * URL of one of the package's own modules, named from the root without extension, in the layout
 * that is running. @example moduleUrl('kernel/runner/child') // …/kernel/runner/child.ts in a checkout
 */
export function moduleUrl(fromRoot: string): URL {
  const file = FROM_SOURCE ? path.join(packageRoot, `${fromRoot}.ts`) : path.join(packageRoot, 'dist', `${fromRoot}.js`);
  return pathToFileURL(file);
}

/**
 * Entry of a worker thread. A worker has its own module loader: from source it starts at a small
 * .js file that registers tsx first (`<name>Entry.js` beside the module); from the build it loads
 * the compiled module directly.
 */
export function workerUrl(fromRoot: string): URL {
  return FROM_SOURCE ? pathToFileURL(path.join(packageRoot, `${fromRoot}Entry.js`)) : moduleUrl(fromRoot);
}

/** The library's public entry (lib/index) in the running layout. */
export const libraryEntry: URL = moduleUrl('lib/index');

/** Resolves a dependency from this package (wherever the caller's working folder is). */
export const requireFromPackage: NodeJS.Require = createRequire(path.join(packageRoot, 'package.json'));

/**
 * Node options for a child process that runs one of our modules: tsx's loader, so a checkout's
 * .ts sources run, and in both layouts a notebook's local .ts modules load.
 */
export function childExecArgv(): string[] {
  return ['--import', import.meta.resolve('tsx')];
}

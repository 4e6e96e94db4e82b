/**
 * Installs, removes and lists kernelspecs with no Python: the files a front end needs are plain
 * JSON and images, written here directly.
 */
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { msg } from '../../lib/internal.js';
import { FROM_SOURCE, moduleUrl, packageRoot } from '../packageMode.js';
import { sagittaVersion } from '../version.js';
import { logoPng, logoSvg } from './logo.js';
import { currentPlatformEnv, kernelsDirFor, kernelSearchPath, type PlatformEnv } from './paths.js';

export const DEFAULT_KERNEL_ID = 'sagitta';
export const DEFAULT_DISPLAY_NAME = 'Sagitta (TypeScript)';

/** The JS file kernel.json starts: it registers the TypeScript loader and serves the connection file. */
export const kernelEntry: string = FROM_SOURCE ? path.join(packageRoot, 'kernel', 'bin', 'sagitta-kernel.js') : fileURLToPath(moduleUrl('kernel/entry/sagitta-kernel'));

export interface KernelJson {
  argv: string[];
  display_name: string;
  language: string;
  interrupt_mode: 'signal' | 'message';
  metadata: Record<string, unknown>;
}

export interface InstallOptions {
  scope?: 'user' | 'system';
  /** Kernels folder to write into instead of the scope's standard one. */
  dir?: string;
  id?: string;
  displayName?: string;
  /** How front ends interrupt a cell (default: signal, except message on Windows, which has no SIGINT to send). */
  interruptMode?: 'signal' | 'message';
  platformEnv?: PlatformEnv;
}

export function defaultInterruptMode(platform: NodeJS.Platform = process.platform): 'signal' | 'message' {
  return platform === 'win32' ? 'message' : 'signal';
}

/** What kernel.json says for this package: this Node binary running this package's kernel entry. */
export function kernelJson(displayName = DEFAULT_DISPLAY_NAME, interruptMode = defaultInterruptMode()): KernelJson {
  return {
    argv: [process.execPath, kernelEntry, '{connection_file}'],
    display_name: displayName,
    language: 'typescript',
    // Both modes stop a cell that blocks the event loop: a signal directly, a message through the
    // kernel's control thread, which raises SIGINT (kernel/protocol/controlThread.ts).
    interrupt_mode: interruptMode,
    metadata: { sagitta: { version: sagittaVersion() } },
  };
}

const ID_PATTERN = /^[a-zA-Z0-9._-]+$/;

function checkId(id: string): string {
  if (!ID_PATTERN.test(id)) throw msg.badArgument('--id', id, 'letters, digits, ".", "_" or "-" (it becomes a folder name)');
  return id;
}

/** Writes `<kernels dir>/<id>/` (kernel.json and logos), replacing an older copy; returns the folder. */
export function installKernelspec(options: InstallOptions = {}): string {
  const id = checkId(options.id ?? DEFAULT_KERNEL_ID);
  const kernelsDir = options.dir ? path.resolve(options.dir) : kernelsDirFor(options.scope ?? 'user', options.platformEnv ?? currentPlatformEnv());
  return withWriteAccess(kernelsDir, options.scope, () => writeSpec(kernelsDir, id, options));
}

/** Turns "permission denied" into a message that says what to do instead. */
function withWriteAccess<T>(kernelsDir: string, scope: InstallOptions['scope'], body: () => T): T {
  try {
    return body();
  } catch (err) {
    const code = (err as { code?: string }).code;
    if (code === 'EACCES' || code === 'EPERM' || code === 'EROFS') {
      const fix = scope === 'system' ? 'run as an administrator, or use --scope user' : 'choose a folder you can write with --dir';
      throw msg.cannotWrite(kernelsDir, code === 'EROFS' ? 'read-only file system' : 'permission denied', fix);
    }
    throw err;
  }
}

function writeSpec(kernelsDir: string, id: string, options: InstallOptions): string {
  const target = path.join(kernelsDir, id);
  mkdirSync(kernelsDir, { recursive: true });
  // Write into a fresh folder next to the target, then swap, so a front end never sees half a spec.
  const staging = path.join(kernelsDir, `.${id}.staging-${process.pid}`);
  rmSync(staging, { recursive: true, force: true });
  mkdirSync(staging);
  writeFileSync(path.join(staging, 'kernel.json'), `${JSON.stringify(kernelJson(options.displayName, options.interruptMode), null, 2)}\n`);
  writeFileSync(path.join(staging, 'logo-32x32.png'), logoPng(32));
  writeFileSync(path.join(staging, 'logo-64x64.png'), logoPng(64));
  writeFileSync(path.join(staging, 'logo-svg.svg'), `${logoSvg()}\n`);
  rmSync(target, { recursive: true, force: true });
  renameSync(staging, target);
  return target;
}

export interface InstalledKernel {
  id: string;
  dir: string;
  displayName: string;
  language: string;
  /** True when kernel.json starts this package's kernel entry. */
  sagitta: boolean;
}

function readSpec(dir: string, id: string): InstalledKernel | undefined {
  const file = path.join(dir, 'kernel.json');
  if (!existsSync(file)) return undefined;
  try {
    const spec = JSON.parse(readFileSync(file, 'utf8')) as Partial<KernelJson>;
    const argv = Array.isArray(spec.argv) ? spec.argv : [];
    return {
      id,
      dir,
      displayName: String(spec.display_name ?? id),
      language: String(spec.language ?? ''),
      sagitta: argv.some((a) => typeof a === 'string' && /sagitta-kernel\.js$/.test(a)),
    };
  } catch {
    return undefined;
  }
}

/** Every kernelspec visible in the search path (JUPYTER_PATH, user, system); the first of an id wins. */
export function listKernelspecs(platformEnv: PlatformEnv = currentPlatformEnv(), extraDirs: readonly string[] = []): InstalledKernel[] {
  const found = new Map<string, InstalledKernel>();
  for (const kernelsDir of [...extraDirs.map((d) => path.resolve(d)), ...kernelSearchPath(platformEnv)]) {
    let entries: string[];
    try {
      entries = readdirSync(kernelsDir);
    } catch {
      continue;
    }
    for (const id of entries.sort()) {
      if (found.has(id.toLowerCase()) || id.startsWith('.')) continue;
      const spec = readSpec(path.join(kernelsDir, id), id);
      if (spec) found.set(id.toLowerCase(), spec);
    }
  }
  return [...found.values()];
}

/**
 * Removes an installed Sagitta kernelspec. Only folders whose kernel.json starts this package's
 * kernel entry are removed, so a kernel of another language with the same id is left alone.
 */
export function removeKernelspec(options: InstallOptions = {}): string {
  const id = checkId(options.id ?? DEFAULT_KERNEL_ID);
  const kernelsDir = options.dir ? path.resolve(options.dir) : kernelsDirFor(options.scope ?? 'user', options.platformEnv ?? currentPlatformEnv());
  const target = path.join(kernelsDir, id);
  const spec = readSpec(target, id);
  if (!spec) throw msg.badArgument('--id', id, `an installed kernel in ${kernelsDir} (see "sagitta kernel list")`);
  if (!spec.sagitta) throw msg.badArgument('--id', id, `a Sagitta kernel; ${target} belongs to another kernel and was left alone`);
  return withWriteAccess(kernelsDir, options.scope, () => {
    rmSync(target, { recursive: true, force: true });
    return target;
  });
}

/**
 * Where notebook front ends look for kernelspecs — the standard data-directory layout of the
 * notebook ecosystem (common practice, as documented for Jupyter's data files): a kernel is a
 * folder `<data dir>/kernels/<id>/` holding `kernel.json` and its logos.
 *
 * Per-user data dir: Linux `$XDG_DATA_HOME/jupyter` or `~/.local/share/jupyter`, macOS
 * `~/Library/Jupyter`, Windows `%APPDATA%\jupyter`; `JUPYTER_DATA_DIR` overrides it. System-wide:
 * `/usr/local/share/jupyter` and `/usr/share/jupyter` (Linux, macOS), `%PROGRAMDATA%\jupyter`
 * (Windows). Search order for listing: each entry of `JUPYTER_PATH`, then the user dir, then the
 * system dirs; the first folder holding a given kernel id wins.
 */
import path from 'node:path';

export interface PlatformEnv {
  platform: NodeJS.Platform;
  env: Record<string, string | undefined>;
  home: string;
}

function pathFor(platform: NodeJS.Platform): path.PlatformPath {
  return platform === 'win32' ? path.win32 : path.posix;
}

/** The per-user data directory (not yet `/kernels`). */
export function userDataDir({ platform, env, home }: PlatformEnv): string {
  const p = pathFor(platform);
  if (env.JUPYTER_DATA_DIR) return env.JUPYTER_DATA_DIR;
  if (platform === 'darwin') return p.join(home, 'Library', 'Jupyter');
  if (platform === 'win32') return p.join(env.APPDATA ?? p.join(home, 'AppData', 'Roaming'), 'jupyter');
  return p.join(env.XDG_DATA_HOME || p.join(home, '.local', 'share'), 'jupyter');
}

/** System-wide data directories, most specific first. */
export function systemDataDirs({ platform, env }: PlatformEnv): string[] {
  if (platform === 'win32') return [path.win32.join(env.PROGRAMDATA ?? 'C:\\ProgramData', 'jupyter')];
  return ['/usr/local/share/jupyter', '/usr/share/jupyter'];
}

/** Kernel folders in search order: JUPYTER_PATH entries, user, system. */
export function kernelSearchPath(pe: PlatformEnv): string[] {
  const p = pathFor(pe.platform);
  const extra = (pe.env.JUPYTER_PATH ?? '').split(p.delimiter).filter((s) => s.length > 0);
  const dirs = [...extra, userDataDir(pe), ...systemDataDirs(pe)].map((d) => p.join(d, 'kernels'));
  return [...new Set(dirs)];
}

/** The kernels folder an install with `scope` writes into. */
export function kernelsDirFor(scope: 'user' | 'system', pe: PlatformEnv): string {
  const p = pathFor(pe.platform);
  return p.join(scope === 'user' ? userDataDir(pe) : systemDataDirs(pe)[0], 'kernels');
}

export function currentPlatformEnv(): PlatformEnv {
  return { platform: process.platform, env: process.env, home: process.env.HOME ?? process.env.USERPROFILE ?? '' };
}

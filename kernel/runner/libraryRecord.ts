import { execFile } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { FROM_SOURCE, packageRoot } from '../packageMode.js';
import { sagittaVersion } from '../version.js';
import type { LibraryRecord } from './runRecord.js';


function git(args: string[]): Promise<string | undefined> {
  return new Promise((resolve) => {
    execFile('git', ['-C', packageRoot, ...args], { timeout: 5000, windowsHide: true }, (err, stdout) => resolve(err ? undefined : stdout.trim()));
  });
}

/**
 * What identifies the library a run used: its version, the git commit of the checkout it runs
 * from (marked "+ local changes" when the library's files differ from that commit), and the
 * hash of the lockfile that pins every dependency. Read beside the run (git runs in parallel
 * with the notebook process), never failing: what cannot be found is left out.
 */
export async function libraryRecord(): Promise<LibraryRecord> {
  if (!FROM_SOURCE) return builtRecord();
  const lock = path.join(packageRoot, 'package-lock.json');
  const lockfileSha256 = existsSync(lock) ? createHash('sha256').update(readFileSync(lock)).digest('hex') : undefined;
  const [commit, changes] = await Promise.all([git(['rev-parse', 'HEAD']), git(['status', '--porcelain', '--', 'lib', 'kernel', 'package.json', 'package-lock.json'])]);
  return {
    version: sagittaVersion(),
    ...(commit ? { commit: changes ? `${commit} + local changes` : commit } : {}),
    ...(lockfileSha256 ? { lockfileSha256 } : {}),
  };
}

/**
 * An installed package has no checkout to ask (git would answer for the user's own project):
 * the build wrote the commit and the lockfile hash it was made from into dist/build-info.json.
 */
function builtRecord(): LibraryRecord {
  const file = path.join(packageRoot, 'dist', 'build-info.json');
  const info = existsSync(file) ? (JSON.parse(readFileSync(file, 'utf8')) as { commit?: string; lockfileSha256?: string }) : {};
  return {
    version: sagittaVersion(),
    ...(info.commit ? { commit: info.commit } : {}),
    ...(info.lockfileSha256 ? { lockfileSha256: info.lockfileSha256 } : {}),
  };
}

#!/usr/bin/env node
// `npm run build` (also run by `npm pack`): compiles lib/ and kernel/ to JavaScript with
// declarations in dist/, so the installed package runs on plain Node, and records which commit
// and lockfile the build was made from (dist/build-info.json, read by the run record).
import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { chmodSync, existsSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(fileURLToPath(new URL('../../', import.meta.url)));
const dist = path.join(root, 'dist');
const require = createRequire(path.join(root, 'package.json'));

// dist/ is this script's own output (ignored by git): built afresh so no stale module survives.
rmSync(dist, { recursive: true, force: true });
execFileSync(process.execPath, [require.resolve('typescript/bin/tsc'), '-p', path.join(root, 'tsconfig.build.json')], { cwd: root, stdio: 'inherit' });

function gitCommit() {
  try {
    const commit = execFileSync('git', ['-C', root, 'rev-parse', 'HEAD'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] }).trim();
    const dirty = execFileSync('git', ['-C', root, 'status', '--porcelain', '--', 'lib', 'kernel', 'package.json', 'package-lock.json'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] }).trim();
    return dirty ? `${commit} + local changes` : commit;
  } catch {
    return undefined;
  }
}
const lock = path.join(root, 'package-lock.json');
const info = {
  commit: gitCommit(),
  lockfileSha256: existsSync(lock) ? createHash('sha256').update(readFileSync(lock)).digest('hex') : undefined,
};
const tmp = path.join(dist, `build-info.json.${process.pid}.tmp`);
writeFileSync(tmp, JSON.stringify(info, null, 2) + '\n');
renameSync(tmp, path.join(dist, 'build-info.json'));
for (const entry of ['sagitta.js', 'sagitta-kernel.js']) chmodSync(path.join(dist, 'kernel', 'entry', entry), 0o755);
process.stdout.write(`built ${path.relative(process.cwd(), dist) || 'dist'} (${info.commit ?? 'no git commit'})\n`);

/** A kernel whose front end died without a shutdown request ends itself instead of lingering. */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { ProtocolClient } from './protocol-client.js';

const root = path.resolve(__dirname, '../..');
const dir = mkdtempSync(path.join(tmpdir(), 'sagitta-orphan-'));
let pid = 0;

/** Running (a zombie waiting for a parent that never reaps it counts as gone). */
function alive(p: number): boolean {
  try {
    process.kill(p, 0);
  } catch {
    return false;
  }
  try {
    return !/^\d+ \(.*\) Z/.test(readFileSync(`/proc/${p}/stat`, 'utf8'));
  } catch {
    return true;
  }
}

afterAll(() => {
  if (pid && alive(pid)) process.kill(pid, 'SIGKILL');
  rmSync(dir, { recursive: true, force: true });
});

describe('orphaned kernel', () => {
  it.skipIf(process.platform === 'win32')('shuts down within seconds once the process that started it is gone', async () => {
    const info = await new ProtocolClient().connectionInfo();
    const file = path.join(dir, 'kernel-orphan.json');
    writeFileSync(file, JSON.stringify(info));
    // A stand-in front end: a shell that starts the kernel in the background, lives on for a
    // while (as the kernel starts up and notes its parent), then exits without a shutdown request.
    const entry = path.join(root, 'kernel/bin/sagitta-kernel.js');
    const pidFile = path.join(dir, 'kernel.pid');
    const logFile = path.join(dir, 'kernel.log');
    execFileSync('sh', ['-c', `"${process.execPath}" "${entry}" "${file}" >/dev/null 2>"${logFile}" & echo $! > "${pidFile}"; sleep 3`], { cwd: dir });
    pid = Number(readFileSync(pidFile, 'utf8').trim());
    expect(pid).toBeGreaterThan(0);
    const deadline = Date.now() + 30_000;
    while (alive(pid) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 250));
    expect(alive(pid)).toBe(false);
    expect(readFileSync(logFile, 'utf8')).toMatch(/the front end \(pid \d+\) is gone; shutting down/);
  }, 60_000);
});

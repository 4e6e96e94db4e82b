import { readConnectionFile } from './connection.js';
import { KernelServer, kernelIdFromFile } from './server.js';

/** How often the kernel checks that the front end that started it is still there. */
const PARENT_CHECK_MS = 3000;

/**
 * Starts the kernel for a front end: `sagitta-kernel <connection-file>`. Cells run in this
 * process, with the working directory the front end started us in (normally the notebook's folder).
 * If the process that started the kernel goes away without a shutdown request (a crashed front
 * end), the kernel shuts itself down instead of lingering: the system hands an orphan to another
 * parent, so a changed parent pid means ours is gone. `parentPid` is the parent as the entry
 * script saw it on its first line: read after start-up (seconds on a loaded machine), the front
 * end might already be gone and the orphan's new parent taken for it.
 */
export async function runKernel(connectionFile: string, parentPid: number = process.ppid): Promise<number> {
  const connection = readConnectionFile(connectionFile);
  const workDir = process.cwd();
  const server = new KernelServer({
    connection,
    kernelId: kernelIdFromFile(connectionFile),
    createSession: async (phase) => (await import('../session/session.js')).createSession({ workDir, phase }),
  });
  await server.start();
  const parent = parentPid;
  const watch = setInterval(() => {
    if (process.ppid !== parent) {
      process.stderr.write(`[sagitta kernel] the front end (pid ${parent}) is gone; shutting down\n`);
      void server.stop();
    }
  }, PARENT_CHECK_MS);
  watch.unref();
  await server.whenStopped();
  clearInterval(watch);
  return 0;
}

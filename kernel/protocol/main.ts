import { readConnectionFile } from './connection';
import { KernelServer, kernelIdFromFile } from './server';

/**
 * Starts the kernel for a front end: `sagitta-kernel <connection-file>`. Cells run in this
 * process, with the working directory the front end started us in (normally the notebook's folder).
 */
export async function runKernel(connectionFile: string): Promise<number> {
  const connection = readConnectionFile(connectionFile);
  const workDir = process.cwd();
  const server = new KernelServer({
    connection,
    kernelId: kernelIdFromFile(connectionFile),
    createSession: async () => (await import('../session/session')).createSession({ workDir }),
  });
  await server.start();
  await server.whenStopped();
  return 0;
}

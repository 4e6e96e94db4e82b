/**
 * The protocol server in this process (control on the main thread), with a session that cannot
 * start: every request still gets an answer (messaging protocol 5.3: a request always has a
 * reply), and shutdown closes the sockets.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { KernelServer } from '../../kernel/protocol/server.js';
import type { ConnectionInfo } from '../../kernel/protocol/connection.js';
import { ProtocolClient, withTimeout } from './protocol-client.js';

const client = new ProtocolClient();
const logged: string[] = [];
let server: KernelServer | undefined;

afterAll(async () => {
  client.close();
  await server?.stop(); // no-op after a served shutdown; closes the sockets if the test failed early
});

describe('KernelServer with a failing session', { timeout: 60_000 }, () => {
  it('answers kernel_info, replies KernelError to execute, and shuts down', async () => {
    const info = (await client.connectionInfo()) as unknown as ConnectionInfo;
    server = new KernelServer({
      connection: info,
      controlThread: false,
      log: (line) => logged.push(line),
      createSession: () => {
        throw new Error('no compiler here');
      },
    });
    await server.start();
    client.connect(info as unknown as Record<string, unknown>);
    const kernelInfo = await client.handshake(20_000, 200);
    expect(kernelInfo.content.status).toBe('ok');

    const { reply } = await client.request('shell', 'execute_request', { code: '1 + 1' });
    expect(reply.content.status).toBe('error');
    expect(reply.content.ename).toBe('KernelError');
    expect(reply.content.evalue).toBe('no compiler here');
    expect(logged.some((l) => /execute_request failed/.test(l))).toBe(true);

    // Interrupting a kernel whose session never started is harmless.
    expect((await client.request('control', 'interrupt_request', {})).reply.content.status).toBe('ok');
    const { reply: bye } = await client.request('control', 'shutdown_request', { restart: true });
    expect(bye.content).toMatchObject({ status: 'ok', restart: true });
    await withTimeout(server.whenStopped(), 10_000, 'server stop');
  });
});

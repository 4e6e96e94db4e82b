import { workerUrl } from '../packageMode.js';
import { Worker } from 'node:worker_threads';
import * as zmq from 'zeromq';
import { msg } from '../../lib/internal.js';
import { endpoint, type ConnectionInfo } from './connection.js';
import type { ControlThreadData, FromControlThread, ToControlThread } from './controlThread.js';
import { serveHeartbeat } from './heartbeat.js';
import { SendQueue, type FrameSender, type Sendable } from './sendQueue.js';
import type { Header } from './wire.js';

export type InboundChannel = 'shell' | 'control' | 'stdin';
export type OutboundChannel = InboundChannel | 'iopub';

export interface KernelSocketsOptions {
  readonly connection: ConnectionInfo;
  readonly sessionId: string;
  readonly kernelId: string;
  readonly phase: Int32Array;
  /** Serve control, heartbeat and iopub from the control thread (default) or from this thread. */
  readonly controlThread: boolean;
  readonly log: (line: string) => void;
  readonly receive: (frames: Buffer[], channel: InboundChannel) => void;
}

/**
 * The kernel's five sockets, bound to the connection file's address. Shell and stdin live on the
 * main thread; control, heartbeat and iopub on the control thread (controlThread.ts), or — for
 * tests of the server in one process — on the main thread with the same heartbeat.
 */
export class KernelSockets {
  private readonly shell = new zmq.Router({ linger: 0 });
  private readonly stdin = new zmq.Router({ linger: 0 });
  private readonly local?: { control: zmq.Router; hb: zmq.Reply; iopub: zmq.Publisher };
  private worker?: Worker;
  private readonly out: Record<OutboundChannel, FrameSender>;
  private stopping = false;

  constructor(private readonly o: KernelSocketsOptions) {
    const onError = (err: unknown) => o.log(`send failed: ${err instanceof Error ? err.message : String(err)}`);
    const viaThread = (channel: 'control' | 'iopub'): FrameSender => ({
      send: (frames) => {
        this.worker?.postMessage({ kind: 'send', channel, frames } satisfies ToControlThread);
        return Promise.resolve();
      },
      drain: () => Promise.resolve(),
    });
    if (!o.controlThread) this.local = { control: new zmq.Router({ linger: 0 }), hb: new zmq.Reply({ linger: 0 }), iopub: new zmq.Publisher({ linger: 0 }) };
    this.out = {
      shell: new SendQueue(this.shell, onError),
      stdin: new SendQueue(this.stdin, onError),
      control: this.local ? new SendQueue(this.local.control, onError) : viaThread('control'),
      iopub: this.local ? new SendQueue(this.local.iopub, onError) : viaThread('iopub'),
    };
  }

  async start(): Promise<void> {
    const info = this.o.connection;
    const local = this.local;
    await Promise.all([
      this.shell.bind(endpoint(info, 'shell')),
      this.stdin.bind(endpoint(info, 'stdin')),
      ...(local
        ? [local.control.bind(endpoint(info, 'control')), local.hb.bind(endpoint(info, 'hb')), local.iopub.bind(endpoint(info, 'iopub'))]
        : [this.startControlThread()]),
    ]);
    if (local) {
      void serveHeartbeat(local.hb, () => this.stopping, this.o.log);
      void this.listen(local.control, 'control');
    }
    void this.listen(this.shell, 'shell');
    void this.listen(this.stdin, 'stdin');
  }

  send(channel: OutboundChannel, frames: Sendable, answers?: string): Promise<void> {
    if (channel === 'control' && this.worker) {
      this.worker.postMessage({ kind: 'send', channel, frames, answers } satisfies ToControlThread);
      return Promise.resolve();
    }
    return this.out[channel].send(frames);
  }

  /** Tells the control thread which execute request is running (for what it says under a stuck cell). */
  cell(parent: Header | undefined): void {
    this.worker?.postMessage({ kind: 'cell', parent } satisfies ToControlThread);
  }

  interruptHandled(): void {
    this.worker?.postMessage({ kind: 'interrupt-handled' } satisfies ToControlThread);
  }

  async close(): Promise<void> {
    this.stopping = true;
    await Promise.all(Object.values(this.out).map((q) => q.drain()));
    for (const s of [this.shell, this.stdin, this.local?.control, this.local?.hb, this.local?.iopub]) s?.close();
    const worker = this.worker;
    if (!worker) return;
    const exited = new Promise<void>((resolve) => worker.once('exit', () => resolve()));
    worker.postMessage({ kind: 'close' } satisfies ToControlThread);
    const timer = setTimeout(() => void worker.terminate(), 2000);
    await exited;
    clearTimeout(timer);
  }

  private startControlThread(): Promise<void> {
    const workerData: ControlThreadData = { connection: this.o.connection, sessionId: this.o.sessionId, kernelId: this.o.kernelId, phase: this.o.phase };
    const worker = new Worker(workerUrl('kernel/protocol/controlThread'), { workerData });
    this.worker = worker;
    return new Promise<void>((resolve, reject) => {
      worker.on('message', (m: FromControlThread) => {
        if (m.kind === 'ready') resolve();
        else if (m.kind === 'failed') reject(msg.kernelState('start the control thread', m.message));
        else if (m.kind === 'log') this.o.log(m.line);
        else this.o.receive(m.frames.map((f) => Buffer.from(f.buffer, f.byteOffset, f.byteLength)), 'control');
      });
      worker.once('error', (err) => {
        this.o.log(`control thread failed: ${String(err)}`);
        reject(err);
      });
    });
  }

  private async listen(socket: zmq.Router, channel: InboundChannel): Promise<void> {
    try {
      for await (const frames of socket) this.o.receive(frames, channel);
    } catch (err) {
      if (!this.stopping) this.o.log(`${channel} listener stopped: ${String(err)}`);
    }
  }
}

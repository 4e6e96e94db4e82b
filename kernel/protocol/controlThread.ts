/**
 * The control, heartbeat and iopub channels, served from a worker thread so that they keep
 * working while a cell blocks the main thread's event loop:
 * - the heartbeat keeps answering, so a front end does not declare a busy kernel dead;
 * - iopub carries everything the main thread publishes (posted here in order), and lets this
 *   thread speak for a main thread that cannot;
 * - a signed `interrupt_request` is acted on here at once (interruptDriver.ts): by SIGINT while
 *   the cell compiles or runs synchronous code, by stopping the main thread's JavaScript when the
 *   cell is busy after an await, and — if neither stops it — by saying so under the cell and
 *   answering the request itself, so the front end is not left waiting.
 * Every control message is also passed to the main thread, which verifies it again, replies and
 * publishes the status messages; those go out from here.
 */
import { parentPort, workerData } from 'node:worker_threads';
import * as zmq from 'zeromq';
import { endpoint, type ConnectionInfo } from './connection.js';
import { serveHeartbeat } from './heartbeat.js';
import { createInterruptDriver } from './interruptDriver.js';
import { SendQueue } from './sendQueue.js';
import { decode, SignatureHistory, type Header } from './wire.js';

export type ToControlThread =
  | { kind: 'send'; channel: 'control' | 'iopub'; frames: Array<Uint8Array | string>; answers?: string }
  | { kind: 'cell'; parent: Header | undefined }
  | { kind: 'interrupt-handled' }
  | { kind: 'close' };

export type FromControlThread = { kind: 'ready' } | { kind: 'message'; frames: Uint8Array[] } | { kind: 'log'; line: string } | { kind: 'failed'; message: string };

export interface ControlThreadData {
  connection: ConnectionInfo;
  /** The kernel's session id (for messages this thread writes itself) and iopub topic prefix. */
  sessionId: string;
  kernelId: string;
  /** The main thread's phase flag (kernel/session/phase.ts). */
  phase: Int32Array;
}

const data = workerData as ControlThreadData;
const info = data.connection;
const port = parentPort!;
const control = new zmq.Router({ linger: 0 });
const hb = new zmq.Reply({ linger: 0 });
const iopub = new zmq.Publisher({ linger: 0 });
const history = new SignatureHistory();
let closing = false;
const post = (m: FromControlThread) => port.postMessage(m);
const log = (line: string) => post({ kind: 'log', line });
const onError = (err: unknown) => log(`send failed: ${String(err)}`);
const out = { control: new SendQueue(control, onError), iopub: new SendQueue(iopub, onError) };
const toBuffer = (f: Uint8Array | string) => (typeof f === 'string' ? f : Buffer.from(f.buffer, f.byteOffset, f.byteLength));
const driver = createInterruptDriver({ ...data, send: (channel, frames) => void out[channel].send(frames), log });

async function listen(): Promise<void> {
  try {
    for await (const frames of control) {
      const msg = decode(frames, info.key, history);
      if (typeof msg !== 'string' && msg.header.msg_type === 'interrupt_request') driver.requested(msg);
      // Bad signatures are logged by the main thread, which checks every message again.
      post({ kind: 'message', frames });
    }
  } catch (err) {
    if (!closing) log(`control listener stopped: ${String(err)}`);
  }
}

port.on('message', (m: ToControlThread) => {
  if (m.kind === 'send') {
    // A reply the driver already sent for a stuck main thread is not sent twice.
    if (m.answers !== undefined && !driver.claimReply(m.answers)) return;
    void out[m.channel].send(m.frames.map(toBuffer));
  } else if (m.kind === 'cell') {
    driver.cell(m.parent);
  } else if (m.kind === 'interrupt-handled') {
    driver.handled();
  } else {
    closing = true;
    driver.handled();
    void Promise.all([out.control.drain(), out.iopub.drain()]).then(() => {
      control.close();
      hb.close();
      iopub.close();
      port.close();
    });
  }
});

Promise.all([control.bind(endpoint(info, 'control')), hb.bind(endpoint(info, 'hb')), iopub.bind(endpoint(info, 'iopub'))]).then(
  () => {
    void serveHeartbeat(hb, () => closing, log);
    void listen();
    post({ kind: 'ready' });
  },
  (err: unknown) => post({ kind: 'failed', message: String(err) }),
);

/**
 * The control and heartbeat channels, served from a worker thread so that they keep working while
 * a cell blocks the main thread's event loop:
 * - the heartbeat keeps answering, so a front end does not declare a busy kernel dead;
 * - a correctly signed `interrupt_request` raises SIGINT in this process at once, which stops a
 *   synchronous cell (it runs with `breakOnSigint`) — message-mode interrupts for blocking cells.
 *   A signal that lands while the cell is still being compiled is spent before the cell's code
 *   runs, so the signal is repeated every half second until the main thread, free again, reports
 *   that it has handled the request (or ten seconds have passed). On Windows there are no signals
 *   to raise: there the request stops only a cell that is waiting on an `await`.
 * Every control message is also passed to the main thread, which verifies it again, replies and
 * publishes the status messages; the main thread's replies come back here to be sent.
 */
import { parentPort, workerData } from 'node:worker_threads';
import * as zmq from 'zeromq';
import { endpoint, type ConnectionInfo } from './connection.js';
import { decode, SignatureHistory } from './wire.js';

export type ToControlThread = { kind: 'send'; frames: Array<Uint8Array | string> } | { kind: 'interrupt-handled' } | { kind: 'close' };

const REPEAT_SIGNAL_MS = 500;
const MAX_SIGNALS = 20;
export type FromControlThread = { kind: 'ready' } | { kind: 'message'; frames: Uint8Array[] } | { kind: 'log'; line: string } | { kind: 'failed'; message: string };

const info = (workerData as { connection: ConnectionInfo }).connection;
const port = parentPort!;
const control = new zmq.Router({ linger: 0 });
const hb = new zmq.Reply({ linger: 0 });
const history = new SignatureHistory();
let closing = false;
let repeating: NodeJS.Timeout | undefined;

function stopRepeating(): void {
  if (repeating) clearInterval(repeating);
  repeating = undefined;
}

function raiseInterrupt(): void {
  stopRepeating();
  process.kill(process.pid, 'SIGINT');
  let sent = 1;
  repeating = setInterval(() => {
    if (++sent > MAX_SIGNALS) stopRepeating();
    else process.kill(process.pid, 'SIGINT');
  }, REPEAT_SIGNAL_MS);
}
let sending: Promise<void> = Promise.resolve();

const post = (m: FromControlThread) => port.postMessage(m);

async function heartbeat(): Promise<void> {
  try {
    for await (const frames of hb) await hb.send(frames);
  } catch (err) {
    if (!closing) post({ kind: 'log', line: `heartbeat stopped: ${String(err)}` });
  }
}

async function listen(): Promise<void> {
  try {
    for await (const frames of control) {
      const msg = decode(frames, info.key, history);
      if (typeof msg !== 'string' && msg.header.msg_type === 'interrupt_request') {
        // The main thread may be stuck in a cell: signal it from here. Not on Windows, where
        // process.kill(pid, 'SIGINT') ends the process instead of signalling it.
        if (process.platform !== 'win32') raiseInterrupt();
      }
      // Bad signatures are logged by the main thread, which checks every message again.
      post({ kind: 'message', frames });
    }
  } catch (err) {
    if (!closing) post({ kind: 'log', line: `control listener stopped: ${String(err)}` });
  }
}

port.on('message', (m: ToControlThread) => {
  if (m.kind === 'send') {
    sending = sending.then(() => control.send(m.frames.map((f) => (typeof f === 'string' ? f : Buffer.from(f.buffer, f.byteOffset, f.byteLength))))).catch((err: unknown) => post({ kind: 'log', line: `control send failed: ${String(err)}` }));
  } else if (m.kind === 'interrupt-handled') {
    stopRepeating();
  } else {
    closing = true;
    stopRepeating();
    void sending.then(() => {
      control.close();
      hb.close();
      port.close();
    });
  }
});

Promise.all([control.bind(endpoint(info, 'control')), hb.bind(endpoint(info, 'hb'))]).then(
  () => {
    void heartbeat();
    void listen();
    post({ kind: 'ready' });
  },
  (err: unknown) => post({ kind: 'failed', message: String(err) }),
);

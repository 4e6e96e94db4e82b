import { Session as InspectorSession } from 'node:inspector';
import { CellPhase, readPhase } from '../session/phase.js';
import type { Sendable } from './sendQueue.js';
import { encode, makeHeader, type Header, type Message } from './wire.js';
import type { ConnectionInfo } from './connection.js';

/**
 * How the control thread stops a cell for an interrupt_request, whatever the main thread is doing
 * (its phase is read from the shared flag, its liveness from the flag's tick):
 *
 * - compiling or running synchronous code: SIGINT, which breaks the cell's script (it runs with
 *   `breakOnSigint`). A signal that lands during compilation is spent before the cell's code
 *   runs, so it is repeated every half second until the main thread reports the request handled.
 * - waiting on an await with the main thread free: the main thread handles the request itself.
 * - busy after an await (a synchronous loop in a continuation; no signal reaches it): the main
 *   thread's JavaScript is stopped through the inspector (`Runtime.terminateExecution`); the
 *   interrupted await then ends the cell as usual.
 * - still stuck after that (native code that ignores both): the cell's output says the interrupt
 *   could not stop it and that a restart is needed, and the interrupt_reply is sent from here.
 * On Windows there are no signals to raise; the other steps apply.
 */
export interface InterruptDriverOptions {
  readonly connection: ConnectionInfo;
  readonly sessionId: string;
  readonly kernelId: string;
  readonly phase: Int32Array;
  send(channel: 'control' | 'iopub', frames: Sendable): void;
  log(line: string): void;
  /** Stops the main thread's JavaScript; true when asked (default: the inspector's Runtime.terminateExecution). */
  stopMainThread?: () => boolean;
}

export interface InterruptDriver {
  /** An interrupt_request arrived on control. */
  requested(msg: Message): void;
  /** The main thread started (parent) or finished (undefined) an execute request. */
  cell(parent: Header | undefined): void;
  /** The main thread has handled the interrupt request. */
  handled(): void;
  /** False when the driver already answered request `msgId` (the main thread's reply is dropped). */
  claimReply(msgId: string): boolean;
}

const CHECK_MS = 250;
const SIGNAL_EVERY = 2; // checks
/** Main-thread ticks must stall this long before it counts as blocked. */
const STALL_MS = 750;
/** After this long without the main thread handling the request, say so and answer. */
const GIVE_UP_MS = 6000;

export function createInterruptDriver(o: InterruptDriverOptions): InterruptDriver {
  let parent: Header | undefined;
  let timer: NodeJS.Timeout | undefined;
  const answered = new Set<string>();
  let inspector: InspectorSession | undefined;

  function stop(): void {
    if (timer) clearInterval(timer);
    timer = undefined;
  }

  function terminateMainThread(): boolean {
    if (o.stopMainThread) return o.stopMainThread();
    try {
      if (!inspector) {
        inspector = new InspectorSession();
        inspector.connectToMainThread();
      }
      inspector.post('Runtime.terminateExecution');
      return true;
    } catch (err) {
      o.log(`could not stop the main thread: ${String(err)}`);
      return false;
    }
  }

  function giveUp(request: Message): void {
    o.log('interrupt: the cell could not be stopped; a restart is needed');
    const text = 'The interrupt could not stop this cell: it is busy in code that neither a signal nor the kernel can break into. Restart the kernel to stop it (its variables will be lost).\n';
    if (parent) o.send('iopub', encode(o.connection.key, [`kernel.${o.kernelId}.stream`], makeHeader('stream', o.sessionId), parent, {}, { name: 'stderr', text }));
    answered.add(request.header.msg_id);
    o.send('control', encode(o.connection.key, request.identities, makeHeader('interrupt_reply', o.sessionId), request.header, {}, {
      status: 'error', ename: 'InterruptFailed', evalue: 'the running cell could not be stopped; restart the kernel', traceback: [],
    }));
  }

  return {
    requested(request) {
      stop();
      const started = Date.now();
      let checks = 0;
      let tick = Atomics.load(o.phase, 1);
      let tickSeen = Date.now();
      let terminated = false;
      const step = () => {
        const now = Date.now();
        const t = Atomics.load(o.phase, 1);
        if (t !== tick) {
          tick = t;
          tickSeen = now;
        }
        const phase = readPhase(o.phase);
        const stalled = now - tickSeen >= STALL_MS;
        if ((phase === CellPhase.Compiling || phase === CellPhase.Running) && checks % SIGNAL_EVERY === 0 && process.platform !== 'win32') {
          process.kill(process.pid, 'SIGINT');
        } else if (phase === CellPhase.Waiting && stalled && !terminated) {
          terminated = terminateMainThread();
        }
        checks++;
        if (now - started >= GIVE_UP_MS && stalled) {
          stop();
          giveUp(request);
        } else if (now - started >= 2 * GIVE_UP_MS) {
          stop();
        }
      };
      step();
      timer = setInterval(step, CHECK_MS);
    },
    cell(p) {
      parent = p;
    },
    handled: stop,
    claimReply: (msgId) => !answered.delete(msgId),
  };
}

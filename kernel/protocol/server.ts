/**
 * Our kernel side of the notebook messaging protocol (5.3) over zeromq: requests in, `busy` /
 * `idle` around each, replies and iopub messages out. The parts live beside it: the sockets and
 * the control thread (sockets.ts, controlThread.ts), the execute request (execute.ts), the
 * history (history.ts); cell work is delegated to a `Session` (kernel/session).
 *
 * Shell requests are handled one at a time, in arrival order. Control requests are handled as
 * they arrive, so `interrupt_request` and `shutdown_request` reach a cell that is waiting on an
 * `await`; a cell that blocks the event loop is stopped from the control thread
 * (interruptDriver.ts) or, in signal mode, by the front end's SIGINT.
 */
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import { msg } from '../../lib/internal.js';
import { createPhaseFlag, startTicking } from '../session/phase.js';
import type { Session } from '../session/types.js';
import type { ConnectionInfo } from './connection.js';
import { abortRequest, executeRequest, type ExecuteContext } from './execute.js';
import { ExecutionHistory } from './history.js';
import { kernelInfoContent } from './kernelInfo.js';
import { KernelSockets, type InboundChannel } from './sockets.js';
import { decode, encode, makeHeader, SignatureHistory, type Header, type Message } from './wire.js';

export interface KernelServerOptions {
  connection: ConnectionInfo;
  /** Makes the execution session; called once, after the first `idle` has been published. */
  createSession: (phase: Int32Array) => Session | Promise<Session>;
  /** Where diagnostics go (default: the process's stderr as it was when the server started). */
  log?: (line: string) => void;
  /** Kernel id used in iopub topics. */
  kernelId?: string;
  /** Serve control, heartbeat and iopub from a worker thread (default true; see controlThread.ts). */
  controlThread?: boolean;
}

const WARM_UP_QUIET_MS = 1000;
/** How long a blocking cell's neighbours get to arrive before the queue is marked for aborting. */
const ARRIVAL_GRACE_MS = 10;

export class KernelServer {
  private readonly info: ConnectionInfo;
  private readonly log: (line: string) => void;
  private readonly sessionId = randomUUID();
  private readonly kernelId: string;
  private readonly signatures = new SignatureHistory();
  private readonly phase = createPhaseFlag();
  private readonly sockets: KernelSockets;
  private readonly makeSession: KernelServerOptions['createSession'];
  private session: Promise<Session> | undefined;
  private executionCount = 0;
  private readonly history = new ExecutionHistory();
  private shellQueue: Array<{ msg: Message; seq: number }> = [];
  /** Number of shell messages received so far (their arrival order). */
  private received = 0;
  private shellBusy = false;
  /** After a failed cell with stop_on_error: execute requests with sequence numbers up to this are aborted. */
  private abortUpTo = 0;
  /** input_request msg_id → how to answer the cell waiting for it. */
  private readonly inputWaiters = new Map<string, (value: string) => void>();
  private stopping = false;
  private stopTicking: (() => void) | undefined;
  private warmUpTimer: NodeJS.Timeout | undefined;
  private readonly stopped: Promise<void>;
  private resolveStopped!: () => void;
  private readonly onSigint = () => {
    this.log('SIGINT received: interrupting the running cell');
    void this.session?.then((s) => s.interrupt());
  };

  constructor(options: KernelServerOptions) {
    this.info = options.connection;
    this.makeSession = options.createSession;
    const stderrWrite = process.stderr.write.bind(process.stderr);
    this.log = options.log ?? ((line) => void stderrWrite(`[sagitta kernel] ${line}\n`));
    this.kernelId = options.kernelId ?? randomUUID();
    this.sockets = new KernelSockets({
      connection: this.info,
      sessionId: this.sessionId,
      kernelId: this.kernelId,
      phase: this.phase,
      controlThread: options.controlThread !== false,
      log: this.log,
      receive: (frames, channel) => this.receive(frames, channel),
    });
    this.stopped = new Promise((resolve) => (this.resolveStopped = resolve));
  }

  /** Binds the sockets, publishes `starting`, and starts serving. */
  async start(): Promise<void> {
    await this.sockets.start();
    process.on('SIGINT', this.onSigint);
    this.stopTicking = startTicking(this.phase);
    await this.publish('status', { execution_state: 'starting' }, {});
  }

  /** Resolves when a shutdown request has been served and the sockets are closed. */
  whenStopped(): Promise<void> {
    return this.stopped;
  }

  /** Closes the sockets and the session. */
  async stop(): Promise<void> {
    if (this.stopping) return this.stopped;
    this.stopping = true;
    process.off('SIGINT', this.onSigint);
    this.stopTicking?.();
    if (this.warmUpTimer) clearTimeout(this.warmUpTimer);
    await this.sockets.close();
    if (this.session) {
      try {
        (await this.session).close();
      } catch {
        // A session that failed to start has nothing to close.
      }
    }
    this.resolveStopped();
  }

  /**
   * Starting the session (the TypeScript compiler) blocks the event loop for a second or two, so
   * it waits until the front end has been quiet for a moment after its first requests (it may
   * repeat kernel_info until its iopub subscription is live); a cell arriving earlier starts it.
   */
  private scheduleWarmUp(): void {
    if (this.warmUpTimer) clearTimeout(this.warmUpTimer);
    this.warmUpTimer = setTimeout(() => {
      this.warmUpTimer = undefined;
      if (this.stopping) return;
      this.getSession()
        .then((s) => s.warmUp?.())
        .catch((err: unknown) => this.log(`session failed to start: ${String(err)}`));
    }, WARM_UP_QUIET_MS);
    this.warmUpTimer.unref();
  }

  private getSession(): Promise<Session> {
    this.session ??= Promise.resolve().then(() => this.makeSession(this.phase));
    return this.session;
  }

  private receive(frames: Buffer[], channel: InboundChannel): void {
    const m = decode(frames, this.info.key, this.signatures);
    if (typeof m === 'string') {
      this.log(`${channel}: dropped a message (${m === 'bad-signature' ? 'bad signature' : m})`);
      return;
    }
    if (channel === 'shell') {
      this.shellQueue.push({ msg: m, seq: ++this.received });
      void this.pumpShell();
    } else if (channel === 'control') {
      void this.handle(m, 'control');
    } else if (m.header.msg_type === 'input_reply') {
      const answer = this.inputWaiters.get(String(m.parent_header.msg_id));
      this.inputWaiters.delete(String(m.parent_header.msg_id));
      answer?.(String(m.content.value ?? ''));
    }
  }

  private async pumpShell(): Promise<void> {
    if (this.shellBusy) return;
    this.shellBusy = true;
    try {
      while (this.shellQueue.length > 0 && !this.stopping) {
        const { msg: m, seq } = this.shellQueue.shift()!;
        if (seq <= this.abortUpTo && m.header.msg_type === 'execute_request') await abortRequest(this.executeContext('shell'), m);
        else await this.handle(m, 'shell');
      }
    } finally {
      this.shellBusy = false;
    }
  }

  private executeContext(channel: 'shell' | 'control'): ExecuteContext {
    return {
      publish: (type, content, parent) => this.publish(type, content, parent),
      reply: (request, type, content, metadata) => this.reply(channel, request, type, content, metadata),
      askFrontEnd: (request, prompt, password) => this.askFrontEnd(request, prompt, password),
      session: () => this.getSession(),
      history: this.history,
      count: (store) => (store ? ++this.executionCount : this.executionCount),
      abortQueued: async () => {
        // A blocking cell kept zeromq from handing over what the client sent meanwhile; let it
        // arrive, then mark everything received so far (before our reply) for aborting.
        await new Promise((resolve) => setTimeout(resolve, ARRIVAL_GRACE_MS));
        this.abortUpTo = this.received;
      },
      running: (parent) => this.sockets.cell(parent),
    };
  }

  private async handle(m: Message, channel: 'shell' | 'control'): Promise<void> {
    const type = m.header.msg_type;
    const parent = m.header;
    await this.publish('status', { execution_state: 'busy' }, parent);
    try {
      switch (type) {
        case 'kernel_info_request':
          await this.reply(channel, m, 'kernel_info_reply', kernelInfoContent());
          break;
        case 'execute_request':
          await executeRequest(this.executeContext(channel), m);
          break;
        case 'complete_request': {
          const code = String(m.content.code ?? '');
          const r = await (await this.getSession()).complete(code, Number(m.content.cursor_pos ?? [...code].length));
          await this.reply(channel, m, 'complete_reply', { status: 'ok', matches: r.matches, cursor_start: r.cursorStart, cursor_end: r.cursorEnd, metadata: {} });
          break;
        }
        case 'inspect_request': {
          const code = String(m.content.code ?? '');
          const data = await (await this.getSession()).inspect(code, Number(m.content.cursor_pos ?? [...code].length), Number(m.content.detail_level ?? 0));
          await this.reply(channel, m, 'inspect_reply', { status: 'ok', found: data !== undefined, data: data ?? {}, metadata: {} });
          break;
        }
        case 'is_complete_request': {
          const code = String(m.content.code ?? '');
          const status = await (await this.getSession()).isComplete(code);
          await this.reply(channel, m, 'is_complete_reply', status === 'incomplete' ? { status, indent: nextIndent(code) } : { status });
          break;
        }
        case 'comm_info_request':
          await this.reply(channel, m, 'comm_info_reply', { status: 'ok', comms: {} });
          break;
        case 'comm_open':
          // No comm targets exist here; the spec asks for an immediate close.
          await this.publish('comm_close', { comm_id: m.content.comm_id, data: {} }, parent);
          break;
        case 'comm_msg':
        case 'comm_close':
          break;
        case 'history_request':
          await this.reply(channel, m, 'history_reply', { status: 'ok', history: this.history.query(m.content) });
          break;
        case 'interrupt_request':
          // Before the session exists there is nothing to interrupt (and no reason to start it).
          await this.session?.then(
            (session) => session.interrupt(),
            () => undefined, // a session that failed to start runs nothing
          );
          this.sockets.interruptHandled();
          await this.reply(channel, m, 'interrupt_reply', { status: 'ok' });
          break;
        case 'shutdown_request': {
          const restart = m.content.restart === true;
          await this.reply(channel, m, 'shutdown_reply', { status: 'ok', restart });
          await this.publish('status', { execution_state: 'idle' }, parent);
          await this.stop();
          return;
        }
        default:
          this.log(`${channel}: ignoring unknown message type "${type}"`);
      }
    } catch (err) {
      this.log(`${channel}: ${type} failed: ${err instanceof Error ? (err.stack ?? err.message) : String(err)}`);
      // A request must not go unanswered: the front end would wait for ever.
      if (type.endsWith('_request')) {
        const error = err instanceof Error ? err : new Error(String(err));
        await this.reply(channel, m, type.replace(/_request$/, '_reply'), {
          status: 'error',
          ename: 'KernelError',
          evalue: error.message,
          traceback: [`KernelError: ${error.message}`],
          ...(type === 'execute_request' ? { execution_count: this.executionCount } : {}),
        });
      }
    }
    await this.publish('status', { execution_state: 'idle' }, parent);
    if (!this.session && !this.stopping) this.scheduleWarmUp();
  }

  /** input_request on stdin (messaging spec, "Messages on the stdin channel"), routed to the front end that sent `request`. */
  private askFrontEnd(request: Message, prompt: string, password: boolean): Promise<string> {
    if (this.stopping) return Promise.reject(msg.kernelState('ask for input', 'the kernel is shutting down'));
    const header = makeHeader('input_request', this.sessionId);
    return new Promise<string>((resolve) => {
      this.inputWaiters.set(header.msg_id, resolve);
      void this.sockets.send('stdin', encode(this.info.key, request.identities, header, request.header, {}, { prompt, password }));
    });
  }

  private reply(channel: 'shell' | 'control', request: Message, type: string, content: Record<string, unknown>, metadata: Record<string, unknown> = {}): Promise<void> {
    const header = makeHeader(type, this.sessionId);
    return this.sockets.send(channel, encode(this.info.key, request.identities, header, request.header, metadata, content), request.header.msg_id);
  }

  private publish(type: string, content: Record<string, unknown>, parent: Partial<Header>): Promise<void> {
    if (this.stopping) return Promise.resolve();
    const header = makeHeader(type, this.sessionId);
    return this.sockets.send('iopub', encode(this.info.key, [`kernel.${this.kernelId}.${type}`], header, parent, {}, content));
  }
}

/** The kernel id a front end put in the connection file's name ("kernel-<id>.json"), if any. */
export function kernelIdFromFile(file: string): string | undefined {
  const m = /^kernel-(.+)\.json$/.exec(path.basename(file));
  return m?.[1];
}

/** Indentation for the line after an unfinished one: its own, plus two spaces after an opening bracket. */
export function nextIndent(code: string): string {
  const last = code.split('\n').at(-1) ?? '';
  const current = /^\s*/.exec(last)![0];
  return /[{([]\s*$/.test(last) ? `${current}  ` : current;
}

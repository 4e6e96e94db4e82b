/**
 * Our kernel side of the notebook messaging protocol (5.3) over zeromq: five sockets bound to the
 * connection file's address, signed messages, `busy`/`idle` around every request, and the
 * request handlers, which delegate cell work to a `Session` (kernel/session).
 *
 * Shell requests are handled one at a time, in arrival order. Control requests are handled as
 * they arrive, so `interrupt_request` and `shutdown_request` reach a cell that is waiting on an
 * `await`. A cell blocking the event loop is interrupted by SIGINT: sent by the front end
 * (signal mode), or raised by the control thread (controlThread.ts) when an interrupt_request
 * arrives (message mode); that thread also keeps the heartbeat answering during long cells.
 */
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import * as zmq from 'zeromq';
import type { CellHooks, Session } from '../session/types.js';
import { endpoint, type ConnectionInfo } from './connection.js';
import type { FromControlThread, ToControlThread } from './controlThread.js';
import { kernelInfoContent } from './kernelInfo.js';
import { decode, encode, makeHeader, SignatureHistory, type Header, type Message } from './wire.js';

export interface KernelServerOptions {
  connection: ConnectionInfo;
  /** Makes the execution session; called once, after the first `idle` has been published. */
  createSession: () => Session | Promise<Session>;
  /** Where diagnostics go (default: the process's stderr as it was when the server started). */
  log?: (line: string) => void;
  /** Kernel id used in iopub topics. */
  kernelId?: string;
  /** Serve control and heartbeat from a worker thread (default true; see controlThread.ts). */
  controlThread?: boolean;
}

type Sendable = Array<Buffer | string>;

interface FrameSender {
  send(frames: Sendable): Promise<void>;
  drain(): Promise<void>;
}

/** zeromq allows one send at a time per socket; this keeps them in order. */
class SendQueue implements FrameSender {
  private tail: Promise<void> = Promise.resolve();
  constructor(private readonly socket: zmq.Writable, private readonly onError: (err: unknown) => void) {}
  send(frames: Sendable): Promise<void> {
    this.tail = this.tail.then(() => this.socket.send(frames)).catch(this.onError);
    return this.tail;
  }
  drain(): Promise<void> {
    return this.tail;
  }
}

const STREAM_FLUSH_MS = 30;
const WARM_UP_QUIET_MS = 1000;

export class KernelServer {
  private readonly info: ConnectionInfo;
  private readonly log: (line: string) => void;
  private readonly sessionId = randomUUID();
  private readonly kernelId: string;
  private readonly history = new SignatureHistory();
  private readonly shell = new zmq.Router({ linger: 0 });
  private readonly stdin = new zmq.Router({ linger: 0 });
  private readonly iopub = new zmq.Publisher({ linger: 0 });
  /** Control and heartbeat sockets when they live on the main thread. */
  private readonly control?: zmq.Router;
  private readonly hb?: zmq.Reply;
  /** The control thread, when control and heartbeat live there. */
  private worker?: Worker;
  private readonly out: { shell: FrameSender; control: FrameSender; stdin: FrameSender; iopub: FrameSender };
  private readonly makeSession: KernelServerOptions['createSession'];
  private session: Promise<Session> | undefined;
  private executionCount = 0;
  /** Cells run with store_history, as [session, line, input] (this kernel's lifetime is session 1). */
  private readonly inputs: Array<[number, number, string]> = [];
  private shellQueue: Array<{ msg: Message; seq: number }> = [];
  /** Number of shell messages received so far (their arrival order). */
  private received = 0;
  private shellBusy = false;
  /**
   * After a failed cell with stop_on_error: execute requests that had arrived before its reply
   * went out (sequence number up to this) are aborted; later ones run normally.
   */
  private abortUpTo = 0;
  private stopping = false;
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
    const onError = (err: unknown) => this.log(`send failed: ${err instanceof Error ? err.message : String(err)}`);
    let control: FrameSender;
    if (options.controlThread === false) {
      this.control = new zmq.Router({ linger: 0 });
      this.hb = new zmq.Reply({ linger: 0 });
      control = new SendQueue(this.control, onError);
    } else {
      control = {
        send: (frames) => {
          this.worker?.postMessage({ kind: 'send', frames } satisfies ToControlThread);
          return Promise.resolve();
        },
        drain: () => Promise.resolve(),
      };
    }
    this.out = {
      shell: new SendQueue(this.shell, onError),
      control,
      stdin: new SendQueue(this.stdin, onError),
      iopub: new SendQueue(this.iopub, onError),
    };
    this.stopped = new Promise((resolve) => (this.resolveStopped = resolve));
  }

  /** Binds the sockets, publishes `starting`, and starts serving. */
  async start(): Promise<void> {
    await Promise.all([
      this.shell.bind(endpoint(this.info, 'shell')),
      this.stdin.bind(endpoint(this.info, 'stdin')),
      this.iopub.bind(endpoint(this.info, 'iopub')),
      this.control ? this.control.bind(endpoint(this.info, 'control')) : this.startControlThread(),
      this.hb?.bind(endpoint(this.info, 'hb')),
    ]);
    process.on('SIGINT', this.onSigint);
    if (this.hb) void this.heartbeat(this.hb);
    void this.listen(this.shell, 'shell');
    if (this.control) void this.listen(this.control, 'control');
    void this.listen(this.stdin, 'stdin');
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
    if (this.warmUpTimer) clearTimeout(this.warmUpTimer);
    await Promise.all(Object.values(this.out).map((q) => q.drain()));
    for (const s of [this.shell, this.control, this.stdin, this.iopub, this.hb]) s?.close();
    if (this.worker) {
      const worker = this.worker;
      const exited = new Promise<void>((resolve) => worker.once('exit', () => resolve()));
      worker.postMessage({ kind: 'close' } satisfies ToControlThread);
      const timer = setTimeout(() => void worker.terminate(), 2000);
      await exited;
      clearTimeout(timer);
    }
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
    this.session ??= Promise.resolve().then(() => this.makeSession());
    return this.session;
  }

  private startControlThread(): Promise<void> {
    const worker = new Worker(new URL('./controlThreadEntry.js', import.meta.url), { workerData: { connection: this.info } });
    this.worker = worker;
    return new Promise<void>((resolve, reject) => {
      worker.on('message', (m: FromControlThread) => {
        if (m.kind === 'ready') resolve();
        else if (m.kind === 'failed') reject(new Error(`control thread: ${m.message}`));
        else if (m.kind === 'log') this.log(m.line);
        else this.receive(m.frames.map((f) => Buffer.from(f.buffer, f.byteOffset, f.byteLength)), 'control');
      });
      worker.once('error', (err) => {
        this.log(`control thread failed: ${String(err)}`);
        reject(err);
      });
    });
  }

  private async heartbeat(hb: zmq.Reply): Promise<void> {
    try {
      for await (const frames of hb) await hb.send(frames);
    } catch (err) {
      if (!this.stopping) this.log(`heartbeat stopped: ${String(err)}`);
    }
  }

  private async listen(socket: zmq.Router, channel: 'shell' | 'control' | 'stdin'): Promise<void> {
    try {
      for await (const frames of socket) this.receive(frames, channel);
    } catch (err) {
      if (!this.stopping) this.log(`${channel} listener stopped: ${String(err)}`);
    }
  }

  private receive(frames: Buffer[], channel: 'shell' | 'control' | 'stdin'): void {
    const msg = decode(frames, this.info.key, this.history);
    if (typeof msg === 'string') {
      this.log(`${channel}: dropped a message (${msg === 'bad-signature' ? 'bad signature' : msg})`);
      return;
    }
    if (channel === 'shell') {
      this.shellQueue.push({ msg, seq: ++this.received });
      void this.pumpShell();
    } else if (channel === 'control') {
      void this.handle(msg, 'control');
    }
    // stdin carries only replies to input requests, which this kernel does not make.
  }

  private async pumpShell(): Promise<void> {
    if (this.shellBusy) return;
    this.shellBusy = true;
    try {
      while (this.shellQueue.length > 0 && !this.stopping) {
        const { msg, seq } = this.shellQueue.shift()!;
        if (seq <= this.abortUpTo && msg.header.msg_type === 'execute_request') await this.abort(msg);
        else await this.handle(msg, 'shell');
      }
    } finally {
      this.shellBusy = false;
    }
  }

  private async handle(msg: Message, channel: 'shell' | 'control'): Promise<void> {
    const type = msg.header.msg_type;
    const parent = msg.header;
    await this.publish('status', { execution_state: 'busy' }, parent);
    try {
      switch (type) {
        case 'kernel_info_request':
          await this.reply(channel, msg, 'kernel_info_reply', kernelInfoContent());
          break;
        case 'execute_request':
          await this.execute(msg);
          break;
        case 'complete_request':
          await this.complete(msg);
          break;
        case 'inspect_request':
          await this.inspect(msg);
          break;
        case 'is_complete_request':
          await this.isComplete(msg);
          break;
        case 'comm_info_request':
          await this.reply(channel, msg, 'comm_info_reply', { status: 'ok', comms: {} });
          break;
        case 'comm_open':
          // No comm targets exist here; the spec asks for an immediate close.
          await this.publish('comm_close', { comm_id: msg.content.comm_id, data: {} }, parent);
          break;
        case 'comm_msg':
        case 'comm_close':
          break;
        case 'history_request':
          await this.reply(channel, msg, 'history_reply', { status: 'ok', history: this.historyFor(msg.content) });
          break;
        case 'interrupt_request':
          // Before the session exists there is nothing to interrupt (and no reason to start it).
          await this.session?.then(
            (session) => session.interrupt(),
            () => undefined, // a session that failed to start runs nothing
          );
          this.worker?.postMessage({ kind: 'interrupt-handled' } satisfies ToControlThread);
          await this.reply(channel, msg, 'interrupt_reply', { status: 'ok' });
          break;
        case 'shutdown_request': {
          const restart = msg.content.restart === true;
          await this.reply(channel, msg, 'shutdown_reply', { status: 'ok', restart });
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
        await this.reply(channel, msg, type.replace(/_request$/, '_reply'), {
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

  private async execute(msg: Message): Promise<void> {
    const c = msg.content as {
      code?: string;
      silent?: boolean;
      store_history?: boolean;
      stop_on_error?: boolean;
      user_expressions?: Record<string, unknown>;
    };
    const code = c.code ?? '';
    const silent = c.silent === true;
    const storeHistory = silent ? false : c.store_history !== false;
    const stopOnError = c.stop_on_error !== false;
    if (storeHistory) this.executionCount++;
    const count = this.executionCount;
    if (storeHistory) this.inputs.push([1, count, code]);
    const parent = msg.header;
    const started = new Date().toISOString();
    if (!silent) await this.publish('execute_input', { code, execution_count: count }, parent);

    let pending: { name: 'stdout' | 'stderr'; text: string } | undefined;
    let timer: NodeJS.Timeout | undefined;
    const flush = () => {
      if (timer) clearTimeout(timer);
      timer = undefined;
      if (pending) void this.publish('stream', { name: pending.name, text: pending.text }, parent);
      pending = undefined;
    };
    const hooks: CellHooks = {
      stream: (name, text) => {
        if (silent) return;
        if (pending && pending.name !== name) flush();
        pending = pending ? { name, text: pending.text + text } : { name, text };
        timer ??= setTimeout(flush, STREAM_FLUSH_MS);
      },
      display: (bundle, options) => {
        if (silent) return;
        flush();
        const transient = options.displayId === undefined ? {} : { display_id: options.displayId };
        const type = options.update && options.displayId !== undefined ? 'update_display_data' : 'display_data';
        void this.publish(type, { data: bundle, metadata: {}, transient }, parent);
      },
    };

    const session = await this.getSession();
    const outcome = await session.execute(code, hooks);
    flush();
    if (outcome.status === 'ok') {
      if (outcome.result && !silent) {
        await this.publish('execute_result', { execution_count: count, data: outcome.result, metadata: {} }, parent);
      }
      const userExpressions = await this.evaluateUserExpressions(session, c.user_expressions);
      await this.reply('shell', msg, 'execute_reply', { status: 'ok', execution_count: count, user_expressions: userExpressions, payload: [] }, { started, status: 'ok' });
      return;
    }
    const error = outcome.error ?? { ename: 'Error', evalue: 'the cell failed', traceback: [] };
    if (stopOnError) {
      // A blocking cell kept zeromq from handing over what the client sent meanwhile; let it
      // arrive, then mark everything received so far (before our reply) for aborting.
      await new Promise((resolve) => setTimeout(resolve, 10));
      this.abortUpTo = this.received;
    }
    if (!silent) await this.publish('error', { ename: error.ename, evalue: error.evalue, traceback: error.traceback }, parent);
    await this.reply(
      'shell',
      msg,
      'execute_reply',
      { status: 'error', execution_count: count, ename: error.ename, evalue: error.evalue, traceback: error.traceback },
      { started, status: 'error' },
    );
  }

  /**
   * The spec's user_expressions: each expression is evaluated after the cell, quietly, and its
   * value returned as a MIME bundle (or its error), keyed by the client's names.
   */
  private async evaluateUserExpressions(session: Session, expressions: Record<string, unknown> | undefined): Promise<Record<string, unknown>> {
    const out: Record<string, unknown> = {};
    const quiet: CellHooks = { stream: () => {}, display: () => {} };
    for (const [name, expression] of Object.entries(expressions ?? {})) {
      const r = await session.execute(String(expression), quiet);
      out[name] =
        r.status === 'ok'
          ? { status: 'ok', data: r.result ?? { 'text/plain': 'undefined' }, metadata: {} }
          : { status: 'error', ename: r.error?.ename ?? 'Error', evalue: r.error?.evalue ?? '', traceback: r.error?.traceback ?? [] };
    }
    return out;
  }

  /** history_request: 'tail' (last n), 'range' (start ≤ line < stop) or 'search' (glob pattern, * and ?). */
  private historyFor(content: Record<string, unknown>): Array<[number, number, string]> {
    const n = typeof content.n === 'number' ? content.n : this.inputs.length;
    switch (content.hist_access_type) {
      case 'range': {
        const start = typeof content.start === 'number' ? content.start : 0;
        const stop = typeof content.stop === 'number' ? content.stop : Infinity;
        return this.inputs.filter(([, line]) => line >= start && line < stop);
      }
      case 'search': {
        const re = globToRegExp(String(content.pattern ?? '*'));
        let found = this.inputs.filter(([, , input]) => re.test(input));
        if (content.unique === true) found = found.filter(([, , input], i) => found.findIndex(([, , other]) => other === input) === i);
        return found.slice(-n);
      }
      default:
        return this.inputs.slice(-n);
    }
  }

  /** Reply to an execute request that was queued behind a failed cell. */
  private async abort(msg: Message): Promise<void> {
    await this.publish('status', { execution_state: 'busy' }, msg.header);
    await this.reply('shell', msg, 'execute_reply', { status: 'aborted', execution_count: this.executionCount }, { status: 'aborted' });
    await this.publish('status', { execution_state: 'idle' }, msg.header);
  }

  private async complete(msg: Message): Promise<void> {
    const code = String(msg.content.code ?? '');
    const cursor = Number(msg.content.cursor_pos ?? [...code].length);
    const r = await (await this.getSession()).complete(code, cursor);
    await this.reply('shell', msg, 'complete_reply', { status: 'ok', matches: r.matches, cursor_start: r.cursorStart, cursor_end: r.cursorEnd, metadata: {} });
  }

  private async inspect(msg: Message): Promise<void> {
    const code = String(msg.content.code ?? '');
    const cursor = Number(msg.content.cursor_pos ?? [...code].length);
    const detail = Number(msg.content.detail_level ?? 0);
    const data = await (await this.getSession()).inspect(code, cursor, detail);
    await this.reply('shell', msg, 'inspect_reply', { status: 'ok', found: data !== undefined, data: data ?? {}, metadata: {} });
  }

  private async isComplete(msg: Message): Promise<void> {
    const code = String(msg.content.code ?? '');
    const status = await (await this.getSession()).isComplete(code);
    await this.reply('shell', msg, 'is_complete_reply', status === 'incomplete' ? { status, indent: nextIndent(code) } : { status });
  }

  private reply(channel: 'shell' | 'control', request: Message, type: string, content: Record<string, unknown>, metadata: Record<string, unknown> = {}): Promise<void> {
    const header = makeHeader(type, this.sessionId);
    return this.out[channel].send(encode(this.info.key, request.identities, header, request.header, metadata, content));
  }

  private publish(type: string, content: Record<string, unknown>, parent: Partial<Header>): Promise<void> {
    if (this.stopping) return Promise.resolve();
    const header = makeHeader(type, this.sessionId);
    return this.out.iopub.send(encode(this.info.key, [`kernel.${this.kernelId}.${type}`], header, parent, {}, content));
  }
}


/** The kernel id a front end put in the connection file's name ("kernel-<id>.json"), if any. */
export function kernelIdFromFile(file: string): string | undefined {
  const m = /^kernel-(.+)\.json$/.exec(path.basename(file));
  return m?.[1];
}

/** A shell-style glob (`*` any run, `?` one character) as an anchored regular expression. */
function globToRegExp(glob: string): RegExp {
  const body = [...glob]
    .map((ch) => (ch === '*' ? '[\\s\\S]*' : ch === '?' ? '[\\s\\S]' : ch.replace(/[.+^${}()|[\]\\]/g, (c) => `\\${c}`)))
    .join('');
  return new RegExp(`^${body}$`);
}

/** Indentation for the line after an unfinished one: its own, plus two spaces after an opening bracket. */
export function nextIndent(code: string): string {
  const last = code.split('\n').at(-1) ?? '';
  const current = /^\s*/.exec(last)![0];
  return /[{([]\s*$/.test(last) ? `${current}  ` : current;
}

/**
 * A small notebook-protocol client, written for the tests from the public messaging specification
 * (Jupyter messaging protocol 5.3, "The Wire Protocol", "Messages on the shell/control/IOPub
 * channels", "Heartbeat"), on purpose independent of the kernel's own code in kernel/protocol:
 * it signs, frames and parses messages itself, so a mistake shared by both sides cannot hide.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { createHmac, randomUUID } from 'node:crypto';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import * as zmq from 'zeromq';

export interface WireMessage {
  header: { msg_id: string; msg_type: string; session: string; date: string; version: string; username: string };
  parent_header: { msg_id?: string; msg_type?: string };
  metadata: Record<string, unknown>;
  content: Record<string, any>;
}

/** A free TCP port on the loopback address (bound and released; good enough for a test). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const port = (srv.address() as { port: number }).port;
      srv.close(() => resolve(port));
    });
  });
}

/** HMAC-SHA256 over header, parent header, metadata and content (spec: "The Wire Protocol"). */
function signature(key: string, parts: string[]): string {
  const h = createHmac('sha256', key);
  for (const p of parts) h.update(p);
  return h.digest('hex');
}

export class ProtocolClient {
  readonly key = randomUUID();
  readonly session = randomUUID();
  private readonly routingId = `client-${randomUUID()}`;
  private readonly shell = new zmq.Dealer({ routingId: this.routingId, linger: 0 });
  /** Spec: the stdin socket has the same identity as the shell socket, so input_request finds it. */
  private readonly stdin = new zmq.Dealer({ routingId: this.routingId, linger: 0 });
  /** Answers input_request messages; every request seen is kept in `inputRequests`. */
  answerInput: (prompt: string, password: boolean) => string = () => '';
  readonly inputRequests: WireMessage[] = [];
  private readonly control = new zmq.Dealer({ routingId: `client-${randomUUID()}`, linger: 0 });
  private readonly iopub = new zmq.Subscriber({ linger: 0 });
  private readonly hb = new zmq.Request({ linger: 0, receiveTimeout: 3000 });
  /** Every iopub message, in arrival order. */
  readonly published: WireMessage[] = [];
  private readonly replies = new Map<string, (m: WireMessage) => void>();
  private readonly earlyReplies = new Map<string, WireMessage>();
  private waiters: Array<() => void> = [];
  kernel?: ChildProcess;
  stderr = '';
  exitCode: Promise<number | null> = Promise.resolve(null);
  connectionFile = '';

  async connectionInfo(): Promise<Record<string, unknown>> {
    const [shell_port, control_port, iopub_port, stdin_port, hb_port] = await Promise.all([freePort(), freePort(), freePort(), freePort(), freePort()]);
    return { transport: 'tcp', ip: '127.0.0.1', shell_port, control_port, iopub_port, stdin_port, hb_port, key: this.key, signature_scheme: 'hmac-sha256', kernel_name: 'sagitta-test' };
  }

  /** Starts the kernel the way a front end does: argv from kernel.json with {connection_file} filled in. */
  async launch(argv: string[], cwd: string): Promise<void> {
    const info = await this.connectionInfo();
    const dir = mkdtempSync(path.join(tmpdir(), 'sagitta-conn-'));
    this.connectionFile = path.join(dir, `kernel-${randomUUID()}.json`);
    writeFileSync(this.connectionFile, JSON.stringify(info));
    const args = argv.map((a) => (a === '{connection_file}' ? this.connectionFile : a));
    const child = spawn(args[0], args.slice(1), { cwd, stdio: ['ignore', 'pipe', 'pipe'] });
    this.kernel = child;
    child.stderr!.on('data', (d: Buffer) => (this.stderr += d.toString()));
    child.stdout!.on('data', () => {});
    this.exitCode = new Promise((resolve) => child.once('exit', (code) => resolve(code)));
    this.connect(info);
  }

  /** Connects to a kernel already serving `info` (e.g. one started in this process). */
  connect(info: Record<string, unknown>): void {
    const at = (port: unknown) => `tcp://127.0.0.1:${port}`;
    this.shell.connect(at(info.shell_port));
    this.control.connect(at(info.control_port));
    this.iopub.connect(at(info.iopub_port));
    this.iopub.subscribe();
    this.hb.connect(at(info.hb_port));
    this.stdin.connect(at(info.stdin_port));
    void this.readStdin();
    void this.read(this.shell);
    void this.read(this.control);
    void this.read(this.iopub);
  }

  private async read(socket: zmq.Dealer | zmq.Subscriber): Promise<void> {
    try {
      for await (const frames of socket) {
        const i = frames.findIndex((f) => f.toString() === '<IDS|MSG>');
        if (i < 0) continue;
        const [sig, ...json] = frames.slice(i + 1, i + 6).map((f) => f.toString('utf8'));
        if (sig !== signature(this.key, json)) throw new Error(`kernel sent a badly signed message: ${json[0]}`);
        const [header, parent_header, metadata, content] = json.map((s) => JSON.parse(s));
        const msg: WireMessage = { header, parent_header, metadata, content };
        if (socket === this.iopub) {
          this.published.push(msg);
          const w = this.waiters;
          this.waiters = [];
          w.forEach((f) => f());
        } else {
          const done = this.replies.get(parent_header.msg_id);
          if (done) done(msg);
          else this.earlyReplies.set(parent_header.msg_id, msg);
        }
      }
    } catch {
      // Socket closed at the end of the test.
    }
  }

  private async readStdin(): Promise<void> {
    try {
      for await (const frames of this.stdin) {
        const i = frames.findIndex((f) => f.toString() === '<IDS|MSG>');
        const [sig, ...json] = frames.slice(i + 1, i + 6).map((f) => f.toString('utf8'));
        if (sig !== signature(this.key, json)) throw new Error(`kernel sent a badly signed message: ${json[0]}`);
        const [header, parent_header, metadata, content] = json.map((s) => JSON.parse(s));
        const request: WireMessage = { header, parent_header, metadata, content };
        this.inputRequests.push(request);
        const reply = { msg_id: randomUUID(), session: this.session, username: 'test', date: new Date().toISOString(), msg_type: 'input_reply', version: '5.3' };
        const body = [JSON.stringify(reply), JSON.stringify(header), '{}', JSON.stringify({ value: this.answerInput(String(content.prompt), content.password === true) })];
        await this.stdin.send(['<IDS|MSG>', signature(this.key, body), ...body]);
      }
    } catch {
      // Socket closed at the end of the test.
    }
  }

  /** Frames for a request; `tamper` corrupts the signature to test that the kernel drops it. */
  frames(msgType: string, content: Record<string, unknown>, tamper = false): { id: string; frames: string[] } {
    const id = randomUUID();
    const header = { msg_id: id, session: this.session, username: 'test', date: new Date().toISOString(), msg_type: msgType, version: '5.3' };
    const json = [JSON.stringify(header), '{}', '{}', JSON.stringify(content)];
    let sig = signature(this.key, json);
    if (tamper) sig = sig.slice(0, -1) + (sig.endsWith('0') ? '1' : '0');
    return { id, frames: ['<IDS|MSG>', sig, ...json] };
  }

  /** Sends a request and returns its id and a promise of the reply. */
  async send(channel: 'shell' | 'control', msgType: string, content: Record<string, unknown>, tamper = false): Promise<{ id: string; reply: Promise<WireMessage> }> {
    const { id, frames } = this.frames(msgType, content, tamper);
    const reply = new Promise<WireMessage>((resolve) => {
      const early = this.earlyReplies.get(id);
      if (early) resolve(early);
      else this.replies.set(id, resolve);
    });
    await (channel === 'shell' ? this.shell : this.control).send(frames);
    return { id, reply };
  }

  /** Sends a request, waits for its reply and for the kernel to go idle after it. */
  async request(channel: 'shell' | 'control', msgType: string, content: Record<string, unknown> = {}, timeoutMs = 60_000): Promise<{ reply: WireMessage; iopub: WireMessage[] }> {
    const { id, reply } = await this.send(channel, msgType, content);
    const r = await withTimeout(reply, timeoutMs, `${msgType} reply`);
    await this.waitFor((m) => m.parent_header.msg_id === id && m.header.msg_type === 'status' && m.content.execution_state === 'idle', timeoutMs);
    return { reply: r, iopub: this.published.filter((m) => m.parent_header.msg_id === id) };
  }

  /** Waits until an iopub message matching `test` has arrived. */
  async waitFor(test: (m: WireMessage) => boolean, timeoutMs: number): Promise<WireMessage> {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const found = this.published.find(test);
      if (found) return found;
      const left = deadline - Date.now();
      if (left <= 0) throw new Error('timed out waiting for an iopub message');
      await new Promise<void>((resolve) => {
        const t = setTimeout(resolve, left);
        this.waiters.push(() => {
          clearTimeout(t);
          resolve();
        });
      });
    }
  }

  /**
   * Until the iopub subscription is live, published messages are lost (a PUB socket drops what no
   * subscriber has joined for); so ask for kernel_info until its status messages arrive.
   */
  async handshake(timeoutMs = 30_000, retryMs = 500): Promise<WireMessage> {
    const deadline = Date.now() + timeoutMs;
    while (Date.now() < deadline) {
      const { id, reply } = await this.send('shell', 'kernel_info_request', {});
      const r = await withTimeout(reply, deadline - Date.now(), 'kernel_info_reply');
      try {
        await this.waitFor((m) => m.parent_header.msg_id === id && m.content.execution_state === 'idle', retryMs);
        return r;
      } catch {
        // iopub not joined yet; ask again.
      }
    }
    throw new Error('kernel did not answer kernel_info with status messages');
  }

  async ping(payload: string): Promise<string> {
    await this.hb.send(payload);
    const [echo] = await this.hb.receive();
    return echo.toString();
  }

  close(): void {
    for (const s of [this.shell, this.control, this.iopub, this.hb, this.stdin]) s.close();
    if (this.kernel && this.kernel.exitCode === null) this.kernel.kill('SIGKILL');
  }
}

export function withTimeout<T>(p: Promise<T>, ms: number, what: string): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const t = setTimeout(() => reject(new Error(`timed out waiting for ${what}`)), ms);
    p.then(
      (v) => (clearTimeout(t), resolve(v)),
      (e) => (clearTimeout(t), reject(e)),
    );
  });
}

/** kernel.json as installed. */
export function readKernelJson(dir: string): { argv: string[]; display_name: string; language: string; interrupt_mode?: string } {
  return JSON.parse(readFileSync(path.join(dir, 'kernel.json'), 'utf8'));
}

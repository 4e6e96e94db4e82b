import type { ChildProcess } from 'node:child_process';
import { longTimer } from './longTimer.js';
import type { FromChild, ToChild } from './messages.js';

export type Waited =
  | { kind: 'message'; message: FromChild }
  | { kind: 'timeout' }
  | { kind: 'exit'; code: number | null; signal: NodeJS.Signals | null };

/** The IPC link to the notebook process: message listeners, a wait with timeout, exit tracking, clean close. */
export class ChildChannel {
  readonly listeners = new Set<(m: FromChild) => void>();
  /** Output the child wrote outside a cell's capture (e.g. a crash message). */
  stray = '';
  private exited: { code: number | null; signal: NodeJS.Signals | null } | undefined;
  private readonly exitWaiters = new Set<() => void>();

  constructor(private readonly child: ChildProcess) {
    child.on('message', (m) => {
      for (const l of [...this.listeners]) l(m as FromChild);
    });
    child.stdout?.setEncoding('utf8').on('data', (s: string) => { this.stray += s; });
    child.stderr?.setEncoding('utf8').on('data', (s: string) => { this.stray += s; });
    child.on('exit', (code, signal) => {
      this.exited = { code, signal };
      for (const w of [...this.exitWaiters]) w();
    });
    child.on('error', () => { /* reported through 'exit' */ });
  }

  send(m: ToChild): void {
    if (this.exited === undefined && this.child.connected) this.child.send(m);
  }

  /** Stops the notebook process at once. */
  kill(): void {
    if (this.exited === undefined) this.child.kill('SIGKILL');
  }

  waitFor(match: (m: FromChild) => boolean, timeoutMs: number): Promise<Waited> {
    if (this.exited) return Promise.resolve({ kind: 'exit', ...this.exited });
    return new Promise((resolveWait) => {
      let cancel = () => {};
      const finish = (w: Waited) => {
        cancel();
        this.listeners.delete(onMessage);
        this.exitWaiters.delete(onExit);
        resolveWait(w);
      };
      const onMessage = (m: FromChild) => { if (match(m)) finish({ kind: 'message', message: m }); };
      const onExit = () => {
        // Let stdout/stderr already in flight arrive before reporting the exit.
        setTimeout(() => finish({ kind: 'exit', ...this.exited! }), 20);
      };
      this.listeners.add(onMessage);
      this.exitWaiters.add(onExit);
      cancel = longTimer(() => {
        this.kill();
        finish({ kind: 'timeout' });
      }, timeoutMs);
    });
  }

  /** Asks the child to close its session and exit; kills it if it has not within 3 s. */
  async close(): Promise<void> {
    if (this.exited) return;
    const gone = new Promise<void>((r) => this.exitWaiters.add(r));
    this.send({ kind: 'close' });
    const timer = setTimeout(() => this.kill(), 3000);
    await gone;
    clearTimeout(timer);
  }
}

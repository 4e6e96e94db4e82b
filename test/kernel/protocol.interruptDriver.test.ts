/**
 * The control thread's interrupt driver (kernel/protocol/interruptDriver.ts) with a stuck main
 * thread simulated by a phase flag whose tick never moves: it stops the main thread once, and
 * when that does not help either, says under the cell that a restart is needed and answers the
 * interrupt_request itself (messaging spec: every request gets a reply).
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { CellPhase, createPhaseFlag, setPhase } from '../../kernel/session/phase.js';
import { createInterruptDriver } from '../../kernel/protocol/interruptDriver.js';
import { makeHeader, type Message } from '../../kernel/protocol/wire.js';

afterEach(() => vi.useRealTimers());

function request(): Message {
  return { identities: [Buffer.from('client')], header: makeHeader('interrupt_request', 'client-session'), parent_header: {}, metadata: {}, content: {}, buffers: [] };
}

describe('interrupt driver', () => {
  it('a cell stuck after an await: one stop of the main thread, then "restart needed" under the cell and an error interrupt_reply', () => {
    vi.useFakeTimers();
    const phase = createPhaseFlag();
    setPhase(phase, CellPhase.Waiting);
    const sent: Array<{ channel: string; type: string; content: Record<string, unknown> }> = [];
    let stops = 0;
    const driver = createInterruptDriver({
      connection: { transport: 'tcp', ip: '127.0.0.1', shell_port: 1, control_port: 2, iopub_port: 3, stdin_port: 4, hb_port: 5, key: '', signature_scheme: 'hmac-sha256' },
      sessionId: 'kernel-session', kernelId: 'k', phase,
      send: (channel, frames) => sent.push({ channel, type: JSON.parse(String(frames.at(-4))).msg_type, content: JSON.parse(String(frames.at(-1))) }),
      log: () => {},
      stopMainThread: () => (stops++, true),
    });
    const cell = makeHeader('execute_request', 'client-session');
    driver.cell(cell);
    const ask = request();
    driver.requested(ask);
    vi.advanceTimersByTime(2000);
    expect(stops).toBe(1);
    expect(sent).toEqual([]);
    vi.advanceTimersByTime(5000);
    expect(sent.map((s) => [s.channel, s.type])).toEqual([['iopub', 'stream'], ['control', 'interrupt_reply']]);
    expect(sent[0].content).toMatchObject({ name: 'stderr' });
    expect(String(sent[0].content.text)).toMatch(/could not stop this cell.*Restart the kernel/);
    expect(sent[1].content).toMatchObject({ status: 'error', ename: 'InterruptFailed' });
    // The main thread's own reply, if it ever comes, is not sent twice.
    expect(driver.claimReply(ask.header.msg_id)).toBe(false);
    expect(driver.claimReply('another request')).toBe(true);
  });

  it('a main thread that handles the request in time: no stop, nothing said', () => {
    vi.useFakeTimers();
    const phase = createPhaseFlag();
    setPhase(phase, CellPhase.Waiting);
    const sent: unknown[] = [];
    let stops = 0;
    const driver = createInterruptDriver({
      connection: { transport: 'tcp', ip: '127.0.0.1', shell_port: 1, control_port: 2, iopub_port: 3, stdin_port: 4, hb_port: 5, key: '', signature_scheme: 'hmac-sha256' },
      sessionId: 's', kernelId: 'k', phase, send: (...a) => sent.push(a), log: () => {}, stopMainThread: () => (stops++, true),
    });
    driver.requested(request());
    Atomics.add(phase, 1, 1);
    vi.advanceTimersByTime(250);
    driver.handled();
    vi.advanceTimersByTime(10_000);
    expect([stops, sent.length]).toEqual([0, 0]);
  });
});

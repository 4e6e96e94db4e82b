import { type MimeBundle } from '../../lib/index.js';
import { joinSource } from '../notebook/source.js';
import type { CodeCell, DisplayDataOutput } from '../notebook/types.js';
import type { ChildChannel } from './childChannel.js';
import type { FromChild } from './messages.js';

/** How the wait for a cell ended. */
export type CellEnd =
  | { kind: 'done'; message: Extract<FromChild, { kind: 'done' }> }
  | { kind: 'timeout' }
  | { kind: 'exit'; code: number | null; signal: NodeJS.Signals | null };

/**
 * Runs one code cell in the child and writes what it produced into the cell, as a front end
 * would keep it: streams merged per stream, displays (replaced in place by a refresh of their
 * display id), clear_output applied (at once, or with `wait` when the next output arrives), the
 * result or the error last.
 */
export async function runCell(
  channel: ChildChannel,
  cell: CodeCell,
  at: { index: number; step: number },
  timeoutMs: number,
  displays: Map<string, DisplayDataOutput[]>,
): Promise<CellEnd> {
  let clearOnNext = false;
  const beforeOutput = () => {
    if (clearOnNext) cell.outputs = [];
    clearOnNext = false;
  };
  const listener = (m: FromChild) => {
    // Late output of an earlier cell's timers shows where it appeared: under the running cell.
    if (m.kind === 'stream') {
      beforeOutput();
      pushStream(cell, m.name, m.text);
    } else if (m.kind === 'clear') {
      if (m.wait) clearOnNext = true;
      else cell.outputs = [];
    } else if (m.kind === 'display') {
      if (m.update && m.displayId !== undefined) {
        for (const out of displays.get(m.displayId) ?? []) out.data = m.bundle as MimeBundle;
        return;
      }
      beforeOutput();
      const out: DisplayDataOutput = { output_type: 'display_data', data: m.bundle, metadata: {} };
      cell.outputs.push(out);
      if (m.displayId !== undefined) displays.set(m.displayId, [...(displays.get(m.displayId) ?? []), out]);
    }
  };
  channel.listeners.add(listener);
  try {
    channel.send({ kind: 'cell', index: at.index, step: at.step, code: joinSource(cell.source) });
    const end = await channel.waitFor((m) => m.kind === 'done' && m.index === at.index, timeoutMs);
    if (end.kind === 'timeout') return { kind: 'timeout' };
    if (end.kind === 'exit') return end;
    const done = end.message as Extract<FromChild, { kind: 'done' }>;
    const { outcome } = done;
    if (outcome.status === 'ok' && outcome.result) {
      beforeOutput();
      cell.outputs.push({ output_type: 'execute_result', execution_count: at.step, data: outcome.result, metadata: {} });
    } else if (outcome.status === 'error' && outcome.error) {
      beforeOutput();
      cell.outputs.push({ output_type: 'error', ename: outcome.error.ename, evalue: outcome.error.evalue, traceback: outcome.error.traceback });
    }
    return { kind: 'done', message: done };
  } finally {
    channel.listeners.delete(listener);
  }
}

/** Appends stream text, merging with the previous output when it is the same stream (as front ends do). */
export function pushStream(cell: CodeCell, name: 'stdout' | 'stderr', text: string): void {
  const last = cell.outputs[cell.outputs.length - 1];
  if (last && last.output_type === 'stream' && last.name === name) last.text = joinSource(last.text) + text;
  else cell.outputs.push({ output_type: 'stream', name, text });
}

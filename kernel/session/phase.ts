/**
 * Where the kernel's main thread is with a cell, in a shared word the control thread can read
 * while the main thread is stuck: that is how the control thread knows whether an interrupt can
 * be delivered as a signal (compiling or running synchronous code) or must stop a cell that is
 * busy after an await (see kernel/protocol/controlThread.ts).
 *
 * Word 0 holds the phase; word 1 is a tick the main thread advances while its event loop runs.
 */
export const CellPhase = Object.freeze({ Idle: 0, Compiling: 1, Running: 2, Waiting: 3 } as const);
export type CellPhase = (typeof CellPhase)[keyof typeof CellPhase];

/** A fresh shared flag (two 32-bit words). */
export function createPhaseFlag(): Int32Array {
  return new Int32Array(new SharedArrayBuffer(8));
}

export function setPhase(flag: Int32Array | undefined, phase: CellPhase): void {
  if (flag) Atomics.store(flag, 0, phase);
}

export function readPhase(flag: Int32Array): CellPhase {
  return Atomics.load(flag, 0) as CellPhase;
}

/** Advances the liveness tick every `everyMs` while the event loop runs; returns a stop function. */
export function startTicking(flag: Int32Array, everyMs = 100): () => void {
  const timer = setInterval(() => Atomics.add(flag, 1, 1), everyMs);
  timer.unref();
  return () => clearInterval(timer);
}

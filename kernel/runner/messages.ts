import type { ProvenanceSnapshot } from '../../lib/provenance.js';
import type { MimeBundle } from '../../lib/display.js';
import type { CellOutcome } from '../session/types.js';

/** Messages from the runner to its child process (over Node's IPC channel, JSON). */
export type ToChild =
  | { kind: 'start'; workDir: string }
  | { kind: 'cell'; index: number; code: string }
  | { kind: 'close' };

/** Messages from the child back to the runner. */
export type FromChild =
  | { kind: 'ready'; typescript: string; startMs: number }
  | { kind: 'stream'; index: number; name: 'stdout' | 'stderr'; text: string }
  | { kind: 'display'; index: number; bundle: MimeBundle; displayId?: string; update?: boolean }
  /** `execMs`: time the session spent on the cell inside the child (compile + run). */
  | { kind: 'done'; index: number; outcome: CellOutcome; provenance: ProvenanceSnapshot; execMs: number }
  | { kind: 'fault'; message: string };

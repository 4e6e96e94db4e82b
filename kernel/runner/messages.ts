import { type MimeBundle } from '../../lib/index.js';
import { type KnobRecord, type ProvenanceSnapshot } from '../../lib/internal.js';
import type { CellOutcome } from '../session/types.js';
import type { ModuleRecord } from './runRecord.js';

/** The child's argument that asks it to start the ahead check's thread at once (kernel/session/compileAhead.ts). */
export const COMPILE_AHEAD_FLAG = '--compile-ahead';

/** Messages from the runner to its child process (over Node's IPC channel, JSON). */
export type ToChild =
  /**
   * `cells`: every code cell (index, source), for finding knobs and compiling ahead; `knobs`:
   * supplied values as [name, text].
   */
  | { kind: 'start'; workDir: string; cells: Array<{ index: number; code: string }>; knobs: Array<[string, string]> }
  | { kind: 'cell'; index: number; step: number; code: string }
  | { kind: 'close' };

/** Messages from the child back to the runner. */
export type FromChild =
  | { kind: 'ready'; typescript: string; startMs: number }
  /** The supplied knob values do not fit the notebook's knobs; nothing ran. */
  | { kind: 'refused'; problems: string[] }
  | { kind: 'stream'; index: number; name: 'stdout' | 'stderr'; text: string }
  | { kind: 'display'; index: number; bundle: MimeBundle; displayId?: string; update?: boolean }
  | { kind: 'clear'; index: number; wait: boolean }
  /** `execMs`: time the session spent on the cell inside the child (compile + run). */
  | { kind: 'done'; index: number; outcome: CellOutcome; provenance: ProvenanceSnapshot; knobs: readonly KnobRecord[]; modules: ModuleRecord[]; execMs: number }
  | { kind: 'fault'; message: string };

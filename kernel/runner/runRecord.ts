import { type SeedRecord } from '../../lib/index.js';
import { type KnobRecord } from '../../lib/internal.js';

/** What the run used of the library itself: enough to rebuild the same code. */
export interface LibraryRecord {
  readonly version: string;
  /** The checkout's commit, with "+ local changes" when files differ from it; undefined outside a git checkout. */
  readonly commit?: string;
  /** SHA-256 of package-lock.json (which pins every dependency), when the package has one. */
  readonly lockfileSha256?: string;
}

/** A local module a cell imported (a .ts file next to the notebook), by path relative to the notebook. */
export interface ModuleRecord {
  readonly path: string;
  readonly sha256: string;
  readonly sizeBytes: number;
}

/** A data file the run read, by path relative to the notebook; `simulated` when a simulator run record made it. */
export interface InputFile {
  readonly path: string;
  readonly sizeBytes: number;
  readonly sha256: string;
  readonly simulated?: { readonly runRecord: string; readonly seed?: number | string; readonly scenario?: string };
}

/**
 * The record of one headless run: what ran, how it ended and everything that shaped its result.
 * The runner writes it; the report (kernel/report) shows it.
 */
export interface RunRecord {
  /** The notebook: its file name (the reference point for every other path), bytes' hash and size. */
  readonly source: { readonly path: string; readonly sha256: string; readonly sizeBytes: number };
  /** ISO-8601 start of the run. */
  readonly startedAt: string;
  readonly wallMs: number;
  /** 'complete' when every code cell ran without error. */
  readonly status: 'complete' | 'stopped' | 'errors';
  /** One line saying why the run did not complete. */
  readonly reason?: string;
  /** The knobs the notebook declared, with the values used (supplied or default). */
  readonly knobs: readonly KnobRecord[];
  /** Data files read (paths relative to the notebook) and the seeds the cells used. */
  readonly inputs: readonly InputFile[];
  readonly seeds: readonly SeedRecord[];
  /** True when a result rests on stopping powers or ranges (the clinical caution applies). */
  readonly usesStoppingPower: boolean;
  /** Local .ts modules the cells imported. */
  readonly modules: readonly ModuleRecord[];
  readonly library: LibraryRecord;
  /** Node.js, and the TypeScript compiler that compiled the cells (tslab's bundled one). */
  readonly versions: { readonly node: string; readonly cellCompiler: string };
}

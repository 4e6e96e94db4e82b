import { type ColumnTable, type HitTable } from '../../lib/index.js';

/**
 * A job the batch path runs on every chunk of whole events of a hit file — in the main thread
 * or in worker threads, with the same result either way. `sagitta fit` is one; a command that
 * works event by event (vertices, track finding) adds its own: a file exporting a `BatchJob`
 * and one line in `BATCH_JOBS` (batchJobs.ts). Options must be plain data (they cross threads).
 */
export interface BatchJob<O> {
  readonly name: string;
  run(hits: HitTable, options: O): JobOutput;
}

/** What a job gives back for one chunk. */
export interface JobOutput {
  /** One row per result (a track, a vertex …), in input order. */
  readonly table: ColumnTable;
  /** Counts the run's summary and the JSON meta block add up over chunks (and over shards). */
  readonly counts: Readonly<Record<string, number>>;
  /** Position in the input of each row's first hit (only when asked for: sharded runs). */
  readonly firstHitPosition?: Float64Array;
  /** Per-row values the summary needs whole (e.g. for a median); concatenated over chunks in order. */
  readonly samples?: Readonly<Record<string, Float64Array>>;
  /** Facts about the run that every chunk agrees on, for the summary. */
  readonly hasZ?: boolean;
  readonly method?: string;
  readonly estimatedErrors?: boolean;
}

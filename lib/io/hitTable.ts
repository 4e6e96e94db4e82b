import type { HitCoordinates } from './hitCoordinates.js';
import type { IdLabels } from './hitIds.js';

/**
 * The hit table: one row per measured point, stored as typed-array columns (STYLE.md §2).
 *
 * Lengths are in metres inside Sagitta whatever the file said; `source.units` records what the
 * file used so that summaries can say so. Rows of one track are identified by (event, track);
 * within a track the rows are in the order the particle travelled (first hit = where it
 * entered or was produced) — the turning sense, and so the charge, is read from that order.
 */
export interface HitTable extends HitCoordinates {
  readonly length: number;
  /** Event and track ids: exact whole numbers (codes when beyond 2⁵³ − 1, see source.idLabels). */
  readonly event: Float64Array;
  readonly track: Float64Array;
  /**
   * Place of each hit along its track in the direction of travel (0 = first), when the file has
   * a `hit_order` column (as `sagitta find` writes): the rows of a track are then taken in this
   * order, whatever their order in the file.
   */
  readonly hitOrder?: Float64Array;
  /** Where the rows came from, for messages and provenance. */
  readonly source: HitTableSource;
}

export interface HitTableSource {
  /** File name as given by the caller, or a label like "(memory)". */
  readonly file: string;
  /** The unit each length column was read in, e.g. { x: 'mm', y: 'mm', z: 'cm' }. */
  readonly units: Readonly<Record<string, string>>;
  /** 1-based line of each row in the file (for error messages downstream). */
  readonly line?: Int32Array;
  /** Columns present in the file that Sagitta does not use. */
  readonly ignoredColumns: readonly string[];
  /**
   * Where each row starts in the input (byte offset in a text file, row number in a columnar
   * one), kept only when a reader was asked for it (sharded batch runs order their results by it).
   */
  readonly position?: Float64Array;
  /**
   * Present when an id column holds ids beyond 2⁵³ − 1: that column then holds order codes and
   * these labels give the exact ids (lib/io/hitIds.ts). Absent in the usual file.
   */
  readonly idLabels?: { readonly event?: IdLabels; readonly track?: IdLabels };
  /** Columns a reader was allowed to miss (`track`, with `trackOptional`: every row then −1). */
  readonly absentColumns?: readonly string[];
}

/**
 * Track boundaries over a hit table whose rows of each track are contiguous: track k spans rows
 * [offsets[k], offsets[k+1]). `event[k]` and `track[k]` are that track's identifiers.
 */
export interface TrackIndex {
  readonly count: number;
  readonly offsets: Int32Array;
  readonly event: Float64Array;
  readonly track: Float64Array;
}

import { type Column, type ColumnTable, consumeWarnings, type HitTable, rowObjects, SagittaError, type SagittaWarning } from '../../lib/index.js';
import { formatCsvBytes, gatherRows, idText, parseCsvRows, parseJsonlRows } from '../../lib/internal.js';
import type { BatchJob } from './batchJob.js';
import { shardOfEvent, type Shard } from './shard.js';
import type { TextChunk } from './textChunks.js';

/** How results leave a chunk: text rows for CSV / JSON Lines / JSON, columns for Parquet. */
export type ResultFormat = 'csv' | 'jsonl' | 'json' | 'parquet';

/** Everything a chunk needs besides its bytes; plain data (sent to workers once per chunk). */
export interface ChunkSettings {
  readonly file: string;
  readonly lengthUnit: string;
  readonly format: ResultFormat;
  readonly shard?: Shard;
  readonly jobOptions: unknown;
}

/**
 * A chunk that holds a ready hit table: columnar inputs are read into tables by the main thread,
 * and so are text chunks it parses before handing them to a worker (`parseTextChunk`; `lines`
 * then carries their line ends).
 */
export interface TableChunk {
  readonly kind: 'table';
  readonly hits: HitTable;
  readonly lines?: number;
}

export type Chunk = TextChunk | TableChunk;

/** The result of one chunk, plain data. */
export interface ChunkOutcome {
  readonly names: readonly string[];
  /** Encoded rows (CSV / JSON Lines / JSON text), or undefined for Parquet. */
  readonly encoded?: Uint8Array;
  readonly table?: ColumnTable;
  readonly rows: number;
  readonly counts: Record<string, number>;
  /** Ids of the events of this chunk, in order of first appearance (numbers, or exact text beyond 2⁵³). */
  readonly events: (number | string)[];
  /** Line ends in the chunk (text inputs), so the caller can number lines across chunks. */
  readonly lines: number;
  readonly warnings: SagittaWarning[];
  readonly samples?: Readonly<Record<string, Float64Array>>;
  readonly hasZ?: boolean;
  readonly method?: string;
  readonly estimatedErrors?: boolean;
  readonly units: Record<string, string>;
  readonly ignoredColumns: readonly string[];
}

/** Name of the ordering column sharded runs add in front of their results (removed by merge). */
export const POSITION_COLUMN = 'first_hit_position';

/**
 * Parses a chunk (line numbers counted from 1 within it), keeps the events of this shard, runs
 * the job and encodes its rows. Pure apart from the warning store, which it drains.
 */
export function processChunk(chunk: Chunk, job: BatchJob<unknown>, s: ChunkSettings): ChunkOutcome {
  consumeWarnings();
  const positions = s.shard !== undefined;
  const parsed = chunk.kind === 'table' ? chunk : parseTextChunk(chunk, s);
  const all = parsed.hits, lines = parsed.lines ?? 0;
  const counts: Record<string, number> = {};
  const events = eventRuns(all);
  let hits = all;
  if (s.shard !== undefined && s.shard.count > 1) {
    const keep = shardRows(all, s.shard);
    counts.other_shard_hits = all.length - keep.length;
    hits = keep.length === all.length ? all : gatherRows(all, keep);
  }
  counts.hits = hits.length;
  const out = job.run(hits, s.jobOptions);
  for (const [k, v] of Object.entries(out.counts)) counts[k] = (counts[k] ?? 0) + v;
  let table = out.table;
  if (positions) {
    const key: Column = { name: POSITION_COLUMN, values: out.firstHitPosition ?? new Float64Array(table.rows), digits: 0 };
    table = { rows: table.rows, columns: [key, ...table.columns] };
  }
  const names = table.columns.map((c) => c.name);
  const encoded = s.format === 'parquet' ? undefined : encodeRows(table, s.format);
  return {
    names, encoded, table: s.format === 'parquet' ? table : undefined, rows: table.rows, counts, events, lines,
    warnings: consumeWarnings(), samples: out.samples, hasZ: out.hasZ, method: out.method, estimatedErrors: out.estimatedErrors,
    units: { ...all.source.units }, ignoredColumns: all.source.ignoredColumns,
  };
}

/**
 * A text chunk parsed into its hit table (line numbers counted from 1 within it), with its line
 * ends; the rows record their byte offsets when the run is sharded. Throws the reader's located
 * error (its line within the chunk).
 */
export function parseTextChunk(chunk: TextChunk, s: ChunkSettings): TableChunk {
  const counted = { lineEnds: 0 };
  const rows = { start: 0, end: chunk.bytes.length, firstLine: 1, positionBase: chunk.positionBase, positions: s.shard !== undefined, allowEmpty: true, counted };
  if (chunk.kind === 'csv') {
    const hits = parseCsvRows(chunk.bytes, chunk.layout!, s.file, rows);
    return { kind: 'table', hits, lines: counted.lineEnds };
  }
  const hits = parseJsonlRows(chunk.bytes, s.file, rows, { lengthUnit: s.lengthUnit }, chunk.fields);
  let lines = 0;
  for (let i = chunk.bytes.indexOf(10); i >= 0; i = chunk.bytes.indexOf(10, i + 1)) lines++;
  return { kind: 'table', hits, lines };
}

/** Rows as bytes: CSV without header, JSON Lines, or JSON array elements each led by ",\n". */
export function encodeRows(table: ColumnTable, format: 'csv' | 'jsonl' | 'json'): Uint8Array {
  if (format === 'csv') return formatCsvBytes(table, { header: false });
  const objects = rowObjects(table);
  const lead = format === 'json' ? ',\n' : '';
  const tail = format === 'json' ? '' : '\n';
  let text = '';
  for (const o of objects) text += lead + JSON.stringify(o) + tail;
  return Buffer.from(text, 'utf8');
}

/** Events in order of first appearance (consecutive runs; a later run of the same id is listed again). */
function eventRuns(t: HitTable): (number | string)[] {
  const out: (number | string)[] = [];
  const labels = t.source.idLabels?.event;
  for (let i = 0; i < t.length; i++) {
    if (i > 0 && t.event[i] === t.event[i - 1]) continue;
    out.push(labels ? idText(t.event[i], labels) : t.event[i]);
  }
  return out;
}

/** Rows of the events that belong to `shard`. */
function shardRows(t: HitTable, shard: Shard): Int32Array {
  const keep = new Int32Array(t.length);
  const labels = t.source.idLabels?.event;
  let n = 0, mine = false;
  for (let i = 0; i < t.length; i++) {
    if (i === 0 || t.event[i] !== t.event[i - 1]) mine = shardOfEvent(t.event[i], labels, shard.count) === shard.index;
    if (mine) keep[n++] = i;
  }
  return keep.subarray(0, n);
}

/** A SagittaError as plain data (to cross from a worker), and back. */
export interface ErrorData {
  readonly sagitta: boolean;
  readonly code?: string;
  readonly message: string;
  readonly where?: { file?: string; line?: number; column?: string | number };
  readonly stack?: string;
}

export function errorToData(err: unknown): ErrorData {
  if (err instanceof SagittaError) return { sagitta: true, code: err.code, message: err.message, where: { ...err.where } };
  const e = err instanceof Error ? err : new Error(String(err));
  return { sagitta: false, message: e.message, stack: e.stack };
}

/**
 * The error rebuilt in this thread; a located message's line is moved from the chunk's own
 * numbering to the file's (`lineBase` = file line of the chunk's first line, minus one).
 */
export function errorFromData(d: ErrorData, lineBase = 0): Error {
  if (!d.sagitta) {
    const e = new Error(d.message);
    if (d.stack) e.stack = d.stack;
    return e;
  }
  let message = d.message;
  const where = { ...d.where };
  if (where.file !== undefined && where.line !== undefined && lineBase !== 0) {
    const prefix = `${where.file}:${where.line}`;
    where.line += lineBase;
    if (message.startsWith(prefix)) message = `${where.file}:${where.line}${message.slice(prefix.length)}`;
  }
  return new SagittaError(d.code as SagittaError['code'], message, where);
}

import { createReadStream } from 'node:fs';
import { type HitTable } from '../../lib/index.js';
import { type ColumnValues, type HeaderField, hitTableFromColumns, msg, parseHeader } from '../../lib/internal.js';
import type { TableChunk } from './processChunk.js';

/** Rows gathered before a table chunk is cut (at an event boundary). */
const CHUNK_ROWS = 131072;

/**
 * Reads a Parquet file (hyparquet, row group by row group) or an Apache Arrow IPC file or
 * stream (apache-arrow, record batch by record batch) into table chunks of whole events.
 * Both libraries load on first use. `whole`: one chunk for the whole file.
 */
export async function columnarChunks(path: string, format: 'parquet' | 'arrow', lengthUnit: string, positions: boolean, onRows?: (done: number) => void, whole = false): Promise<AsyncIterable<TableChunk>> {
  const batches = format === 'parquet' ? parquetBatches(path) : arrowBatches(path);
  return cutAtEvents(batches, path, lengthUnit, positions, onRows, whole);
}

interface Batch {
  readonly names: readonly string[];
  readonly columns: ColumnValues[];
  /** Progress measure after this batch (bytes or rows). */
  readonly done: number;
}

async function* cutAtEvents(batches: AsyncIterable<Batch>, path: string, lengthUnit: string, positions: boolean, onRows: ((done: number) => void) | undefined, whole: boolean): AsyncGenerator<TableChunk> {
  let fields: readonly HeaderField[] | undefined;
  let names: readonly string[] = [];
  let pending: unknown[][] = [];
  let pendingRows = 0;
  let rowBase = 0;
  let eventColumn = -1;
  const emit = (rows: number): HitTable => {
    const cols = pending.map((c) => c.slice(0, rows) as ColumnValues);
    pending = pending.map((c) => c.slice(rows));
    pendingRows -= rows;
    const table = hitTableFromColumns(names, cols, path, { lengthUnit, rowBase, positions, allowEmpty: true, fields });
    rowBase += rows;
    return table;
  };
  for await (const b of batches) {
    if (fields === undefined) {
      names = b.names;
      fields = parseHeader(names, path, lengthUnit, 0);
      eventColumn = fields.findIndex((f) => f.column === 'event');
      pending = names.map(() => []);
    }
    b.columns.forEach((c, j) => {
      const dst = pending[j];
      for (let i = 0; i < c.length; i++) dst.push(c[i]);
    });
    pendingRows += b.columns[0]?.length ?? 0;
    onRows?.(b.done);
    if (whole || pendingRows < CHUNK_ROWS) continue;
    // Cut before the last event present (it may go on in the next batch).
    const ev = pending[eventColumn];
    let cut = pendingRows - 1;
    const last = String(ev[cut]);
    while (cut > 0 && String(ev[cut - 1]) === last) cut--;
    if (cut > 0) yield { kind: 'table', hits: emit(cut) };
  }
  if (fields === undefined) throw msg.emptyFile(path, 'at least one row');
  yield { kind: 'table', hits: emit(pendingRows) };
}

async function* parquetBatches(path: string): AsyncGenerator<Batch> {
  const { asyncBufferFromFile, parquetMetadataAsync, parquetRead, parquetSchema } = await import('hyparquet');
  let file, metadata;
  try {
    file = await asyncBufferFromFile(path);
    metadata = await parquetMetadataAsync(file);
  } catch (err) {
    throw msg.badRow(path, 0, `not a readable Parquet file (${(err as Error).message})`);
  }
  const names = parquetSchema(metadata).children.map((c) => c.element.name);
  let start = 0;
  for (const group of metadata.row_groups) {
    const rows = Number(group.num_rows);
    const columns: ColumnValues[] = names.map(() => []);
    await parquetRead({
      file, metadata, rowStart: start, rowEnd: start + rows,
      onComplete: (data: unknown[][]) => {
        for (const row of data) row.forEach((v, j) => (columns[j] as unknown[]).push(v));
      },
    });
    start += rows;
    yield { names, columns, done: start };
  }
}

async function* arrowBatches(path: string): AsyncGenerator<Batch> {
  const arrow = await import('apache-arrow');
  let reader;
  try {
    reader = await arrow.RecordBatchReader.from(createReadStream(path));
  } catch (err) {
    throw msg.badRow(path, 0, `not a readable Arrow IPC file or stream (${(err as Error).message})`);
  }
  let done = 0;
  for await (const batch of reader) {
    const names = batch.schema.fields.map((f) => f.name);
    const columns = names.map((_, j) => {
      const child = batch.getChildAt(j);
      return (child ? child.toArray() : []) as ColumnValues;
    });
    done += batch.numRows;
    yield { names, columns, done };
  }
}

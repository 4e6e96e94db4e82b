import { writeSync } from 'node:fs';
import { type Column, type ColumnTable } from '../../lib/index.js';
import type { ResultFormat } from './processChunk.js';

/** Where a sink's bytes go: a file of an OutputSet, or standard output. */
export type ByteTarget = (bytes: Uint8Array) => void;

/** Rows per Parquet row group: fixed, so that merged shards give the same file as one run. */
export const PARQUET_ROW_GROUP = 65536;

/** Standard output closed by the reader (`| head`): the command stops quietly. */
export class OutputClosed extends Error {
  constructor() {
    super('standard output was closed');
  }
}

/** Writes to standard output synchronously, in order; a closed pipe becomes OutputClosed. */
export const stdoutTarget: ByteTarget = (bytes) => {
  try {
    let off = 0;
    while (off < bytes.byteLength) off += writeSync(1, bytes, off, bytes.byteLength - off);
  } catch (err) {
    if ((err as { code?: string }).code === 'EPIPE') throw new OutputClosed();
    if ((err as { code?: string }).code === 'EAGAIN') return stdoutTarget(bytes);
    throw err;
  }
};

/**
 * Writes result rows as they arrive, in one of the result formats:
 * - CSV: header then rows;
 * - JSON Lines: one object per row;
 * - JSON: `{"tracks":[` rows `],"meta":{…}}` — the meta block last, since its counts are known
 *   only at the end (one row per line, so the file also reads line by line);
 * - Parquet: row groups of PARQUET_ROW_GROUP rows, column types fixed by column name.
 */
export class ResultSink {
  private started = false;
  private firstJsonRow = true;
  private parquet: ParquetSink | undefined;

  constructor(private readonly format: ResultFormat, private readonly target: ByteTarget, private readonly rowsKey = 'tracks') {}

  /** Column names of the results (from the first chunk; every chunk has the same). */
  begin(names: readonly string[]): void {
    if (this.started) return;
    this.started = true;
    if (this.format === 'csv') this.target(Buffer.from(`${names.map(csvName).join(',')}\n`, 'utf8'));
    else if (this.format === 'json') this.target(Buffer.from(`{${JSON.stringify(this.rowsKey)}:[`, 'utf8'));
  }

  /** Encoded rows (CSV / JSON Lines / JSON) or a column table (Parquet). */
  async add(encoded: Uint8Array | undefined, table: ColumnTable | undefined): Promise<void> {
    if (this.format === 'parquet') {
      this.parquet ??= await ParquetSink.open(this.target);
      this.parquet.add(table!);
      return;
    }
    if (encoded === undefined || encoded.byteLength === 0) return;
    if (this.format === 'json' && this.firstJsonRow) {
      this.firstJsonRow = false;
      this.target(encoded.subarray(1)); // the first row has no comma before it
    } else this.target(encoded);
  }

  /** Closes the document: the JSON meta block, the Parquet footer. */
  async finish(names: readonly string[], meta: unknown): Promise<void> {
    this.begin(names);
    if (this.format === 'json') this.target(Buffer.from(`\n],\n"meta":${JSON.stringify(meta)}}\n`, 'utf8'));
    if (this.format === 'parquet') {
      this.parquet ??= await ParquetSink.open(this.target);
      this.parquet.finish(names);
    }
  }
}

function csvName(name: string): string {
  return /[",\n\r]/.test(name) ? `"${name.replace(/"/g, '""')}"` : name;
}

type ParquetType = 'INT64' | 'INT32' | 'DOUBLE' | 'STRING';
type Cell = number | bigint | string | null;

/** The Parquet type of a result column: ids and positions INT64, other integers INT32, text, else DOUBLE. */
export function parquetTypeOf(c: Column): ParquetType {
  if (c.name === 'event' || c.name === 'track' || c.name === 'first_hit_position') return 'INT64';
  if (c.values.length > 0 && typeof c.values[0] === 'string') return 'STRING';
  return c.digits === 0 ? 'INT32' : 'DOUBLE';
}

/** A row group's worth of columns, buffered, then written with hyparquet-writer. */
class ParquetSink {
  private names: string[] = [];
  private types: ParquetType[] = [];
  private cells: Cell[][] = [];
  private buffered = 0;
  private writer: { write(o: object): void; finish(): void } | undefined;

  private constructor(private readonly target: ByteTarget, private readonly lib: typeof import('hyparquet-writer')) {}

  static async open(target: ByteTarget): Promise<ParquetSink> {
    return new ParquetSink(target, await import('hyparquet-writer'));
  }

  add(table: ColumnTable): void {
    if (table.rows === 0) return;
    if (this.names.length === 0) {
      this.names = table.columns.map((c) => c.name);
      this.types = table.columns.map(parquetTypeOf);
      this.cells = table.columns.map(() => []);
    }
    table.columns.forEach((c, j) => {
      const type = this.types[j];
      const dst = this.cells[j];
      for (let i = 0; i < table.rows; i++) dst.push(cell(c.values[i], type));
    });
    this.buffered += table.rows;
    while (this.buffered >= PARQUET_ROW_GROUP) this.flush(PARQUET_ROW_GROUP);
  }

  finish(names: readonly string[]): void {
    if (this.names.length === 0) {
      this.names = [...names];
      this.types = names.map((n) => (n === 'status' ? 'STRING' : n === 'event' || n === 'track' || n === 'first_hit_position' ? 'INT64' : 'DOUBLE'));
      this.cells = names.map(() => []);
    }
    if (this.buffered > 0 || this.writer === undefined) this.flush(this.buffered);
    this.writer!.finish();
  }

  private flush(rows: number): void {
    if (this.writer === undefined) {
      const target = this.target;
      const bytes = new this.lib.ByteWriter();
      const flushBytes = () => {
        if (bytes.index > 0) target(new Uint8Array(bytes.buffer, 0, bytes.index).slice());
        bytes.index = 0;
      };
      Object.assign(bytes, { flush: flushBytes, finish: flushBytes });
      const schema = [{ name: 'root', num_children: this.names.length }, ...this.names.map((name, j) => schemaElement(name, this.types[j]))];
      this.writer = new this.lib.ParquetWriter({ writer: bytes, schema: schema as never, createdBy: 'sagitta', statistics: true }) as never;
    }
    const columnData = this.names.map((name, j) => ({ name, data: this.cells[j].slice(0, rows), type: this.types[j] }));
    this.writer!.write({ columnData, rowGroupSize: Math.max(1, rows) });
    this.cells = this.cells.map((c) => c.slice(rows));
    this.buffered -= rows;
  }
}

function schemaElement(name: string, type: ParquetType): object {
  if (type === 'STRING') return { name, type: 'BYTE_ARRAY', converted_type: 'UTF8', repetition_type: 'OPTIONAL' };
  return { name, type, repetition_type: 'OPTIONAL' };
}

function cell(v: number | string | undefined, type: ParquetType): Cell {
  if (v === undefined) return null;
  if (type === 'STRING') return String(v);
  if (typeof v === 'string') return type === 'INT64' ? BigInt(v) : Number(v);
  if (!Number.isFinite(v)) return null;
  return type === 'INT64' ? BigInt(v) : v;
}

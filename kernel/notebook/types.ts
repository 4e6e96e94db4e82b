/**
 * The notebook document, nbformat 4 (the Jupyter notebook format, an open standard). Only the
 * fields Sagitta reads or writes are typed; everything else is carried through untouched.
 */

export type MultilineString = string | string[];

export interface StreamOutput {
  output_type: 'stream';
  name: 'stdout' | 'stderr';
  text: MultilineString;
}

export interface DisplayDataOutput {
  output_type: 'display_data';
  data: Record<string, unknown>;
  metadata: Record<string, unknown>;
  transient?: { display_id?: string };
}

export interface ExecuteResultOutput {
  output_type: 'execute_result';
  execution_count: number | null;
  data: Record<string, unknown>;
  metadata: Record<string, unknown>;
}

export interface ErrorOutput {
  output_type: 'error';
  ename: string;
  evalue: string;
  traceback: string[];
}

export type Output = StreamOutput | DisplayDataOutput | ExecuteResultOutput | ErrorOutput;

export interface CodeCell {
  id?: string;
  cell_type: 'code';
  metadata: Record<string, unknown>;
  source: MultilineString;
  outputs: Output[];
  execution_count: number | null;
}

export interface MarkdownCell {
  id?: string;
  cell_type: 'markdown';
  metadata: Record<string, unknown>;
  source: MultilineString;
  attachments?: Record<string, Record<string, string>>;
}

export interface RawCell {
  id?: string;
  cell_type: 'raw';
  metadata: Record<string, unknown>;
  source: MultilineString;
  attachments?: Record<string, Record<string, string>>;
}

export type Cell = CodeCell | MarkdownCell | RawCell;

export interface Notebook {
  nbformat: 4;
  nbformat_minor: number;
  metadata: Record<string, unknown>;
  cells: Cell[];
}

/** What Sagitta keeps in a cell's metadata under the key `sagitta` (names of our own). */
export interface SagittaCellMeta {
  /** How the cell's last run ended: 'done', 'failed', 'not-run' (an earlier cell stopped the run). */
  outcome?: 'done' | 'failed' | 'not-run';
  /** Wall time of the cell's run in milliseconds. */
  wallMs?: number;
  /** ISO-8601 time the cell started. */
  startedAt?: string;
}

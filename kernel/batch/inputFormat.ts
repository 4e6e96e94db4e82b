import { msg } from '../../lib/internal.js';

/** The hit-file formats the batch path reads, by file extension. */
export type InputFormat = 'csv' | 'jsonl' | 'parquet' | 'arrow';

export const INPUT_EXTENSIONS: Readonly<Record<string, InputFormat>> = {
  '.csv': 'csv', '.tsv': 'csv', '.txt': 'csv',
  '.jsonl': 'jsonl', '.ndjson': 'jsonl',
  '.parquet': 'parquet', '.pq': 'parquet',
  '.arrow': 'arrow', '.arrows': 'arrow', '.feather': 'arrow', '.ipc': 'arrow',
};

export function inputFormatOf(path: string): InputFormat {
  const lower = path.toLowerCase();
  const ext = Object.keys(INPUT_EXTENSIONS).find((e) => lower.endsWith(e));
  if (ext === undefined) throw msg.unknownFormat(path, Object.keys(INPUT_EXTENSIONS));
  return INPUT_EXTENSIONS[ext];
}

/** Result formats by extension of --out. */
export const RESULT_EXTENSIONS: Readonly<Record<string, 'csv' | 'jsonl' | 'json' | 'parquet'>> = {
  '.csv': 'csv', '.jsonl': 'jsonl', '.ndjson': 'jsonl', '.json': 'json', '.parquet': 'parquet',
};

export function resultFormatOf(path: string): 'csv' | 'jsonl' | 'json' | 'parquet' {
  const lower = path.toLowerCase();
  const ext = Object.keys(RESULT_EXTENSIONS).find((e) => lower.endsWith(e));
  if (ext === undefined) throw msg.unknownFormat(path, Object.keys(RESULT_EXTENSIONS));
  return RESULT_EXTENSIONS[ext];
}

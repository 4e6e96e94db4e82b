import { existsSync } from 'node:fs';
import { msg } from '../errors.js';
import { recordInput } from '../provenance.js';
import { readInputFile } from './readInputFile.js';
import type { HitTable } from './hitTable.js';
import { parseHitsCsv, type ReadHitsOptions } from './parseHitsCsv.js';
import { parseHitsJsonl } from './parseHitsJsonl.js';

export const HIT_FILE_FORMATS = ['.csv', '.tsv', '.txt', '.jsonl', '.ndjson'] as const;

/**
 * Reads a hit file (CSV or JSON Lines, chosen by extension) into a HitTable in metres, and
 * records the file (name, size, SHA-256) for the report's provenance block.
 * @example readHits('notebooks/data/run.csv', { lengthUnit: 'mm' })
 */
export function readHits(path: string, options: ReadHitsOptions = {}): HitTable {
  if (!existsSync(path)) throw msg.fileNotFound(path);
  const lower = path.toLowerCase();
  const format = HIT_FILE_FORMATS.find((ext) => lower.endsWith(ext));
  if (format === undefined) throw msg.unknownFormat(path, HIT_FILE_FORMATS);
  const bytes = readInputFile(path, 'the hit file');
  recordInput(path, bytes);
  return format === '.jsonl' || format === '.ndjson' ? parseHitsJsonl(bytes, path, options) : parseHitsCsv(bytes, path, options);
}

import { msg } from '../../lib/internal.js';
import { LineReader } from './lineReader.js';
import { POSITION_COLUMN } from './processChunk.js';
import { ResultSink, type ByteTarget } from './resultSink.js';

/** What merging found, for the summary. */
export interface MergeTotals {
  readonly parts: number;
  readonly rows: number;
  readonly format: 'csv' | 'jsonl' | 'json' | 'parquet';
}

interface Part {
  readonly path: string;
  key: number;
  row: string | undefined;
  next(): void;
}

/**
 * Merges the results of sharded runs (`--shard K/N`) into what one unsharded run writes, byte for
 * byte: every part's rows carry `first_hit_position` (where their track starts in the input) and
 * are in increasing order of it; the parts are interleaved by it (a k-way merge, in bounded
 * memory for the text formats) and the column is removed. JSON meta blocks are checked to come
 * from the same run and their counts are added exactly; the shards must be N distinct of N.
 */
export async function mergeParts(paths: readonly string[], format: MergeTotals['format'], target: ByteTarget): Promise<MergeTotals> {
  if (format === 'parquet') return mergeParquet(paths, target);
  const readers = paths.map((p) => new LineReader(p));
  try {
    let header: string | undefined;
    const metas: Record<string, unknown>[] = [];
    const parts: Part[] = readers.map((r) => openPart(r, format, (h) => {
      if (header === undefined) header = h;
      else if (h !== header) throw msg.badRow(r.path, 1, `the columns differ from those of ${paths[0]}; parts to merge come from one command with the same options`);
    }, (m) => metas.push(m)));
    const names = format === 'csv' ? header!.split(',').slice(1) : [];
    const sink = new ResultSink(format, target);
    sink.begin(names);
    let rows = 0;
    // k-way merge on the position key; ties cannot happen (one track per position).
    for (;;) {
      let best: Part | undefined;
      for (const p of parts) if (p.row !== undefined && (best === undefined || p.key < best.key)) best = p;
      if (best === undefined) break;
      const text = format === 'json' ? `,\n${best.row}` : `${best.row}\n`;
      await sink.add(Buffer.from(text, 'utf8'), undefined);
      rows++;
      best.next();
    }
    // The parts' own meta blocks come after their rows: read once every part is exhausted.
    await sink.finish(names, format === 'json' ? mergeMeta(paths, metas) : undefined);
    return { parts: paths.length, rows, format };
  } finally {
    for (const r of readers) r.close();
  }
}

/** Opens one part: checks its first line and positions it on its first row. */
function openPart(r: LineReader, format: 'csv' | 'jsonl' | 'json', onHeader: (h: string) => void, onMeta: (m: Record<string, unknown>) => void): Part {
  const notPart = (line: number) => msg.badRow(r.path, line, `not a part of a sharded run: its rows do not start with ${POSITION_COLUMN} (made with sagitta fit --shard K/N?)`);
  if (format === 'csv') {
    const h = r.next();
    if (h === undefined || !h.startsWith(`${POSITION_COLUMN},`)) throw notPart(1);
    onHeader(h.replace(/\r$/, ''));
  } else if (format === 'json') {
    if (r.next() !== '{"tracks":[') throw notPart(1);
  }
  let lastKey = -Infinity;
  const part: Part = {
    path: r.path,
    key: 0,
    row: undefined,
    next() {
      for (;;) {
        let line = r.next();
        if (line === undefined) {
          part.row = undefined;
          return;
        }
        if (format === 'json') {
          if (line === '],') {
            const meta = r.next();
            if (meta === undefined || !meta.startsWith('"meta":')) throw notPart(r.line);
            onMeta(JSON.parse(meta.slice(7, -1)) as Record<string, unknown>);
            part.row = undefined;
            return;
          }
          if (line.endsWith(',')) line = line.slice(0, -1);
        }
        if (line === '') continue;
        const m = format === 'csv' ? /^(\d+),/.exec(line) : new RegExp(`^\\{"${POSITION_COLUMN}":(\\d+),`).exec(line);
        if (m === null) throw notPart(r.line);
        const key = Number(m[1]);
        if (!(key > lastKey)) throw msg.badRow(r.path, r.line, `rows are not in input order (${POSITION_COLUMN} ${key} after ${lastKey}); a part must be merged as sagitta fit wrote it`);
        lastKey = key;
        part.key = key;
        part.row = format === 'csv' ? line.slice(m[0].length) : `{${line.slice(m[0].length)}`;
        return;
      }
    },
  };
  part.next();
  return part;
}

/** One meta block from the parts' blocks: same run settings, shards 1…N once each, counts added. */
function mergeMeta(paths: readonly string[], metas: Record<string, unknown>[]): Record<string, unknown> {
  if (metas.length !== paths.length) throw msg.badRow(paths[metas.length] ?? paths[0], 0, 'a JSON part has no meta block at its end (was it cut short?)');
  const strip = (m: Record<string, unknown>) => JSON.stringify({ ...m, counts: undefined, shard: undefined });
  const shards = metas.map((m, i) => {
    const s = /^(\d+)\/(\d+)$/.exec(String(m.shard ?? ''));
    if (s === null) throw msg.badRow(paths[i], 0, 'the meta block names no shard (K/N); merge the parts of one sharded run');
    if (strip(m) !== strip(metas[0])) throw msg.badRow(paths[i], 0, `made with other settings or input than ${paths[0]} (compare their meta blocks)`);
    return { k: Number(s[1]), n: Number(s[2]) };
  });
  const n = shards[0].n;
  const ks = new Set(shards.map((s) => s.k));
  if (shards.some((s) => s.n !== n) || ks.size !== shards.length || ks.size !== n) {
    const missing = Array.from({ length: n }, (_, i) => i + 1).filter((k) => !ks.has(k));
    throw msg.badArgument('<parts>', shards.map((s) => `${s.k}/${s.n}`).join(' '), `each of the ${n} shards once${missing.length ? ` (missing ${missing.join(', ')})` : ''}`);
  }
  const counts: Record<string, number> = {};
  for (const m of metas) for (const [k, v] of Object.entries((m.counts ?? {}) as Record<string, number>)) counts[k] = (counts[k] ?? 0) + v;
  const { shard: _shard, ...rest } = metas[0];
  return { ...rest, counts };
}

/** Parquet parts: read whole (results are small beside the hits), merged by position, written as one run writes. */
async function mergeParquet(paths: readonly string[], target: ByteTarget): Promise<MergeTotals> {
  const { asyncBufferFromFile, parquetMetadataAsync, parquetReadObjects, parquetSchema } = await import('hyparquet');
  const parts: Record<string, unknown>[][] = [];
  let names: string[] | undefined;
  const types = new Map<string, string>();
  for (const p of paths) {
    let rows: Record<string, unknown>[];
    try {
      const file = await asyncBufferFromFile(p);
      const metadata = await parquetMetadataAsync(file);
      for (const c of parquetSchema(metadata).children) types.set(c.element.name, String(c.element.type));
      rows = await parquetReadObjects({ file, metadata });
    } catch (err) {
      throw msg.badRow(p, 0, `not a readable Parquet file (${(err as Error).message})`);
    }
    const cols = rows.length ? Object.keys(rows[0]) : [];
    if (rows.length && cols[0] !== POSITION_COLUMN) throw msg.badRow(p, 0, `not a part of a sharded run: no ${POSITION_COLUMN} column`);
    if (rows.length) {
      if (names === undefined) names = cols;
      else if (cols.join(',') !== names.join(',')) throw msg.badRow(p, 0, `the columns differ from those of ${paths[0]}`);
    }
    parts.push(rows);
  }
  const all = parts.flat().sort((a, b) => Number(a[POSITION_COLUMN]) - Number(b[POSITION_COLUMN]));
  const kept = (names ?? [POSITION_COLUMN]).slice(1);
  const sink = new ResultSink('parquet', target);
  const columns = kept.map((name) => {
    const values = all.map((r) => r[name]);
    const text = types.get(name) === 'BYTE_ARRAY';
    const ints = types.get(name) === 'INT32' || types.get(name) === 'INT64';
    return {
      name,
      values: text ? values.map((v) => (v === null ? '' : String(v))) : Float64Array.from(values, (v) => (v === null ? NaN : Number(v))),
      digits: ints && !text ? 0 : undefined,
      exact: name === 'event' || name === 'track' ? values.map((v) => (v === null ? '' : String(v))) : undefined,
    };
  });
  await sink.add(undefined, { rows: all.length, columns: columns.map((c) => ({ name: c.name, values: c.exact ?? c.values, digits: c.digits })) });
  await sink.finish(kept, undefined);
  return { parts: paths.length, rows: all.length, format: 'parquet' };
}

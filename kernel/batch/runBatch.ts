import { performance } from 'node:perf_hooks';
import { closeSync, openSync, readFileSync, statSync } from 'node:fs';
import { type HitTable, type SagittaWarning } from '../../lib/index.js';
import { msg } from '../../lib/internal.js';
import { loadBatchJob } from './batchJobs.js';
import { columnarChunks } from './columnarChunks.js';
import { batchThreads, stopEarlyWorkers } from './earlyWorkers.js';
import { inputFormatOf, type InputFormat } from './inputFormat.js';
import { errorFromData, errorToData, parseTextChunk, processChunk, type Chunk, type ChunkOutcome, type ChunkSettings, type ResultFormat } from './processChunk.js';
import { Progress } from './progress.js';
import { ResultSink, type ByteTarget } from './resultSink.js';
import type { Shard } from './shard.js';
import { textChunks, type TextChunk } from './textChunks.js';
import { WorkerPool, type Settled } from './workerPool.js';

/** One batch run: an input hit file through a job into one result output. */
export interface BatchRunOptions {
  readonly input: string;
  readonly lengthUnit: string;
  readonly job: string;
  readonly jobOptions: unknown;
  /** Worker threads; 1 runs everything in this thread. Default: all cores. */
  readonly threads?: number;
  readonly shard?: Shard;
  readonly format: ResultFormat;
  readonly target: ByteTarget;
  /** Empties the target to start again (a file can; standard output cannot: leave it out). */
  readonly restart?: () => void;
  /** The JSON meta block, from the run's totals (JSON output only). */
  readonly meta?: (totals: BatchTotals) => unknown;
  /** Draw a progress bar (the caller decides: a terminal, not --quiet). */
  readonly progress?: boolean;
  readonly progressLabel?: string;
}

/** What a run adds up over its chunks. */
export interface BatchTotals {
  readonly counts: Record<string, number>;
  readonly rows: number;
  readonly names: readonly string[];
  readonly warnings: SagittaWarning[];
  /** The jobs' per-row samples, concatenated in input order. */
  readonly samples: Record<string, number[]>;
  readonly hasZ: boolean;
  readonly method?: string;
  readonly estimatedErrors: boolean;
  readonly units: Record<string, string>;
  readonly ignoredColumns: readonly string[];
  readonly inputFormat: InputFormat;
  readonly threads: number;
  readonly chunks: number;
  /** True when the input's events were not grouped, so it was read whole instead of streamed. */
  readonly readWhole: boolean;
}

/** Thrown inside a run when an event appears again after other events (the input is not grouped by event). */
class NotGrouped extends Error {}

/**
 * Streams a hit file through a batch job: the input is read in chunks of whole events, each
 * chunk is parsed and processed in a worker thread or here — N threads are N − 1 workers and
 * this thread, which works a chunk itself whenever no worker has room for it — and the results
 * are written in input order — so the output is byte-identical whatever the thread count. When
 * an event reappears after others, the file cannot be streamed; it is then read whole and
 * regrouped as `readHits` does (same results), and the totals say so.
 * Errors name the file's own line numbers; nothing is written to the target after an error.
 */
export async function runBatch(o: BatchRunOptions): Promise<BatchTotals> {
  const format = inputFormatOf(o.input);
  checkReadable(o.input);
  const size = statSync(o.input).size;
  const job = await loadBatchJob(o.job);
  const settings: ChunkSettings = { file: o.input, lengthUnit: o.lengthUnit, format: o.format, shard: o.shard, jobOptions: o.jobOptions };
  const threads = batchThreads(o.threads, size, o.job);
  const progress = o.progress ? new Progress(o.progressLabel ?? 'reading', size) : undefined;
  let sink = new ResultSink(o.format, o.target);
  const totals = newTotals(format, threads);
  let pool: WorkerPool | undefined;
  try {
    pool = threads > 1 ? new WorkerPool(threads - 1, o.job, settings) : undefined;
    const here = (chunk: Chunk): Settled => {
      try {
        return { outcome: processChunk(chunk, job, settings) };
      } catch (err) {
        return { error: errorToData(err) };
      }
    };
    const source = format === 'csv' || format === 'jsonl'
      ? textChunks(o.input, format, o.lengthUnit, (done) => progress?.update(done))
      : await columnarChunks(o.input, format, o.lengthUnit, settings.shard !== undefined, (done) => progress?.update(done));
    // With one worker, text chunks bound for it are parsed here first, so the two threads split
    // each chunk's work (this one reads and parses, the worker fits and encodes) and each warms
    // up only its half of the code; with more workers this thread would become the bottleneck.
    const parse = threads === 2 ? (chunk: Chunk): Chunk => (chunk.kind === 'table' ? chunk : parseTextChunk(chunk, settings)) : undefined;
    try {
      await pipeline(source, here, pool, threads, sink, totals, parse);
    } catch (err) {
      if (!(err instanceof NotGrouped)) throw err;
      // Not grouped by event: read whole, as one chunk (bounded memory is not possible here).
      if (totals.chunks > 0) {
        if (o.restart === undefined) throw msg.notGrouped(o.input);
        o.restart();
      }
      sink = new ResultSink(o.format, o.target);
      Object.assign(totals, newTotals(format, 1), { readWhole: true });
      const whole = await wholeChunk(o.input, format, o.lengthUnit, settings.shard !== undefined);
      await pipeline(whole, here, undefined, 1, sink, totals);
    }
    if ((totals.counts.hits ?? 0) + (totals.counts.other_shard_hits ?? 0) === 0) {
      throw msg.emptyFile(o.input, format === 'jsonl' ? 'one JSON object per line' : 'at least one data row after the header');
    }
    await sink.finish(totals.names, o.meta?.(totals));
    return totals;
  } finally {
    progress?.stop();
    await pool?.close();
    await stopEarlyWorkers();
  }
}

/** A chunk handed out: settled at once when worked here, later when a worker replies. */
interface InFlight {
  settled?: Settled;
  readonly reply?: Promise<Settled>;
}

/**
 * Hands each chunk to a worker with room, or works it here, and consumes the outcomes in input
 * order as they are ready, keeping at most 8 × threads chunks in flight. Results are held back
 * only until their chunk is known not to repeat an earlier event (the input is grouped so far).
 */
async function pipeline(source: Iterable<Chunk> | AsyncIterable<Chunk>, here: (c: Chunk) => Settled, pool: WorkerPool | undefined, threads: number, sink: ResultSink, totals: MutableTotals, parse?: (c: Chunk) => Chunk): Promise<void> {
  const inFlight: InFlight[] = [];
  // Outcomes worked here wait in order behind a worker's chunk: a few MB at most.
  const limit = 8 * threads;
  const seen = new Set<number | string>();
  let lineBase = 0;
  let firstChunk = true;
  let lastTurn = performance.now();
  const consume = async (): Promise<void> => {
    const head = inFlight.shift()!;
    const settled = head.settled ?? (await head.reply!);
    if ('error' in settled) throw errorFromData(settled.error, lineBase);
    const out = settled.outcome;
    const fresh = new Set<number | string>();
    for (const e of out.events) {
      if (seen.has(e)) throw new NotGrouped();
      fresh.add(e);
    }
    for (const e of fresh) seen.add(e);
    lineBase += out.lines;
    addOutcome(totals, out);
    sink.begin(out.names);
    await sink.add(out.encoded, out.table);
  };
  for await (const chunk of source) {
    if (firstChunk && chunk.kind === 'csv') lineBase = chunk.layout!.bodyLine - 1;
    firstChunk = false;
    if (pool?.hasRoom()) {
      let sent = chunk;
      let failed: Settled | undefined;
      try {
        if (parse) sent = parse(chunk);
      } catch (err) {
        failed = { error: errorToData(err) };
      }
      if (failed) inFlight.push({ settled: failed });
      else {
        const reply = pool.submit(sent, sent !== chunk && sent.kind === 'table' ? tableBuffers(sent.hits) : []);
        const entry: InFlight = { reply };
        reply.then((v) => (entry.settled = v), () => undefined);
        inFlight.push(entry);
      }
    } else inFlight.push({ settled: here(chunk) });
    while (inFlight.length > 0 && (inFlight[0].settled !== undefined || inFlight.length >= limit)) await consume();
    // A turn of the event loop after every chunk with workers (their replies arrive then), and
    // every 50 ms of work without, so a Ctrl-C (SIGINT, SIGTERM) is handled promptly even when
    // every chunk is worked in this thread: the command stops with nothing written.
    if (pool !== undefined || performance.now() - lastTurn > 50) {
      await new Promise((resolve) => setImmediate(resolve));
      lastTurn = performance.now();
    }
  }
  while (inFlight.length > 0) await consume();
}

/** The distinct buffers under a hit table's columns (a table made here for a worker is moved to it whole). */
function tableBuffers(t: HitTable): ArrayBuffer[] {
  const out = new Set<ArrayBuffer>();
  for (const a of [t.event, t.track, t.x, t.y, t.z, t.sigmaX, t.sigmaY, t.sigmaZ, t.hitOrder, t.source.line, t.source.position]) {
    if (a && a.buffer instanceof ArrayBuffer) out.add(a.buffer);
  }
  return [...out];
}

type MutableTotals = { -readonly [K in keyof BatchTotals]: BatchTotals[K] };

function newTotals(inputFormat: InputFormat, threads: number): MutableTotals {
  return { counts: {}, rows: 0, names: [], warnings: [], samples: {}, hasZ: false, estimatedErrors: false, units: {}, ignoredColumns: [], inputFormat, threads, chunks: 0, readWhole: false };
}

function addOutcome(t: MutableTotals, out: ChunkOutcome): void {
  for (const [k, v] of Object.entries(out.counts)) t.counts[k] = (t.counts[k] ?? 0) + v;
  t.rows += out.rows;
  t.chunks++;
  for (const [k, v] of Object.entries(out.samples ?? {})) {
    const dst = (t.samples[k] ??= []);
    for (let i = 0; i < v.length; i++) dst.push(v[i]);
  }
  if (t.names.length === 0) t.names = out.names;
  if (out.hasZ) t.hasZ = true;
  if (out.estimatedErrors) t.estimatedErrors = true;
  t.method ??= out.method;
  if (Object.keys(t.units).length === 0) t.units = out.units;
  if (t.ignoredColumns.length < out.ignoredColumns.length) t.ignoredColumns = out.ignoredColumns;
  for (const w of out.warnings) {
    const same = t.warnings.findIndex((x) => x.code === w.code && x.message === w.message);
    if (same < 0) t.warnings.push(w);
    else t.warnings[same] = { ...t.warnings[same], count: t.warnings[same].count + w.count };
  }
}

/** The whole input as one chunk (for inputs whose events are not grouped). */
async function wholeChunk(path: string, format: InputFormat, lengthUnit: string, positions: boolean): Promise<Chunk[]> {
  if (format === 'csv' || format === 'jsonl') {
    const bytes = readFileSync(path);
    // One chunk spanning everything after the header (the header and fields from the first chunk).
    const chunks = textChunks(path, format, lengthUnit);
    const first = chunks.next().value as TextChunk;
    chunks.return(undefined);
    const start = first.positionBase;
    return [{ ...first, bytes: new Uint8Array(bytes.buffer, bytes.byteOffset + start, bytes.byteLength - start), positionBase: start }];
  }
  const all: Chunk[] = [];
  for await (const c of await columnarChunks(path, format, lengthUnit, positions, undefined, true)) all.push(c);
  return all;
}

/** Refuses a folder, a missing or an unreadable input with one line. */
export function checkReadable(path: string): void {
  let st;
  try {
    st = statSync(path);
  } catch {
    throw msg.fileNotFound(path);
  }
  if (st.isDirectory()) throw msg.cannotRead(path, 'it is a folder', 'give the hit file inside it');
  try {
    closeSync(openSync(path, 'r'));
  } catch (err) {
    const code = (err as { code?: string }).code;
    throw msg.cannotRead(path, code === 'EACCES' ? 'permission denied' : code ?? 'unknown error', 'check the file\'s permissions');
  }
}

import { createHash } from 'node:crypto';
import { readFileSync, statSync } from 'node:fs';
import { basename, resolve } from 'node:path';

/**
 * Provenance registry: which data files the library read and which seeds it used, so that a
 * report can say exactly what an analysis was computed from.
 *
 * Readers in `lib/io` call `recordInput(path, bytes)` once per file they read; seeded code calls
 * `recordSeed(seed, label)`. The notebook runner takes `provenanceSnapshot()` after each cell and
 * prints it in the report's provenance block.
 *
 * The registry lives on `globalThis` under a well-known symbol, not in a module variable: a
 * notebook may load this module more than once (ESM and CommonJS loaders each keep their own
 * instance), and every instance must write into the same record.
 */

/** One data file the library read. */
export interface InputRecord {
  /** File name without folders, as shown in reports. */
  readonly name: string;
  /** Absolute path at the time it was read. */
  readonly path: string;
  readonly sizeBytes: number;
  /** SHA-256 of the bytes read, lower-case hex. */
  readonly sha256: string;
  /** ISO-8601 time of the first read. */
  readonly firstReadAt: string;
}

/** One seed a seeded generator was started with. */
export interface SeedRecord {
  /** The seed as given (bigints as decimal text). */
  readonly seed: number | string;
  /** Who used it, e.g. 'simulateChamber'. */
  readonly label: string;
}

/** Kinds of result that call for a caution wherever they are shown. */
export type CautionKind = 'stopping-power';

export interface ProvenanceSnapshot {
  readonly inputs: readonly InputRecord[];
  readonly seeds: readonly SeedRecord[];
  /** Cautions the results call for (e.g. ranges and stopping powers near clinical use). */
  readonly cautions?: readonly CautionKind[];
}

interface Registry {
  inputs: InputRecord[];
  seeds: SeedRecord[];
  cautions?: CautionKind[];
}

const KEY = Symbol.for('sagitta.provenance');

function registry(): Registry {
  const g = globalThis as unknown as Record<symbol, Registry | undefined>;
  let r = g[KEY];
  if (r === undefined) {
    r = { inputs: [], seeds: [] };
    g[KEY] = r;
  }
  return r;
}

/**
 * Records that a data file was read. Pass the bytes when you already hold them (no second read);
 * otherwise the file is read here to hash it. The same path with the same content is recorded
 * once; the same path with changed content is recorded again (the report then shows both).
 * @example recordInput('notebooks/data/run-07.csv') // { name: 'run-07.csv', sizeBytes: …, sha256: '…' }
 */
export function recordInput(path: string, bytes?: Uint8Array): InputRecord {
  const absolute = resolve(path);
  const data = bytes ?? readFileSync(absolute);
  const sha256 = createHash('sha256').update(data).digest('hex');
  const sizeBytes = bytes !== undefined ? bytes.byteLength : statSync(absolute).size;
  const r = registry();
  const known = r.inputs.find((x) => x.path === absolute && x.sha256 === sha256);
  if (known) return known;
  const record: InputRecord = Object.freeze({
    name: basename(absolute),
    path: absolute,
    sizeBytes,
    sha256,
    firstReadAt: new Date().toISOString(),
  });
  r.inputs.push(record);
  return record;
}

/** Records a seed used by a seeded generator; identical (seed, label) pairs are kept once. */
export function recordSeed(seed: number | bigint | string, label = 'seed'): SeedRecord {
  const value = typeof seed === 'bigint' ? seed.toString() : seed;
  const r = registry();
  const known = r.seeds.find((s) => s.seed === value && s.label === label);
  if (known) return known;
  const record: SeedRecord = Object.freeze({ seed: value, label });
  r.seeds.push(record);
  return record;
}

/**
 * Records that a result of a kind that calls for a caution was computed (once per kind): a range
 * or stopping-power table is the case today — reports that show one carry the clinical caution.
 * @example recordCaution('stopping-power')
 */
export function recordCaution(kind: CautionKind): void {
  const r = registry();
  r.cautions ??= [];
  if (!r.cautions.includes(kind)) r.cautions.push(kind);
}

/** A copy of everything recorded so far, in the order it was recorded. */
export function provenanceSnapshot(): ProvenanceSnapshot {
  const r = registry();
  return Object.freeze({ inputs: Object.freeze(r.inputs.slice()), seeds: Object.freeze(r.seeds.slice()), cautions: Object.freeze((r.cautions ?? []).slice()) });
}

/** Forgets everything recorded (a fresh run, or a test). */
export function resetProvenance(): void {
  const r = registry();
  r.inputs.length = 0;
  r.seeds.length = 0;
  r.cautions = [];
}

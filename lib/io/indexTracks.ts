import type { HitTable, TrackIndex } from './hitTable.js';

/**
 * Groups the rows of a hit table into tracks by (event, track).
 *
 * Files written by a chamber read-out usually keep each track's rows together; then the table is
 * returned as it is. When a track's rows are scattered (e.g. a file sorted by plane), the rows
 * are gathered track by track, in order of each track's first appearance, keeping the file order
 * within a track (a stable regrouping, so the travel order of hits is preserved).
 * No row is dropped. `rows`, when the rows were regrouped, gives for each row of the returned
 * table its row in `table` (absent: the same rows in the same order).
 * When the table has a `hitOrder` column (from `sagitta find`), the rows of each track are put
 * in that order instead of the file order (equal places keep the file order).
 */
export function indexTracks(table: HitTable): { table: HitTable; index: TrackIndex; rows?: Int32Array } {
  const n = table.length;
  const { event, track, hitOrder } = table;
  // Fast path: (event, track) never decreasing means every track is one contiguous run.
  let sorted = true;
  let inOrder = true;
  let runs = n > 0 ? 1 : 0;
  for (let i = 1; i < n; i++) {
    const de = event[i] - event[i - 1];
    if (de !== 0 || track[i] !== track[i - 1]) {
      runs++;
      if (de < 0 || (de === 0 && track[i] < track[i - 1])) sorted = false;
    } else if (hitOrder !== undefined && hitOrder[i] < hitOrder[i - 1]) inOrder = false;
  }
  if (sorted && inOrder) return { table, index: runIndex(event, track, n, runs) };

  // Slow path: stable gather by first appearance.
  const order = new Map<string, number>();
  const groupOf = new Int32Array(n);
  const counts: number[] = [];
  for (let i = 0; i < n; i++) {
    const key = `${event[i]}\u0000${track[i]}`;
    let g = order.get(key);
    if (g === undefined) {
      g = counts.length;
      order.set(key, g);
      counts.push(0);
    }
    groupOf[i] = g;
    counts[g]++;
  }
  if (order.size === runs && inOrder) return { table, index: runIndex(event, track, n, runs) };
  const start = new Int32Array(counts.length + 1);
  for (let g = 0; g < counts.length; g++) start[g + 1] = start[g] + counts[g];
  const fill = start.slice(0, counts.length);
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[fill[groupOf[i]]++] = i;
  if (hitOrder !== undefined) {
    // Each track's rows by place along it (Array.prototype.sort is stable: ties keep file order).
    for (let g = 0; g < counts.length; g++) {
      const a = start[g], b = start[g + 1];
      let ok = true;
      for (let q = a + 1; q < b && ok; q++) ok = hitOrder[perm[q]] >= hitOrder[perm[q - 1]];
      if (ok) continue;
      const part = Array.from(perm.subarray(a, b)).sort((r, s) => hitOrder[r] - hitOrder[s]);
      perm.set(part, a);
    }
  }
  const gathered = gatherRows(table, perm);
  return { table: gathered, index: runIndex(gathered.event, gathered.track, n, counts.length), rows: perm };
}

function runIndex(event: Float64Array, track: Float64Array, n: number, runs: number): TrackIndex {
  const offsets = new Int32Array(runs + 1);
  const ev = new Float64Array(runs);
  const tr = new Float64Array(runs);
  let k = 0;
  for (let i = 0; i < n; i++) {
    if (i === 0 || event[i] !== event[i - 1] || track[i] !== track[i - 1]) {
      offsets[k] = i;
      ev[k] = event[i];
      tr[k] = track[i];
      k++;
    }
  }
  offsets[runs] = n;
  return { count: runs, offsets, event: ev, track: tr };
}

function gather(column: Float64Array | undefined, perm: Int32Array): Float64Array | undefined {
  if (column === undefined) return undefined;
  const out = new Float64Array(perm.length);
  for (let i = 0; i < perm.length; i++) out[i] = column[perm[i]];
  return out;
}

/** Returns a new table whose row i is row perm[i] of `table`. */
export function gatherRows(table: HitTable, perm: Int32Array): HitTable {
  let line: Int32Array | undefined;
  if (table.source.line) {
    line = new Int32Array(perm.length);
    for (let i = 0; i < perm.length; i++) line[i] = table.source.line[perm[i]];
  }
  return {
    length: perm.length,
    event: gather(table.event, perm)!,
    track: gather(table.track, perm)!,
    x: gather(table.x, perm)!,
    y: gather(table.y, perm)!,
    z: gather(table.z, perm),
    sigmaX: gather(table.sigmaX, perm),
    sigmaY: gather(table.sigmaY, perm),
    sigmaZ: gather(table.sigmaZ, perm),
    ...(table.hitOrder ? { hitOrder: gather(table.hitOrder, perm) } : {}),
    source: { ...table.source, line, ...(table.source.position ? { position: gather(table.source.position, perm) } : {}) },
  };
}

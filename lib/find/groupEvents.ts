/**
 * Rows grouped by event, in order of each event's first appearance, file order kept within an
 * event: event e is rows[offsets[e] … offsets[e+1]) and carries the number events[e].
 * No row is dropped.
 */
export interface EventGroups {
  readonly count: number;
  readonly offsets: Int32Array;
  readonly rows: Int32Array;
  readonly events: Float64Array;
}

/** @example groupEvents(Float64Array.of(1, 1, 2, 1)).rows // [0, 1, 3, 2] */
export function groupEvents(event: Float64Array): EventGroups {
  const n = event.length;
  const groupOf = new Int32Array(n);
  const ids: number[] = [];
  const counts: number[] = [];
  const index = new Map<number, number>();
  let last = NaN, lastGroup = -1;
  for (let i = 0; i < n; i++) {
    const e = event[i];
    let g: number;
    if (e === last) g = lastGroup;
    else {
      const known = index.get(e);
      if (known === undefined) { g = ids.length; index.set(e, g); ids.push(e); counts.push(0); }
      else g = known;
      last = e; lastGroup = g;
    }
    groupOf[i] = g;
    counts[g]++;
  }
  const offsets = new Int32Array(ids.length + 1);
  for (let g = 0; g < ids.length; g++) offsets[g + 1] = offsets[g] + counts[g];
  const fill = offsets.slice(0, ids.length);
  const rows = new Int32Array(n);
  for (let i = 0; i < n; i++) rows[fill[groupOf[i]]++] = i;
  return { count: ids.length, offsets, rows, events: Float64Array.from(ids) };
}

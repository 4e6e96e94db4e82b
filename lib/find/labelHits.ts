import type { HitTable } from '../io/hitTable.js';
import type { FoundTracks } from './findTracks.js';

/**
 * The hit table with the finder's answer in it: `track` the found track of each row (−1: on no
 * track) and `hitOrder` its place along the track, rows as they were — what `sagitta find`
 * writes, ready for `measureTracks` (which orders each track by `hitOrder`).
 * @example measureTracks(labelHits(hits, findTracks(hits)), { fieldT: 1 })
 */
export function labelHits(hits: HitTable, found: FoundTracks): HitTable {
  return {
    ...hits,
    track: Float64Array.from(found.track),
    hitOrder: Float64Array.from(found.hitOrder),
    source: { ...hits.source, absentColumns: undefined },
  };
}

import { chamberMedium, type Column, type ColumnTable, findV0s, type HitTable, measureTracks, v0CandidateColumns, vertexTracks } from '../../lib/index.js';
import { idColumnText } from '../../lib/internal.js';
import type { BatchJob, JobOutput } from './batchJob.js';

/** What `sagitta vertices` asks of every chunk; plain data, so it can be sent to a worker. */
export interface VerticesJobOptions {
  readonly fieldT: number;
  readonly method: string;
  readonly hitErrorM?: number;
  /** Material name for the energy-loss correction between vertex and first hits. */
  readonly material?: string;
  readonly primaryM: readonly [number, number, number];
  readonly maxDcaM?: number;
  readonly minFlightM?: number;
  readonly maxPointingRad?: number;
}

/**
 * The V⁰ search of one chunk of whole events: tracks measured as `sagitta fit` measures them,
 * then `findV0s`; one row per candidate, ids as exact text when they are beyond 2⁵³, and the
 * counts the summary adds up (pairs tried, candidates, what each cut removed).
 */
export const VERTICES_JOB: BatchJob<VerticesJobOptions> = {
  name: 'vertices',
  run(hits: HitTable, o: VerticesJobOptions): JobOutput {
    const table = measureTracks(hits, { fieldT: o.fieldT, method: o.method, hitErrorM: o.hitErrorM });
    const tracks = vertexTracks(table, { hitErrorM: o.hitErrorM });
    const found = findV0s(tracks, {
      primaryM: o.primaryM, medium: o.material !== undefined ? chamberMedium(o.material) : undefined,
      maxDcaM: o.maxDcaM, minFlightM: o.minFlightM, maxPointingRad: o.maxPointingRad,
    });
    const c = found.candidates;
    const labels = hits.source.idLabels;
    const columns: Column[] = v0CandidateColumns(c).columns.map((col) => {
      if (col.name === 'event' && labels?.event) return { name: col.name, values: idColumnText(col.values as ArrayLike<number>, labels.event) };
      if ((col.name === 'track_pos' || col.name === 'track_neg') && labels?.track) return { name: col.name, values: idColumnText(col.values as ArrayLike<number>, labels.track) };
      return col;
    });
    const out: ColumnTable = { rows: c.count, columns };
    let usable = 0;
    for (let k = 0; k < tracks.count; k++) usable += tracks.usable[k];
    const counts: Record<string, number> = {
      tracks: table.count, usable_tracks: usable, track_hits: table.hits.length, unassigned_hits: table.unassignedHits,
      pairs_tried: found.pairsTried, candidates: c.count,
      rejected_circles: found.rejected.circles, rejected_closest_approach: found.rejected.closestApproach,
      rejected_flight: found.rejected.flight, rejected_pointing: found.rejected.pointing, rejected_chi2: found.rejected.chi2,
    };
    for (const s of c.status) counts[`status_${s}`] = (counts[`status_${s}`] ?? 0) + 1;
    const position = table.hits.source.position;
    let firstHit: Float64Array | undefined;
    if (position) {
      firstHit = new Float64Array(c.count);
      for (let i = 0; i < c.count; i++) firstHit[i] = position[table.offsets[c.rowPos[i]]];
    }
    return { table: out, counts, firstHitPosition: firstHit, hasZ: table.hasZ, method: table.method, estimatedErrors: hits.sigmaX === undefined && o.hitErrorM === undefined };
  },
};

import { type Column, type ColumnTable, type HitTable, material as lookupMaterial, measureTracks, particle as lookupParticle, resolutionBudget, resolutionBudgetColumns, trackTableColumns } from '../../lib/index.js';
import { idColumnText } from '../../lib/internal.js';
import type { BatchJob, JobOutput } from './batchJob.js';

/** What `sagitta fit` asks of every chunk; plain data, so it can be sent to a worker. */
export interface FitJobOptions {
  readonly fieldT: number;
  readonly method: string;
  readonly chargeMagnitude: number;
  readonly hitErrorM?: number;
  readonly material?: string;
  readonly particle: string;
}

/**
 * The fit of one chunk of whole events: the track table (and the error budget with a material)
 * as output columns, ids as exact text when they are beyond 2⁵³, and the counts the summary adds
 * up. χ² is left empty when the hit errors were estimated from the residuals (it is then
 * ndf by construction and says nothing about the fit).
 */
export const FIT_JOB: BatchJob<FitJobOptions> = {
  name: 'fit',
  run(hits: HitTable, o: FitJobOptions): JobOutput {
    const tracks = measureTracks(hits, { fieldT: o.fieldT, method: o.method, chargeMagnitude: o.chargeMagnitude, hitErrorM: o.hitErrorM });
    const base = trackTableColumns(tracks);
    let columns: Column[] = [...base.columns];
    let samples: Record<string, Float64Array> | undefined;
    if (o.material !== undefined) {
      const budget = resolutionBudget(tracks, { material: lookupMaterial(o.material), particle: lookupParticle(o.particle), hitErrorM: o.hitErrorM });
      columns.push(...resolutionBudgetColumns(budget));
      const p = tracks.hasZ ? tracks.momentum.pGeV : tracks.momentum.ptGeV;
      samples = {
        measurement: Float64Array.from(budget.sigmaPMeasGeV, (v, k) => v / p[k]),
        scattering: Float64Array.from(budget.sigmaPMsGeV, (v, k) => v / p[k]),
      };
    }
    const estimated = hits.sigmaX === undefined && o.hitErrorM === undefined;
    const labels = hits.source.idLabels;
    columns = columns.map((c) => {
      if (c.name === 'chi2' && estimated) return { ...c, values: new Float64Array(tracks.count).fill(NaN) };
      if (c.name === 'event' && labels?.event) return { name: c.name, values: idColumnText(c.values as ArrayLike<number>, labels.event) };
      if (c.name === 'track' && labels?.track) return { name: c.name, values: idColumnText(c.values as ArrayLike<number>, labels.track) };
      return c;
    });
    const table: ColumnTable = { rows: tracks.count, columns };
    const counts: Record<string, number> = { tracks: tracks.count, track_hits: tracks.hits.length, unassigned_hits: tracks.unassignedHits };
    for (const [s, c] of Object.entries(tracks.statusCounts)) counts[`status_${s}`] = c;
    // Position in the input of each track's first hit (for merging sharded results in input order).
    const position = tracks.hits.source.position;
    let firstHit: Float64Array | undefined;
    if (position) {
      firstHit = new Float64Array(tracks.count);
      for (let k = 0; k < tracks.count; k++) firstHit[k] = position[tracks.offsets[k]];
    }
    return { table, counts, samples, firstHitPosition: firstHit, hasZ: tracks.hasZ, method: tracks.method, estimatedErrors: estimated };
  },
};

import { type Column, type ColumnTable, type HitTable, material as lookupMaterial, measureTracks, particle as lookupParticle, resolutionBudget, resolutionBudgetColumns, trackTableColumns } from '../../lib/index.js';
import { checkHitOrder, idColumnText, speciesList } from '../../lib/internal.js';
import type { BatchJob, JobOutput } from './batchJob.js';

/** What `sagitta fit` asks of every chunk; plain data, so it can be sent to a worker. */
export interface FitJobOptions {
  readonly fieldT: number;
  readonly method: string;
  readonly chargeMagnitude: number;
  readonly hitErrorM?: number;
  readonly material?: string;
  /** One species, or 'auto' / a comma list for identification by range. */
  readonly particle: string;
  /** With a material: 'matter' (default) or 'plain-helix'. */
  readonly fit?: 'matter' | 'plain-helix';
  /** Fiducial box [m] for the stop decision of identification by range. */
  readonly volume?: { readonly min: readonly [number, number, number]; readonly max: readonly [number, number, number] };
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
    const tracks = measureTracks(hits, {
      fieldT: o.fieldT, method: o.method, chargeMagnitude: o.chargeMagnitude, hitErrorM: o.hitErrorM,
      material: o.material, particle: o.particle, fit: o.fit, volume: o.volume,
    });
    checkHitOrder(tracks);
    const base = trackTableColumns(tracks);
    let columns: Column[] = [...base.columns];
    let samples: Record<string, Float64Array> | undefined;
    const identifying = speciesList(o.particle) !== undefined;
    if (o.material !== undefined && !identifying) {
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
      if ((c.name === 'chi2' || c.name === 'chi2_prob') && estimated) return { ...c, values: new Float64Array(tracks.count).fill(NaN) };
      if (c.name === 'event' && labels?.event) return { name: c.name, values: idColumnText(c.values as ArrayLike<number>, labels.event) };
      if (c.name === 'track' && labels?.track) return { name: c.name, values: idColumnText(c.values as ArrayLike<number>, labels.track) };
      return c;
    });
    const table: ColumnTable = { rows: tracks.count, columns };
    const counts: Record<string, number> = { tracks: tracks.count, track_hits: tracks.hits.length, unassigned_hits: tracks.unassignedHits };
    for (const [s, c] of Object.entries(tracks.statusCounts)) counts[`status_${s}`] = c;
    if (tracks.stops && !tracks.identity) counts.stopping = tracks.stops.reduce((a, v) => a + v, 0);
    if (tracks.identity) {
      for (const p of tracks.identity.pid) counts[`pid_${p}`] = (counts[`pid_${p}`] ?? 0) + 1;
      counts.stopping = tracks.identity.stops.reduce((a, v) => a + v, 0);
    }
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

import { msg } from '../errors.js';
import { FIT_STATUS, type FitStatus } from '../fit/circleFit.js';
import { CIRCLE_FIT_DEFAULTS, fitCircles } from '../fit/fitCircles.js';
import { fitHelices } from '../fit/fitHelices.js';
import type { FitMethod } from '../fit/fitMethod.js';
import { fitMethod } from '../fit/fitMethods.js';
import type { HitTable } from '../io/hitTable.js';
import { gatherRows, indexTracks } from '../io/indexTracks.js';
import { momenta, type MomentumColumns } from './momentum.js';

export interface MeasureTracksOptions {
  /** B_z [T], signed (negative: the field points along −z). Required. */
  readonly fieldT: number;
  /** A registered fit method (`fitMethods()`) or a method object; default 'geometric'. */
  readonly method?: string | FitMethod;
  /** |z| of the particles, default 1. */
  readonly chargeMagnitude?: number;
  /** Error [m] to use for hits that carry none; omitted → estimated from each track's residuals. */
  readonly hitErrorM?: number;
}

/**
 * One row per track: identifiers, fit results and momenta — the table `sagitta fit` writes and
 * notebooks display. Every track of the input is here, failed fits included (status ≠ 'ok').
 * It keeps what it was built from: the hits it fitted, grouped by track (`hits`, track k is rows
 * [offsets[k], offsets[k+1]) in travel order), where each of those rows came from in the input
 * (`hitRows`), and the reference point (the first hit) the parameters are given at; `trackHits`
 * hands one track's hits to a notebook.
 */
export interface TrackTable {
  readonly count: number;
  readonly event: Float64Array;
  readonly track: Float64Array;
  readonly nhits: Int32Array;
  readonly kappa: Float64Array;
  readonly phi0: Float64Array;
  readonly d0: Float64Array;
  /** NaN when the hits have no z. */
  readonly z0: Float64Array;
  /** Reference point of the parameters [m]: the track's first hit. */
  readonly xRef: Float64Array;
  readonly yRef: Float64Array;
  readonly chi2: Float64Array;
  readonly ndf: Int32Array;
  readonly iterations: Int32Array;
  readonly status: readonly FitStatus[];
  readonly momentum: MomentumColumns;
  /** True when the hits carry z, so p and tan λ are measured (otherwise only p_T). */
  readonly hasZ: boolean;
  /** Name of the fit method. */
  readonly method: string;
  readonly fieldT: number;
  /** The hits that were fitted (unassigned hits left out), grouped by track in travel order. */
  readonly hits: HitTable;
  /** Track k is rows [offsets[k], offsets[k+1]) of `hits`. */
  readonly offsets: Int32Array;
  /** Row of the input hit table of each row of `hits`. */
  readonly hitRows: Int32Array;
  /** Hits with a negative track id (not assigned to any track: noise, or not yet found); not fitted. */
  readonly unassignedHits: number;
  /** Count of tracks per status. */
  readonly statusCounts: Readonly<Record<FitStatus, number>>;
}

/**
 * Groups hits into tracks, fits each (helix when z is present, circle otherwise) and converts
 * curvature to momentum. Lengths in metres, field in tesla.
 * @example measureTracks(readHits('run.csv'), { fieldT: 1.5 }).momentum.ptGeV
 */
export function measureTracks(hits: HitTable, options: MeasureTracksOptions): TrackTable {
  const method = fitMethod(options.method ?? CIRCLE_FIT_DEFAULTS.method);
  if (options.hitErrorM !== undefined && !(options.hitErrorM > 0)) throw msg.badArgument('hitErrorM', options.hitErrorM, 'a positive hit error in metres');
  if (!Number.isFinite(options.fieldT) || options.fieldT === 0) throw msg.badArgument('fieldT', options.fieldT, 'a non-zero magnetic field in tesla (signed along +z)');
  const { assigned, keptRows, unassignedHits } = splitUnassigned(hits);
  const { table, index, rows } = indexTracks(assigned);
  const hitRows = rows === undefined ? keptRows : Int32Array.from(rows, (r) => keptRows[r]);
  let sigmaX = table.sigmaX, sigmaY = table.sigmaY;
  if (sigmaX === undefined && options.hitErrorM !== undefined) {
    sigmaX = sigmaY = new Float64Array(table.length).fill(options.hitErrorM);
  }
  const planeHits = { x: table.x, y: table.y, sigmaX, sigmaY };
  const hasZ = table.z !== undefined;
  const fitOptions = { method, fieldT: options.fieldT };
  const helix = hasZ ? fitHelices({ ...planeHits, z: table.z!, sigmaZ: table.sigmaZ }, index.offsets, fitOptions) : undefined;
  const circle = helix ? helix.circle : fitCircles(planeHits, index.offsets, fitOptions);
  const momentum = momenta(helix ?? circle, options.fieldT, { chargeMagnitude: options.chargeMagnitude });
  const n = index.count;
  const nhits = new Int32Array(n);
  for (let k = 0; k < n; k++) nhits[k] = index.offsets[k + 1] - index.offsets[k];
  const status = Array.from(circle.status, (s) => FIT_STATUS[s]);
  const statusCounts = Object.fromEntries(FIT_STATUS.map((s) => [s, 0])) as Record<FitStatus, number>;
  for (const s of status) statusCounts[s]++;
  return {
    count: n,
    event: index.event,
    track: index.track,
    nhits,
    kappa: circle.kappa,
    phi0: circle.phi0,
    d0: circle.d0,
    z0: helix ? helix.z0 : new Float64Array(n).fill(NaN),
    xRef: circle.xRef,
    yRef: circle.yRef,
    chi2: circle.chi2,
    ndf: circle.ndf,
    iterations: circle.iterations,
    status,
    momentum,
    hasZ,
    method: method.name,
    fieldT: options.fieldT,
    hits: table,
    offsets: index.offsets,
    hitRows,
    statusCounts,
    unassignedHits,
  };
}

/**
 * Hits whose track id is negative belong to no track (the hit-file convention for noise and for
 * hits a pattern-recognition step left over). They are set aside and counted, never fitted.
 */
function splitUnassigned(hits: HitTable): { assigned: HitTable; keptRows: Int32Array; unassignedHits: number } {
  let unassigned = 0;
  for (let i = 0; i < hits.length; i++) if (hits.track[i] < 0) unassigned++;
  const keep = new Int32Array(hits.length - unassigned);
  for (let i = 0, j = 0; i < hits.length; i++) if (hits.track[i] >= 0) keep[j++] = i;
  if (unassigned === 0) return { assigned: hits, keptRows: keep, unassignedHits: 0 };
  return { assigned: gatherRows(hits, keep), keptRows: keep, unassignedHits: unassigned };
}

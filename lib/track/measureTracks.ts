import { msg } from '../errors.js';
import { FIT_STATUS, type FitStatus } from '../fit/circleFit.js';
import { CIRCLE_FIT_DEFAULTS, fitCircles } from '../fit/fitCircles.js';
import { fitHelices } from '../fit/fitHelices.js';
import type { FitMethod } from '../fit/fitMethod.js';
import { fitMethod } from '../fit/fitMethods.js';
import type { HitTable } from '../io/hitTable.js';
import { gatherRows, indexTracks } from '../io/indexTracks.js';
import { momenta, type MomentumColumns } from './momentum.js';
import { chi2Survival } from '../analysis/chi2Survival.js';
import { fitTracksInMatter, type MatterFitColumns } from '../fit/matter/fitTracksInMatter.js';
import { MATTER_FIT_MIN_PROBABILITY, MATTER_FIT_STATUS } from '../fit/matter/matterTrackFit.js';
import { material as lookupMaterial, type Material } from '../matter/materials.js';
import { particle as lookupParticle, PION_PLUS, type Particle } from '../particles.js';
import { matterMomenta } from './matterMomenta.js';
import { measureByIdentity, speciesList } from './measureByIdentity.js';
import type { IdentifiedTracks } from './identifyTracks.js';
import { endsInside, type FiducialBox } from './stopsInside.js';
import type { StopDecayLinks } from './linkStopDecays.js';

/** χ² probability below which a fitted track is flagged 'poor-fit' (the fit-with-material threshold, 1e-3). */
export const POOR_FIT_PROBABILITY = MATTER_FIT_MIN_PROBABILITY;

/** Which fit gives the momenta: the helix with material effects, or the plain helix (or circle) fit. */
export type TrackFitKind = 'matter' | 'plain-helix';

export interface MeasureTracksOptions {
  /** B_z [T], signed (negative: the field points along −z). Required. */
  readonly fieldT: number;
  /** A registered fit method (`fitMethods()`) or a method object; default 'geometric'. */
  readonly method?: string | FitMethod;
  /** |z| of the particles, default 1. */
  readonly chargeMagnitude?: number;
  /** Error [m] to use for hits that carry none; omitted → estimated from each track's residuals. */
  readonly hitErrorM?: number;
  /**
   * Chamber medium: with it, p_GeV is the momentum at the first hit from the fit with material
   * (energy loss of `particle`, multiple scattering; σ(p) includes the scattering), unless
   * `fit: 'plain-helix'`. Needs hit errors (sigma columns or `hitErrorM`).
   */
  readonly material?: Material | string;
  /**
   * Mass hypothesis for the fit with material; default pi+. 'auto' (e, μ, π, K, p), a list, or
   * text with commas ('mu-,pi-,proton'): identify each track by range (`identifyTracks`) and
   * report it under the chosen species (`identity` in the table).
   */
  readonly particle?: Particle | string | readonly (Particle | string)[];
  /**
   * The chamber's fiducial volume [m]. With the fit with material, a track whose last hit lies
   * 2 cm or more inside every face is taken to stop (`endsInside`) and is fitted with the stop
   * constraint (momentum from range, `MatterFitOptions.stops`; `stops` in the table). With several
   * species it is also the stop decision of the identification (`stopsInside`); omitted → no stop
   * constraint, and the identification uses the curvature-rise criterion.
   */
  readonly volume?: FiducialBox;
  /** 'matter' (default with a material) or 'plain-helix' (one helix, no material; the only choice without one). */
  readonly fit?: TrackFitKind;
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
  /** P(χ²_ndf ≥ χ²); NaN when the hit errors were estimated from the residuals (χ² = ndf then). */
  readonly chi2Prob: Float64Array;
  /** 'poor-fit' marks converged fits with chi2Prob < POOR_FIT_PROBABILITY. */
  readonly status: readonly FitStatus[];
  /** Which fit gave the momenta, and under which mass hypothesis ('matter' only). */
  readonly fit: TrackFitKind;
  readonly particle?: string;
  /** The fits with material (state and covariance at the first hit, last-hit momentum, path, residual range). */
  readonly matter?: MatterFitColumns;
  /** With `particle: 'auto'` or a list: the identification of every track (pid, margin, stop, bound). */
  readonly identity?: IdentifiedTracks;
  /**
   * With the fit with material and a `volume`: 1 for each track that ends inside it (`endsInside`),
   * fitted with the stop constraint.
   */
  readonly stops?: Uint8Array;
  /** With identification: each track's link to the stopping track it starts from (decay at rest). */
  readonly decays?: StopDecayLinks;
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
  /**
   * Arc length s [m] of each row of `hits` along its track's plain helix fit (as the fit measured
   * it, from the reference point; NaN where the fit failed). Absent without z and with material.
   */
  readonly arcLengthM?: Float64Array;
  /** Hits with a negative track id (not assigned to any track: noise, or not yet found); not fitted. */
  readonly unassignedHits: number;
  /** Count of tracks per status. */
  readonly statusCounts: Readonly<Record<FitStatus, number>>;
}

/**
 * Groups hits into tracks, fits each (helix when z is present, circle otherwise) and converts
 * curvature to momentum. Lengths in metres, field in tesla. With a `material`, the fit with
 * material effects (lib/fit/matter) gives p at the first hit under the `particle` hypothesis,
 * with σ(p) including multiple scattering; `fit: 'plain-helix'` keeps the one-helix fit, which
 * measures a mean curvature and so is biased low on a track that slows down.
 * Every fit carries its χ² probability; a converged fit below POOR_FIT_PROBABILITY is 'poor-fit'.
 * @example measureTracks(readHits('run.csv'), { fieldT: 1.5 }).momentum.ptGeV
 */
export function measureTracks(hits: HitTable, options: MeasureTracksOptions): TrackTable {
  const method = fitMethod(options.method ?? CIRCLE_FIT_DEFAULTS.method);
  if (options.hitErrorM !== undefined && !(options.hitErrorM > 0)) throw msg.badArgument('hitErrorM', options.hitErrorM, 'a positive hit error in metres');
  if (!Number.isFinite(options.fieldT) || options.fieldT === 0) throw msg.badArgument('fieldT', options.fieldT, 'a non-zero magnetic field in tesla (signed along +z)');
  const several = speciesList(options.particle);
  if (several !== undefined) {
    if (options.material === undefined || options.fit === 'plain-helix') throw msg.badArgument('particle', String(options.particle), "one species without a material or with the plain helix fit; identification by range needs a material and the fit with material");
    return measureByIdentity(hits, options, several, measureTracks);
  }
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
  // Spelled out, not spread: a spread built a new hidden class per call here, so the fits
  // recompiled (deoptimised on "wrong map") chunk after chunk of a batch run.
  const helix = hasZ ? fitHelices({ x: table.x, y: table.y, sigmaX, sigmaY, z: table.z!, sigmaZ: table.sigmaZ }, index.offsets, fitOptions) : undefined;
  const circle = helix ? helix.circle : fitCircles(planeHits, index.offsets, fitOptions);
  const n = index.count;
  const nhits = new Int32Array(n);
  for (let k = 0; k < n; k++) nhits[k] = index.offsets[k + 1] - index.offsets[k];
  const fit: TrackFitKind = options.material !== undefined && options.fit !== 'plain-helix' ? 'matter' : 'plain-helix';
  if (options.fit !== undefined && options.fit !== 'matter' && options.fit !== 'plain-helix') throw msg.badArgument('fit', options.fit, "'matter' or 'plain-helix'");
  if (fit === 'matter') {
    if (sigmaX === undefined) throw msg.badArgument('hitErrorM', undefined, "hit errors for the fit with material: sigma columns, hitErrorM (--hit-error), or the plain helix fit (fit: 'plain-helix', --plain-helix)");
    const medium = typeof options.material === 'string' ? lookupMaterial(options.material) : options.material!;
    const species = options.particle === undefined ? PION_PLUS : typeof options.particle === 'string' ? lookupParticle(options.particle) : (options.particle as Particle);
    const stops = options.volume ? endsInside(table, index.offsets, options.volume) : undefined;
    const matter = fitTracksInMatter({ x: table.x, y: table.y, sigmaX, sigmaY, z: table.z, sigmaZ: table.sigmaZ }, index.offsets, { fieldT: options.fieldT, medium, particle: species, hitErrorM: options.hitErrorM, stoppingTracks: stops });
    const status = Array.from(matter.status, (s) => MATTER_FIT_STATUS[s] as FitStatus);
    return {
      count: n, event: index.event, track: index.track, nhits,
      kappa: matter.kappa, phi0: matter.phi, d0: new Float64Array(n), z0: hasZ ? matter.zM : new Float64Array(n).fill(NaN),
      xRef: matter.xM, yRef: matter.yM, chi2: matter.chi2, ndf: matter.ndf, iterations: matter.iterations,
      chi2Prob: matter.pValue, status, fit, particle: species.name, matter, ...(stops ? { stops } : {}),
      momentum: matterMomenta(matter), hasZ, method: 'matter', fieldT: options.fieldT,
      hits: table, offsets: index.offsets, hitRows, statusCounts: countStatuses(status), unassignedHits,
    };
  }
  const momentum = momenta(helix ?? circle, options.fieldT, { chargeMagnitude: options.chargeMagnitude });
  const chi2Prob = new Float64Array(n);
  const status = Array.from(circle.status, (s) => FIT_STATUS[s]);
  for (let k = 0; k < n; k++) {
    chi2Prob[k] = circle.errorsEstimated[k] === 1 ? NaN : chi2Survival(circle.chi2[k], circle.ndf[k]);
    if (status[k] === 'ok' && chi2Prob[k] < POOR_FIT_PROBABILITY) status[k] = 'poor-fit';
  }
  const statusCounts = countStatuses(status);
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
    chi2Prob,
    status,
    fit,
    momentum,
    hasZ,
    method: method.name,
    fieldT: options.fieldT,
    hits: table,
    offsets: index.offsets,
    hitRows,
    ...(helix?.arcLengthM ? { arcLengthM: helix.arcLengthM } : {}),
    statusCounts,
    unassignedHits,
  };
}

function countStatuses(status: readonly FitStatus[]): Record<FitStatus, number> {
  const counts = Object.fromEntries(FIT_STATUS.map((s) => [s, 0])) as Record<FitStatus, number>;
  for (const s of status) counts[s]++;
  return counts;
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

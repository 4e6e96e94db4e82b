import { chi2Survival } from '../../analysis/chi2Survival.js';
import { msg } from '../../errors.js';
import { lossModel } from './lossModel.js';
import { convergedStatus, END_KAPPA, END_P, END_PT, END_SIGMA_KAPPA, END_SIGMA_P, END_X, END_Y, END_Z, endState, fitIntoScratch, inputsFinite, matterFitNdf, matterFitSettings } from './matterFitCore.js';
import { matterFitScratch } from './matterFitScratch.js';
import {
  MATTER_FIT_MIN_HITS, MATTER_FIT_MIN_PROBABILITY, MATTER_FIT_STATUS,
  type MatterFitOptions, type MatterFitStatus, type MatterTrackHits,
} from './matterTrackFit.js';

/** Hit columns of many tracks (track k is rows [offsets[k], offsets[k+1]), in travel order), metres: the columns of one track's hits. */
export type MatterTrackColumnsHits = MatterTrackHits;

/**
 * Fits with material of many tracks, struct-of-arrays (one entry per track; see
 * `MatterTrackFit` for the meaning of each): `status` holds indices into `MATTER_FIT_STATUS`;
 * `firstState`/`firstCov` 5 and 25 numbers per track (state (φ, tan λ, q/p, u, z) at the first hit).
 */
export interface MatterFitColumns {
  readonly count: number;
  readonly particle: string;
  readonly status: Uint8Array;
  readonly pGeV: Float64Array;
  readonly sigmaPGeV: Float64Array;
  readonly ptGeV: Float64Array;
  readonly kappa: Float64Array;
  readonly sigmaKappa: Float64Array;
  readonly phi: Float64Array;
  readonly tanLambda: Float64Array;
  readonly xM: Float64Array;
  readonly yM: Float64Array;
  readonly zM: Float64Array;
  readonly pLastGeV: Float64Array;
  readonly sigmaPLastGeV: Float64Array;
  readonly charge: Float64Array;
  readonly chi2: Float64Array;
  readonly ndf: Int32Array;
  readonly pValue: Float64Array;
  /** The stop constraint's χ² term (1 dof; NaN for a track fitted without it). */
  readonly stopChi2: Float64Array;
  readonly pathLengthM: Float64Array;
  readonly residualRangeM: Float64Array;
  readonly reachedHits: Int32Array;
  readonly stopsBeforeNextHit: Uint8Array;
  readonly iterations: Int32Array;
  readonly firstState: Float64Array;
  readonly firstCov: Float64Array;
  /** Count of tracks per status. */
  readonly statusCounts: Readonly<Record<MatterFitStatus, number>>;
}

/** Options of `fitTracksInMatter`: those of one track, and which tracks are known to stop. */
export interface MatterBatchFitOptions extends MatterFitOptions {
  /** Per track, 1 when it is known to stop (`MatterFitOptions.stops` for that track); overrides `stops`. */
  readonly stoppingTracks?: ArrayLike<number>;
}

/**
 * `fitTrackInMatter` for every track of a columnar hit table, with one scratch for all tracks
 * (the batch path of `measureTracks` and `sagitta fit`). Same options, validity, sources and
 * numbers (the same core, `fitIntoScratch`); the per-hit residuals are not kept, and nothing is
 * allocated per track but the hit views.
 * @example fitTracksInMatter(hits, offsets, { fieldT: 2, medium: material('liquid-propane'), particle: PROTON, hitErrorM: 2e-4 }).pGeV
 */
export function fitTracksInMatter(hits: MatterTrackColumnsHits, offsets: Int32Array, options: MatterBatchFitOptions): MatterFitColumns {
  const count = offsets.length - 1;
  if (count < 0 || offsets[count] > hits.x.length) throw msg.badArgument('offsets', offsets.length, 'track offsets into the hit columns (count + 1 entries)');
  const stopping = options.stoppingTracks;
  if (stopping !== undefined && stopping.length !== count) throw msg.badArgument('stoppingTracks', stopping.length, `one flag per track (${count})`);
  const set = matterFitSettings(options);
  if (hits.sigmaX === undefined && options.hitErrorM === undefined) throw msg.badArgument('hitErrorM', undefined, 'a hit error in metres (the hits carry no sigma columns)');
  const model = lossModel(options.medium, options.particle);
  const f = () => new Float64Array(count);
  const out = {
    count, particle: options.particle.name, status: new Uint8Array(count),
    pGeV: f(), sigmaPGeV: f(), ptGeV: f(), kappa: f(), sigmaKappa: f(), phi: f(), tanLambda: f(), xM: f(), yM: f(), zM: f(),
    pLastGeV: f(), sigmaPLastGeV: f(), charge: f(), chi2: f(), ndf: new Int32Array(count), pValue: f(), stopChi2: f(), pathLengthM: f(),
    residualRangeM: f(), reachedHits: new Int32Array(count), stopsBeforeNextHit: new Uint8Array(count), iterations: new Int32Array(count),
    firstState: new Float64Array(5 * count), firstCov: new Float64Array(25 * count),
  };
  const counts = Object.fromEntries(MATTER_FIT_STATUS.map((s) => [s, 0])) as Record<MatterFitStatus, number>;
  let longest = 0;
  for (let k = 0; k < count; k++) longest = Math.max(longest, offsets[k + 1] - offsets[k]);
  const sc = matterFitScratch(longest);
  const scalars = new Float64Array(9);
  const firstOut = { state: out.firstState, so: 0, cov: out.firstCov, co: 0, scalars };
  const lastOut = { state: new Float64Array(5), so: 0, cov: new Float64Array(25), co: 0, scalars };
  const hit = { n: 0, last: false, tanLambda: 0, hasZ: hits.z !== undefined };
  for (let k = 0; k < count; k++) {
    const a = offsets[k], b = offsets[k + 1], n = b - a;
    // One view per distinct column (a table often shares one error column for x, y and z).
    const sigmaX = hits.sigmaX?.subarray(a, b);
    const sigmaY = hits.sigmaY === hits.sigmaX ? sigmaX : hits.sigmaY?.subarray(a, b);
    const sigmaZ = hits.sigmaZ === hits.sigmaX ? sigmaX : hits.sigmaZ === hits.sigmaY ? sigmaY : hits.sigmaZ?.subarray(a, b);
    const h: MatterTrackHits = { x: hits.x.subarray(a, b), y: hits.y.subarray(a, b), z: hits.z?.subarray(a, b), sigmaX, sigmaY, sigmaZ };
    const status = fitOne(h, n, k);
    out.status[k] = MATTER_FIT_STATUS.indexOf(status);
    counts[status]++;
  }
  return Object.freeze({ ...out, statusCounts: Object.freeze(counts) });

  function fitOne(h: MatterTrackHits, n: number, k: number): MatterFitStatus {
    if (n < MATTER_FIT_MIN_HITS) return failed(k, 'too-few-hits', 0);
    if (!inputsFinite(h, set.hitErrorM)) return failed(k, 'bad-input', 0);
    const run = fitIntoScratch(model, h, set, sc, false, stopping !== undefined ? stopping[k] === 1 : options.stops === true);
    if (run.status !== 'ok') return failed(k, run.status, run.reachedHits);
    hit.n = n; hit.tanLambda = run.tanLambda;
    hit.last = true;
    endState(sc, model, options.fieldT, hit, lastOut);
    out.pLastGeV[k] = scalars[END_P]; out.sigmaPLastGeV[k] = scalars[END_SIGMA_P];
    hit.last = false; firstOut.so = 5 * k; firstOut.co = 25 * k;
    endState(sc, model, options.fieldT, hit, firstOut);
    out.pGeV[k] = scalars[END_P]; out.sigmaPGeV[k] = scalars[END_SIGMA_P]; out.ptGeV[k] = scalars[END_PT];
    out.kappa[k] = scalars[END_KAPPA]; out.sigmaKappa[k] = scalars[END_SIGMA_KAPPA];
    out.phi[k] = out.firstState[5 * k]; out.tanLambda[k] = out.firstState[5 * k + 1];
    out.xM[k] = scalars[END_X]; out.yM[k] = scalars[END_Y]; out.zM[k] = scalars[END_Z];
    out.charge[k] = -Math.sign(scalars[END_KAPPA]) * Math.sign(options.fieldT) * model.chargeAbs;
    const ndf = matterFitNdf(n, hit.hasZ, run.constrained), pValue = chi2Survival(run.chi2, ndf);
    const path = sc.path[n - 1], residualRangeM = set.energyLoss ? sc.range[n - 1] / model.gcm2PerM : Infinity;
    out.chi2[k] = run.chi2; out.ndf[k] = ndf; out.pValue[k] = pValue; out.stopChi2[k] = run.stopChi2; out.pathLengthM[k] = path;
    out.residualRangeM[k] = residualRangeM; out.reachedHits[k] = n; out.stopsBeforeNextHit[k] = residualRangeM < path / (n - 1) ? 1 : 0;
    out.iterations[k] = run.iterations;
    return convergedStatus(pValue, run.stopChi2);
  }

  /** A track not fitted: NaN numbers (as `fitTrackInMatter` gives), the hits reached. */
  function failed(k: number, status: MatterFitStatus, reached: number): MatterFitStatus {
    out.pGeV[k] = NaN; out.sigmaPGeV[k] = NaN; out.ptGeV[k] = NaN; out.kappa[k] = NaN; out.sigmaKappa[k] = NaN;
    out.phi[k] = NaN; out.tanLambda[k] = NaN; out.xM[k] = NaN; out.yM[k] = NaN; out.zM[k] = NaN;
    out.pLastGeV[k] = NaN; out.sigmaPLastGeV[k] = NaN; out.charge[k] = NaN; out.chi2[k] = NaN; out.ndf[k] = 0; out.pValue[k] = NaN; out.stopChi2[k] = NaN;
    out.pathLengthM[k] = NaN; out.residualRangeM[k] = NaN; out.reachedHits[k] = reached; out.stopsBeforeNextHit[k] = status === 'cannot-reach' ? 1 : 0;
    out.iterations[k] = 0;
    out.firstState.fill(NaN, 5 * k, 5 * k + 5); out.firstCov.fill(NaN, 25 * k, 25 * k + 25);
    return status;
  }
}

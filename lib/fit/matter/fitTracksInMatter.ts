import { msg } from '../../errors.js';
import { fitTrackInMatter } from './fitTrackInMatter.js';
import { matterFitScratch } from './matterFitScratch.js';
import { MATTER_FIT_STATUS, type MatterFitOptions, type MatterFitStatus, type MatterTrackHits } from './matterTrackFit.js';

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

/**
 * `fitTrackInMatter` for every track of a columnar hit table, with one scratch for all tracks
 * (the batch path of `measureTracks` and `sagitta fit`). Same options, validity and sources.
 * @example fitTracksInMatter(hits, offsets, { fieldT: 2, medium: material('liquid-propane'), particle: PROTON, hitErrorM: 2e-4 }).pGeV
 */
export function fitTracksInMatter(hits: MatterTrackColumnsHits, offsets: Int32Array, options: MatterFitOptions): MatterFitColumns {
  const count = offsets.length - 1;
  if (count < 0 || offsets[count] > hits.x.length) throw msg.badArgument('offsets', offsets.length, 'track offsets into the hit columns (count + 1 entries)');
  const f = () => new Float64Array(count);
  const out = {
    count, particle: options.particle.name, status: new Uint8Array(count),
    pGeV: f(), sigmaPGeV: f(), ptGeV: f(), kappa: f(), sigmaKappa: f(), phi: f(), tanLambda: f(), xM: f(), yM: f(), zM: f(),
    pLastGeV: f(), sigmaPLastGeV: f(), charge: f(), chi2: f(), ndf: new Int32Array(count), pValue: f(), pathLengthM: f(),
    residualRangeM: f(), reachedHits: new Int32Array(count), stopsBeforeNextHit: new Uint8Array(count), iterations: new Int32Array(count),
    firstState: new Float64Array(5 * count), firstCov: new Float64Array(25 * count),
  };
  const counts = Object.fromEntries(MATTER_FIT_STATUS.map((s) => [s, 0])) as Record<MatterFitStatus, number>;
  let longest = 0;
  for (let k = 0; k < count; k++) longest = Math.max(longest, offsets[k + 1] - offsets[k]);
  const scratch = matterFitScratch(longest);
  const view = (c: Float64Array | undefined, a: number, b: number) => c?.subarray(a, b);
  for (let k = 0; k < count; k++) {
    const a = offsets[k], b = offsets[k + 1];
    const r = fitTrackInMatter({
      x: hits.x.subarray(a, b), y: hits.y.subarray(a, b), z: view(hits.z, a, b),
      sigmaX: view(hits.sigmaX, a, b), sigmaY: view(hits.sigmaY, a, b), sigmaZ: view(hits.sigmaZ, a, b),
    }, options, scratch);
    out.status[k] = MATTER_FIT_STATUS.indexOf(r.status);
    counts[r.status]++;
    const s = r.first;
    out.pGeV[k] = s.pGeV; out.sigmaPGeV[k] = s.sigmaPGeV; out.ptGeV[k] = s.ptGeV; out.kappa[k] = s.kappa; out.sigmaKappa[k] = s.sigmaKappa;
    out.phi[k] = s.state[0]; out.tanLambda[k] = s.state[1]; out.xM[k] = s.xM; out.yM[k] = s.yM; out.zM[k] = s.zM;
    out.pLastGeV[k] = r.last.pGeV; out.sigmaPLastGeV[k] = r.last.sigmaPGeV; out.charge[k] = r.charge;
    out.chi2[k] = r.chi2; out.ndf[k] = r.ndf; out.pValue[k] = r.pValue; out.pathLengthM[k] = r.pathLengthM;
    out.residualRangeM[k] = r.residualRangeM; out.reachedHits[k] = r.reachedHits; out.stopsBeforeNextHit[k] = r.stopsBeforeNextHit ? 1 : 0;
    out.iterations[k] = r.iterations;
    out.firstState.set(s.state, 5 * k); out.firstCov.set(s.cov, 25 * k);
  }
  return Object.freeze({ ...out, statusCounts: Object.freeze(counts) });
}

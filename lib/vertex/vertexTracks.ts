import { GEV_PER_TESLA_METRE } from '../constants.js';
import { msg } from '../errors.js';
import { FIT_STATUS } from '../fit/circleFit.js';
import { fitCircles, type CircleMethod } from '../fit/fitCircles.js';
import { arcLengths, fitHelices } from '../fit/fitHelices.js';
import type { HitTable } from '../io/hitTable.js';
import { gatherRows, indexTracks } from '../io/indexTracks.js';
import type { HelixParameters } from './helixParameters.js';

/**
 * Tracks as the vertex finders read them: one row per track, helix parameters at the track's
 * first hit with their 5×5 covariance, the charge sign, and the arc length of the last hit
 * (where a track ends, for kinks). Rows of one event are contiguous. Lengths [m].
 */
export interface VertexTracks {
  readonly count: number;
  readonly event: Float64Array;
  readonly track: Float64Array;
  readonly xRef: Float64Array;
  readonly yRef: Float64Array;
  readonly kappa: Float64Array;
  readonly phi0: Float64Array;
  readonly d0: Float64Array;
  readonly z0: Float64Array;
  readonly tanLambda: Float64Array;
  /** 25 numbers per track: row-major covariance of (κ, φ0, d0, z0, tan λ). */
  readonly cov: Float64Array;
  /** Charge sign ±1 (0 for a straight track, NaN where the fit failed). */
  readonly charge: Float64Array;
  /** 1 where the fit is usable ('ok'). */
  readonly usable: Uint8Array;
  /** Transverse arc length of the last hit from the first [m]. */
  readonly lastArcM: Float64Array;
  /** B_z [T], signed. */
  readonly fieldT: number;
  /** False when the hits carry no z: z0 = tan λ = 0 with 1 m² variances, and outputs leave z empty. */
  readonly hasZ: boolean;
}

export interface VertexTracksOptions {
  readonly fieldT: number;
  readonly method?: CircleMethod;
  /** Hit error [m] for hits without one; omitted → estimated from each track's residuals. */
  readonly hitErrorM?: number;
}

/**
 * Fits every track of a hit table (helix when z is present) and keeps what vertexing needs.
 * Hits with a negative track id are set aside (counted in `unassignedHits`), as `measureTracks`
 * does; the grouping and fits are the same calls.
 * @example vertexTracks(readHits('v0.csv'), { fieldT: 1.5 }).count
 */
export function vertexTracks(hits: HitTable, options: VertexTracksOptions): VertexTracks & { readonly unassignedHits: number } {
  const { fieldT } = options;
  if (!Number.isFinite(fieldT) || fieldT === 0) throw msg.badArgument('fieldT', fieldT, 'a non-zero magnetic field in tesla (signed along +z)');
  let unassigned = 0;
  for (let i = 0; i < hits.length; i++) if (hits.track[i] < 0) unassigned++;
  let assigned = hits;
  if (unassigned > 0) {
    const keep = new Int32Array(hits.length - unassigned);
    for (let i = 0, j = 0; i < hits.length; i++) if (hits.track[i] >= 0) keep[j++] = i;
    assigned = gatherRows(hits, keep);
  }
  const { table, index } = indexTracks(assigned);
  let sigmaX = table.sigmaX, sigmaY = table.sigmaY;
  if (sigmaX === undefined && options.hitErrorM !== undefined) sigmaX = sigmaY = new Float64Array(table.length).fill(options.hitErrorM);
  const planeHits = { x: table.x, y: table.y, sigmaX, sigmaY };
  const method = options.method ?? 'geometric';
  const hasZ = table.z !== undefined;
  const helix = hasZ ? fitHelices({ ...planeHits, z: table.z!, sigmaZ: table.sigmaZ }, index.offsets, { method }) : undefined;
  const circle = helix ? helix.circle : fitCircles(planeHits, index.offsets, { method });
  const n = index.count;
  const cov = new Float64Array(25 * n);
  const charge = new Float64Array(n), usable = new Uint8Array(n), lastArcM = new Float64Array(n);
  const z0 = new Float64Array(n), tanLambda = new Float64Array(n);
  let scratch = new Float64Array(64);
  for (let k = 0; k < n; k++) {
    const c = 25 * k;
    if (helix) {
      z0[k] = helix.z0[k];
      tanLambda[k] = helix.tanLambda[k];
      for (let r = 0, q = 0; r < 5; r++) for (let s = r; s < 5; s++, q++) cov[c + 5 * r + s] = cov[c + 5 * s + r] = helix.cov[15 * k + q];
    } else {
      const c6 = circle.cov.subarray(6 * k, 6 * k + 6);
      const up = [c6[0], c6[1], c6[2], c6[3], c6[4], c6[5]];
      for (let r = 0, q = 0; r < 3; r++) for (let s = r; s < 3; s++, q++) cov[c + 5 * r + s] = cov[c + 5 * s + r] = up[q];
      cov[c + 18] = 1;
      cov[c + 24] = 1;
    }
    const kap = circle.kappa[k];
    charge[k] = Number.isFinite(kap) ? (kap === 0 ? 0 : -Math.sign(kap) * Math.sign(fieldT)) : NaN;
    usable[k] = FIT_STATUS[circle.status[k]] === 'ok' && Number.isFinite(tanLambda[k]) && Number.isFinite(cov[c]) ? 1 : 0;
    const from = index.offsets[k], to = index.offsets[k + 1];
    if (usable[k]) {
      if (scratch.length < to - from) scratch = new Float64Array(2 * (to - from));
      arcLengths(table.x, table.y, from, to, kap, circle.phi0[k], circle.d0[k], circle.xRef[k], circle.yRef[k], scratch);
      lastArcM[k] = scratch[to - from - 1];
    } else {
      lastArcM[k] = NaN;
    }
  }
  return {
    count: n, event: index.event, track: index.track, xRef: circle.xRef, yRef: circle.yRef,
    kappa: circle.kappa, phi0: circle.phi0, d0: circle.d0, z0, tanLambda, cov, charge, usable, lastArcM,
    fieldT, hasZ, unassignedHits: unassigned,
  };
}

/** Copies track k into the scratch helix `out` (and returns it). */
export function loadHelix(tracks: VertexTracks, k: number, out: HelixParameters): HelixParameters {
  out.xRef = tracks.xRef[k];
  out.yRef = tracks.yRef[k];
  out.kappa = tracks.kappa[k];
  out.phi0 = tracks.phi0[k];
  out.d0 = tracks.d0[k];
  out.z0 = tracks.z0[k];
  out.tanLambda = tracks.tanLambda[k];
  out.cov.set(tracks.cov.subarray(25 * k, 25 * k + 25));
  return out;
}

/** Transverse momentum [MeV/c] of a track of curvature κ [1/m] and charge number |z| in B [T]. */
export function transverseMomentumMeV(kappa: number, fieldT: number, chargeMagnitude = 1): number {
  return (1e3 * GEV_PER_TESLA_METRE * chargeMagnitude * Math.abs(fieldT)) / Math.abs(kappa);
}

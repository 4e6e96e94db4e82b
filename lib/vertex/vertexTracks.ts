import { GEV_PER_TESLA_METRE } from '../constants.js';
import { arcLengthsAndSlopes, newArcLengthSlopes } from '../fit/arcLengths.js';
import { FIT_STATUS } from '../fit/circleFit.js';
import { fitCircles } from '../fit/fitCircles.js';
import { fitHelices } from '../fit/fitHelices.js';
import type { TrackTable } from '../track/measureTracks.js';
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
  /** Hit error [m] for hits without one (as given to measureTracks); omitted → estimated from the residuals. */
  readonly hitErrorM?: number;
}

/**
 * What vertexing needs of a measured track table: the helix parameters at each track's first
 * hit (the table's reference point) with their 5×5 covariance, charges and the arc length of
 * each track's last hit. The table keeps its hits grouped by track, so nothing is regrouped;
 * the table does not keep the fit covariance, so the tracks are fitted once more here with the
 * table's own method (the same numbers, plus the covariance).
 * @example vertexTracks(measureTracks(readHits('v0.csv'), { fieldT: 1.5 })).count
 */
export function vertexTracks(table: TrackTable, options: VertexTracksOptions = {}): VertexTracks {
  const { fieldT, hits, offsets } = table;
  let sigmaX = hits.sigmaX, sigmaY = hits.sigmaY;
  if (sigmaX === undefined && options.hitErrorM !== undefined) sigmaX = sigmaY = new Float64Array(hits.length).fill(options.hitErrorM);
  const planeHits = { x: hits.x, y: hits.y, sigmaX, sigmaY };
  const fitOptions = { method: table.method, fieldT };
  const hasZ = hits.z !== undefined;
  const helix = hasZ ? fitHelices({ x: hits.x, y: hits.y, sigmaX, sigmaY, z: hits.z!, sigmaZ: hits.sigmaZ }, offsets, fitOptions) : undefined;
  const circle = helix ? helix.circle : fitCircles(planeHits, offsets, fitOptions);
  const n = table.count;
  const cov = new Float64Array(25 * n);
  const charge = new Float64Array(n), usable = new Uint8Array(n), lastArcM = new Float64Array(n);
  const z0 = new Float64Array(n), tanLambda = new Float64Array(n);
  let arcs = newArcLengthSlopes(64);
  const rows = { x: hits.x, y: hits.y, from: 0, to: 0 };
  const at = { kappa: 0, phi: 0, d: 0, xRef: 0, yRef: 0 };
  for (let k = 0; k < n; k++) {
    const c = 25 * k;
    if (helix) {
      z0[k] = helix.z0[k];
      tanLambda[k] = helix.tanLambda[k];
      for (let r = 0, q = 0; r < 5; r++) for (let u = r; u < 5; u++, q++) cov[c + 5 * r + u] = cov[c + 5 * u + r] = helix.cov[15 * k + q];
    } else {
      const c6 = circle.cov.subarray(6 * k, 6 * k + 6);
      for (let r = 0, q = 0; r < 3; r++) for (let u = r; u < 3; u++, q++) cov[c + 5 * r + u] = cov[c + 5 * u + r] = c6[q];
      cov[c + 18] = 1;
      cov[c + 24] = 1;
    }
    const kap = circle.kappa[k];
    charge[k] = Number.isFinite(kap) ? (kap === 0 ? 0 : -Math.sign(kap) * Math.sign(fieldT)) : NaN;
    usable[k] = FIT_STATUS[circle.status[k]] === 'ok' && Number.isFinite(tanLambda[k]) && Number.isFinite(cov[c]) ? 1 : 0;
    lastArcM[k] = NaN;
    if (usable[k]) {
      rows.from = offsets[k];
      rows.to = offsets[k + 1];
      if (arcs.s.length < rows.to - rows.from) arcs = newArcLengthSlopes(2 * (rows.to - rows.from));
      at.kappa = kap; at.phi = circle.phi0[k]; at.d = circle.d0[k]; at.xRef = circle.xRef[k]; at.yRef = circle.yRef[k];
      arcLengthsAndSlopes(rows, at, arcs);
      lastArcM[k] = arcs.s[rows.to - rows.from - 1];
    }
  }
  return {
    count: n, event: table.event, track: table.track, xRef: circle.xRef, yRef: circle.yRef,
    kappa: circle.kappa, phi0: circle.phi0, d0: circle.d0, z0, tanLambda, cov, charge, usable, lastArcM, fieldT, hasZ,
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

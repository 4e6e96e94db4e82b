import { SPEED_OF_LIGHT_M_S } from '../constants.js';
import { msg } from '../errors.js';
import type { Medium } from '../matter/medium.js';
import { ANTIPROTON, ELECTRON, KAON_SHORT, LAMBDA, PION_MINUS, PION_PLUS, POSITRON, PROTON, type Particle } from '../particles.js';
import { armenteros } from './armenteros.js';
import { circleCrossings, newClosestApproachScratch, refineClosestApproach, type ClosestApproach, type ClosestApproachScratch } from './closestApproach.js';
import { helixPoint, newHelixParameters, type HelixParameters } from './helixParameters.js';
import { newTrackState, trackStateAt, type TrackState } from './trackState.js';
import { newV0MassScratch, v0Masses } from './v0Masses.js';
import { fitTwoTrackVertex, newTwoTrackVertex, newVertexScratch } from './twoTrackVertex.js';
import { V0CandidateBuilder, type V0Candidates } from './v0Candidates.js';
import { loadHelix, type VertexTracks } from './vertexTracks.js';

/**
 * Cuts of the V⁰ finder (lengths [m], angles [rad]); each is applied in this order:
 * 1. opposite charges, both fits usable;
 * 2. the two circles come within `maxDcaM` of each other in the bending plane;
 * 3. the 3-D closest approach (`closestApproach`) lies no more than `maxDownstreamM` downstream
 *    of either daughter's first hit (a decay product cannot have been measured before it was
 *    made) and the distance of closest approach is below `maxDcaM`;
 * 4. the flight distance from the primary point exceeds `minFlightM` (rejects pairs from the
 *    primary vertex itself);
 * 5. the pointing angle between the flight direction and the summed momentum is below
 *    `maxPointingRad` (a V⁰ made at the primary point flies away from it);
 * 6. the vertex fit's χ² (1 degree of freedom) is below `maxChi2`.
 */
export const V0_FINDER_DEFAULTS = Object.freeze({
  maxDcaM: 0.01,
  maxDownstreamM: 0.01,
  minFlightM: 0.02,
  maxPointingRad: 0.15,
  maxChi2: Infinity,
});

export interface V0FinderOptions {
  /** Primary interaction point [m]; default the origin. */
  readonly primaryM?: readonly [number, number, number];
  /** Chamber medium for the energy-loss correction between vertex and first hits; none by default. */
  readonly medium?: Medium;
  readonly maxDcaM?: number;
  readonly maxDownstreamM?: number;
  readonly minFlightM?: number;
  readonly maxPointingRad?: number;
  readonly maxChi2?: number;
}

export interface V0FinderResult {
  readonly candidates: V0Candidates;
  /** Opposite-charge pairs of usable tracks in the same event: the pairs tried. */
  readonly pairsTried: number;
  /** How many pairs each cut removed, in the order of V0_FINDER_DEFAULTS' description. */
  readonly rejected: { readonly circles: number; readonly closestApproach: number; readonly flight: number; readonly pointing: number; readonly chi2: number };
}

const HYPOTHESES: readonly (readonly [Particle, Particle])[] = [
  [PION_PLUS, PION_MINUS], [PROTON, PION_MINUS], [PION_PLUS, ANTIPROTON], [POSITRON, ELECTRON],
];
const C_M_PER_PS = SPEED_OF_LIGHT_M_S * 1e-12;

/**
 * Finds V⁰ decays (K⁰_S → π⁺π⁻, Λ → pπ⁻, Λ̄ → p̄π⁺, and photon conversions γ → e⁺e⁻) among the
 * tracks of each event: opposite-charge pairs whose common vertex is displaced from the primary
 * point, with the cuts of `V0_FINDER_DEFAULTS`. For each candidate: the fitted vertex with its
 * covariance and χ², the distance of closest approach, flight distance and pointing angle, the
 * invariant mass and its error under ππ, pπ⁻, π⁺p̄ and ee with each daughter's momentum taken at
 * the vertex (helix direction there; energy lost between vertex and first hit added back under
 * each hypothesis when `medium` is given), Armenteros α and q_T, and proper times under the
 * K⁰_S and Λ masses. Fields [T] and lengths [m] as in `VertexTracks`.
 * @example findV0s(vertexTracks(measureTracks(hits, { fieldT: 1.5 })), { primaryM: [0, 0, 0] }).candidates.massPiPiMeV
 */
export function findV0s(tracks: VertexTracks, options: V0FinderOptions = {}): V0FinderResult {
  const cut = { ...V0_FINDER_DEFAULTS, ...stripUndefined(options) };
  for (const k of ['maxDcaM', 'maxDownstreamM', 'minFlightM', 'maxPointingRad', 'maxChi2'] as const) {
    if (!(cut[k] >= 0)) throw msg.badArgument(k, cut[k], 'a non-negative number');
  }
  const primary = options.primaryM ?? [0, 0, 0];
  const { count, fieldT } = tracks;
  // Circle centres and radii once per track, for the cheap first cut.
  const xc = new Float64Array(count), yc = new Float64Array(count), rad = new Float64Array(count);
  for (let k = 0; k < count; k++) {
    const arm = 1 / tracks.kappa[k] - tracks.d0[k];
    xc[k] = tracks.xRef[k] - arm * Math.sin(tracks.phi0[k]);
    yc[k] = tracks.yRef[k] + arm * Math.cos(tracks.phi0[k]);
    rad[k] = 1 / Math.abs(tracks.kappa[k]);
  }
  const order = eventOrder(tracks.event);
  const pool: HelixParameters[] = [];
  const scratch = newClosestApproachScratch();
  const ca: ClosestApproach = { s1: NaN, s2: NaN, distanceM: NaN, status: 'no-start' };
  const vertex = newTwoTrackVertex(), vScratch = newVertexScratch();
  const states: TrackState[] = [newTrackState(), newTrackState()];
  const massScratch = newV0MassScratch(HYPOTHESES.length, newClosestApproachScratch());
  const massRow = new Float64Array(HYPOTHESES.length), sigmaRow = new Float64Array(HYPOTHESES.length);
  const out = new V0CandidateBuilder();
  const rejected = { circles: 0, closestApproach: 0, flight: 0, pointing: 0, chi2: 0 };
  let pairsTried = 0;
  const cosMax = Math.cos(cut.maxPointingRad);

  for (let a = 0; a < order.length;) {
    let b = a;
    while (b < order.length && tracks.event[order[b]] === tracks.event[order[a]]) b++;
    while (pool.length < b - a) pool.push(newHelixParameters());
    for (let i = a; i < b; i++) if (tracks.usable[order[i]]) loadHelix(tracks, order[i], pool[i - a]);
    for (let i = a; i < b; i++) {
      const ki = order[i];
      if (!tracks.usable[ki]) continue;
      for (let j = i + 1; j < b; j++) {
        const kj = order[j];
        if (!tracks.usable[kj] || tracks.charge[ki] * tracks.charge[kj] >= 0) continue;
        pairsTried++;
        const iPos = tracks.charge[ki] > 0;
        const kp = iPos ? ki : kj, kn = iPos ? kj : ki;
        const d = Math.hypot(xc[kp] - xc[kn], yc[kp] - yc[kn]);
        if (d > rad[kp] + rad[kn] + cut.maxDcaM || d < Math.abs(rad[kp] - rad[kn]) - cut.maxDcaM) { rejected.circles++; continue; }
        const hPos = pool[(iPos ? i : j) - a], hNeg = pool[(iPos ? j : i) - a];
        const found = pairApproach(hPos, hNeg, primary, cut, ca, scratch);
        if (found === 'flight') { rejected.flight++; continue; }
        if (found === 'pointing') { rejected.pointing++; continue; }
        if (found === 'none') { rejected.closestApproach++; continue; }
        // Flight and pointing from the midpoint and the helix directions (no loss correction yet).
        const p1 = scratch.p1, p2 = scratch.p2;
        const mx = 0.5 * (p1[0] + p2[0]) - primary[0], my = 0.5 * (p1[1] + p2[1]) - primary[1], mz = 0.5 * (p1[2] + p2[2]) - primary[2];
        const flight = Math.hypot(mx, my, mz);
        if (!(flight >= cut.minFlightM)) { rejected.flight++; continue; }
        const px = sumDirection(hPos, ca.s1, hNeg, ca.s2);
        if (!(cosine(mx, my, mz, px[0], px[1], px[2]) >= cosMax)) { rejected.pointing++; continue; }
        fitTwoTrackVertex(hPos, hNeg, ca.s1, ca.s2, vertex, vScratch);
        if (vertex.status === 'ok' && !(vertex.chi2 <= cut.maxChi2)) { rejected.chi2++; continue; }
        const ok = vertex.status === 'ok';
        const sPos = ok ? vertex.s1 : ca.s1, sNeg = ok ? vertex.s2 : ca.s2;
        const vx = ok ? vertex.xM : mx + primary[0], vy = ok ? vertex.yM : my + primary[1], vz = ok ? vertex.zM : mz + primary[2];
        let status = ok ? 'ok' : 'vertex-singular';
        const row = out.add(kp, kn, status);
        const c = out.cols;
        c.event[row] = tracks.event[kp];
        c.trackPos[row] = tracks.track[kp];
        c.trackNeg[row] = tracks.track[kn];
        c.xM[row] = vx; c.yM[row] = vy; c.zM[row] = tracks.hasZ ? vz : NaN;
        out.cov.set(ok ? vertex.cov : [NaN, NaN, NaN, NaN, NaN, NaN], 6 * row);
        c.dcaM[row] = ca.distanceM;
        c.chi2[row] = ok ? vertex.chi2 : NaN;
        const fx = vx - primary[0], fy = vy - primary[1], fz = vz - primary[2];
        const L = Math.hypot(fx, fy, fz);
        c.flightM[row] = L;
        const ux = fx / L, uy = fy / L, uz = fz / L, v = vertex.cov;
        c.sigmaFlightM[row] = ok ? Math.sqrt(ux * ux * v[0] + uy * uy * v[3] + uz * uz * v[5] + 2 * (ux * uy * v[1] + ux * uz * v[2] + uy * uz * v[4])) : NaN;
        const ctx = { fieldT, medium: options.medium, momentumArcPosM: 0.5 * tracks.lastArcM[kp], momentumArcNegM: 0.5 * tracks.lastArcM[kn], hypotheses: HYPOTHESES };
        if (v0Masses(hPos, hNeg, sPos, sNeg, ctx, massRow, sigmaRow, massScratch) !== 'ok') status = 'ranged-out';
        c.massPiPiMeV[row] = massRow[0]; c.sigmaMassPiPiMeV[row] = sigmaRow[0];
        c.massPPiMeV[row] = massRow[1]; c.sigmaMassPPiMeV[row] = sigmaRow[1];
        c.massPiPMeV[row] = massRow[2]; c.sigmaMassPiPMeV[row] = sigmaRow[2];
        c.massEEMeV[row] = massRow[3]; c.sigmaMassEEMeV[row] = sigmaRow[3];
        // Armenteros variables, V⁰ momentum and proper times from the ππ momenta at the vertex.
        const pp = trackStateAt(hPos, sPos, { fieldT, species: PION_PLUS, medium: options.medium, momentumArcM: ctx.momentumArcPosM }, states[0]).pMeV;
        const pn = trackStateAt(hNeg, sNeg, { fieldT, species: PION_MINUS, medium: options.medium, momentumArcM: ctx.momentumArcNegM }, states[1]).pMeV;
        const ap = armenteros(pp, pn);
        c.armenterosAlpha[row] = ap.alpha;
        c.armenterosQtMeV[row] = ap.qtMeV;
        const sx = pp[0] + pn[0], sy = pp[1] + pn[1], sz = pp[2] + pn[2];
        const p = Math.hypot(sx, sy, sz);
        c.pMeV[row] = p;
        c.pointingRad[row] = Math.acos(Math.min(1, cosine(fx, fy, fz, sx, sy, sz)));
        c.properTimeK0sPs[row] = (L * KAON_SHORT.massMeV) / p / C_M_PER_PS;
        c.properTimeLambdaPs[row] = (L * LAMBDA.massMeV) / p / C_M_PER_PS;
        out.status[row] = status;
      }
    }
    a = b;
  }
  return { candidates: out.finish(), pairsTried, rejected };
}

/**
 * The pair's closest approach for the finder, from the crossings of the circles. A crossing
 * where the helices also meet in z (|Δz| below the DCA cut, so the 3-D closest approach lies
 * within about that of it) is judged at once: nearer the primary than the flight cut less twice
 * the DCA cut, or pointing away by more than the pointing cut plus the angle twice the DCA cut
 * subtends, it cannot pass, and it is not refined (most pairs of tracks from the primary vertex
 * go this way). Starts downstream of a first hit, and starts whose straight-line estimate of
 * the distance exceeds twice the cut (with the estimate valid), are not refined either.
 * Returns 'ok' with the best approach in `ca` and its two points in `scratch.p1`, `scratch.p2`;
 * otherwise the cut that removed every start ('flight', 'pointing', or 'none' for the
 * closest-approach cut).
 */
function pairApproach(
  a: HelixParameters, b: HelixParameters, primary: readonly number[],
  cut: { readonly maxDcaM: number; readonly minFlightM: number; readonly maxDownstreamM: number; readonly maxPointingRad: number },
  ca: ClosestApproach, scratch: ClosestApproachScratch,
): 'flight' | 'pointing' | 'none' | 'ok' {
  const starts = scratch.starts, p = scratch.p1;
  const n = circleCrossings(a, b, starts);
  const { maxDcaM, minFlightM, maxDownstreamM, maxPointingRad } = cut;
  const startLimit = 3 * maxDownstreamM + maxDcaM;
  const s0 = starts[0], s1 = starts[1], s2 = starts[2], s3 = starts[3];
  let best1 = NaN, best2 = NaN, bestD = Infinity;
  let flightFails = 0, pointingFails = 0;
  for (let i = 0; i < n; i++) {
    const u = i === 0 ? s0 : s2, v = i === 0 ? s1 : s3;
    if (u > startLimit || v > startLimit) continue;
    const z1 = a.z0 + a.tanLambda * u, z2 = b.z0 + b.tanLambda * v;
    const dz = Math.abs(z1 - z2);
    const f1 = a.phi0 + a.kappa * u, f2 = b.phi0 + b.kappa * v;
    const c1 = Math.cos(f1), n1 = Math.sin(f1), c2 = Math.cos(f2), n2 = Math.sin(f2);
    if (dz <= maxDcaM) {
      helixPoint(a, u, p);
      const fx = p[0] - primary[0], fy = p[1] - primary[1], fz = 0.5 * (z1 + z2) - primary[2];
      const flight = Math.hypot(fx, fy, fz);
      if (flight < minFlightM - 2 * maxDcaM) { flightFails++; continue; }
      const w1 = 1 / Math.abs(a.kappa), w2 = 1 / Math.abs(b.kappa);
      const cos = cosine(fx, fy, fz, w1 * c1 + w2 * c2, w1 * n1 + w2 * n2, w1 * a.tanLambda + w2 * b.tanLambda);
      if (flight > 4 * maxDcaM && cos < Math.cos(Math.min(Math.PI, maxPointingRad + (4 * maxDcaM) / flight))) { pointingFails++; continue; }
    } else {
      // Straight-line estimate at the crossing: two lines meeting in x–y with a z offset δ are
      // |δ (t₁ × t₂)_z| / |t₁ × t₂| apart, reached after a shift of about δ / |t₁ × t₂| along them.
      const cx = n1 * b.tanLambda - a.tanLambda * n2, cy = a.tanLambda * c2 - c1 * b.tanLambda, cz = c1 * n2 - n1 * c2;
      const cross = Math.hypot(cx, cy, cz);
      if (cross > 0 && (dz * Math.abs(cz)) / cross > 2 * maxDcaM && (dz / cross) * Math.max(Math.abs(a.kappa), Math.abs(b.kappa)) < 0.1) continue;
    }
    refineClosestApproach(a, b, u, v, ca, scratch);
    if (ca.s1 <= maxDownstreamM && ca.s2 <= maxDownstreamM && ca.distanceM <= maxDcaM && ca.distanceM < bestD) {
      bestD = ca.distanceM; best1 = ca.s1; best2 = ca.s2;
    }
  }
  if (bestD === Infinity) return flightFails > 0 ? 'flight' : pointingFails > 0 ? 'pointing' : 'none';
  ca.s1 = best1; ca.s2 = best2; ca.distanceM = bestD; ca.status = 'ok';
  helixPoint(a, best1, scratch.p1);
  helixPoint(b, best2, scratch.p2);
  return 'ok';
}

/** Rows in event order (stable), so that each event's tracks are one run. */
function eventOrder(event: Float64Array): Int32Array {
  const order = Int32Array.from({ length: event.length }, (_, i) => i);
  let sorted = true;
  for (let i = 1; i < event.length; i++) if (event[i] < event[i - 1]) { sorted = false; break; }
  if (!sorted) order.sort((p, q) => event[p] - event[q] || p - q);
  return order;
}

/** Summed momentum direction (unnormalised, p_T-weighted) of the two helices at their arc lengths. */
function sumDirection(a: HelixParameters, s1: number, b: HelixParameters, s2: number): [number, number, number] {
  const w1 = 1 / Math.abs(a.kappa), w2 = 1 / Math.abs(b.kappa);
  const f1 = a.phi0 + a.kappa * s1, f2 = b.phi0 + b.kappa * s2;
  return [w1 * Math.cos(f1) + w2 * Math.cos(f2), w1 * Math.sin(f1) + w2 * Math.sin(f2), w1 * a.tanLambda + w2 * b.tanLambda];
}

function cosine(ax: number, ay: number, az: number, bx: number, by: number, bz: number): number {
  return (ax * bx + ay * by + az * bz) / (Math.hypot(ax, ay, az) * Math.hypot(bx, by, bz));
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

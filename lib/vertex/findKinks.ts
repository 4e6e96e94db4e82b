import { msg } from '../errors.js';
import type { Medium } from '../matter/medium.js';
import { KAON_MINUS, KAON_PLUS, MUON_MINUS, MUON_PLUS, PION_MINUS, PION_PLUS, type Particle } from '../particles.js';
import { newClosestApproachScratch, refineClosestApproach, type ClosestApproach } from './closestApproach.js';
import { fourMomentum } from './fourVector.js';
import { helixPoint, newHelixParameters } from './helixParameters.js';
import { toRestFrame } from './lorentzBoost.js';
import { newTrackState, trackStateAt } from './trackState.js';
import { loadHelix, type VertexTracks } from './vertexTracks.js';

/**
 * Cuts of the kink finder (lengths [m], angles [rad]):
 * 1. parent and daughter in the same event, same charge sign, both fits usable;
 * 2. the daughter's first hit lies within `maxGapM` of the parent's last hit;
 * 3. the closest approach of the two helices, searched from those two hits, lies no more than
 *    `maxOverlapM` before the parent's last hit or after the daughter's first hit, with a
 *    distance below `maxDcaM`;
 * 4. the kink angle between the two directions there exceeds `minAngleRad` (a track broken into
 *    two pieces by a missed hit has no kink).
 */
export const KINK_FINDER_DEFAULTS = Object.freeze({
  maxGapM: 0.05,
  maxOverlapM: 0.01,
  maxDcaM: 0.01,
  minAngleRad: 0.03,
});

export interface KinkFinderOptions {
  /** Medium for the energy-loss correction of both tracks to the kink; none by default. */
  readonly medium?: Medium;
  readonly maxGapM?: number;
  readonly maxOverlapM?: number;
  readonly maxDcaM?: number;
  readonly minAngleRad?: number;
}

/** Kink candidates, one row per (parent, daughter) pair. Lengths [m], momenta [MeV/c], angles [rad]. */
export interface KinkCandidates {
  readonly count: number;
  readonly event: Float64Array;
  readonly trackParent: Float64Array;
  readonly trackDaughter: Float64Array;
  readonly rowParent: Int32Array;
  readonly rowDaughter: Int32Array;
  readonly xM: Float64Array;
  readonly yM: Float64Array;
  readonly zM: Float64Array;
  readonly dcaM: Float64Array;
  readonly angleRad: Float64Array;
  /** |p| of the parent at the kink as a pion and of the daughter as a muon. */
  readonly parentMomentumMeV: Float64Array;
  readonly daughterMomentumMeV: Float64Array;
  /** Daughter momentum transverse to the parent direction (≤ p* of the decay). */
  readonly qtMeV: Float64Array;
  /** Daughter momentum in the parent's rest frame under π → μν and K → μν (29.8 and 235.5 MeV/c when right). */
  readonly pStarPiMuMeV: Float64Array;
  readonly pStarKMuMeV: Float64Array;
  /** Squared missing mass (E_P − E_μ)² − |P − p_μ|² [MeV²] under each parent hypothesis: 0 for a neutrino. */
  readonly missingMass2PiMuMeV2: Float64Array;
  readonly missingMass2KMuMeV2: Float64Array;
  readonly status: readonly string[];
}

export interface KinkFinderResult {
  readonly kinks: KinkCandidates;
  /** Same-sign pairs of usable tracks in one event: the pairs tried. */
  readonly pairsTried: number;
}

type Col = Exclude<keyof KinkCandidates, 'count' | 'status' | 'rowParent' | 'rowDaughter'>;
const COLS: readonly Col[] = ['event', 'trackParent', 'trackDaughter', 'xM', 'yM', 'zM', 'dcaM', 'angleRad', 'parentMomentumMeV', 'daughterMomentumMeV', 'qtMeV', 'pStarPiMuMeV', 'pStarKMuMeV', 'missingMass2PiMuMeV2', 'missingMass2KMuMeV2'];

/**
 * Finds decays in flight of charged particles — π → μν and K → μν, whose neutrino is unseen —
 * as kinks: a track that ends where another of the same charge begins, at an angle (cuts in
 * `KINK_FINDER_DEFAULTS`). For each kink: the point (closest approach of the two helices), the
 * kink angle, the parent's momentum at the kink, the daughter's transverse momentum to the
 * parent, its momentum in the parent's rest frame under each parent hypothesis (two-body decay:
 * 29.79 MeV/c for π → μν, 235.5 MeV/c for K → μν) and the missing mass² (0 for the neutrino).
 * Momenta come from each track's helix at the kink (`trackStateAt`, energy loss under the
 * hypothesis when `medium` is given). The hypotheses' charge follows the tracks'.
 * @example findKinks(vertexTracks(measureTracks(hits, { fieldT: 1.5 }))).kinks.pStarPiMuMeV
 */
export function findKinks(tracks: VertexTracks, options: KinkFinderOptions = {}): KinkFinderResult {
  const cut: Record<keyof typeof KINK_FINDER_DEFAULTS, number> = { ...KINK_FINDER_DEFAULTS };
  for (const k of Object.keys(cut) as (keyof typeof cut)[]) {
    const v = options[k];
    if (v !== undefined) {
      if (!(v >= 0)) throw msg.badArgument(k, v, 'a non-negative number');
      cut[k] = v;
    }
  }
  const { count, fieldT } = tracks;
  const ha = newHelixParameters(), hb = newHelixParameters();
  const scratch = newClosestApproachScratch();
  const ca: ClosestApproach = { s1: NaN, s2: NaN, distanceM: NaN, status: 'ok' };
  const end = new Float64Array(3), start = new Float64Array(3);
  const sa = newTrackState(), sd = newTrackState();
  const rows: number[][] = [];
  const status: string[] = [];
  let pairsTried = 0;
  // Rows in event order (stable), so each event's tracks are one run and only they are paired.
  const order = Int32Array.from({ length: count }, (_, i) => i).sort((p, q) => tracks.event[p] - tracks.event[q] || p - q);
  for (let r0 = 0; r0 < count;) {
    let r1 = r0;
    while (r1 < count && tracks.event[order[r1]] === tracks.event[order[r0]]) r1++;
    for (let ia = r0; ia < r1; ia++) {
      const a = order[ia];
      if (!tracks.usable[a]) continue;
      loadHelix(tracks, a, ha);
      helixPoint(ha, tracks.lastArcM[a], end);
      for (let ib = r0; ib < r1; ib++) {
        const b = order[ib];
        if (b === a || !tracks.usable[b] || tracks.charge[a] !== tracks.charge[b] || tracks.charge[a] === 0) continue;
        pairsTried++;
        loadHelix(tracks, b, hb);
        helixPoint(hb, 0, start);
        if (Math.hypot(end[0] - start[0], end[1] - start[1], end[2] - start[2]) > cut.maxGapM) continue;
        refineClosestApproach(ha, hb, tracks.lastArcM[a], 0, ca, scratch);
        if (!(ca.distanceM <= cut.maxDcaM) || ca.s1 < tracks.lastArcM[a] - cut.maxOverlapM || ca.s2 > cut.maxOverlapM) continue;
        const fa = ha.phi0 + ha.kappa * ca.s1, fb = hb.phi0 + hb.kappa * ca.s2;
        const ua = [Math.cos(fa), Math.sin(fa), ha.tanLambda], ub = [Math.cos(fb), Math.sin(fb), hb.tanLambda];
        const cosAngle = (ua[0] * ub[0] + ua[1] * ub[1] + ua[2] * ub[2]) / (Math.hypot(ua[0], ua[1], ua[2]) * Math.hypot(ub[0], ub[1], ub[2]));
        const angle = Math.acos(Math.max(-1, Math.min(1, cosAngle)));
        if (!(angle >= cut.minAngleRad)) continue;
        const sign = tracks.charge[a] > 0 ? 1 : -1;
        const mu = sign > 0 ? MUON_PLUS : MUON_MINUS;
        const d = trackStateAt(hb, ca.s2, { fieldT, species: mu, medium: options.medium, momentumArcM: 0.5 * tracks.lastArcM[b] }, sd);
        const pd = [d.pMeV[0], d.pMeV[1], d.pMeV[2]];
        let st = d.status === 'ok' ? 'ok' : 'ranged-out';
        const perParent = (sign > 0 ? [PION_PLUS, KAON_PLUS] : [PION_MINUS, KAON_MINUS]).map((parent: Particle) => {
          const p = trackStateAt(ha, ca.s1, { fieldT, species: parent, medium: options.medium, momentumArcM: 0.5 * tracks.lastArcM[a] }, sa);
          if (p.status !== 'ok') st = 'ranged-out';
          const P = fourMomentum(p.pMeV[0], p.pMeV[1], p.pMeV[2], parent.massMeV);
          const D = fourMomentum(pd[0], pd[1], pd[2], mu.massMeV);
          const rest = toRestFrame(D, P);
          const miss = (P[0] - D[0]) ** 2 - (P[1] - D[1]) ** 2 - (P[2] - D[2]) ** 2 - (P[3] - D[3]) ** 2;
          return { pStar: Math.hypot(rest[1], rest[2], rest[3]), miss, p: Math.hypot(P[1], P[2], P[3]), dir: [P[1], P[2], P[3]] };
        });
        const pp = perParent[0];
        const n = Math.hypot(pp.dir[0], pp.dir[1], pp.dir[2]);
        const along = (pd[0] * pp.dir[0] + pd[1] * pp.dir[1] + pd[2] * pp.dir[2]) / n;
        const qt = Math.sqrt(Math.max(0, pd[0] ** 2 + pd[1] ** 2 + pd[2] ** 2 - along * along));
        const px = scratch.p1, py = scratch.p2;
        rows.push([
          tracks.event[a], tracks.track[a], tracks.track[b], 0.5 * (px[0] + py[0]), 0.5 * (px[1] + py[1]), tracks.hasZ ? 0.5 * (px[2] + py[2]) : NaN,
          ca.distanceM, angle, pp.p, Math.hypot(pd[0], pd[1], pd[2]), qt, perParent[0].pStar, perParent[1].pStar, perParent[0].miss, perParent[1].miss, a, b,
        ]);
        status.push(st);
      }
    }
    r0 = r1;
  }
  const n = rows.length;
  const cols = Object.fromEntries(COLS.map((c, i) => [c, Float64Array.from(rows, (r) => r[i])])) as Record<Col, Float64Array>;
  return {
    kinks: { count: n, ...cols, rowParent: Int32Array.from(rows, (r) => r[15]), rowDaughter: Int32Array.from(rows, (r) => r[16]), status },
    pairsTried,
  };
}

import type { Medium } from '../matter/medium.js';
import type { Particle } from '../particles.js';
import { refineClosestApproach, type ClosestApproach, type ClosestApproachScratch } from './closestApproach.js';
import type { HelixParameters } from './helixParameters.js';
import { newTrackState, trackStateAt, type TrackState } from './trackState.js';

/** The daughter mass hypotheses of a V⁰, positive first. */
export type DaughterHypotheses = readonly (readonly [Particle, Particle])[];

export interface V0MassContext {
  readonly fieldT: number;
  readonly medium?: Medium;
  /** Arc length of each daughter at which its fitted curvature gives the momentum (see trackStateAt). */
  readonly momentumArcPosM: number;
  readonly momentumArcNegM: number;
  readonly hypotheses: DaughterHypotheses;
}

/** Scratch for `v0Masses`: allocated once per finder run. */
export interface V0MassScratch {
  readonly states: readonly [TrackState, TrackState];
  readonly plus: Float64Array;
  readonly minus: Float64Array;
  readonly grad: Float64Array;
  readonly ca: ClosestApproach;
  readonly caScratch: ClosestApproachScratch;
}

export function newV0MassScratch(hypotheses: number, caScratch: ClosestApproachScratch): V0MassScratch {
  return {
    states: [newTrackState(), newTrackState()], plus: new Float64Array(hypotheses), minus: new Float64Array(hypotheses),
    grad: new Float64Array(10 * hypotheses), ca: { s1: NaN, s2: NaN, distanceM: NaN, status: 'ok' }, caScratch,
  };
}

const FIELDS = ['kappa', 'phi0', 'd0', 'z0', 'tanLambda'] as const;

/**
 * Masses [MeV] of the pair under each hypothesis with both daughters taken at their closest
 * approach (s₁, s₂); returns false if a daughter ranges out.
 */
function massesAt(hp: HelixParameters, hn: HelixParameters, s1: number, s2: number, ctx: V0MassContext, states: readonly [TrackState, TrackState], out: Float64Array): boolean {
  let ok = true;
  ctx.hypotheses.forEach(([sp, sn], k) => {
    const a = trackStateAt(hp, s1, { fieldT: ctx.fieldT, species: sp, medium: ctx.medium, momentumArcM: ctx.momentumArcPosM }, states[0]);
    const b = trackStateAt(hn, s2, { fieldT: ctx.fieldT, species: sn, medium: ctx.medium, momentumArcM: ctx.momentumArcNegM }, states[1]);
    ok = ok && a.status === 'ok' && b.status === 'ok';
    const ea = Math.sqrt(a.pMeV[0] ** 2 + a.pMeV[1] ** 2 + a.pMeV[2] ** 2 + sp.massMeV ** 2);
    const eb = Math.sqrt(b.pMeV[0] ** 2 + b.pMeV[1] ** 2 + b.pMeV[2] ** 2 + sn.massMeV ** 2);
    const x = a.pMeV[0] + b.pMeV[0], y = a.pMeV[1] + b.pMeV[1], z = a.pMeV[2] + b.pMeV[2], e = ea + eb;
    out[k] = Math.sqrt(Math.max(0, e * e - x * x - y * y - z * z));
  });
  return ok;
}

/**
 * Invariant masses of a V⁰ pair under each hypothesis and their errors. The error is the full
 * first-order propagation of both tracks' 5×5 helix covariances: the mass depends on each
 * track's parameters directly (momentum, direction) and through the closest-approach point
 * (where along each helix the momentum is taken), so the gradient is taken numerically, each
 * parameter moved by ±1 % of its error with the closest approach solved again; then
 * σ_m² = g₊ᵀ C₊ g₊ + g₋ᵀ C₋ g₋ (tracks independent).
 * Writes masses and errors; returns 'ok' or 'ranged-out'.
 */
export function v0Masses(
  hp: HelixParameters, hn: HelixParameters, s1: number, s2: number, ctx: V0MassContext,
  massMeV: Float64Array, sigmaMeV: Float64Array, scratch: V0MassScratch,
): 'ok' | 'ranged-out' {
  const nh = ctx.hypotheses.length;
  const ok = massesAt(hp, hn, s1, s2, ctx, scratch.states, massMeV);
  const { plus, minus, grad, ca, caScratch } = scratch;
  for (let t = 0; t < 2; t++) {
    const h = t === 0 ? hp : hn;
    for (let i = 0; i < 5; i++) {
      const sigma = Math.sqrt(h.cov[6 * i]);
      const key = FIELDS[i];
      const v0 = h[key];
      if (!(sigma > 0) || !Number.isFinite(sigma)) { for (let k = 0; k < nh; k++) grad[nh * (5 * t + i) + k] = 0; continue; }
      const d = 0.01 * sigma;
      h[key] = v0 + d;
      refineClosestApproach(hp, hn, s1, s2, ca, caScratch, 8);
      massesAt(hp, hn, ca.s1, ca.s2, ctx, scratch.states, plus);
      h[key] = v0 - d;
      refineClosestApproach(hp, hn, s1, s2, ca, caScratch, 8);
      massesAt(hp, hn, ca.s1, ca.s2, ctx, scratch.states, minus);
      h[key] = v0;
      for (let k = 0; k < nh; k++) grad[nh * (5 * t + i) + k] = (plus[k] - minus[k]) / (2 * d);
    }
  }
  for (let k = 0; k < nh; k++) {
    let v = 0;
    for (let t = 0; t < 2; t++) {
      const c = t === 0 ? hp.cov : hn.cov;
      for (let i = 0; i < 5; i++) {
        const gi = grad[nh * (5 * t + i) + k];
        if (gi === 0) continue;
        for (let j = 0; j < 5; j++) v += gi * c[5 * i + j] * grad[nh * (5 * t + j) + k];
      }
    }
    sigmaMeV[k] = Math.sqrt(Math.max(0, v));
  }
  return ok ? 'ok' : 'ranged-out';
}

import type { Medium } from '../matter/medium.js';
import type { Particle } from '../particles.js';
import { refineClosestApproach, type ClosestApproach, type ClosestApproachScratch } from './closestApproach.js';
import type { HelixParameters } from './helixParameters.js';
import { newTrackState, trackStateAt, type TrackState } from './trackState.js';
import { transverseMomentumMeV } from './vertexTracks.js';

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
  readonly state: TrackState;
  readonly plus: Float64Array;
  readonly minus: Float64Array;
  readonly grad: Float64Array;
  /** Energy-loss factor of the positive and negative daughter under each hypothesis. */
  readonly lossPos: Float64Array;
  readonly lossNeg: Float64Array;
  readonly ca: ClosestApproach;
  readonly caScratch: ClosestApproachScratch;
}

export function newV0MassScratch(hypotheses: number, caScratch: ClosestApproachScratch): V0MassScratch {
  return {
    state: newTrackState(), plus: new Float64Array(hypotheses), minus: new Float64Array(hypotheses), grad: new Float64Array(10 * hypotheses),
    lossPos: new Float64Array(hypotheses), lossNeg: new Float64Array(hypotheses), ca: { s1: NaN, s2: NaN, distanceM: NaN, status: 'ok' }, caScratch,
  };
}

const FIELDS = ['kappa', 'phi0', 'd0', 'z0', 'tanLambda'] as const;

/**
 * Masses [MeV] of the pair under each hypothesis with the daughters taken at arc lengths
 * (s₁, s₂) and their momenta scaled by the given energy-loss factors.
 */
function massesAt(hp: HelixParameters, hn: HelixParameters, s1: number, s2: number, ctx: V0MassContext, lossPos: Float64Array, lossNeg: Float64Array, out: Float64Array): void {
  const ptp = transverseMomentumMeV(hp.kappa, ctx.fieldT), ptn = transverseMomentumMeV(hn.kappa, ctx.fieldT);
  const fp = hp.phi0 + hp.kappa * s1, fn = hn.phi0 + hn.kappa * s2;
  const cp = Math.cos(fp), sp = Math.sin(fp), cn = Math.cos(fn), sn = Math.sin(fn);
  for (let k = 0; k < ctx.hypotheses.length; k++) {
    const [a, b] = ctx.hypotheses[k];
    const pp = ptp * lossPos[k], pn = ptn * lossNeg[k];
    const ax = pp * cp, ay = pp * sp, az = pp * hp.tanLambda;
    const bx = pn * cn, by = pn * sn, bz = pn * hn.tanLambda;
    const e = Math.sqrt(ax * ax + ay * ay + az * az + a.massMeV * a.massMeV) + Math.sqrt(bx * bx + by * by + bz * bz + b.massMeV * b.massMeV);
    const x = ax + bx, y = ay + by, z = az + bz;
    out[k] = Math.sqrt(Math.max(0, e * e - x * x - y * y - z * z));
  }
}

/**
 * Invariant masses of a V⁰ pair under each hypothesis and their errors. The error is the full
 * first-order propagation of both tracks' 5×5 helix covariances: the mass depends on each
 * track's parameters directly (momentum, direction) and through the closest-approach point
 * (where along each helix the momentum is taken), so the gradient is taken numerically, each
 * parameter moved by ±1 % of its error with the closest approach solved again (one Newton step
 * from the unperturbed solution, exact to second order in the step); then
 * σ_m² = g₊ᵀ C₊ g₊ + g₋ᵀ C₋ g₋ (tracks independent). The energy-loss factor of each daughter
 * (`trackStateAt`) is evaluated once at the vertex and held fixed in the gradient (its own
 * variation is a relative 10⁻³ of the momentum's for centimetres of liquid hydrogen).
 * Writes masses and errors; returns 'ok' or 'ranged-out'.
 */
export function v0Masses(
  hp: HelixParameters, hn: HelixParameters, s1: number, s2: number, ctx: V0MassContext,
  massMeV: Float64Array, sigmaMeV: Float64Array, scratch: V0MassScratch,
): 'ok' | 'ranged-out' {
  const nh = ctx.hypotheses.length;
  const { plus, minus, grad, ca, caScratch, lossPos, lossNeg, state } = scratch;
  let ok = true;
  for (let k = 0; k < nh; k++) {
    const [a, b] = ctx.hypotheses[k];
    lossPos[k] = trackStateAt(hp, s1, { fieldT: ctx.fieldT, species: a, medium: ctx.medium, momentumArcM: ctx.momentumArcPosM }, state).lossFactor;
    ok = ok && state.status === 'ok';
    lossNeg[k] = trackStateAt(hn, s2, { fieldT: ctx.fieldT, species: b, medium: ctx.medium, momentumArcM: ctx.momentumArcNegM }, state).lossFactor;
    ok = ok && state.status === 'ok';
  }
  massesAt(hp, hn, s1, s2, ctx, lossPos, lossNeg, massMeV);
  for (let t = 0; t < 2; t++) {
    const h = t === 0 ? hp : hn;
    for (let i = 0; i < 5; i++) {
      const sigma = Math.sqrt(h.cov[6 * i]);
      const key = FIELDS[i];
      const v0 = h[key];
      if (!(sigma > 0) || !Number.isFinite(sigma)) { for (let k = 0; k < nh; k++) grad[nh * (5 * t + i) + k] = 0; continue; }
      const d = 0.01 * sigma;
      h[key] = v0 + d;
      refineClosestApproach(hp, hn, s1, s2, ca, caScratch, 1);
      massesAt(hp, hn, ca.s1, ca.s2, ctx, lossPos, lossNeg, plus);
      h[key] = v0 - d;
      refineClosestApproach(hp, hn, s1, s2, ca, caScratch, 1);
      massesAt(hp, hn, ca.s1, ca.s2, ctx, lossPos, lossNeg, minus);
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

import { chi2Survival } from '../../analysis/chi2Survival.js';
import { GEV_PER_TESLA_METRE } from '../../constants.js';
import { msg } from '../../errors.js';
import { kineticAndStoppingAtRange, type LossModel } from './lossModel.js';
import { runMatterFitIterations, type MatterFitRun } from './matterFitIterations.js';
import type { MatterFitScratch } from './matterFitScratch.js';
import { MATTER_FIT_DEFAULTS, MATTER_FIT_MIN_PROBABILITY, type MatterFitOptions, type MatterTrackHits } from './matterTrackFit.js';
import type { ReferenceSettings } from './referenceTrack.js';

/** The options of a fit, checked and with their defaults (plain data, shared by all tracks of a batch). */
export interface MatterFitSettings extends ReferenceSettings {
  readonly maxIterations: number;
}

/** Checks the options (throws a `msg.badArgument` on a bad one) and fills in the defaults. */
export function matterFitSettings(o: MatterFitOptions): MatterFitSettings {
  if (!Number.isFinite(o.fieldT) || o.fieldT === 0) throw msg.badArgument('fieldT', o.fieldT, 'a non-zero magnetic field in tesla (signed along +z)');
  if (o.medium === undefined || !(o.medium.densityGcm3 > 0)) throw msg.badArgument('medium', o.medium?.name, 'a lib/matter material, e.g. material("liquid-propane")');
  if (o.particle === undefined || o.particle.charge === 0) throw msg.badArgument('particle', o.particle?.name, 'a charged species, e.g. PROTON');
  if (o.hitErrorM !== undefined && !(o.hitErrorM > 0)) throw msg.badArgument('hitErrorM', o.hitErrorM, 'a positive hit error in metres');
  return {
    fieldT: o.fieldT,
    energyLoss: o.energyLoss ?? MATTER_FIT_DEFAULTS.energyLoss,
    multipleScattering: o.multipleScattering ?? MATTER_FIT_DEFAULTS.multipleScattering,
    hitErrorM: o.hitErrorM ?? NaN,
    maxIterations: o.maxIterations ?? MATTER_FIT_DEFAULTS.maxIterations,
  };
}

/** Whether every coordinate is finite and every hit error positive. */
export function inputsFinite(h: MatterTrackHits, hitErrorM: number): boolean {
  for (let i = 0; i < h.x.length; i++) {
    if (!Number.isFinite(h.x[i]) || !Number.isFinite(h.y[i])) return false;
    if (h.z && !Number.isFinite(h.z[i])) return false;
    const s = h.sigmaX ? h.sigmaX[i] : hitErrorM;
    if (!(s > 0 && Number.isFinite(s))) return false;
    if (h.sigmaY && !(h.sigmaY[i] > 0)) return false;
    if (h.z && h.sigmaZ && !(h.sigmaZ[i] > 0)) return false;
  }
  return true;
}

/**
 * The fit of one track (at least MATTER_FIT_MIN_HITS finite hits) into the scratch: the
 * iterations (`runMatterFitIterations`), then the range-end error added to the curvature
 * variances at both ends (with `stops` and energy loss: the stop constraint instead, see
 * `stopConstraint`, after a fit without it whose χ² gives `stopChi2` = Δχ², the likelihood-ratio
 * test of the constraint with 1 degree of freedom; NaN when either fit failed or there is no
 * constraint). When the run is 'ok' the scratch holds the reference and the filter
 * outputs at the first and the last hit for `endState` (and the smoothed residuals when
 * `withResiduals`). A fit held at the reach limit whose hits reject it (χ² probability below
 * `MATTER_FIT_MIN_PROBABILITY`) is 'cannot-reach': the hypothesis cannot reach them.
 */
export function fitIntoScratch(model: LossModel, hits: MatterTrackHits, set: MatterFitSettings, sc: MatterFitScratch, withResiduals: boolean, stops = false): MatterFitRun {
  const n = hits.x.length;
  let free = NaN;
  if (stops && set.energyLoss) {
    // The fit without the constraint first: Δχ² between the two tests the claim that the track stops.
    const f = runMatterFitIterations(model, hits, set, sc, set.maxIterations, false);
    if (f.status === 'ok') free = f.chi2;
  }
  const fit = runMatterFitIterations(model, hits, set, sc, set.maxIterations, withResiduals, stops && set.energyLoss);
  const run = fit.constrained ? { ...fit, stopChi2: Math.max(0, fit.chi2 - free) } : fit;
  if (run.status !== 'ok') return run;
  if (run.atReachLimit && chi2Survival(run.chi2, matterFitNdf(n, hits.z !== undefined, run.constrained)) < MATTER_FIT_MIN_PROBABILITY) return { ...run, status: 'cannot-reach' };
  if (run.constrained) return run; // the stop constraint already holds the stopping point and the straggling
  const residualRangeM = set.energyLoss ? sc.range[n - 1] / model.gcm2PerM : Infinity;
  const spacingM = sc.path[n - 1] / (n - 1);
  const stopVariance = residualRangeM < spacingM ? ((spacingM * model.gcm2PerM) ** 2) / 12 : 0;
  // The profile, where it was made, supersedes the stopping-point variance (it sees the wall).
  const extra = run.profiled ? run.extraRangeVariance : stopVariance;
  if (extra > 0) {
    addRangeVariance(model, sc, 0, sc.firstB, extra);
    addRangeVariance(model, sc, n - 1, sc.lastB, extra);
  }
  return run;
}

/** The status of a converged fit: 'poor-fit' when its χ² probability, or that of its stop constraint's term (1 dof), is below MATTER_FIT_MIN_PROBABILITY. */
export function convergedStatus(pValue: number, stopChi2: number): 'ok' | 'poor-fit' {
  return pValue < MATTER_FIT_MIN_PROBABILITY || chi2Survival(stopChi2, 1) < MATTER_FIT_MIN_PROBABILITY ? 'poor-fit' : 'ok';
}

/** Degrees of freedom of a fit of n hits: n − 3 bending-plane, n − 2 in z, one more with the stop constraint. */
export function matterFitNdf(n: number, hasZ: boolean, constrained: boolean): number {
  return n - 3 + (hasZ ? n - 2 : 0) + (constrained ? 1 : 0);
}

/**
 * Near the end of its range a track's curvature rises so steeply that the linearised error in p
 * is far too small. Two corrections, the larger is used: a hypothesis that stops before a next
 * hit one spacing on leaves the stopping point unknown within that spacing (residual range
 * uniform over one mean 3-D spacing, σ_R = spacing/√12); a track that ends within a few
 * spacings of its range end gets the excess of its profile-likelihood error (`rangeProfileSigma`). The
 * variance `varianceGcm2` of the residual range is carried to κ at hit i through
 * dκ/dR = −(κ/p)·S/β (range–energy relation) and added to its variance in `b`.
 */
function addRangeVariance(model: LossModel, sc: MatterFitScratch, i: number, b: Float64Array, varianceGcm2: number): void {
  const sigmaR = Math.sqrt(varianceGcm2);
  const out = sc.tmp, m = model.massMeV;
  kineticAndStoppingAtRange(model, Math.max(sc.range[i], 1e-12), out);
  const t = out[0], s = out[1];
  const pm = Math.sqrt(t * (t + 2 * m)), beta = pm / (t + m);
  const dk = (Math.abs(sc.kappa[i]) / pm) * (s / beta) * sigmaR;
  if (Number.isFinite(dk)) b[11] += dk * dk;
}

/** Which end `endState` reports: the track's hit count, the end, the fitted tan λ, whether z was fitted. */
export interface EndHit { n: number; last: boolean; tanLambda: number; hasZ: boolean }

/** Where `endState` writes: the state at `state[so..]`, the covariance at `cov[co..]`, the numbers to `scalars`. */
export interface EndOutput { state: Float64Array; so: number; cov: Float64Array; co: number; readonly scalars: Float64Array }

/** Numbers of `endState` in its `scalars` output, by index. */
export const END_X = 0, END_Y = 1, END_Z = 2, END_KAPPA = 3, END_SIGMA_KAPPA = 4, END_P = 5, END_SIGMA_P = 6, END_PT = 7, END_KINETIC = 8;

/**
 * The reported state at the first (`hit.last` false) or the last hit from the reference point there
 * and the filter's deviations b = (u, ψ, δκ, cov 3×3) and zb = (δz, δt, cov 2×2): the state
 * (φ, tan λ, q/p, u, z) to `state[so..so+4]`, its 5×5 covariance (row-major) to
 * `cov[co..co+24]`, and x, y, z, κ, σ(κ), p, σ(p), p_T, T to `scalars` (END_* indices). The
 * Jacobian of local (u, ψ, δκ, δz, δt) → (φ, t, q/p, u, z) is written out: φ ← ψ, t ← δt,
 * q/p ← −cos λ/(cB)·κ with ∂/∂t = κ t cos³λ/(cB), u ← u, z ← δz.
 */
export function endState(sc: MatterFitScratch, model: LossModel, fieldT: number, hit: EndHit, out: EndOutput): void {
  const last = hit.last, i = last ? hit.n - 1 : 0, hasZ = hit.hasZ;
  const b = last ? sc.lastB : sc.firstB, zb = last ? sc.lastZ : sc.firstZ;
  const phi0 = sc.phi[i];
  const phi = phi0 + b[1], kappa = sc.kappa[i] + b[2];
  const t = hit.tanLambda + (hasZ ? zb[1] : 0);
  const nx = -Math.sin(phi0), ny = Math.cos(phi0);
  const xM = sc.x[i] + b[0] * nx, yM = sc.y[i] + b[0] * ny, zM = sc.z[i] + (hasZ ? zb[0] : 0);
  const k0 = GEV_PER_TESLA_METRE * model.chargeAbs * Math.abs(fieldT);
  const sec = Math.sqrt(1 + t * t), cosL = 1 / sec;
  const pt = k0 / Math.abs(kappa), p = pt * sec;
  const kb = GEV_PER_TESLA_METRE * fieldT;
  const dqk = -cosL / kb, dqt = (kappa * t * cosL * cosL * cosL) / kb;
  // Local covariances: bending (u, ψ, κ) from b, (z, t) from zb (zero without z).
  const uu = b[3], up = b[4], uk = b[5], pp = b[7], pk = b[8], kk = b[11];
  const zz = hasZ ? zb[2] : 0, zt = hasZ ? zb[3] : 0, tt = hasZ ? zb[5] : 0;
  const s = out.state, so = out.so, c = out.cov, co = out.co;
  s[so] = phi; s[so + 1] = t; s[so + 2] = (-kappa * cosL) / kb; s[so + 3] = 0; s[so + 4] = zM;
  const cpq = dqk * pk, ctq = dqt * tt, cqq = dqk * dqk * kk + dqt * dqt * tt, cqu = dqk * uk, cqz = dqt * zt;
  // Rows φ, t, q/p, u, z.
  c[co] = pp; c[co + 1] = 0; c[co + 2] = cpq; c[co + 3] = up; c[co + 4] = 0;
  c[co + 5] = 0; c[co + 6] = tt; c[co + 7] = ctq; c[co + 8] = 0; c[co + 9] = zt;
  c[co + 10] = cpq; c[co + 11] = ctq; c[co + 12] = cqq; c[co + 13] = cqu; c[co + 14] = cqz;
  c[co + 15] = up; c[co + 16] = 0; c[co + 17] = cqu; c[co + 18] = uu; c[co + 19] = 0;
  c[co + 20] = 0; c[co + 21] = zt; c[co + 22] = cqz; c[co + 23] = 0; c[co + 24] = zz;
  const dpk = -p / kappa, dpt = (p * t) / (1 + t * t);
  const sigmaP = Math.sqrt(dpk * dpk * kk + (hasZ ? dpt * dpt * tt : 0));
  const m = model.massMeV, pm = 1000 * p;
  const r = out.scalars;
  r[END_X] = xM; r[END_Y] = yM; r[END_Z] = zM; r[END_KAPPA] = kappa; r[END_SIGMA_KAPPA] = Math.sqrt(kk);
  r[END_P] = p; r[END_SIGMA_P] = sigmaP; r[END_PT] = pt; r[END_KINETIC] = Math.sqrt(pm * pm + m * m) - m;
}

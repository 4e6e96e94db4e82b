import { chi2Survival } from '../../analysis/chi2Survival.js';
import { GEV_PER_TESLA_METRE } from '../../constants.js';
import { msg } from '../../errors.js';
import { runMatterFitIterations } from './matterFitIterations.js';
import { kineticAndStoppingAtRange, lossModel, type LossModel } from './lossModel.js';
import { ensureScratch, type MatterFitScratch } from './matterFitScratch.js';
import {
  MATTER_FIT_DEFAULTS, MATTER_FIT_MIN_HITS, MATTER_FIT_MIN_PROBABILITY,
  type MatterFitOptions, type MatterFitState, type MatterFitStatus, type MatterTrackFit, type MatterTrackHits,
} from './matterTrackFit.js';

/**
 * Fits one track with material effects: a helix in the uniform field B_z = `fieldT`, slowed by
 * the mean energy loss of the mass hypothesis `particle` in `medium` and scattered by it, with
 * the state and full covariance at the first and the last hit, χ², ndf and the χ² probability.
 *
 * Method: an iterated, linearised Kalman filter with a two-filter smoother. A reference
 * trajectory is propagated from the current estimate at the first hit (lib/matter CSDA range
 * table for the loss, Highland for the scattering noise, Bohr straggling; see
 * `buildReference`); a backward filter over the deviations gives the state at the first hit
 * from all hits, the reference is moved there and rebuilt (Gauss–Newton), until the change is
 * below 1 % of its error. A forward pass then gives the state at the last hit and the smoothed
 * residuals. We chose the filter over a global χ² fit with the scattering angles as parameters
 * because its cost grows linearly with the hits (the global fit with one kink per hit needs an
 * N×N band solve, the filter only 3×3 and 2×2 steps), and it gives the end states directly.
 * Starting each iteration from the first hit makes p at the first hit the fitted parameter, so
 * it is not the mean-curvature estimate of a plain helix fit (which is biased low on a slowing
 * track).
 *
 * Validity: heavy charged particles (μ and heavier) and e± from the range table's lower end
 * (1 keV proton-equivalent) to βγ = 1000; the loss is the mean (CSDA), so tracks whose loss is
 * dominated by a few hard collisions (δ-rays, bremsstrahlung of electrons) fit worse than χ²
 * says. Small scattering angles per hit step (Gaussian core of Highland, accurate to 11 %).
 * Hits in travel order. The hypothesis' charge sign is not used: q follows the turning sense.
 * Refuses gracefully: 'cannot-reach' when the hypothesis' range ends before a hit, never a throw
 * for a numerical failure. Research values, not for treatment planning.
 * @example fitTrackInMatter(trackHits(tracks, 0), { fieldT: 2, medium: material('liquid-propane'), particle: PROTON, hitErrorM: 2e-4 }).first.pGeV
 */
export function fitTrackInMatter(hits: MatterTrackHits, options: MatterFitOptions, scratch?: MatterFitScratch): MatterTrackFit {
  checkOptions(options);
  const n = hits.x.length;
  if (hits.y.length !== n || (hits.z && hits.z.length !== n)) throw msg.badArgument('hits', n, 'x, y (and z) columns of the same length');
  if (hits.sigmaX === undefined && options.hitErrorM === undefined) throw msg.badArgument('hitErrorM', undefined, 'a hit error in metres (the hits carry no sigma columns)');
  const model = lossModel(options.medium, options.particle);
  const set = {
    fieldT: options.fieldT,
    energyLoss: options.energyLoss ?? MATTER_FIT_DEFAULTS.energyLoss,
    multipleScattering: options.multipleScattering ?? MATTER_FIT_DEFAULTS.multipleScattering,
    hitErrorM: options.hitErrorM ?? NaN,
  };
  if (n < MATTER_FIT_MIN_HITS) return failed('too-few-hits', options, n, 0);
  if (!inputsFinite(hits, set.hitErrorM)) return failed('bad-input', options, n, 0);
  const sc = ensureScratch(scratch, n);
  const run = runMatterFitIterations(model, hits, set, sc, options.maxIterations ?? MATTER_FIT_DEFAULTS.maxIterations);
  if (run.status !== 'ok') return failed(run.status, options, n, run.reachedHits);
  const hasZ = hits.z !== undefined;
  const ctx = { fieldT: options.fieldT, chargeAbs: model.chargeAbs, massMeV: model.massMeV, s_m: 0 };
  const residualRangeM = set.energyLoss ? sc.range[n - 1] / model.gcm2PerM : Infinity;
  const spacingM = sc.path[n - 1] / (n - 1);
  const stopVariance = residualRangeM < spacingM ? ((spacingM * model.gcm2PerM) ** 2) / 12 : 0;
  // The profile, where it was made, supersedes the stopping-point variance (it sees the wall).
  const extra = run.profiled ? run.extraRangeVariance : stopVariance;
  if (extra > 0) addRangeVariance(model, sc, n, extra);
  const ref = Float64Array.of(sc.x[0], sc.y[0], sc.phi[0], sc.kappa[0], sc.z[0], run.tanLambda);
  const first = finishState(ref, sc.firstB, sc.firstZ, hasZ, ctx);
  const e = n - 1;
  ref[0] = sc.x[e]; ref[1] = sc.y[e]; ref[2] = sc.phi[e]; ref[3] = sc.kappa[e]; ref[4] = sc.z[e];
  const path = sc.path[e];
  const last = finishState(ref, sc.lastB, sc.lastZ, hasZ, { ...ctx, s_m: path });
  const ndf = n - 3 + (hasZ ? n - 2 : 0);
  const pValue = chi2Survival(run.chi2, ndf);
  return Object.freeze({
    status: pValue < MATTER_FIT_MIN_PROBABILITY ? 'poor-fit' : 'ok',
    particle: options.particle.name,
    first, last,
    charge: -Math.sign(first.kappa) * Math.sign(options.fieldT) * model.chargeAbs,
    chi2: run.chi2, ndf, pValue,
    pathLengthM: path,
    residualRangeM,
    reachedEnd: true,
    reachedHits: n,
    stopsBeforeNextHit: residualRangeM < path / e,
    iterations: run.iterations,
    residualM: sc.residual.slice(0, n),
    residualZM: sc.residualZ.slice(0, n),
  });
}

/**
 * Near the end of its range a track's curvature rises so steeply that the linearised error in p
 * is far too small. Two corrections, the larger is used: a hypothesis that stops before a next
 * hit one spacing on leaves the stopping point unknown within that spacing (residual range
 * uniform over one mean 3-D spacing, σ_R = spacing/√12); a track that ends within a few
 * spacings of its range end gets the excess of its χ²-profile error (`rangeProfileSigma`). The
 * variance `varianceGcm2` of the residual range is carried to κ at the first and the last hit
 * through dκ/dR = −(κ/p)·S/β (range–energy relation) and added to their variances.
 */
function addRangeVariance(model: LossModel, sc: MatterFitScratch, n: number, varianceGcm2: number): void {
  const sigmaR = Math.sqrt(varianceGcm2);
  const out = sc.tmp, m = model.massMeV;
  for (const [i, b] of [[0, sc.firstB], [n - 1, sc.lastB]] as const) {
    kineticAndStoppingAtRange(model, Math.max(sc.range[i], 1e-12), out);
    const t = out[0], s = out[1];
    const pm = Math.sqrt(t * (t + 2 * m)), beta = pm / (t + m);
    const dk = (Math.abs(sc.kappa[i]) / pm) * (s / beta) * sigmaR;
    if (Number.isFinite(dk)) b[11] += dk * dk;
  }
}

function checkOptions(o: MatterFitOptions): void {
  if (!Number.isFinite(o.fieldT) || o.fieldT === 0) throw msg.badArgument('fieldT', o.fieldT, 'a non-zero magnetic field in tesla (signed along +z)');
  if (o.medium === undefined || !(o.medium.densityGcm3 > 0)) throw msg.badArgument('medium', o.medium?.name, 'a lib/matter material, e.g. material("liquid-propane")');
  if (o.particle === undefined || o.particle.charge === 0) throw msg.badArgument('particle', o.particle?.name, 'a charged species, e.g. PROTON');
  if (o.hitErrorM !== undefined && !(o.hitErrorM > 0)) throw msg.badArgument('hitErrorM', o.hitErrorM, 'a positive hit error in metres');
}

function inputsFinite(h: MatterTrackHits, hitErrorM: number): boolean {
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

const NAN_STATE: MatterFitState = Object.freeze({
  state: new Float64Array(5).fill(NaN), cov: new Float64Array(25).fill(NaN), xM: NaN, yM: NaN, zM: NaN,
  kappa: NaN, sigmaKappa: NaN, pGeV: NaN, sigmaPGeV: NaN, ptGeV: NaN, kineticMeV: NaN, s_m: NaN,
});

function failed(status: MatterFitStatus, o: MatterFitOptions, n: number, reached: number): MatterTrackFit {
  return Object.freeze({
    status, particle: o.particle.name, first: NAN_STATE, last: NAN_STATE, charge: NaN, chi2: NaN, ndf: 0, pValue: NaN,
    pathLengthM: NaN, residualRangeM: NaN, reachedEnd: false, reachedHits: reached, stopsBeforeNextHit: status === 'cannot-reach',
    iterations: 0, residualM: new Float64Array(n).fill(NaN), residualZM: new Float64Array(n).fill(NaN),
  });
}

/**
 * The reported state at one hit from the reference point (x, y, φ, κ, z, t) there and the
 * filter's deviations b = (u, ψ, δκ, cov 3×3) and zb = (δz, δt, cov 2×2).
 */
function finishState(ref: Float64Array, b: Float64Array, zb: Float64Array, hasZ: boolean, ctx: { fieldT: number; chargeAbs: number; massMeV: number; s_m: number }): MatterFitState {
  const phi = ref[2] + b[1], kappa = ref[3] + b[2];
  const t = ref[5] + (hasZ ? zb[1] : 0);
  const nx = -Math.sin(ref[2]), ny = Math.cos(ref[2]);
  const xM = ref[0] + b[0] * nx, yM = ref[1] + b[0] * ny, zM = ref[4] + (hasZ ? zb[0] : 0);
  const k0 = GEV_PER_TESLA_METRE * ctx.chargeAbs * Math.abs(ctx.fieldT);
  const sec = Math.sqrt(1 + t * t), cosL = 1 / sec;
  const pt = k0 / Math.abs(kappa), p = pt * sec;
  const kb = GEV_PER_TESLA_METRE * ctx.fieldT;
  const qop = (-kappa * cosL) / kb;
  // Local (u, ψ, δκ, δz, δt) → state (φ, t, q/p, u, z): J rows.
  const dqk = -cosL / kb, dqt = (kappa * t * cosL * cosL * cosL) / kb;
  const L = new Float64Array(25); // local cov, order u, ψ, κ, z, t
  for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) L[5 * r + c] = b[3 + 3 * r + c];
  if (hasZ) { L[18] = zb[2]; L[19] = zb[3]; L[23] = zb[4]; L[24] = zb[5]; }
  const J = new Float64Array(25);
  J[1] = 1; // φ ← ψ
  J[9] = 1; // t ← δt
  J[12] = dqk; J[14] = dqt; // q/p ← κ, t
  J[15] = 1; // u ← u
  J[23] = 1; // z ← δz
  const cov = new Float64Array(25);
  for (let r = 0; r < 5; r++) for (let c = 0; c < 5; c++) {
    let s = 0;
    for (let i = 0; i < 5; i++) { const jri = J[5 * r + i]; if (jri === 0) continue; for (let j = 0; j < 5; j++) s += jri * L[5 * i + j] * J[5 * c + j]; }
    cov[5 * r + c] = s;
  }
  const vkk = L[12], vtt = L[24];
  const dpk = -p / kappa, dpt = (p * t) / (1 + t * t);
  const sigmaP = Math.sqrt(dpk * dpk * vkk + (hasZ ? dpt * dpt * vtt : 0));
  const m = ctx.massMeV, pm = 1000 * p;
  return Object.freeze({
    state: Float64Array.of(phi, t, qop, 0, zM), cov, xM, yM, zM, kappa, sigmaKappa: Math.sqrt(vkk),
    pGeV: p, sigmaPGeV: sigmaP, ptGeV: pt, kineticMeV: Math.sqrt(pm * pm + m * m) - m, s_m: ctx.s_m,
  });
}


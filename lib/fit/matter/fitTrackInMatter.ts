import { chi2Survival } from '../../analysis/chi2Survival.js';
import { msg } from '../../errors.js';
import { lossModel, type LossModel } from './lossModel.js';
import {
  END_KAPPA, END_KINETIC, END_P, END_PT, END_SIGMA_KAPPA, END_SIGMA_P, END_X, END_Y, END_Z,
  convergedStatus, endState, fitIntoScratch, inputsFinite, matterFitNdf, matterFitSettings, type EndHit,
} from './matterFitCore.js';
import { ensureScratch, type MatterFitScratch } from './matterFitScratch.js';
import {
  MATTER_FIT_MIN_HITS, MATTER_FIT_MIN_PROBABILITY,
  type MatterFitOptions, type MatterFitState, type MatterFitStatus, type MatterTrackFit, type MatterTrackHits,
} from './matterTrackFit.js';

/**
 * Fits one track with material effects: a helix in the uniform field B_z = `fieldT`, slowed by
 * the mean energy loss of the mass hypothesis `particle` in `medium` and scattered by it, with
 * the state and full covariance at the first and the last hit, χ², ndf and the χ² probability.
 *
 * Method: an iterated, linearised Kalman filter with a two-filter smoother. A reference
 * trajectory is propagated from the current estimate at the first hit (lib/matter CSDA range
 * table for the loss, Highland for the scattering noise, Bohr straggling, and for e± the
 * Bethe–Heitler bremsstrahlung straggling in its Gaussian form, var(δp/p) = 0.415 per radiation
 * length; see `buildReference`); a backward filter over the deviations gives the state at the first hit
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
 * (1 keV proton-equivalent) to βγ = 1000; the loss is the mean (CSDA) with Gaussian noise, so
 * tracks whose loss is dominated by a few hard collisions (δ-rays, the heavy tail of an
 * electron's bremsstrahlung) fit worse than χ² says: on the Hollowmere e± (propane, 2 T) the
 * bremsstrahlung noise turned 47 of the 63 'diverged' fits into fits, most of them 'poor-fit'.
 * Small scattering angles per hit step (Gaussian core of Highland, accurate to 11 %).
 * Hits in travel order. The hypothesis' charge sign is not used: q follows the turning sense.
 * Refuses gracefully: 'cannot-reach' when the hypothesis' range ends before a hit, never a throw
 * for a numerical failure. Research values, not for treatment planning.
 * @example fitTrackInMatter(trackHits(tracks, 0), { fieldT: 2, medium: material('liquid-propane'), particle: PROTON, hitErrorM: 2e-4 }).first.pGeV
 */
export function fitTrackInMatter(hits: MatterTrackHits, options: MatterFitOptions, scratch?: MatterFitScratch): MatterTrackFit {
  const set = matterFitSettings(options);
  const n = hits.x.length;
  if (hits.y.length !== n || (hits.z && hits.z.length !== n)) throw msg.badArgument('hits', n, 'x, y (and z) columns of the same length');
  if (hits.sigmaX === undefined && options.hitErrorM === undefined) throw msg.badArgument('hitErrorM', undefined, 'a hit error in metres (the hits carry no sigma columns)');
  const model = lossModel(options.medium, options.particle);
  if (n < MATTER_FIT_MIN_HITS) return failed('too-few-hits', options, n, 0);
  if (!inputsFinite(hits, set.hitErrorM)) return failed('bad-input', options, n, 0);
  const sc = ensureScratch(scratch, n);
  const run = fitIntoScratch(model, hits, set, sc, true, options.stops === true);
  if (run.status !== 'ok') return failed(run.status, options, n, run.reachedHits);
  const hasZ = hits.z !== undefined;
  const residualRangeM = set.energyLoss ? sc.range[n - 1] / model.gcm2PerM : Infinity;
  const hit = { n, last: false, tanLambda: run.tanLambda, hasZ };
  const first = reportedState(sc, model, options.fieldT, hit, 0);
  hit.last = true;
  const path = sc.path[n - 1];
  const last = reportedState(sc, model, options.fieldT, hit, path);
  const ndf = matterFitNdf(n, hasZ, run.constrained);
  const pValue = chi2Survival(run.chi2, ndf);
  return Object.freeze({
    status: convergedStatus(pValue, run.stopChi2),
    particle: options.particle.name,
    first, last,
    charge: -Math.sign(first.kappa) * Math.sign(options.fieldT) * model.chargeAbs,
    chi2: run.chi2, ndf, pValue, stopChi2: run.stopChi2,
    pathLengthM: path,
    residualRangeM,
    reachedEnd: true,
    reachedHits: n,
    stopsBeforeNextHit: residualRangeM < path / (n - 1),
    iterations: run.iterations,
    residualM: sc.residual.slice(0, n),
    residualZM: sc.residualZ.slice(0, n),
  });
}

const NAN_STATE: MatterFitState = Object.freeze({
  state: new Float64Array(5).fill(NaN), cov: new Float64Array(25).fill(NaN), xM: NaN, yM: NaN, zM: NaN,
  kappa: NaN, sigmaKappa: NaN, pGeV: NaN, sigmaPGeV: NaN, ptGeV: NaN, kineticMeV: NaN, s_m: NaN,
});

function failed(status: MatterFitStatus, o: MatterFitOptions, n: number, reached: number): MatterTrackFit {
  return Object.freeze({
    status, particle: o.particle.name, first: NAN_STATE, last: NAN_STATE, charge: NaN, chi2: NaN, ndf: 0, pValue: NaN, stopChi2: NaN,
    pathLengthM: NaN, residualRangeM: NaN, reachedEnd: false, reachedHits: reached, stopsBeforeNextHit: status === 'cannot-reach',
    iterations: 0, residualM: new Float64Array(n).fill(NaN), residualZM: new Float64Array(n).fill(NaN),
  });
}

/** `endState` as a frozen state object, at path `pathM` from the first hit. */
function reportedState(sc: MatterFitScratch, model: LossModel, fieldT: number, hit: EndHit, pathM: number): MatterFitState {
  const out = { state: new Float64Array(5), so: 0, cov: new Float64Array(25), co: 0, scalars: new Float64Array(9) };
  endState(sc, model, fieldT, hit, out);
  const r = out.scalars;
  return Object.freeze({
    state: out.state, cov: out.cov, xM: r[END_X], yM: r[END_Y], zM: r[END_Z], kappa: r[END_KAPPA], sigmaKappa: r[END_SIGMA_KAPPA],
    pGeV: r[END_P], sigmaPGeV: r[END_SIGMA_P], ptGeV: r[END_PT], kineticMeV: r[END_KINETIC], s_m: pathM,
  });
}

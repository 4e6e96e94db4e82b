import { backwardPass, forwardPass } from './filterPasses.js';
import { GEV_PER_TESLA_METRE } from '../../constants.js';
import { kineticAndStoppingAtRange, rangeAtKinetic, type LossModel } from './lossModel.js';
import { rangeProfileSigma } from './rangeProfile.js';
import type { MatterFitScratch } from './matterFitScratch.js';
import type { MatterTrackHits } from './matterTrackFit.js';
import { buildReference, REFERENCE_DIVERGED, REFERENCE_OK, type ReferenceSettings } from './referenceTrack.js';
import { seedState } from './seedState.js';
import { stopConstraint } from './stopConstraint.js';

/** Outcome of the iterations: the converged reference stays in the scratch. */
export interface MatterFitRun {
  readonly status: 'ok' | 'cannot-reach' | 'diverged';
  readonly reachedHits: number;
  readonly iterations: number;
  readonly chi2: number;
  /** tan λ of the final reference. */
  readonly tanLambda: number;
  /**
   * Variance [(g/cm²)²] to add to the residual range at the first hit beyond the linearised one,
   * from the χ² profile of a track that ends near the end of its range (0 otherwise).
   */
  readonly extraRangeVariance: number;
  /** Whether the −2 ln L profile was made (a track ending within a few spacings of its range end). */
  readonly profiled: boolean;
  /** Whether the stop constraint (`stopConstraint`) is in the fit: one measurement more in χ² and ndf. */
  readonly constrained: boolean;
  /** Δχ² of the stop constraint (set by `fitIntoScratch`, NaN here and without the constraint). */
  readonly stopChi2: number;
  /**
   * Whether the fit ended against the reach limit: the hits asked for a first-hit momentum whose
   * mean-loss range ends before the last hit, and the reported state is the last one that reaches it.
   */
  readonly atReachLimit: boolean;
}

/** Tracks whose residual range at the last hit is below this many mean spacings get the −2 ln L profile. */
const PROFILE_SPACINGS = 5;

/**
 * A change below this fraction of its error ends the iterations (the change itself is applied,
 * so what is left is of second order: ≲ 1 % of σ).
 */
const CONVERGED_SIGMAS = 0.1;
/**
 * A track that uses less than this fraction of its residual range between its first and last
 * hit moves its curvature linearly in κ (its curvature barely changes, so the problem is nearly
 * linear in κ); one that uses more moves linearly in the residual range (see `moveStart`).
 */
const LOSS_FRACTION_RANGE_MOVE = 0.3;
/**
 * The same for a track that is nearly linear in its parameters (`nearlyLinear`): there the
 * change left after the move is of second order in a move already below 0.2 σ (on simulated
 * pions in liquid propane the results move by < 0.003 σ in p and < 0.3 % in σ(p) against the
 * 0.1 σ test), and the confirming rebuild is saved.
 */
const CONVERGED_SIGMAS_LINEAR = 0.2;
/** Largest relative curvature error σ(κ)/|κ| of a track counted as nearly linear. */
const LINEAR_MAX_RELATIVE_ERROR = 0.25;

/**
 * Whether the current reference is nearly linear in its parameters: it uses less than
 * LOSS_FRACTION_RANGE_MOVE of its residual range over the hits (its curvature barely changes)
 * and its curvature is measured to better than LINEAR_MAX_RELATIVE_ERROR (so the momentum
 * dependence of the noise changes little within the errors).
 */
function nearlyLinear(sc: MatterFitScratch, n: number): boolean {
  const k = sc.kappa[0] + sc.firstB[2];
  return !(sc.range[0] - sc.range[n - 1] >= LOSS_FRACTION_RANGE_MOVE * sc.range[0]) && sc.firstB[11] < LINEAR_MAX_RELATIVE_ERROR * LINEAR_MAX_RELATIVE_ERROR * k * k;
}

/** Halvings of a step that overshot (the hypothesis stopped short) before giving up. */
const MAX_HALVINGS = 8;

/**
 * Gauss–Newton on the first-hit state: seed, then per iteration build the reference and run the
 * backward filter; move the start by the filtered deviation, halving the move when the new
 * start cannot reach every hit or raises χ² (by more than max(2, 2 %)); stop when every component moved by < 1 % of its error. Then one
 * forward pass on the last reference for the last-hit state and (`withResiduals`) the smoothed
 * residuals. With `stops` (the track is known to stop after its last hit) every backward pass
 * takes the stop constraint at the first hit (`stopConstraint`), and so does the forward pass;
 * the −2 ln L profile is then not made (the constraint closes the open side of the range).
 */
export function runMatterFitIterations(model: LossModel, hits: MatterTrackHits, set: ReferenceSettings, sc: MatterFitScratch, maxIterations: number, withResiduals: boolean, stops = false): MatterFitRun {
  const n = hits.x.length;
  const hasZ = hits.z !== undefined;
  const start = sc.start, good = sc.good, delta = sc.delta;
  if (!seedState(hits, model, set.fieldT, set.energyLoss, start, sc.tmp)) return { status: 'diverged', reachedHits: 0, iterations: 0, chi2: NaN, tanLambda: NaN, extraRangeVariance: 0, profiled: false, constrained: false, stopChi2: NaN, atReachLimit: false };
  const prior = sc.prior;
  let goodChi2 = Infinity, lastBuildGood = false, goodRange = Infinity, haveGood = false, lambda = 1, halvings = 0, chi2 = NaN, converged = false, reached = n, iterations = 0, tries = 0;
  let atReachLimit = false;
  while (iterations < maxIterations && tries < maxIterations + 3 * MAX_HALVINGS) {
    tries++;
    const code = buildReference(model, hits, start, set, sc);
    lastBuildGood = code === REFERENCE_OK;
    if (code === REFERENCE_DIVERGED) return { status: 'diverged', reachedHits: 0, iterations, chi2: NaN, tanLambda: NaN, extraRangeVariance: 0, profiled: false, constrained: false, stopChi2: NaN, atReachLimit: false };
    if (code !== REFERENCE_OK) {
      reached = code;
      if (++halvings > MAX_HALVINGS) {
        if (!haveGood) return { status: 'cannot-reach', reachedHits: reached, iterations, chi2: NaN, tanLambda: NaN, extraRangeVariance: 0, profiled: false, constrained: false, stopChi2: NaN, atReachLimit: false };
        // Every move from the last reaching state towards the hits' optimum stops short of the
        // last hit: the optimum lies beyond the reach limit (range straggling carries a real
        // particle past its mean-loss range), so the constrained fit is that state itself.
        atReachLimit = true;
        break;
      }
      lambda *= 0.5;
      if (haveGood) moveStart(model, set, sc, start, good, delta, lambda, goodRange);
      else start[3] *= 0.7; // the seed stops short: raise its momentum
      continue;
    }
    if (!haveGood) setPrior(prior, start);
    chi2 = backwardPass(sc, n, hasZ, prior, withResiduals, false, stops ? stopHit(model, sc, hits, set, start[5]) : -1);
    if (haveGood && chi2 > goodChi2 + Math.max(2, 0.02 * goodChi2) && halvings < MAX_HALVINGS) {
      // The move made the fit worse (it overshot into the steep end of the range): halve it.
      halvings++; lambda *= 0.5; lastBuildGood = false;
      moveStart(model, set, sc, start, good, delta, lambda, goodRange);
      continue;
    }
    goodChi2 = chi2;
    iterations++;
    const b = sc.firstB, zb = sc.firstZ;
    good[0] = sc.x[0]; good[1] = sc.y[0]; good[2] = sc.phi[0]; good[3] = sc.kappa[0]; good[4] = sc.z[0]; good[5] = start[5];
    haveGood = true;
    lambda = 1; halvings = 0;
    const nx = -Math.sin(good[2]), ny = Math.cos(good[2]);
    delta[0] = b[0] * nx; delta[1] = b[0] * ny; delta[2] = b[1]; delta[3] = b[2];
    delta[4] = hasZ ? zb[0] : 0; delta[5] = hasZ ? zb[1] : 0;
    const lim = nearlyLinear(sc, n) ? CONVERGED_SIGMAS_LINEAR : CONVERGED_SIGMAS;
    converged = small(b[0], b[3], lim) && small(b[1], b[7], lim) && small(b[2], b[11], lim) && (!hasZ || (small(zb[0], zb[2], lim) && small(zb[1], zb[5], lim)));
    if (!Number.isFinite(chi2 + b[2] + b[11])) return { status: 'diverged', reachedHits: 0, iterations, chi2: NaN, tanLambda: NaN, extraRangeVariance: 0, profiled: false, constrained: false, stopChi2: NaN, atReachLimit: false };
    if (converged) break;
    goodRange = sc.range[0] - sc.range[n - 1] < LOSS_FRACTION_RANGE_MOVE * sc.range[0] ? Infinity : sc.range[0];
    moveStart(model, set, sc, start, good, delta, 1, goodRange);
  }
  if (!haveGood) return { status: 'cannot-reach', reachedHits: reached, iterations, chi2: NaN, tanLambda: NaN, extraRangeVariance: 0, profiled: false, constrained: false, stopChi2: NaN, atReachLimit: false };
  if (!converged) {
    // Accept the last reachable state only when its last move was within its error; rebuild its
    // reference when a later trial overwrote it.
    if (!atReachLimit && !(delta[3] * delta[3] <= sc.firstB[11])) return { status: 'diverged', reachedHits: n, iterations, chi2: NaN, tanLambda: NaN, extraRangeVariance: 0, profiled: false, constrained: false, stopChi2: NaN, atReachLimit: false };
    if (!lastBuildGood) {
      if (buildReference(model, hits, good, set, sc) !== REFERENCE_OK) return { status: 'diverged', reachedHits: n, iterations, chi2: NaN, tanLambda: NaN, extraRangeVariance: 0, profiled: false, constrained: false, stopChi2: NaN, atReachLimit: false };
      chi2 = backwardPass(sc, n, hasZ, prior, withResiduals, false, stops ? stopHit(model, sc, hits, set, good[5]) : -1);
    }
    // Report the reachable state itself, not the move beyond it.
    sc.firstB[0] = 0; sc.firstB[1] = 0; sc.firstB[2] = 0; sc.firstZ[0] = 0; sc.firstZ[1] = 0;
  }
  let extraRangeVariance = 0, profiled = false;
  const spacingGcm2 = (sc.path[n - 1] / (n - 1)) * model.gcm2PerM;
  if (set.energyLoss && !stops && sc.range[n - 1] < PROFILE_SPACINGS * spacingGcm2) {
    const b = sc.firstB, est = sc.est;
    est.set(good);
    est[0] += delta[0]; est[1] += delta[1]; est[2] += b[1] * (converged ? 1 : 0); est[3] += b[2] * (converged ? 1 : 0);
    const t = good[5], sec = Math.sqrt(1 + t * t);
    const sigmaLinK = Math.sqrt(sc.firstB[11]);
    const sigmaR = rangeProfileSigma(model, hits, set, sc, est, prior);
    profiled = Number.isFinite(sigmaR);
    // Linearised σ(R₀) again from the κ error, to take the excess only.
    const m = model.massMeV, cK = GEV_PER_TESLA_METRE * model.chargeAbs * Math.abs(set.fieldT) * sec;
    const p0 = (1000 * cK) / Math.abs(est[3]);
    kineticAndStoppingAtRange(model, rangeAtKinetic(model, Math.sqrt(p0 * p0 + m * m) - m), sc.tmp);
    const sigmaLin = (p0 / Math.abs(est[3])) * ((p0 / (sc.tmp[0] + m)) / sc.tmp[1]) * sigmaLinK;
    if (Number.isFinite(sigmaR) && sigmaR > sigmaLin) extraRangeVariance = sigmaR * sigmaR - sigmaLin * sigmaLin;
    // The scan overwrote the scratch: rebuild the fitted reference.
    if (buildReference(model, hits, good, set, sc) !== REFERENCE_OK) return { status: 'diverged', reachedHits: n, iterations, chi2: NaN, tanLambda: NaN, extraRangeVariance: 0, profiled: false, constrained: false, stopChi2: NaN, atReachLimit: false };
    chi2 = backwardPass(sc, n, hasZ, prior, withResiduals);
    if (!converged) { sc.firstB[0] = 0; sc.firstB[1] = 0; sc.firstB[2] = 0; sc.firstZ[0] = 0; sc.firstZ[1] = 0; }
  }
  const stopAt = stops ? stopHit(model, sc, hits, set, good[5]) : -1;
  const constrained = stopAt >= 0;
  forwardPass(sc, n, hasZ, prior, withResiduals, stopAt);
  return { status: 'ok', reachedHits: n, iterations, chi2, tanLambda: good[5], extraRangeVariance, profiled, constrained, stopChi2: NaN, atReachLimit };
}

/** The stop constraint of the reference in the scratch (`stopConstraint`, into sc.stop): its hit, or −1 when none can be made. */
function stopHit(model: LossModel, sc: MatterFitScratch, hits: MatterTrackHits, set: ReferenceSettings, tanLambda: number): number {
  return stopConstraint(model, sc, hits, set.hitErrorM, set.fieldT, tanLambda) ? sc.stop[0] : -1;
}

/** Whether a change d is below `lim` standard errors (variance v). */
function small(d: number, v: number, lim: number): boolean {
  return d * d <= lim * lim * v;
}

/**
 * start = good + λ·delta, except the curvature of a track that slows appreciably over its hits
 * (`goodRange` finite: see LOSS_FRACTION_RANGE_MOVE): its change is made linear in
 * the residual range at the first hit (δR = dR/dκ·δκ), in which the track's end is nearly
 * linear — so a stopping track converges from either side instead of creeping up to the
 * stopping point; a move to R ≤ 0 becomes a momentum too low to reach anything (halved again).
 */
function moveStart(model: LossModel, set: ReferenceSettings, sc: MatterFitScratch, start: Float64Array, good: Float64Array, delta: Float64Array, lambda: number, goodRange: number): void {
  for (let k = 0; k < 6; k++) start[k] = good[k] + lambda * delta[k];
  if (!set.energyLoss || !Number.isFinite(goodRange) || good[3] === 0) return;
  const t = good[5], sec = Math.sqrt(1 + t * t);
  const cK = GEV_PER_TESLA_METRE * model.chargeAbs * Math.abs(set.fieldT) * sec;
  const m = model.massMeV;
  const tmp = sc.tmp;
  kineticAndStoppingAtRange(model, goodRange, tmp);
  const t0 = tmp[0], s0 = tmp[1];
  const pm = Math.sqrt(t0 * (t0 + 2 * m)), beta = pm / (t0 + m);
  const dRdK = (beta / s0) * (-pm / good[3]);
  const r1 = goodRange + lambda * dRdK * delta[3];
  if (!(r1 > 0) || !(s0 > 0)) { start[3] = good[3] * 4; return; }
  kineticAndStoppingAtRange(model, r1, tmp);
  const p1 = Math.sqrt(tmp[0] * (tmp[0] + 2 * m)) / 1000;
  start[3] = (Math.sign(good[3]) * cK) / p1;
}

/**
 * Wide prior of the deviations, centred on the reference: 1 cm across the track (and in z),
 * 0.3 rad of direction, three times the seed curvature plus 0.1/m, one unit of tan λ — far
 * wider than what any track measures, so it adds no information that matters.
 */
function setPrior(prior: Float64Array, start: Float64Array): void {
  const k = 3 * Math.abs(start[3]) + 0.1;
  prior[0] = 1e-4; prior[1] = 0.09; prior[2] = k * k; prior[3] = 1e-4; prior[4] = 1;
}

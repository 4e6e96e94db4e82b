import { GEV_PER_TESLA_METRE } from '../../constants.js';
import { backwardPass } from './filterPasses.js';
import { kineticAndStoppingAtRange, rangeAtKinetic, type LossModel } from './lossModel.js';
import type { MatterFitScratch } from './matterFitScratch.js';
import type { MatterTrackHits } from './matterTrackFit.js';
import { buildReference, REFERENCE_OK, type ReferenceSettings } from './referenceTrack.js';

/** Doublings of the scan step on each side (the last is 0.5·2¹¹ ≈ 1000 linearised errors away). */
const SCAN_STEPS = 12;
/** The scan on each side ends where −2 ln L is this far above its smallest value (e^(−6) of the peak). */
const SCAN_DELTA = 12;
/** Points of the even grid over the scanned span on which the likelihood is integrated. */
const GRID_POINTS = 9;

/**
 * Error of the residual range at the first hit [g/cm²] from the profile of −2 ln L, for tracks
 * that end close to the end of their range. There the curvature rises so steeply that the
 * linearised error is far too small, and the likelihood of the residual range is one-sided: it
 * ends at the wall where the hypothesis stops short of the last hit and falls off slowly, nearly
 * linearly, above it. −2 ln L(R₀) = χ² + Σ ln(variance of each predicted residual) (Gaussian
 * likelihood of the innovations; common practice when the noise depends on the state) +
 * (δκ̂)²/C_κκ, the linear cost of holding the curvature at the value R₀ implies, on the reference
 * started there with the other parameters of `est`.
 *
 * The error is the root-mean-square distance of R₀ from the fitted value under the normalised
 * likelihood, σ² = ∫ (R − R̂)² L(R) dR / ∫ L(R) dR (trapezoid rule on an even grid of
 * GRID_POINTS over the span where −2 ln L is within SCAN_DELTA of its smallest value, found by
 * scans in doubling steps from ½ linearised error on each side), never less than the linearised
 * one. For a parabolic profile far from the wall that is the usual error; for a profile that
 * falls linearly from the wall, −2 ln L = a·x, it is 2√2/a, where the Δ(−2 ln L) = 1 distance
 * (PDG RPP "Statistics") would give 1/a and leave 22 % of the true values beyond three of
 * those errors. Measured on 10 000 simulated protons in propane (test/fit/matterFitExiting.test.ts):
 * tracks leaving 1–5 / 5–20 spacings before their range end have pull rms 1.26 / 1.48 with the
 * Δ = 1 distance, 0.92 / 1.16 with this one.
 * Returns NaN when the reference at the fit cannot be built. Overwrites the scratch.
 */
export function rangeProfileSigma(model: LossModel, hits: MatterTrackHits, set: ReferenceSettings, sc: MatterFitScratch, est: Float64Array, prior: Float64Array): number {
  const n = hits.x.length, hasZ = hits.z !== undefined;
  const t = est[5], sec = Math.sqrt(1 + t * t);
  const cK = GEV_PER_TESLA_METRE * model.chargeAbs * Math.abs(set.fieldT) * sec;
  const m = model.massMeV, sign = Math.sign(est[3]);
  const p0 = (1000 * cK) / Math.abs(est[3]);
  const r0 = rangeAtKinetic(model, Math.sqrt(p0 * p0 + m * m) - m);
  const trial = Float64Array.from(est);
  const profile = (r: number): number => {
    if (!(r > 0)) return NaN;
    kineticAndStoppingAtRange(model, r, sc.tmp);
    const p = Math.sqrt(sc.tmp[0] * (sc.tmp[0] + 2 * m)) / 1000;
    trial[3] = (sign * cK) / p;
    if (buildReference(model, hits, trial, set, sc) !== REFERENCE_OK) return NaN;
    const chi2 = backwardPass(sc, n, hasZ, prior, false, true);
    return chi2 + sc.tmp[14] + (sc.firstB[2] * sc.firstB[2]) / sc.firstB[11];
  };
  const base = profile(r0);
  if (!Number.isFinite(base)) return NaN;
  // Linearised error of R₀: |dR/dκ|·σ(κ), dR/dκ = −(p/κ)·β/S.
  kineticAndStoppingAtRange(model, r0, sc.tmp);
  const beta = p0 / (sc.tmp[0] + m);
  const sigmaLin = (p0 / Math.abs(est[3])) * (beta / sc.tmp[1]) * Math.sqrt(sc.firstB[11]);
  if (!(sigmaLin > 0)) return NaN;
  // The span: on each side, out to where −2 ln L is SCAN_DELTA above the smallest value seen
  // (the minimum may lie inside the scan), or to the last range the hypothesis reaches the hits from.
  let min = base;
  const edge = (dir: number): number => {
    let last = 0, lastQ = base;
    for (let j = 0; j < SCAN_STEPS; j++) {
      const d = dir * 0.5 * sigmaLin * 2 ** j;
      const q = profile(r0 + d);
      if (!Number.isFinite(q)) break;
      if (q < min) min = q;
      // Past the crossing: end the span where the straight line between the two points crosses it.
      if (q - min >= SCAN_DELTA) return last + ((d - last) * Math.max(0, min + SCAN_DELTA - lastQ)) / Math.max(q - lastQ, 1e-12);
      last = d; lastQ = q;
    }
    return last;
  };
  const hi = edge(1), lo = edge(-1);
  if (!(hi > lo)) return sigmaLin;
  const h = (hi - lo) / (GRID_POINTS - 1);
  const q = new Float64Array(GRID_POINTS);
  for (let j = 0; j < GRID_POINTS; j++) {
    q[j] = profile(r0 + lo + j * h);
    if (q[j] < min) min = q[j];
  }
  let w0 = 0, w2 = 0;
  for (let j = 0; j < GRID_POINTS; j++) {
    if (!Number.isFinite(q[j])) continue;
    const d = lo + j * h, w = Math.exp(-0.5 * (q[j] - min)) * (j === 0 || j === GRID_POINTS - 1 ? 0.5 : 1);
    w0 += w; w2 += w * d * d;
  }
  const sigma = w0 > 0 ? Math.sqrt(w2 / w0) : NaN;
  return Number.isFinite(sigma) ? Math.max(sigma, sigmaLin) : sigmaLin;
}

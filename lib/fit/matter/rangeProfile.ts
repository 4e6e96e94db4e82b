import { GEV_PER_TESLA_METRE } from '../../constants.js';
import { backwardPass } from './filterPasses.js';
import { kineticAndStoppingAtRange, rangeAtKinetic, type LossModel } from './lossModel.js';
import type { MatterFitScratch } from './matterFitScratch.js';
import type { MatterTrackHits } from './matterTrackFit.js';
import { buildReference, REFERENCE_OK, type ReferenceSettings } from './referenceTrack.js';

/** Steps of the scan on each side (the last is 32 linearised errors away). */
const SCAN_STEPS = 7;

/**
 * Error of the residual range at the first hit [g/cm²] from the profile of −2 ln L — for tracks
 * that end close to the end of their range, where the curvature rises so steeply that the
 * linearised error is far too small, and where the scattering and straggling noise, which grow
 * without bound as the particle slows, make a hypothesis that stops just after the last hit
 * look better in χ² than it is. −2 ln L(R₀) = χ² + Σ ln(variance of each predicted residual)
 * (Gaussian likelihood of the innovations; common practice when the noise depends on the
 * state) + (δκ̂)²/C_κκ, the linear cost of holding the curvature at the value R₀ implies, on the
 * reference started there with the other parameters of `est`. The scan moves to larger R₀ in
 * steps of ½, 1, 2, … linearised errors until −2 ln L is 1 above its smallest value; the error
 * is the distance from the fit to that point, never less than the linearised one (the Δ = 1
 * interval of a profile likelihood, PDG RPP "Statistics"). Overwrites the scratch.
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
    kineticAndStoppingAtRange(model, r, sc.tmp);
    const p = Math.sqrt(sc.tmp[0] * (sc.tmp[0] + 2 * m)) / 1000;
    trial[3] = (sign * cK) / p;
    if (buildReference(model, hits, trial, set, sc) !== REFERENCE_OK) return NaN;
    const chi2 = backwardPass(sc, n, hasZ, prior, true);
    return chi2 + sc.tmp[14] + (sc.firstB[2] * sc.firstB[2]) / sc.firstB[11];
  };
  const base = profile(r0);
  if (!Number.isFinite(base)) return NaN;
  // Linearised error of R₀: |dR/dκ|·σ(κ), dR/dκ = −(p/κ)·β/S.
  kineticAndStoppingAtRange(model, r0, sc.tmp);
  const beta = p0 / (sc.tmp[0] + m);
  const sigmaLin = (p0 / Math.abs(est[3])) * (beta / sc.tmp[1]) * Math.sqrt(sc.firstB[11]);
  if (!(sigmaLin > 0)) return NaN;
  // Scan towards larger ranges (higher momentum at the first hit), where the likelihood is
  // shallow; the other side ends at the wall where the hypothesis stops short. The minimum may
  // lie inside the scan: the width is measured from the fit to where −2 ln L is 1 above it.
  let min = base, width = NaN, prevD = 0, prevQ = base;
  for (let j = 0; j < SCAN_STEPS; j++) {
    const d = 0.5 * sigmaLin * 2 ** j;
    const q = profile(r0 + d);
    if (!Number.isFinite(q)) break;
    if (q < min) min = q;
    if (q - min >= 1 && d > 0) { width = prevD + ((d - prevD) * (min + 1 - prevQ)) / Math.max(q - prevQ, 1e-12); break; }
    prevD = d; prevQ = q;
  }
  if (!Number.isFinite(width)) width = prevD;
  return Math.max(width, sigmaLin);
}

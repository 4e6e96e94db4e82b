import { GEV_PER_TESLA_METRE } from '../../constants.js';
import { backwardPass } from './filterPasses.js';
import { kineticAndStoppingAtRange, rangeAtKinetic, type LossModel } from './lossModel.js';
import type { MatterFitScratch } from './matterFitScratch.js';
import type { MatterTrackHits } from './matterTrackFit.js';
import { buildReference, REFERENCE_OK, type ReferenceSettings } from './referenceTrack.js';

/** Steps of the scan on each side (the last is 32 linearised errors away). */
const SCAN_STEPS = 7;

/**
 * Error of the residual range at the first hit [g/cm²] from the profile of χ² — for tracks that
 * end close to the end of their range, where the curvature rises so steeply that the linearised
 * error is far too small. χ²(R₀) is the backward filter's χ² on the reference started with the
 * residual range R₀ (the curvature it implies) and the other parameters of `est`, plus the
 * linear cost (δκ̂)²/C_κκ of holding the curvature there. The scan moves away from the fitted R̂₀
 * in steps of ½, 1, 2, … linearised errors until χ² has risen by 1 on each side (a side where
 * the hypothesis can no longer reach the last hit ends at the last reachable step); the error is
 * the mean of the two half-widths, never less than the linearised one (common practice: the
 * Δχ² = 1 interval of a profile likelihood, PDG RPP "Statistics"). Overwrites the scratch.
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
    const chi2 = backwardPass(sc, n, hasZ, prior);
    return chi2 + (sc.firstB[2] * sc.firstB[2]) / sc.firstB[11];
  };
  const base = profile(r0);
  if (!Number.isFinite(base)) return NaN;
  // Linearised error of R₀: |dR/dκ|·σ(κ), dR/dκ = −(p/κ)·β/S.
  kineticAndStoppingAtRange(model, r0, sc.tmp);
  const beta = p0 / (sc.tmp[0] + m);
  const sigmaLin = (p0 / Math.abs(est[3])) * (beta / sc.tmp[1]) * Math.sqrt(sc.firstB[11]);
  if (!(sigmaLin > 0)) return NaN;
  let sum = 0;
  for (const side of [1, -1]) {
    let prevD = 0, prevRise = 0, width = NaN;
    for (let j = 0; j < SCAN_STEPS; j++) {
      const d = 0.5 * sigmaLin * 2 ** j;
      const rise = profile(r0 + side * d) - base;
      if (!Number.isFinite(rise)) { width = prevD; break; }
      if (rise >= 1) { width = prevD + ((d - prevD) * (1 - prevRise)) / Math.max(rise - prevRise, 1e-12); break; }
      prevD = d; prevRise = Math.max(rise, 0);
    }
    sum += Number.isFinite(width) ? width : prevD;
  }
  return Math.max(0.5 * sum, sigmaLin);
}

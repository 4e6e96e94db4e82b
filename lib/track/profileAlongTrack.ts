import { GEV_PER_TESLA_METRE } from '../constants.js';
import type { SegmentCurvatures } from './segmentCurvatures.js';
import type { SpeciesRange } from './speciesRange.js';

/** Measured momentum of each segment against the residual range at its middle. */
export interface MomentumAgainstRange {
  /** Residual range [m] at the middle of each segment: s_end − s_mid. */
  readonly residualRangeM: Float64Array;
  /** p = 0.2998·B·|z|/(|κ| cos λ) [GeV/c] of the segment, and its error from the curvature error. */
  readonly pGeV: Float64Array;
  readonly sigmaPGeV: Float64Array;
}

/**
 * Momentum against residual range along a stopping track, from its segment curvatures:
 * p = 0.2998·B·|z|/(|κ| cos λ) (common practice), σ_p = p·σ_κ/|κ| (hit errors only; scattering
 * inside the segment adds more, see `fitHypothesis`). The residual range counts from
 * `endPathM` (path from the first hit where the particle stops; default last hit + half the mean
 * hit spacing). Compare with each species' `momentumGeV(residualRangeM)` (CSDA).
 * @example momentumAgainstResidualRange(segmentCurvatures(hits), { fieldT: 2 }).pGeV
 */
export function momentumAgainstResidualRange(seg: SegmentCurvatures, options: { fieldT: number; chargeMagnitude?: number; endPathM?: number }): MomentumAgainstRange {
  const c = GEV_PER_TESLA_METRE * Math.abs(options.fieldT) * (options.chargeMagnitude ?? 1);
  const n = seg.pathM.length;
  const end = options.endPathM ?? seg.pathM[n - 1] * (1 + 0.5 / Math.max(n - 1, 1));
  const out = { residualRangeM: new Float64Array(seg.count), pGeV: new Float64Array(seg.count), sigmaPGeV: new Float64Array(seg.count) };
  for (let j = 0; j < seg.count; j++) {
    const k = Math.abs(seg.kappa[j]);
    out.residualRangeM[j] = end - seg.pathMidM[j];
    out.pGeV[j] = c / (k * seg.cosLambda[j]);
    out.sigmaPGeV[j] = (out.pGeV[j] * seg.sigmaKappa[j]) / k;
  }
  return Object.freeze(out);
}

/**
 * Predicted bending-plane curvature |κ| [1/m] at path `pathM` [m] of a particle whose CSDA
 * profile comes to rest at path `rangeEndM`: κ = 0.2998·B·|z|/(p_h(rangeEndM − s)·cos λ);
 * NaN beyond the stop. `cosLambda` is one dip for the whole track (default 1).
 * @example predictedCurvature(speciesRange(MUON_PLUS, mat), 0.3, Float64Array.of(0, 0.1), { fieldT: 2 })
 */
export function predictedCurvature(range: SpeciesRange, rangeEndM: number, pathM: ArrayLike<number>, options: { fieldT: number; chargeMagnitude?: number; cosLambda?: number }): Float64Array {
  const c = GEV_PER_TESLA_METRE * Math.abs(options.fieldT) * (options.chargeMagnitude ?? 1);
  const out = new Float64Array(pathM.length);
  for (let i = 0; i < pathM.length; i++) {
    const left = rangeEndM - pathM[i];
    out[i] = left > 0 ? c / (range.momentumGeV(left) * (options.cosLambda ?? 1)) : NaN;
  }
  return out;
}

import type { MatterFitColumns } from '../fit/matter/fitTracksInMatter.js';
import type { MomentumColumns } from './momentum.js';

/**
 * Momentum columns from fits with material: p, p_T and the direction at the first hit, σ(p)
 * from the fit's covariance (so it holds the multiple-scattering and straggling process noise
 * as well as the hit errors), charge from the turning sense (q = −sign(κ)·sign(B_z)·|z|).
 * Components p_x = p_T cos φ, p_y = p_T sin φ, p_z = p_T tan λ (common practice).
 */
export function matterMomenta(fits: MatterFitColumns): MomentumColumns {
  const n = fits.count;
  const f = () => new Float64Array(n);
  const out = {
    count: n, charge: f(), radiusM: f(), ptGeV: f(), pGeV: f(), pxGeV: f(), pyGeV: f(), pzGeV: f(), tanLambda: f(),
    sigmaPtGeV: f(), sigmaPGeV: f(), curvatureSignificance: f(),
  };
  for (let k = 0; k < n; k++) {
    const kappa = fits.kappa[k], pt = fits.ptGeV[k], t = fits.tanLambda[k], phi = fits.phi[k];
    out.charge[k] = fits.charge[k];
    out.radiusM[k] = 1 / Math.abs(kappa);
    out.ptGeV[k] = pt;
    out.pGeV[k] = fits.pGeV[k];
    out.pxGeV[k] = pt * Math.cos(phi);
    out.pyGeV[k] = pt * Math.sin(phi);
    out.pzGeV[k] = pt * t;
    out.tanLambda[k] = t;
    out.sigmaPtGeV[k] = (pt * fits.sigmaKappa[k]) / Math.abs(kappa);
    out.sigmaPGeV[k] = fits.sigmaPGeV[k];
    out.curvatureSignificance[k] = Math.abs(kappa) / fits.sigmaKappa[k];
  }
  return out;
}

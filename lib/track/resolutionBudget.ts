import type { Column } from '../io/columnTable.js';
import { PION_PLUS, type Particle } from '../particles.js';
import type { Material } from '../matter/materials.js';
import type { TrackTable } from './measureTracks.js';
import { radiationLengthM } from '../matter/highland.js';
import { curvatureSigmaLeastSquares, multipleScatteringCurvatureSigma } from './resolution.js';

export interface ResolutionBudgetOptions {
  /** Medium filling the tracking volume. */
  readonly material: Material;
  /** Mass hypothesis for β in the multiple-scattering term; default π⁺ (common practice for unidentified tracks). */
  readonly particle?: Particle;
  /** Point error [m] for hits without a sigma column; without it the fit's own σ(κ) is the measurement term. */
  readonly hitErrorM?: number;
}

/** σ(p) [GeV/c] per track, split by source; NaN where the fit failed. */
export interface ResolutionBudgetColumns {
  readonly count: number;
  /** Projected track length: extent of the hits along their chord [m]. */
  readonly lengthM: Float64Array;
  readonly sigmaPMeasGeV: Float64Array;
  readonly sigmaPMsGeV: Float64Array;
  readonly sigmaPTotalGeV: Float64Array;
}

/**
 * The momentum error budget of every fitted track in a chamber medium (PDG RPP detector review;
 * Gluckstern, NIM 24 (1963) 381):
 *  - measurement: the exact least-squares curvature error for the track's own hit positions
 *    (projected on the chord) and hit errors (`curvatureSigmaLeastSquares`); when the hits carry
 *    no error and none is given, the fit's covariance σ(κ) (the same quantity, estimated);
 *  - multiple scattering: `multipleScatteringCurvatureSigma` over the projected length L with
 *    the material's X₀, β from p and the mass hypothesis, dip angle from tan λ when measured;
 *  - total in quadrature. σ(p) = p · σ(κ)/|κ| with κ from p_T = 0.299792458 |z| B R.
 * Rows follow `tracks`; the hits are the ones the track table was measured from (kept on it),
 * and κ is the fitted curvature. Valid for small sagitta.
 */
export function resolutionBudget(tracks: TrackTable, options: ResolutionBudgetOptions): ResolutionBudgetColumns {
  const species = options.particle ?? PION_PLUS;
  const x0M = radiationLengthM(options.material);
  const table = tracks.hits;
  const n = tracks.count;
  const out = {
    count: n,
    lengthM: new Float64Array(n), sigmaPMeasGeV: new Float64Array(n), sigmaPMsGeV: new Float64Array(n), sigmaPTotalGeV: new Float64Array(n),
  };
  const m = tracks.momentum;
  for (let k = 0; k < n; k++) {
    const a = tracks.offsets[k], b = tracks.offsets[k + 1];
    const pt = m.ptGeV[k];
    const p = tracks.hasZ ? m.pGeV[k] : pt;
    if (tracks.status[k] !== 'ok' || !(pt > 0) || b - a < 3) {
      out.lengthM[k] = out.sigmaPMeasGeV[k] = out.sigmaPMsGeV[k] = out.sigmaPTotalGeV[k] = NaN;
      continue;
    }
    // Positions along the chord from the first to the last hit.
    const dx = table.x[b - 1] - table.x[a], dy = table.y[b - 1] - table.y[a];
    const chord = Math.hypot(dx, dy);
    const s = new Float64Array(b - a);
    let lo = Infinity, hi = -Infinity;
    for (let i = a; i < b; i++) {
      const v = ((table.x[i] - table.x[a]) * dx + (table.y[i] - table.y[a]) * dy) / chord;
      s[i - a] = v;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    const lengthM = hi - lo;
    out.lengthM[k] = lengthM;
    const kappaAbs = Math.abs(tracks.kappa[k]);
    let sigmaKappa: number;
    if (table.sigmaX !== undefined) {
      const sig = new Float64Array(b - a);
      for (let i = a; i < b; i++) sig[i - a] = table.sigmaY ? Math.sqrt(0.5 * (table.sigmaX[i] ** 2 + table.sigmaY[i] ** 2)) : table.sigmaX[i];
      sigmaKappa = curvatureSigmaLeastSquares(s, sig);
    } else if (options.hitErrorM !== undefined) {
      sigmaKappa = curvatureSigmaLeastSquares(s, options.hitErrorM);
    } else {
      sigmaKappa = (m.sigmaPtGeV[k] / pt) * kappaAbs;
    }
    const beta = p / Math.hypot(p, species.massMeV / 1000);
    const dip = tracks.hasZ ? Math.atan(m.tanLambda[k]) : 0;
    const sigmaKappaMs = multipleScatteringCurvatureSigma({ momentumGeV: p, beta, charge: m.charge[k], lengthM, radiationLengthM: x0M, dipAngleRad: dip });
    out.sigmaPMeasGeV[k] = (p * sigmaKappa) / kappaAbs;
    out.sigmaPMsGeV[k] = (p * sigmaKappaMs) / kappaAbs;
    out.sigmaPTotalGeV[k] = Math.hypot(out.sigmaPMeasGeV[k], out.sigmaPMsGeV[k]);
  }
  return out;
}

/**
 * The budget as result-table columns, named as `sagitta fit --material` writes them:
 * sigma_p_meas, sigma_p_ms, sigma_p_total, all σ(p) in GeV/c.
 */
export function resolutionBudgetColumns(budget: ResolutionBudgetColumns): Column[] {
  return [
    { name: 'sigma_p_meas_GeV_c', values: budget.sigmaPMeasGeV, digits: 4 },
    { name: 'sigma_p_ms_GeV_c', values: budget.sigmaPMsGeV, digits: 4 },
    { name: 'sigma_p_total_GeV_c', values: budget.sigmaPTotalGeV, digits: 4 },
  ];
}

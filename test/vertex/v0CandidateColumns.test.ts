import { describe, expect, it } from 'vitest';
import { v0CandidateColumns } from '../../lib/vertex/v0CandidateColumns.js';
import type { V0Candidates } from '../../lib/vertex/v0Candidates.js';

/**
 * The column contract of `sagitta vertices` (names, order, print digits) on a hand-made set of
 * two candidates whose every field holds its own distinct numbers, so a column fed from the
 * wrong field shows. Vertex errors are √ of the covariance diagonal (x, y, z at 0, 3, 5 of the
 * upper triangle).
 */
const FIELDS = [
  'event', 'trackPos', 'trackNeg', 'xM', 'yM', 'zM', 'dcaM', 'flightM', 'massPiPiMeV', 'sigmaMassPiPiMeV', 'massPPiMeV',
  'sigmaMassPPiMeV', 'massPiPMeV', 'sigmaMassPiPMeV', 'armenterosAlpha', 'armenterosQtMeV', 'chi2', 'sigmaFlightM', 'pointingRad',
  'pMeV', 'massEEMeV', 'sigmaMassEEMeV', 'properTimeK0sPs', 'properTimeLambdaPs',
] as const;

function candidates(): V0Candidates {
  const c: Record<string, unknown> = { count: 2, status: ['ok', 'poor-fit'] };
  FIELDS.forEach((f, k) => { c[f] = Float64Array.of(100 + k, 200 + k); });
  c.cov = Float64Array.of(4, 0.1, 0.2, 9, 0.3, 16, /* second */ 25, 0, 0, 36, 0, 49);
  return c as unknown as V0Candidates;
}

describe('v0CandidateColumns', () => {
  it('writes the contract columns first, the errors and extras after, status last, each from its own field', () => {
    const t = v0CandidateColumns(candidates());
    expect(t.rows).toBe(2);
    const names = t.columns.map((c) => c.name);
    expect(names).toEqual([
      'event', 'track_pos', 'track_neg', 'x_m', 'y_m', 'z_m', 'dca_m', 'flight_m', 'mass_pipi_MeV', 'sigma_mass_pipi_MeV',
      'mass_ppi_MeV', 'sigma_mass_ppi_MeV', 'mass_pip_MeV', 'sigma_mass_pip_MeV', 'armenteros_alpha', 'armenteros_qt_MeV',
      'sigma_x_m', 'sigma_y_m', 'sigma_z_m', 'chi2', 'sigma_flight_m', 'pointing_rad', 'p_MeV_c', 'mass_ee_MeV',
      'sigma_mass_ee_MeV', 'proper_time_k0s_ps', 'proper_time_lambda_ps', 'status',
    ]);
    const byName = new Map(t.columns.map((c) => [c.name, c]));
    const fromField: Record<string, (typeof FIELDS)[number]> = {
      event: 'event', track_pos: 'trackPos', track_neg: 'trackNeg', x_m: 'xM', y_m: 'yM', z_m: 'zM', dca_m: 'dcaM', flight_m: 'flightM',
      mass_pipi_MeV: 'massPiPiMeV', sigma_mass_pipi_MeV: 'sigmaMassPiPiMeV', mass_ppi_MeV: 'massPPiMeV', sigma_mass_ppi_MeV: 'sigmaMassPPiMeV',
      mass_pip_MeV: 'massPiPMeV', sigma_mass_pip_MeV: 'sigmaMassPiPMeV', armenteros_alpha: 'armenterosAlpha', armenteros_qt_MeV: 'armenterosQtMeV',
      chi2: 'chi2', sigma_flight_m: 'sigmaFlightM', pointing_rad: 'pointingRad', p_MeV_c: 'pMeV', mass_ee_MeV: 'massEEMeV',
      sigma_mass_ee_MeV: 'sigmaMassEEMeV', proper_time_k0s_ps: 'properTimeK0sPs', proper_time_lambda_ps: 'properTimeLambdaPs',
    };
    for (const [name, field] of Object.entries(fromField)) {
      const k = FIELDS.indexOf(field);
      expect(Array.from(byName.get(name)!.values as ArrayLike<number>), name).toEqual([100 + k, 200 + k]);
    }
    expect(Array.from(byName.get('sigma_x_m')!.values as ArrayLike<number>)).toEqual([2, 5]);
    expect(Array.from(byName.get('sigma_y_m')!.values as ArrayLike<number>)).toEqual([3, 6]);
    expect(Array.from(byName.get('sigma_z_m')!.values as ArrayLike<number>)).toEqual([4, 7]);
    expect(byName.get('status')!.values).toEqual(['ok', 'poor-fit']);
  });

  it('prints ids whole, errors to 4 digits, angles, χ² and proper times to 6, the rest at the default', () => {
    const digits = Object.fromEntries(v0CandidateColumns(candidates()).columns.map((c) => [c.name, c.digits]));
    expect(digits).toEqual({
      event: 0, track_pos: 0, track_neg: 0, x_m: undefined, y_m: undefined, z_m: undefined, dca_m: 4, flight_m: undefined,
      mass_pipi_MeV: undefined, sigma_mass_pipi_MeV: 4, mass_ppi_MeV: undefined, sigma_mass_ppi_MeV: 4, mass_pip_MeV: undefined,
      sigma_mass_pip_MeV: 4, armenteros_alpha: 6, armenteros_qt_MeV: 6, sigma_x_m: 4, sigma_y_m: 4, sigma_z_m: 4, chi2: 6,
      sigma_flight_m: 4, pointing_rad: 6, p_MeV_c: undefined, mass_ee_MeV: undefined, sigma_mass_ee_MeV: 4,
      proper_time_k0s_ps: 6, proper_time_lambda_ps: 6, status: undefined,
    });
  });
});

import type { ColumnTable } from '../io/columnTable.js';
import type { V0Candidates } from './v0Candidates.js';

/**
 * V⁰ candidates as output columns, in the order `sagitta vertices` writes them: the contract
 * columns first (event, track_pos, track_neg, x_m, y_m, z_m, dca_m, flight_m, the three mass
 * hypotheses with errors, armenteros_alpha, armenteros_qt_MeV), then the vertex errors, χ²,
 * flight error, pointing angle, V⁰ momentum, the e⁺e⁻ mass and the proper times, and status last.
 * `ppi` = positive daughter as proton, negative as π⁻; `pip` = positive as π⁺, negative as
 * antiproton. Units are in the names.
 */
export function v0CandidateColumns(c: V0Candidates): ColumnTable {
  const sd = (k: number) => Float64Array.from({ length: c.count }, (_, i) => Math.sqrt(c.cov[6 * i + k]));
  return {
    rows: c.count,
    columns: [
      { name: 'event', values: c.event, digits: 0 },
      { name: 'track_pos', values: c.trackPos, digits: 0 },
      { name: 'track_neg', values: c.trackNeg, digits: 0 },
      { name: 'x_m', values: c.xM },
      { name: 'y_m', values: c.yM },
      { name: 'z_m', values: c.zM },
      { name: 'dca_m', values: c.dcaM, digits: 4 },
      { name: 'flight_m', values: c.flightM },
      { name: 'mass_pipi_MeV', values: c.massPiPiMeV },
      { name: 'sigma_mass_pipi_MeV', values: c.sigmaMassPiPiMeV, digits: 4 },
      { name: 'mass_ppi_MeV', values: c.massPPiMeV },
      { name: 'sigma_mass_ppi_MeV', values: c.sigmaMassPPiMeV, digits: 4 },
      { name: 'mass_pip_MeV', values: c.massPiPMeV },
      { name: 'sigma_mass_pip_MeV', values: c.sigmaMassPiPMeV, digits: 4 },
      { name: 'armenteros_alpha', values: c.armenterosAlpha, digits: 6 },
      { name: 'armenteros_qt_MeV', values: c.armenterosQtMeV, digits: 6 },
      { name: 'sigma_x_m', values: sd(0), digits: 4 },
      { name: 'sigma_y_m', values: sd(3), digits: 4 },
      { name: 'sigma_z_m', values: sd(5), digits: 4 },
      { name: 'chi2', values: c.chi2, digits: 6 },
      { name: 'sigma_flight_m', values: c.sigmaFlightM, digits: 4 },
      { name: 'pointing_rad', values: c.pointingRad, digits: 6 },
      { name: 'p_MeV_c', values: c.pMeV },
      { name: 'mass_ee_MeV', values: c.massEEMeV },
      { name: 'sigma_mass_ee_MeV', values: c.sigmaMassEEMeV, digits: 4 },
      { name: 'proper_time_k0s_ps', values: c.properTimeK0sPs, digits: 6 },
      { name: 'proper_time_lambda_ps', values: c.properTimeLambdaPs, digits: 6 },
      { name: 'status', values: c.status },
    ],
  };
}

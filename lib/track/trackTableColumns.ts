import type { ColumnTable } from '../io/columnTable.js';
import type { TrackTable } from './measureTracks.js';

/**
 * The track table as output columns, in the order `sagitta fit` writes them: snake_case names
 * ending in their unit (`_m`, `_rad`, `_GeV_c` for momenta). `p_GeV_c`, `tan_lambda`, `z0_m` and
 * `sigma_p_GeV_c` are empty when the hits carry no z. `chi2_prob` is P(χ²_ndf ≥ χ²). After a fit with
 * material: `p_last_GeV_c` and its error at the last hit, the 3-D `path_m` first → last hit and the
 * hypothesis' CSDA `residual_range_m` left at the last hit, and with a fiducial volume `stops`
 * (1 for a track that ends inside it and was fitted with the stop constraint) and `stop_chi2`
 * (that constraint's own χ², 1 degree of freedom; empty without it). After identification by range
 * (`particle: 'auto'` or a list): `pid` (the chosen species, or 'undecided'), `pid_delta_m2lnL`
 * (−2 ln L of the runner-up minus the best), `stops` (1 when the track stops inside) and
 * `p_min_GeV_c` (least first-hit momentum that reaches the last hit, the bound for a track that
 * leaves); p and σ(p) are then those of the chosen species — of the charged pion for an
 * 'undecided' track (common practice) — and `p_species` names the species they were computed under; `decay_of` is the track id of the
 * stopping track of the same event whose last hit lies within 1.5 cm of this track's first hit
 * (a decay at rest, `linkStopDecays`), empty when none, and `decay_distance_m` that distance.
 */
export function trackTableColumns(t: TrackTable): ColumnTable {
  const m = t.momentum;
  return {
    rows: t.count,
    columns: [
      { name: 'event', values: t.event, digits: 0 },
      { name: 'track', values: t.track, digits: 0 },
      { name: 'n_hits', values: t.nhits, digits: 0 },
      { name: 'charge', values: m.charge, digits: 0 },
      { name: 'radius_m', values: m.radiusM },
      { name: 'pt_GeV_c', values: m.ptGeV },
      { name: 'p_GeV_c', values: m.pGeV },
      { name: 'tan_lambda', values: m.tanLambda },
      { name: 'phi0_rad', values: t.phi0 },
      { name: 'd0_m', values: t.d0 },
      { name: 'z0_m', values: t.z0 },
      { name: 'sigma_pt_GeV_c', values: m.sigmaPtGeV, digits: 4 },
      { name: 'sigma_p_GeV_c', values: m.sigmaPGeV, digits: 4 },
      { name: 'kappa_significance', values: m.curvatureSignificance, digits: 4 },
      { name: 'chi2', values: t.chi2, digits: 6 },
      { name: 'ndf', values: t.ndf, digits: 0 },
      { name: 'chi2_prob', values: t.chi2Prob, digits: 6 },
      { name: 'iterations', values: t.iterations, digits: 0 },
      { name: 'status', values: t.status },
      ...(t.matter ? [
        { name: 'p_last_GeV_c', values: t.matter.pLastGeV },
        { name: 'sigma_p_last_GeV_c', values: t.matter.sigmaPLastGeV, digits: 4 },
        { name: 'path_m', values: t.matter.pathLengthM },
        { name: 'residual_range_m', values: t.matter.residualRangeM },
      ] : []),
      ...(t.stops && !t.identity ? [{ name: 'stops', values: t.stops, digits: 0 }, { name: 'stop_chi2', values: t.matter!.stopChi2, digits: 6 }] : []),
      ...(t.identity ? [
        { name: 'pid', values: t.identity.pid },
        { name: 'pid_delta_m2lnL', values: t.identity.deltaM2lnL, digits: 6 },
        { name: 'stops', values: t.identity.stops, digits: 0 },
        { name: 'p_min_GeV_c', values: t.identity.pMinGeV },
        ...(t.identity.pSpecies ? [{ name: 'p_species', values: t.identity.pSpecies }] : []),
      ] : []),
      ...(t.decays ? [
        { name: 'decay_of', values: Float64Array.from(t.decays.parentRow, (r) => (r >= 0 ? t.track[r] : NaN)), digits: 0 },
        { name: 'decay_distance_m', values: t.decays.distanceM, digits: 4 },
      ] : []),
    ],
  };
}

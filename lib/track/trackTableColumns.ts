import type { ColumnTable } from '../io/columnTable.js';
import type { TrackTable } from './measureTracks.js';

/**
 * The track table as output columns, in the order `sagitta fit` writes them. Units are in the
 * names (`_m`, `_GeV`, `_rad`); `p_GeV`, `tanLambda`, `z0_m` and `sigma_p_GeV` are empty
 * when the hits carry no z.
 */
export function trackTableColumns(t: TrackTable): ColumnTable {
  const m = t.momentum;
  return {
    rows: t.count,
    columns: [
      { name: 'event', values: t.event, digits: 0 },
      { name: 'track', values: t.track, digits: 0 },
      { name: 'nhits', values: t.nhits, digits: 0 },
      { name: 'charge', values: m.charge, digits: 0 },
      { name: 'R_m', values: m.radiusM },
      { name: 'pT_GeV', values: m.ptGeV },
      { name: 'p_GeV', values: m.pGeV },
      { name: 'tanLambda', values: m.tanLambda },
      { name: 'phi0_rad', values: t.phi0 },
      { name: 'd0_m', values: t.d0 },
      { name: 'z0_m', values: t.z0 },
      { name: 'sigma_pT_GeV', values: m.sigmaPtGeV, digits: 4 },
      { name: 'sigma_p_GeV', values: m.sigmaPGeV, digits: 4 },
      { name: 'kappa_signif', values: m.curvatureSignificance, digits: 4 },
      { name: 'chi2', values: t.chi2, digits: 6 },
      { name: 'ndf', values: t.ndf, digits: 0 },
      { name: 'iterations', values: t.iterations, digits: 0 },
      { name: 'status', values: t.status },
    ],
  };
}

import type { TrackTable } from '../track/measureTracks.js';
import { trackTableColumns } from '../track/trackTableColumns.js';
import { TableView, type TableViewOptions } from './tableView.js';

/**
 * The fitted tracks as a table view, one row per track keyed by event and track, with the
 * selection verbs of TableView (`where`, `sortBy`, `first`, `columns`). Shown by default: hits,
 * charge, p_T ± σ, p ± σ (when the hits carry z), χ²/ndf and status; every column of
 * `trackTableColumns` can be picked with `.columns(…)`.
 * @example trackRows(tracks).where((t) => t.status === 'ok').sortBy('pt_GeV_c', 'descending').first(10)
 */
/** 'Tracks fitted by geometric in 1.5 T', or for a fit with material 'Tracks fitted with material (mass: auto) in 1.5 T'. */
function defaultCaption(tracks: TrackTable): string {
  const by = tracks.method === 'matter' ? `with material${tracks.particle ? ` (mass: ${tracks.particle})` : ''}` : `by ${tracks.method}`;
  return `Tracks fitted ${by} in ${tracks.fieldT} T`;
}

export function trackRows(tracks: TrackTable, options: Pick<TableViewOptions, 'caption' | 'shown'> = {}): TableView {
  const columns = ['n_hits', 'charge', 'pt_GeV_c', ...(tracks.hasZ ? ['p_GeV_c'] : []), 'chi2', 'ndf', 'status'];
  return new TableView(trackTableColumns(tracks), {
    noun: 'track',
    keys: ['event', 'track'],
    columns,
    caption: options.caption ?? defaultCaption(tracks),
    shown: options.shown,
  });
}

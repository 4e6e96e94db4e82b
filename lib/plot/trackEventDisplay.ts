import { msg } from '../errors.js';
import type { HitTable } from '../io/hitTable.js';
import type { TrackTable } from '../track/measureTracks.js';
import { eventDisplay, type DisplayTrack, type EventDisplay, type EventDisplayOptions } from './eventDisplay.js';

/** One event's hits (row numbers in the hit table) and the circles of its fitted tracks. */
export interface EventArcs {
  readonly rows: readonly number[];
  readonly drawn: readonly DisplayTrack[];
  /** Track id → index into `drawn`. */
  readonly trackIndexOf: ReadonlyMap<number, number>;
}

/**
 * The circles [m] of one event's successfully fitted tracks (`measureTracks`). The centre is
 * rebuilt from (κ, φ0, d0) at the track's reference point (its first hit, kept on the table), C = ref + (1/κ − d0)·n with
 * n = (−sin φ0, cos φ0) — the parametrisation of lib/fit (Karimäki, NIM A305 (1991) 187).
 * Each is labelled with its transverse momentum.
 */
export function eventArcs(hits: HitTable, tracks: TrackTable, event: number): EventArcs {
  const rows: number[] = [];
  for (let i = 0; i < hits.length; i++) if (hits.event[i] === event) rows.push(i);
  if (rows.length === 0) throw msg.badArgument('event', event, `an event number present in ${hits.source.file}`);
  const trackIndexOf = new Map<number, number>();
  const drawn: DisplayTrack[] = [];
  for (let k = 0; k < tracks.count; k++) {
    if (tracks.event[k] !== event || (tracks.status[k] !== 'ok' && tracks.status[k] !== 'poor-fit') || tracks.track[k] < 0) continue;
    const kappa = tracks.kappa[k], phi0 = tracks.phi0[k], d0 = tracks.d0[k];
    if (!(Math.abs(kappa) > 0)) continue;
    const lever = 1 / kappa - d0;
    const pt = tracks.momentum.ptGeV[k];
    trackIndexOf.set(tracks.track[k], drawn.length);
    drawn.push({
      centerXM: tracks.xRef[k] - lever * Math.sin(phi0),
      centerYM: tracks.yRef[k] + lever * Math.cos(phi0),
      radiusM: Math.abs(1 / kappa),
      charge: tracks.momentum.charge[k],
      label: Number.isFinite(pt) ? (pt < 1 ? `${(pt * 1000).toFixed(0)} MeV/c` : `${pt.toFixed(2)} GeV/c`) : undefined,
    });
  }
  return { rows, drawn, trackIndexOf };
}

/**
 * The event display of one event: hits as read (open circles for hits on no track) and each
 * fitted track as the arc of its circle over its own hits, labelled with p_T.
 * @example trackEventDisplay(hits, measureTracks(hits, { fieldT: 1.5 }), 12, { extentM: { xMin: -0.6, xMax: 0.6, yMin: -0.4, yMax: 0.4 } })
 */
export function trackEventDisplay(hits: HitTable, tracks: TrackTable, event: number, options: EventDisplayOptions = {}): EventDisplay {
  const { rows, drawn, trackIndexOf } = eventArcs(hits, tracks, event);
  const xM = rows.map((i) => hits.x[i]);
  const yM = rows.map((i) => hits.y[i]);
  const track = rows.map((i) => trackIndexOf.get(hits.track[i]) ?? -1);
  return eventDisplay({ xM, yM, track }, drawn, { title: `Event ${event}`, fieldT: tracks.fieldT, ...options });
}

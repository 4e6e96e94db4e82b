import { msg } from '../errors.js';
import { estimateHitSpacing } from './hitSpacing.js';
import { findInEvent } from './findInEvent.js';
import { groupEvents } from './groupEvents.js';
import { createRoadContext, reserveRoadContext, type RoadSettings } from './roadContext.js';
import { createDirectionScratch, travelDirection, type DirectionRule } from './travelDirection.js';

/** The hit columns the finder reads (a HitTable has them all); lengths in metres. */
export interface FindHits {
  readonly length: number;
  readonly event: Float64Array;
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly z?: Float64Array;
  readonly sigmaX?: Float64Array;
  readonly sigmaZ?: Float64Array;
}

export interface FindTracksOptions {
  /** Distance between neighbouring hits of a track [m]; default estimated from the hits. */
  readonly hitSpacingM?: number;
  /** Hit error in the bending plane [m]; default the hits' sigma (median), else 3 % of the spacing. */
  readonly hitErrorM?: number;
  /** Hit error along z [m]; default the hits' sigma_z (median), else the bending-plane error. */
  readonly hitErrorZM?: number;
  /**
   * Point the tracks come from [m]. Given, it marks a common start: no road steps across it
   * (two tracks leaving it back to back are not joined) and tracks are oriented away from it.
   * Omitted, tracks may start anywhere and (0, 0, 0) only breaks ties of the direction.
   */
  readonly originM?: readonly [number, number, number];
  /** χ² cut (2 dof with z, 1 without) on the predicted helix for picking up the next hit. */
  readonly chi2Cut?: number;
  /** Hits in the local helix fit at the end of the road. */
  readonly window?: number;
  /** Fewest hits of its own a found track must hold. */
  readonly minHits?: number;
  /** Missing hits in a row the road may step over. */
  readonly maxMissingHits?: number;
  /** Scattering allowance of the road [rad] (angle per unit of arc, times Δs). */
  readonly scatterRad?: number;
}

export const FIND_TRACKS_DEFAULTS = Object.freeze({
  chi2Cut: 20,
  window: 8,
  minHits: 5,
  maxMissingHits: 2,
  scatterRad: 0.05,
  originM: Object.freeze([0, 0, 0]) as readonly [number, number, number],
  /** Hit error, as a fraction of the spacing, when the hits carry none and none is given. */
  errorPerSpacing: 0.03,
});

/** Where the road's hit error came from. */
export type HitErrorSource = 'hits' | 'option' | 'spacing';

/**
 * Tracks found in a hit table: per input row a track id and a place along the track, and per
 * found track its rows in travel order (kept, so no caller regroups: STYLE.md §18).
 */
export interface FoundTracks {
  /** Found tracks in all events. */
  readonly count: number;
  /** Per input row: the found track's id within its event (1, 2, …); −1 for a hit on no track. */
  readonly track: Int32Array;
  /** Per input row: place along its track in the direction of travel, 0 = first; −1 on no track. */
  readonly hitOrder: Int32Array;
  /** Track k is the input rows rows[offsets[k] … offsets[k+1]), in travel order. */
  readonly offsets: Int32Array;
  readonly rows: Int32Array;
  /** Per found track: event number, id within the event, hits, hits shared with earlier tracks. */
  readonly event: Float64Array;
  readonly id: Int32Array;
  readonly nhits: Int32Array;
  readonly sharedHits: Int32Array;
  /** Per found track: how its direction of travel was decided. */
  readonly direction: readonly DirectionRule[];
  readonly events: number;
  readonly unassignedHits: number;
  /** Hits that lie on two found tracks (each kept by the first track found through it). */
  readonly sharedHitsTotal: number;
  readonly hitSpacingM: number;
  readonly hitSpacingEstimated: boolean;
  readonly hitErrorM: number;
  readonly hitErrorZM: number;
  readonly hitErrorSource: HitErrorSource;
}

/**
 * Finds tracks among unlabelled hits, event by event, in a uniform field along z: helices from
 * a common region and tracks that start anywhere, curling tracks of several turns, crossing
 * tracks, shared hits (kept by one track, counted) and noise (left on no track, −1).
 *
 * Method: local seeds (straight-enough triplets of neighbouring hits, cleanest first) grown in
 * both directions by road following on the local helix with a χ² gate (followRoad.ts,
 * roadWindow.ts); the direction of travel from the curvature change, else from the origin
 * (travelDirection.ts). Any track id already in the table is ignored.
 * Validity: hits sampled densely along each track (each hit within about the spacing of the
 * next; up to `maxMissingHits` missing in a row), a field uniform enough that a few hits lie
 * on a circle, turns of a spiral separated in z by well over the z error (without z,
 * overlapping turns cannot be told apart).
 * @example findTracks(readHits('event.csv'), { hitErrorM: 3e-4 }).track // per row, −1 = noise
 */
export function findTracks(hits: FindHits, options: FindTracksOptions = {}): FoundTracks {
  const n = hits.length;
  // Options given as undefined take their default.
  const o = { ...FIND_TRACKS_DEFAULTS, ...Object.fromEntries(Object.entries(options).filter(([, v]) => v !== undefined)) } as typeof FIND_TRACKS_DEFAULTS & FindTracksOptions;
  for (const [name, v, ok] of [
    ['chi2Cut', o.chi2Cut, o.chi2Cut > 0], ['window', o.window, Number.isInteger(o.window) && o.window >= 3],
    ['minHits', o.minHits, Number.isInteger(o.minHits) && o.minHits >= 3], ['maxMissingHits', o.maxMissingHits, Number.isInteger(o.maxMissingHits) && o.maxMissingHits >= 0],
    ['scatterRad', o.scatterRad, o.scatterRad >= 0],
  ] as const) if (!ok) throw msg.badArgument(name, v, name === 'chi2Cut' ? 'a positive number' : 'a whole number in range (see FIND_TRACKS_DEFAULTS)');
  if (options.hitSpacingM !== undefined && !(options.hitSpacingM > 0)) throw msg.badArgument('hitSpacingM', options.hitSpacingM, 'a positive length in metres');
  if (options.hitErrorM !== undefined && !(options.hitErrorM > 0)) throw msg.badArgument('hitErrorM', options.hitErrorM, 'a positive length in metres');
  const groups = groupEvents(hits.event);
  const hasZ = hits.z !== undefined;
  const spacingGiven = options.hitSpacingM !== undefined;
  const spacing = spacingGiven ? options.hitSpacingM! : estimateHitSpacing(hits.x, hits.y, hits.z, groups.offsets, groups.rows);
  const columnSigma = hits.sigmaX ? median(hits.sigmaX) : NaN;
  const hitErrorSource: HitErrorSource = options.hitErrorM !== undefined ? 'option' : columnSigma > 0 ? 'hits' : 'spacing';
  const sigma = options.hitErrorM ?? (columnSigma > 0 ? columnSigma : o.errorPerSpacing * spacing);
  const columnSigmaZ = hits.sigmaZ ? median(hits.sigmaZ) : NaN;
  const sigmaZ = options.hitErrorZM ?? (columnSigmaZ > 0 ? columnSigmaZ : sigma);

  const track = new Int32Array(n).fill(-1);
  const hitOrder = new Int32Array(n).fill(-1);
  const rows = new Int32Array(n);
  const offsets: number[] = [0];
  const event: number[] = [], id: number[] = [], nhits: number[] = [], shared: number[] = [];
  const direction: DirectionRule[] = [];
  let stored = 0, sharedTotal = 0;
  if (spacing > 0) {
    const settings: RoadSettings = {
      spacingM: spacing,
      seedRadiusM: 1.6 * spacing,
      nearStepM: 1.5 * spacing,
      maxStepM: (1.5 + o.maxMissingHits) * spacing,
      sigmaM: sigma,
      sigmaZM: sigmaZ,
      chi2Cut: o.chi2Cut,
      scatterRad: o.scatterRad,
      window: o.window,
      minHits: o.minHits,
      maxSharedRun: 3,
      maxSharedFraction: 0.5,
      seedCosMax: -0.5,
      originM: o.originM,
      originRadiusM: options.originM !== undefined ? spacing : 0,
    };
    const ctx = createRoadContext(settings);
    const dirScratch = createDirectionScratch();
    const dirSettings = { originM: o.originM, sigmaM: sigma, significance: 5, minRelativeChange: 0.03 };
    for (let e = 0; e < groups.count; e++) {
      const from = groups.offsets[e], m = groups.offsets[e + 1] - from;
      reserveRoadContext(ctx, m);
      const { x, y, z } = ctx;
      for (let i = 0; i < m; i++) {
        const r = groups.rows[from + i];
        x[i] = hits.x[r]; y[i] = hits.y[r]; z[i] = hasZ ? hits.z![r] : 0;
      }
      ctx.hasZ = hasZ;
      const found = findInEvent(ctx);
      for (let k = 0; k < found; k++) {
        const a = ctx.trackStart[k], b = ctx.trackStart[k + 1];
        const { reverse, rule } = travelDirection(x, y, z, hasZ, ctx.trackHits, a, b, dirSettings, dirScratch);
        const trackId = k + 1;
        for (let i = 0; i < b - a; i++) {
          const local = ctx.trackHits[reverse ? b - 1 - i : a + i];
          const row = groups.rows[from + local];
          track[row] = trackId;
          hitOrder[row] = i;
          rows[stored++] = row;
        }
        offsets.push(stored);
        event.push(groups.events[e]); id.push(trackId); nhits.push(b - a); shared.push(ctx.trackShared[k]);
        direction.push(rule);
        sharedTotal += ctx.trackShared[k];
      }
    }
  }
  return {
    count: event.length,
    track, hitOrder,
    offsets: Int32Array.from(offsets), rows: rows.slice(0, stored),
    event: Float64Array.from(event), id: Int32Array.from(id), nhits: Int32Array.from(nhits), sharedHits: Int32Array.from(shared),
    direction,
    events: groups.count,
    unassignedHits: n - stored,
    sharedHitsTotal: sharedTotal,
    hitSpacingM: spacing, hitSpacingEstimated: !spacingGiven,
    hitErrorM: sigma, hitErrorZM: sigmaZ, hitErrorSource,
  };
}

/** Median of the finite values, from at most about 10 000 evenly spread ones. */
function median(values: Float64Array): number {
  const stride = Math.max(1, Math.floor(values.length / 10_000));
  const finite: number[] = [];
  for (let i = 0; i < values.length; i += stride) if (Number.isFinite(values[i])) finite.push(values[i]);
  finite.sort((a, b) => a - b);
  return finite.length ? finite[finite.length >> 1] : NaN;
}

import { createHitGrid, type HitGrid } from './hitGrid.js';
import { createRoadState, type RoadState } from './roadWindow.js';

/**
 * Everything the finder works on for one event, reused from event to event (explicit scratch,
 * grown on demand): the event's hit coordinates [m], the grid, who owns each hit, the marks of
 * the candidate being built, the chain buffer and the settings in internal units.
 */
export interface RoadContext {
  n: number;
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
  hasZ: boolean;
  grid: HitGrid;
  /** Index of the found track holding each hit, −1 when free. */
  owner: Int32Array;
  /** Hits of the candidate being built carry `mark[h] === stamp`. */
  mark: Int32Array;
  stamp: number;
  /** Candidate hits in travel order occupy chain[head … tail]; the seed starts mid-buffer. */
  chain: Int32Array;
  /** Running arc length in the bending plane [m] of each chain place, increasing with the index. */
  chainS: Float64Array;
  neighbours: Int32Array;
  seedOrder: Int32Array;
  sArc: Float64Array;
  /** Neighbours of one seed search (at most this many are considered). */
  near: Int32Array;
  /** Counting-sort buckets of the seed order (neighbour counts 2 … ≥ length − 1). */
  buckets: Int32Array;
  /** The two outer hits of a seed triplet. */
  seedPair: Int32Array;
  state: RoadState;
  settings: RoadSettings;
  /** Found tracks of the event: own hits of track k (travel order) are trackHits[trackStart[k] … trackStart[k+1]). */
  trackCount: number;
  trackHits: Int32Array;
  trackStart: Int32Array;
  /** Hits each found track passed through that an earlier track holds. */
  trackShared: Int32Array;
}

/** The finder's settings in internal units (metres, radians); see FIND_TRACKS_DEFAULTS. */
export interface RoadSettings {
  readonly spacingM: number;
  readonly seedRadiusM: number;
  readonly nearStepM: number;
  readonly maxStepM: number;
  readonly sigmaM: number;
  readonly sigmaZM: number;
  readonly chi2Cut: number;
  readonly scatterRad: number;
  readonly window: number;
  readonly minHits: number;
  readonly maxSharedRun: number;
  readonly maxSharedFraction: number;
  readonly seedCosMax: number;
  /** Common start point of the tracks [m] and the radius about it that no road crosses (0: none). */
  readonly originM: readonly [number, number, number];
  readonly originRadiusM: number;
}

export function createRoadContext(settings: RoadSettings): RoadContext {
  return {
    n: 0,
    x: new Float64Array(0), y: new Float64Array(0), z: new Float64Array(0), hasZ: false,
    grid: createHitGrid(),
    owner: new Int32Array(0), mark: new Int32Array(0), stamp: 0,
    chain: new Int32Array(0), chainS: new Float64Array(0), neighbours: new Int32Array(0), seedOrder: new Int32Array(0),
    sArc: new Float64Array(Math.max(4, settings.window)),
    near: new Int32Array(32), buckets: new Int32Array(11), seedPair: new Int32Array(2),
    state: createRoadState(),
    settings,
    trackCount: 0, trackHits: new Int32Array(0), trackStart: new Int32Array(1), trackShared: new Int32Array(0),
  };
}

/** Makes room for an event of n hits (arrays grow, never shrink). */
export function reserveRoadContext(ctx: RoadContext, n: number): void {
  ctx.n = n;
  if (ctx.x.length >= n) return;
  const cap = Math.max(n, 2 * ctx.x.length, 256);
  ctx.x = new Float64Array(cap); ctx.y = new Float64Array(cap); ctx.z = new Float64Array(cap);
  ctx.owner = new Int32Array(cap); ctx.mark = new Int32Array(cap);
  ctx.chain = new Int32Array(2 * cap + 3);
  ctx.chainS = new Float64Array(2 * cap + 3);
  ctx.neighbours = new Int32Array(cap); ctx.seedOrder = new Int32Array(cap);
  ctx.trackHits = new Int32Array(cap); ctx.trackStart = new Int32Array(cap + 1); ctx.trackShared = new Int32Array(cap);
  ctx.stamp = 0;
}

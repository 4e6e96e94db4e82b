import type { Material } from '../matter/materials.js';
import type { Particle } from '../particles.js';
import type { CircleFitColumns } from './circleFit.js';
import type { HelixFitColumns, SpaceHits } from './fitHelices.js';
import type { PreparedPlaneHits } from './preparePlaneHits.js';

/**
 * What a fit may know besides the hits. Plain circle fits use none of it; a fit with material
 * effects needs the field, the medium and a species hypothesis (`needs` says which).
 */
export interface FitContext {
  /** B_z [T], signed along +z. */
  readonly fieldT?: number;
  /** Medium the track crosses. */
  readonly material?: Material;
  /** Species hypothesis (mass and charge) for energy loss and scattering. */
  readonly particle?: Particle;
  /** Iteration limit of iterative fits. */
  readonly maxIterations?: number;
  /** Convergence: a step that moves the track by less than this fraction of its length. */
  readonly tolerance?: number;
  /** Convergence: an undamped step that lowers χ² by less than this (units of max(1, χ²/ndf)). */
  readonly chi2Tolerance?: number;
  /** Algebraic fits: also compute χ² and the covariance (default true). */
  readonly covariance?: boolean;
}

interface FitMethodBase {
  /** Registry key, as `sagitta fit --fitter` and `measureTracks({ method })` take it. */
  readonly name: string;
  /** One line for help texts, with the method's reference. */
  readonly summary: string;
  /** Context entries the method cannot work without. */
  readonly needs?: readonly ('fieldT' | 'material' | 'particle')[];
}

/**
 * A method that fits the bending plane only: (κ, φ0, d0) at each track's first hit, with χ² and
 * covariance. The helix step (z against arc length) is added by `fitHelices` for any of them.
 */
export interface CircleFitMethod extends FitMethodBase {
  readonly measures: 'circle';
  /** Fits every track, rows [offsets[k], offsets[k+1]), into fresh columns; never throws on bad numbers. */
  fitTracks(hits: PreparedPlaneHits, offsets: Int32Array, context: FitContext): CircleFitColumns;
}

/** A method that fits all five helix parameters itself (e.g. a fit with material effects). */
export interface HelixFitMethod extends FitMethodBase {
  readonly measures: 'helix';
  fitTracks(hits: SpaceHits & { readonly prepared: PreparedPlaneHits }, offsets: Int32Array, context: FitContext): HelixFitColumns;
}

/** One entry of the fitter registry (`lib/fit/fitMethods.ts`). */
export type FitMethod = CircleFitMethod | HelixFitMethod;

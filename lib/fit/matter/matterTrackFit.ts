import type { HitCoordinates } from '../../io/hitCoordinates.js';
import type { Material } from '../../matter/materials.js';
import type { Particle } from '../../particles.js';

/**
 * One track's hits in travel order, lengths in metres (a notebook's `trackHits` result is one);
 * without z only the bending plane is fitted (tan λ = 0 assumed).
 */
export type MatterTrackHits = HitCoordinates;

export interface MatterFitOptions {
  /** B_z [T], signed along +z. Required, non-zero. */
  readonly fieldT: number;
  /** Chamber medium (a lib/matter material: `material('liquid-propane')`). */
  readonly medium: Material;
  /** Mass hypothesis; its |charge| sets the loss and the momentum scale, the sign comes from the turning sense. */
  readonly particle: Particle;
  /** Hit error [m] for hits whose columns carry none (then required). */
  readonly hitErrorM?: number;
  /** Multiple-scattering process noise (Highland); default true. */
  readonly multipleScattering?: boolean;
  /** Mean energy loss along the track (CSDA range table) and its straggling; default true. */
  readonly energyLoss?: boolean;
  /** Largest number of re-linearisations; default 12. */
  readonly maxIterations?: number;
  /**
   * The track is known to stop: it ends inside the chamber (away from every wall) and nothing
   * leaves its end point, so the particle comes to rest within one mean hit spacing after its
   * last hit. Adds the range–energy constraint (`stopConstraint`: momentum from range, with
   * range straggling) to the fit — one measurement more in χ² and ndf, so a track that did not
   * stop (a decay in flight, an exit through a gap, a wrong mass) shows as a poor fit. Needs
   * energy loss on; ignored for e± (their range is not Gaussian). Default false. For
   * `fitTracksInMatter`, `stoppingTracks` gives it per track.
   */
  readonly stops?: boolean;
}

/**
 * Outcome of a fit:
 * - 'ok': converged, χ² probability ≥ `MATTER_FIT_MIN_PROBABILITY`;
 * - 'poor-fit': converged, but the χ² probability (or that of the stop constraint's own term,
 *   `stopChi2`) is below that threshold (a wrong mass
 *   hypothesis, a kink or decay, a wrong hit error, a merged track): numbers are given, not trusted;
 * - 'cannot-reach': the hypothesis stops (its CSDA range is used up) before the hit
 *   `reachedHits` — no momentum at the first hit lets it reach all hits, or only momenta whose
 *   fit the hits reject (held at the reach limit with a χ² probability below the threshold);
 *   numbers are NaN. A fit held at the reach limit that the hits accept is reported as a fit:
 *   range straggling carries real particles past their mean-loss range;
 * - 'diverged': the iterations did not settle or the state became non-finite;
 * - 'too-few-hits': fewer than `MATTER_FIT_MIN_HITS` hits;
 * - 'bad-input': a non-finite coordinate or a non-positive hit error.
 */
export type MatterFitStatus = 'ok' | 'poor-fit' | 'cannot-reach' | 'diverged' | 'too-few-hits' | 'bad-input';

export const MATTER_FIT_STATUS: readonly MatterFitStatus[] = Object.freeze(['ok', 'poor-fit', 'cannot-reach', 'diverged', 'too-few-hits', 'bad-input']);

/** χ² probability below which a converged fit is flagged 'poor-fit' (0.1 %: one good track in a thousand is flagged). */
export const MATTER_FIT_MIN_PROBABILITY = 1e-3;

/** Fewest hits the fit takes (five parameters with z, three without, plus a check). */
export const MATTER_FIT_MIN_HITS = 4;

export const MATTER_FIT_DEFAULTS = Object.freeze({ multipleScattering: true, energyLoss: true, maxIterations: 12 });

/**
 * The fitted state at one hit, at the point of the track closest (in the bending plane) to it.
 * `state` = (φ [rad], tan λ, q/p [e/(GeV/c)], u [m], z [m]): φ the direction of travel in the
 * bending plane, λ the dip, q/p signed (q from the turning sense: q = −sign(κ)·sign(B_z)·|z|),
 * u the offset along the left normal n = (−sin φ, cos φ) from the point (xM, yM) (0 at the
 * point itself; its variance is the position error across the track), z the coordinate along B.
 * `cov` is the 5×5 covariance of `state`, row-major. κ [1/m] is the signed bending-plane
 * curvature (> 0 counter-clockwise seen from +z), as in lib/fit circle fits.
 */
export interface MatterFitState {
  readonly state: Float64Array;
  readonly cov: Float64Array;
  readonly xM: number;
  readonly yM: number;
  readonly zM: number;
  readonly kappa: number;
  readonly sigmaKappa: number;
  readonly pGeV: number;
  readonly sigmaPGeV: number;
  readonly ptGeV: number;
  /** Kinetic energy [MeV] under the hypothesis. */
  readonly kineticMeV: number;
  /** 3-D path length [m] along the fitted track from the first hit to this one. */
  readonly s_m: number;
}

export interface MatterTrackFit {
  readonly status: MatterFitStatus;
  readonly particle: string;
  readonly first: MatterFitState;
  readonly last: MatterFitState;
  /** Charge in units of e from the turning sense (NaN if not fitted). */
  readonly charge: number;
  readonly chi2: number;
  readonly ndf: number;
  /** P(χ²_ndf ≥ χ²). */
  readonly pValue: number;
  /**
   * With the stop constraint (`stops`): its own χ² term, 1 degree of freedom — the curvature the
   * hits measure where it is applied against the one the range implies. NaN without it. A track
   * that did not stop (it left through a gap, decayed in flight, or has another mass) shows here
   * first: a term whose probability is below `MATTER_FIT_MIN_PROBABILITY` (χ² > 10.8) makes the
   * fit 'poor-fit' however good the total χ² is.
   */
  readonly stopChi2: number;
  /** 3-D path length [m] from the first to the last hit along the fitted track. */
  readonly pathLengthM: number;
  /** CSDA range [m] left at the last hit under the hypothesis (Infinity without energy loss). */
  readonly residualRangeM: number;
  /** Whether the hypothesis reaches the last hit (false with 'cannot-reach'). */
  readonly reachedEnd: boolean;
  /** Hits the hypothesis reaches (all of them unless 'cannot-reach'). */
  readonly reachedHits: number;
  /**
   * Whether the hypothesis would stop before a next hit one mean spacing beyond the last:
   * residual range at the last hit below the mean 3-D hit spacing (a stopping-track hint).
   */
  readonly stopsBeforeNextHit: boolean;
  readonly iterations: number;
  /** Per hit: bending-plane residual across the track [m] of the smoothed fit, and z residual (NaN without z). */
  readonly residualM: Float64Array;
  readonly residualZM: Float64Array;
}

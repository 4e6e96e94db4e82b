/**
 * The coordinate and error columns of measured points, lengths in metres — what the hit table,
 * one track's hits (lib/track) and the fit with material (lib/fit/matter) share.
 */
export interface HitCoordinates {
  /** Bending-plane coordinates [m]. */
  readonly x: Float64Array;
  readonly y: Float64Array;
  /** Coordinate along the field [m], when measured; without it only the bending plane is fitted. */
  readonly z?: Float64Array;
  /** Per-hit position error in the bending plane [m] (σ_x = σ_y unless the two are given). */
  readonly sigmaX?: Float64Array;
  readonly sigmaY?: Float64Array;
  /** Per-hit error along z [m]. */
  readonly sigmaZ?: Float64Array;
}

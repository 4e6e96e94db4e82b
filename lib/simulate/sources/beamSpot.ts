import type { SeededRandom } from '../rng.js';
import { rotateAbout } from '../scatteringKick.js';
import type { PositionAndDirection } from '../trackInFlight.js';
import { unit } from './primary.js';

/** Where a beam comes from and how it spreads: origin [m], mean direction, spot σ [m], divergence σ [rad]. */
export interface BeamSpot {
  readonly originM: readonly [number, number, number];
  readonly direction: readonly [number, number, number];
  readonly spotSigmaM: number;
  readonly divergenceRad: number;
}

/**
 * Draws a starting point and direction: two Gaussian offsets of σ = spotSigmaM across the mean
 * direction, and a Gaussian tilt (projected σ = divergenceRad) about it. Draws exactly four
 * Gaussians from `rng`, in a fixed order (the demo data's bytes depend on it).
 */
export function drawFromSpot(spot: BeamSpot, rng: SeededRandom): PositionAndDirection {
  const [dx, dy, dz] = unit(spot.direction[0], spot.direction[1], spot.direction[2]);
  // Two axes across the beam: a from the rotation helper, b = d × a.
  const a = rotateAbout(dx, dy, dz, 0, 0);
  const b: [number, number, number] = [dy * a[2] - dz * a[1], dz * a[0] - dx * a[2], dx * a[1] - dy * a[0]];
  const g1 = spot.spotSigmaM * rng.gaussian(), g2 = spot.spotSigmaM * rng.gaussian();
  const t1 = spot.divergenceRad * rng.gaussian(), t2 = spot.divergenceRad * rng.gaussian();
  const theta = Math.hypot(t1, t2);
  const [ux, uy, uz] = theta > 0 ? rotateAbout(dx, dy, dz, Math.cos(theta), Math.atan2(t2, t1)) : [dx, dy, dz];
  return {
    xM: spot.originM[0] + g1 * a[0] + g2 * b[0],
    yM: spot.originM[1] + g1 * a[1] + g2 * b[1],
    zM: spot.originM[2] + g1 * a[2] + g2 * b[2],
    ux, uy, uz,
  };
}

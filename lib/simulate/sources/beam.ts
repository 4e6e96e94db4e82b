import type { Particle } from '../../particles';
import type { SeededRandom } from '../rng';
import { rotateAbout } from '../transport';
import { unit, type Primary } from './primary';

/**
 * A beam: one particle per event, species drawn by weight, Gaussian momentum spread, Gaussian
 * spot (σ, in the plane across the beam) and Gaussian divergence (projected σ). Used for mixed
 * beams, single-species test beams and neutral beams (K⁰_S, Λ) whose decays the event loop makes.
 */
export interface BeamSource {
  readonly kind: 'beam';
  readonly events: number;
  readonly species: readonly { readonly particle: Particle; readonly weight: number }[];
  readonly momentumGeV: number;
  /** Relative σ of |p| (0.02 = 2 %). */
  readonly momentumSpread: number;
  readonly originM: readonly [number, number, number];
  readonly direction: readonly [number, number, number];
  readonly spotSigmaM: number;
  readonly divergenceRad: number;
  /** Truth label; 'beam' unless given. */
  readonly process?: string;
}

/** Draws the primaries of one beam event. */
export function beamEvent(src: BeamSource, rng: SeededRandom): Primary[] {
  let total = 0;
  for (const s of src.species) total += s.weight;
  let pick = rng.uniform() * total;
  let species = src.species[src.species.length - 1].particle;
  for (const s of src.species) {
    if (pick < s.weight) { species = s.particle; break; }
    pick -= s.weight;
  }
  const [dx, dy, dz] = unit(src.direction[0], src.direction[1], src.direction[2]);
  // Spot: two Gaussian offsets across the beam direction.
  const a = rotateAbout(dx, dy, dz, 0, 0);
  const b: [number, number, number] = [dy * a[2] - dz * a[1], dz * a[0] - dx * a[2], dx * a[1] - dy * a[0]];
  const g1 = src.spotSigmaM * rng.gaussian(), g2 = src.spotSigmaM * rng.gaussian();
  const t1 = src.divergenceRad * rng.gaussian(), t2 = src.divergenceRad * rng.gaussian();
  const theta = Math.hypot(t1, t2);
  const [ux, uy, uz] = theta > 0 ? rotateAbout(dx, dy, dz, Math.cos(theta), Math.atan2(t2, t1)) : [dx, dy, dz];
  // A Gaussian spread is truncated at zero momentum by drawing again.
  let p = src.momentumGeV * (1 + src.momentumSpread * rng.gaussian());
  for (let tries = 0; !(p > 0) && tries < 100; tries++) p = src.momentumGeV * (1 + src.momentumSpread * rng.gaussian());
  if (!(p > 0)) p = src.momentumGeV;
  return [{
    species,
    xM: src.originM[0] + g1 * a[0] + g2 * b[0],
    yM: src.originM[1] + g1 * a[1] + g2 * b[1],
    zM: src.originM[2] + g1 * a[2] + g2 * b[2],
    ux, uy, uz,
    momentumGeV: p,
    process: src.process ?? 'beam',
  }];
}

import type { Particle } from '../../particles.js';
import type { SeededRandom } from '../rng.js';
import type { Primary } from './primary.js';
import { drawFromSpot, type BeamSpot } from './beamSpot.js';

/**
 * A beam: one particle per event, species drawn by weight, Gaussian momentum spread, Gaussian
 * spot (σ, in the plane across the beam) and Gaussian divergence (projected σ). Used for mixed
 * beams, single-species test beams and neutral beams (K⁰_S, Λ) whose decays the event loop makes.
 */
export interface BeamSource extends BeamSpot {
  readonly kind: 'beam';
  readonly events: number;
  readonly species: readonly { readonly particle: Particle; readonly weight: number }[];
  readonly momentumGeV: number;
  /** Relative σ of |p| (0.02 = 2 %). */
  readonly momentumSpread: number;
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
  const start = drawFromSpot(src, rng);
  // A Gaussian spread is truncated at zero momentum by drawing again.
  let p = src.momentumGeV * (1 + src.momentumSpread * rng.gaussian());
  for (let tries = 0; !(p > 0) && tries < 100; tries++) p = src.momentumGeV * (1 + src.momentumSpread * rng.gaussian());
  if (!(p > 0)) p = src.momentumGeV;
  return [{
    species,
    ...start,
    momentumGeV: p,
    process: src.process ?? 'beam',
  }];
}

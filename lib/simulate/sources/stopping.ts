import type { Particle } from '../../particles.js';
import type { Chamber } from '../chamber.js';
import type { SeededRandom } from '../rng.js';
import type { Primary } from './primary.js';
import { drawFromSpot, type BeamSpot } from './beamSpot.js';

/**
 * Charged particles whose momentum is chosen so that they stop at a depth (path length) drawn
 * uniformly in [minDepthM, maxDepthM]: the kinetic energy is the one whose CSDA range in the
 * chamber medium equals the depth (range tables of the matter module). When a muon stops, the
 * event loop lets it decay to an electron with a Michel-spectrum energy; a stopped π⁺ decays to
 * μ⁺ν and then on (see `DECAY_AT_REST`).
 */
export interface StoppingSource extends BeamSpot {
  readonly kind: 'stopping';
  readonly events: number;
  readonly species: Particle;
  readonly minDepthM: number;
  readonly maxDepthM: number;
}

export function stoppingEvent(src: StoppingSource, chamber: Chamber, rng: SeededRandom): Primary[] {
  const depth = src.minDepthM + (src.maxDepthM - src.minDepthM) * rng.uniform();
  const kinetic = chamber.medium.forSpecies(src.species).kineticFromRangeM(depth);
  const m = src.species.massMeV;
  const p = Math.sqrt(kinetic * (kinetic + 2 * m)) * 1e-3;
  const start = drawFromSpot(src, rng);
  return [{
    species: src.species,
    ...start,
    momentumGeV: Number.isFinite(p) ? p : 0.1,
    process: 'stopping',
  }];
}

import type { Particle } from '../../particles';
import type { Chamber } from '../chamber';
import type { SeededRandom } from '../rng';
import { rotateAbout } from '../transport';
import { unit, type Primary } from './primary';

/**
 * Charged particles whose momentum is chosen so that they stop at a depth (path length) drawn
 * uniformly in [minDepthM, maxDepthM]: the kinetic energy is the one whose CSDA range in the
 * chamber medium equals the depth (range tables of the matter module). When a muon stops, the
 * event loop lets it decay to an electron with a Michel-spectrum energy; a stopped π⁺ decays to
 * μ⁺ν and then on (see `DECAY_AT_REST`).
 */
export interface StoppingSource {
  readonly kind: 'stopping';
  readonly events: number;
  readonly species: Particle;
  readonly minDepthM: number;
  readonly maxDepthM: number;
  readonly originM: readonly [number, number, number];
  readonly direction: readonly [number, number, number];
  readonly spotSigmaM: number;
  readonly divergenceRad: number;
}

export function stoppingEvent(src: StoppingSource, chamber: Chamber, rng: SeededRandom): Primary[] {
  const depth = src.minDepthM + (src.maxDepthM - src.minDepthM) * rng.uniform();
  const kinetic = chamber.medium.forSpecies(src.species).kineticFromRangeM(depth);
  const m = src.species.massMeV;
  const p = Math.sqrt(kinetic * (kinetic + 2 * m)) * 1e-3;
  const [dx, dy, dz] = unit(src.direction[0], src.direction[1], src.direction[2]);
  const a = rotateAbout(dx, dy, dz, 0, 0);
  const b: [number, number, number] = [dy * a[2] - dz * a[1], dz * a[0] - dx * a[2], dx * a[1] - dy * a[0]];
  const g1 = src.spotSigmaM * rng.gaussian(), g2 = src.spotSigmaM * rng.gaussian();
  const t1 = src.divergenceRad * rng.gaussian(), t2 = src.divergenceRad * rng.gaussian();
  const theta = Math.hypot(t1, t2);
  const [ux, uy, uz] = theta > 0 ? rotateAbout(dx, dy, dz, Math.cos(theta), Math.atan2(t2, t1)) : [dx, dy, dz];
  return [{
    species: src.species,
    xM: src.originM[0] + g1 * a[0] + g2 * b[0],
    yM: src.originM[1] + g1 * a[1] + g2 * b[1],
    zM: src.originM[2] + g1 * a[2] + g2 * b[2],
    ux, uy, uz,
    momentumGeV: Number.isFinite(p) ? p : 0.1,
    process: 'stopping',
  }];
}

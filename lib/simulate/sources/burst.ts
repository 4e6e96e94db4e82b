import type { Particle } from '../../particles.js';
import type { SeededRandom } from '../rng.js';
import type { Primary } from './primary.js';

/**
 * Many particles per event from one small region (a collision or a decay point seen by a
 * tracker): a uniform whole number of particles in `multiplicity`, each with a species drawn by
 * weight, a transverse momentum (across z) log-uniform in `ptRangeGeV`, a dip tan λ uniform in
 * `tanLambdaRange` and an azimuth uniform in [0, 2π). The common start point is drawn once per
 * event from a round Gaussian of σ = `spotSigmaM` in x, y and z about `originM`.
 * |p| = p_T·√(1 + tan²λ); direction (cos λ cos φ, cos λ sin φ, sin λ).
 */
export interface BurstSource {
  readonly kind: 'burst';
  readonly events: number;
  /** Particles per event, [fewest, most] (whole numbers). */
  readonly multiplicity: readonly [number, number];
  readonly species: readonly { readonly particle: Particle; readonly weight: number }[];
  /** Transverse momentum range [GeV/c]; drawn log-uniformly. */
  readonly ptRangeGeV: readonly [number, number];
  /** Range of tan λ = p_z/p_T; drawn uniformly. */
  readonly tanLambdaRange: readonly [number, number];
  readonly originM: readonly [number, number, number];
  readonly spotSigmaM: number;
}

/**
 * Draws the primaries of one burst event. Draw order (fixed, so data regenerate byte for byte):
 * the count, three Gaussians for the start point, then per particle species, p_T, tan λ, φ.
 */
export function burstEvent(src: BurstSource, rng: SeededRandom): Primary[] {
  const [lo, hi] = src.multiplicity;
  const count = lo + Math.min(hi - lo, Math.floor(rng.uniform() * (hi - lo + 1)));
  const x = src.originM[0] + src.spotSigmaM * rng.gaussian();
  const y = src.originM[1] + src.spotSigmaM * rng.gaussian();
  const z = src.originM[2] + src.spotSigmaM * rng.gaussian();
  let total = 0;
  for (const s of src.species) total += s.weight;
  const [ptLo, ptHi] = src.ptRangeGeV;
  const [tlLo, tlHi] = src.tanLambdaRange;
  const out: Primary[] = [];
  for (let k = 0; k < count; k++) {
    let pick = rng.uniform() * total;
    let species = src.species[src.species.length - 1].particle;
    for (const s of src.species) {
      if (pick < s.weight) { species = s.particle; break; }
      pick -= s.weight;
    }
    const pt = ptLo * Math.pow(ptHi / ptLo, rng.uniform());
    const tanL = tlLo + (tlHi - tlLo) * rng.uniform();
    const phi = 2 * Math.PI * rng.uniform();
    const cosL = 1 / Math.sqrt(1 + tanL * tanL);
    out.push({
      species,
      xM: x, yM: y, zM: z,
      ux: cosL * Math.cos(phi), uy: cosL * Math.sin(phi), uz: cosL * tanL,
      momentumGeV: pt / cosL,
      process: 'burst',
    });
  }
  return out;
}

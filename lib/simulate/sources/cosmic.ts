import { MUON_MINUS, MUON_PLUS } from '../../particles.js';
import type { Chamber } from '../chamber.js';
import type { SeededRandom } from '../rng.js';
import type { Primary } from './primary.js';

/**
 * Cosmic-like muons entering through the top face of the chamber (+y is up).
 * Model (simple and stated, not a fit to data): zenith angle with intensity ∝ cos²θ per solid
 * angle (common practice for sea-level muons; PDG RPP "Cosmic rays"), so the rate through a flat
 * face goes as cos³θ and cos θ = u^{1/4}; momentum from a power law dN/dp ∝ p^−index between
 * two limits; μ⁺/μ⁻ charge ratio as given (PDG quotes ≈ 1.27 at sea level for p ≲ 100 GeV/c,
 * (memory)).
 */
export interface CosmicSource {
  readonly kind: 'cosmic';
  readonly events: number;
  readonly momentumMinGeV: number;
  readonly momentumMaxGeV: number;
  readonly spectralIndex: number;
  /** Number of μ⁺ per μ⁻. */
  readonly chargeRatio: number;
}

export function cosmicEvent(src: CosmicSource, chamber: Chamber, rng: SeededRandom): Primary[] {
  const x = chamber.xMinM + (chamber.xMaxM - chamber.xMinM) * rng.uniform();
  const z = chamber.zMinM + (chamber.zMaxM - chamber.zMinM) * rng.uniform();
  const cosT = Math.sqrt(Math.sqrt(rng.uniformPositive()));
  const sinT = Math.sqrt(Math.max(0, 1 - cosT * cosT));
  const phi = 2 * Math.PI * rng.uniform();
  const g = 1 - src.spectralIndex;
  const u = rng.uniform();
  const p = Math.abs(g) < 1e-12
    ? src.momentumMinGeV * Math.pow(src.momentumMaxGeV / src.momentumMinGeV, u)
    : Math.pow(src.momentumMinGeV ** g + u * (src.momentumMaxGeV ** g - src.momentumMinGeV ** g), 1 / g);
  const plus = rng.uniform() < src.chargeRatio / (1 + src.chargeRatio);
  return [{
    species: plus ? MUON_PLUS : MUON_MINUS,
    xM: x,
    // Start a hair inside the top face so the first point counts as inside.
    yM: chamber.yMaxM - 1e-9,
    zM: z,
    ux: sinT * Math.cos(phi),
    uy: -cosT,
    uz: sinT * Math.sin(phi),
    momentumGeV: p,
    process: 'cosmic',
  }];
}

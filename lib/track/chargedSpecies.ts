import { ANTIPROTON, ELECTRON, KAON_MINUS, KAON_PLUS, MUON_MINUS, MUON_PLUS, PION_MINUS, PION_PLUS, POSITRON, PROTON, type Particle } from '../particles.js';

/** The five mass hypotheses of identification by range: e, μ, π, K, p (the sign is set per track). */
export const PID_SPECIES: readonly Particle[] = Object.freeze([ELECTRON, MUON_MINUS, PION_PLUS, KAON_PLUS, PROTON]);

const PAIRS: readonly (readonly [Particle, Particle])[] = [
  [POSITRON, ELECTRON], [MUON_PLUS, MUON_MINUS], [PION_PLUS, PION_MINUS], [KAON_PLUS, KAON_MINUS], [PROTON, ANTIPROTON],
];

/**
 * The species of the same mass as `particle` with the charge sign a track measured (+1 or −1),
 * e.g. (pi+, −1) → pi-; names as `sagitta range --particle` reads them. A species without a
 * partner of that sign, or a sign of 0/NaN, returns `particle` unchanged.
 * @example chargedSpecies(PROTON, -1).name // 'antiproton'
 */
export function chargedSpecies(particle: Particle, sign: number): Particle {
  const pair = PAIRS.find(([a, b]) => a === particle || b === particle);
  if (!pair || !(sign === 1 || sign === -1)) return particle;
  return sign > 0 ? pair[0] : pair[1];
}

import {
  ELECTRON, KAON_SHORT, LAMBDA, MUON_MINUS, MUON_PLUS, PION_MINUS, PION_PLUS, POSITRON, PROTON,
  type Particle,
} from '../particles.js';

/**
 * The decay modes the simulator follows. Only the mode with two charged daughters is made for
 * each neutral parent (branching fractions, PDG 2022 listings: K⁰_S → π⁺π⁻ 69.2 %, Λ → pπ⁻
 * 63.9 %); an event of a neutral source is therefore an event in which that mode happened.
 */
export const NEUTRAL_DECAYS: Readonly<Record<string, readonly [Particle, Particle]>> = Object.freeze({
  [KAON_SHORT.name]: [PION_PLUS, PION_MINUS] as const,
  [LAMBDA.name]: [PROTON, PION_MINUS] as const,
});

/**
 * Decays in flight the simulator follows (two-body, the neutrino unseen): π± → μ±ν (branching
 * 99.988 %, PDG 2022). Other charged species fly on (muons live cτ = 659 m; kaons are not decayed,
 * since only a part of their modes would be modelled).
 */
export const DECAY_IN_FLIGHT: Readonly<Record<string, Particle>> = Object.freeze({
  [PION_PLUS.name]: MUON_PLUS,
  [PION_MINUS.name]: MUON_MINUS,
});

/**
 * What a charged particle that stops in the chamber turns into (decay at rest):
 * π⁺ → μ⁺ν (the neutrino is unseen; the μ⁺ has the two-body momentum 29.79 MeV/c), μ± → e± ν ν̄
 * (Michel spectrum). A stopped π⁻ is captured by a nucleus and a stopped μ⁻ in hydrogen decays
 * almost always (capture ~0.1 %, (memory)); neither capture is modelled.
 */
export const DECAY_AT_REST: Readonly<Record<string, { readonly kind: 'two-body' | 'michel'; readonly daughter: Particle }>> =
  Object.freeze({
    [PION_PLUS.name]: { kind: 'two-body', daughter: MUON_PLUS },
    [MUON_PLUS.name]: { kind: 'michel', daughter: POSITRON },
    [MUON_MINUS.name]: { kind: 'michel', daughter: ELECTRON },
  });

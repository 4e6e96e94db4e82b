import { ELECTRON_MASS_MEV } from './constants.js';
import { msg } from './errors.js';

/**
 * Particle species: mass [MeV/c²], charge in units of e, mean lifetime cτ [m] where finite.
 * Source: PDG Review of Particle Physics, 2022 edition, Summary Tables (masses unchanged in the
 * 2024 edition at the digits shown). Electron mass from CODATA 2018.
 */
export interface Particle {
  /** Name used on the command line and in tables. */
  readonly name: string;
  /** Typeset symbol for reports. */
  readonly symbol: string;
  readonly massMeV: number;
  /** Charge number z (charge in units of e, signed). */
  readonly charge: number;
  /** Mean proper decay length cτ [m]; Infinity for stable particles. */
  readonly ctauM: number;
}

const P = (name: string, symbol: string, massMeV: number, charge: number, ctauM = Infinity): Particle =>
  Object.freeze({ name, symbol, massMeV, charge, ctauM });

/** PDG 2022: e 0.51099895000 MeV (CODATA 2018). Stable. */
export const ELECTRON = P('electron', 'e⁻', ELECTRON_MASS_MEV, -1);
export const POSITRON = P('positron', 'e⁺', ELECTRON_MASS_MEV, +1);
/** PDG 2022: μ 105.6583755(23) MeV, cτ 658.6384 m. */
export const MUON_MINUS = P('mu-', 'μ⁻', 105.6583755, -1, 658.6384);
export const MUON_PLUS = P('mu+', 'μ⁺', 105.6583755, +1, 658.6384);
/** PDG 2022: π± 139.57039(18) MeV, cτ 7.8045 m. */
export const PION_PLUS = P('pi+', 'π⁺', 139.57039, +1, 7.8045);
export const PION_MINUS = P('pi-', 'π⁻', 139.57039, -1, 7.8045);
/** PDG 2022: K± 493.677(16) MeV, τ 1.2380(20)e-8 s → cτ 3.7114 m (printed 3.711 m). */
export const KAON_PLUS = P('K+', 'K⁺', 493.677, +1, 3.7114);
export const KAON_MINUS = P('K-', 'K⁻', 493.677, -1, 3.7114);
/** PDG 2022: K⁰ 497.611(13) MeV; K⁰_S cτ 2.6844 cm. */
export const KAON_SHORT = P('K0S', 'K⁰_S', 497.611, 0, 0.026844);
/** PDG 2022: p 938.27208816(29) MeV (CODATA 2018 value; recalled, cross-check in fixtures). */
export const PROTON = P('proton', 'p', 938.27208816, +1);
export const ANTIPROTON = P('antiproton', 'p̄', 938.27208816, -1);
/** PDG 2022: Λ 1115.683(6) MeV, cτ 7.89 cm. */
export const LAMBDA = P('Lambda', 'Λ', 1115.683, 0, 0.0789);
/** Deuteron, CODATA 2018: m_d c² 1875.61294257 MeV. */
export const DEUTERON = P('deuteron', 'd', 1875.61294257, +1);
/** Alpha particle, CODATA 2018: m_α c² 3727.3794066 MeV. */
export const ALPHA = P('alpha', 'α', 3727.3794066, +2);

export const PARTICLES: readonly Particle[] = Object.freeze([
  ELECTRON, POSITRON, MUON_MINUS, MUON_PLUS, PION_PLUS, PION_MINUS, KAON_PLUS, KAON_MINUS,
  KAON_SHORT, PROTON, ANTIPROTON, LAMBDA, DEUTERON, ALPHA,
]);

const ALIASES: Readonly<Record<string, Particle>> = Object.freeze({
  'e-': ELECTRON, 'e': ELECTRON, 'e+': POSITRON, 'mu': MUON_MINUS, 'muon': MUON_MINUS,
  'mu-': MUON_MINUS, 'mu+': MUON_PLUS, 'pion': PION_PLUS, 'pi': PION_PLUS, 'k': KAON_PLUS,
  'kaon': KAON_PLUS, 'k0s': KAON_SHORT, 'ks': KAON_SHORT, 'p': PROTON, 'pbar': ANTIPROTON,
  'lambda': LAMBDA, 'd': DEUTERON,
});

/**
 * Looks a species up by name or alias, case-insensitively ("proton", "p", "pi-", "mu+", "alpha").
 * Throws UNKNOWN_PARTICLE with the list of known names.
 */
export function particle(name: string): Particle {
  const key = name.trim().toLowerCase();
  const direct = PARTICLES.find((p) => p.name.toLowerCase() === key);
  const found = direct ?? ALIASES[key];
  if (!found) throw msg.unknownParticle(name, PARTICLES.map((p) => p.name));
  return found;
}

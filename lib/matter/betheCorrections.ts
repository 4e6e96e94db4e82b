import { FINE_STRUCTURE } from '../constants.js';
import { ELEMENTS, type Element } from './elements.js';
import type { Material } from './materials.js';

/**
 * Corrections to the Bethe stopping number L (in the ½ ln(…) − β² − δ/2 normalisation of the
 * PDG RPP): shell correction −C/Z and Bloch term; added to the bracket of `betheStoppingPower`.
 * There is no separate Barkas (z³) term: at the velocities where these forms are used
 * (proton-equivalent energies above the join, ≥ 2.5–5 MeV) it is below 0.3 % in the materials
 * checked, and its part at lower energies is carried by the ICRU 49 fits and the join
 * (electronicStopping.ts). Stated in the README accuracy table.
 */

/** Lowest βγ of the shell-correction formula (Barkas & Berger; proton ≈ 7.9 MeV). */
export const SHELL_MIN_BETA_GAMMA = 0.13;

/**
 * Shell correction C/Z of one element (dimensionless), the empirical formula of W.H. Barkas and
 * M.J. Berger (NASA SP-3013, 1964) as given in ICRU Report 37 (1984) and in W.R. Leo,
 * "Techniques for Nuclear and Particle Physics Experiments", 2nd ed., eq. 2.33 (form recalled,
 * (memory)); η = βγ, I in eV:
 *
 *   C = (0.422377 η⁻² + 0.0304043 η⁻⁴ − 0.00038106 η⁻⁶)·10⁻⁶ I²
 *     + (3.858019 η⁻² − 0.1667989 η⁻⁴ + 0.00157955 η⁻⁶)·10⁻⁹ I³
 *
 * Valid η ≥ 0.13; below, the value at 0.13 is used (the formula turns over there), which is
 * why the low-energy end is taken from the ICRU 49 fits instead.
 * @example shellCorrectionOverZ(ELEMENTS.Al, 0.5) // ≈ 0.00909 (I = 166 eV, Z = 13)
 */
export function shellCorrectionOverZ(el: Element, betaGammaValue: number): number {
  const eta = Math.max(betaGammaValue, SHELL_MIN_BETA_GAMMA);
  const e2 = 1 / (eta * eta);
  const e4 = e2 * e2;
  const e6 = e4 * e2;
  const i = el.meanExcitationEV;
  const c = (0.422377 * e2 + 0.0304043 * e4 - 0.00038106 * e6) * 1e-6 * i * i + (3.858019 * e2 - 0.1667989 * e4 + 0.00157955 * e6) * 1e-9 * i * i * i;
  return c / el.atomicNumber;
}

const BY_Z = new Map<number, Element>(Object.values(ELEMENTS).map((e) => [e.atomicNumber, e]));

/**
 * Shell correction of a material, ⟨C/Z⟩ = Σ wⱼ (Z/A)ⱼ (C/Z)ⱼ / ⟨Z/A⟩ (Bragg additivity over
 * electrons, common practice), from its elemental composition. Elements not in `ELEMENTS` are
 * skipped (their weight goes to the others).
 */
export function materialShellCorrection(material: Material, betaGammaValue: number): number {
  const [i2, i3] = shellMoments(material);
  return shellFromMoments(i2, i3, betaGammaValue);
}

/**
 * The two material constants the shell correction needs: ⟨I²/Z⟩ and ⟨I³/Z⟩ weighted by
 * electrons (the Barkas–Berger C is linear in I² and I³, so ⟨C/Z⟩ = a(η)⟨I²/Z⟩ + b(η)⟨I³/Z⟩).
 */
export function shellMoments(material: Material): readonly [number, number] {
  let i2 = 0, i3 = 0, weight = 0;
  for (const c of material.composition) {
    const el = BY_Z.get(c.atomicNumber);
    if (!el) continue;
    const w = (c.massFraction * c.atomicNumber) / c.atomicMassGmol;
    const i = el.meanExcitationEV;
    i2 += (w * i * i) / el.atomicNumber;
    i3 += (w * i * i * i) / el.atomicNumber;
    weight += w;
  }
  return weight > 0 ? [i2 / weight, i3 / weight] : [0, 0];
}

/** ⟨C/Z⟩ from the moments of `shellMoments` at βγ (frozen below 0.13). */
export function shellFromMoments(i2: number, i3: number, betaGammaValue: number): number {
  const eta = Math.max(betaGammaValue, SHELL_MIN_BETA_GAMMA);
  const e2 = 1 / (eta * eta);
  const e4 = e2 * e2;
  const e6 = e4 * e2;
  return (0.422377 * e2 + 0.0304043 * e4 - 0.00038106 * e6) * 1e-6 * i2 + (3.858019 * e2 - 0.1667989 * e4 + 0.00157955 * e6) * 1e-9 * i3;
}


/**
 * Bloch correction (the z⁴ term) to the stopping number, PDG RPP "Passage of particles through
 * matter" (Bloch, Ann. Phys. 16 (1933) 285; ψ(1) − Re ψ(1 + iy) in closed approximate form):
 *
 *   L_Bloch = −y² [1.20206 − y² (1.042 − 0.855 y² + 0.343 y⁴)],  y = zα/β.
 *
 * Dimensionless, ≤ 0. Valid for y ≲ 1 (the whole Bethe region).
 * @example blochCorrection(1, 0.1) // ≈ −0.0064
 */
export function blochCorrection(charge: number, beta: number): number {
  const y = (Math.abs(charge) * FINE_STRUCTURE) / beta;
  const y2 = y * y;
  return -y2 * (1.20206 - y2 * (1.042 - 0.855 * y2 + 0.343 * y2 * y2));
}

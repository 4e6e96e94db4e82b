import { msg } from '../errors.js';

/**
 * Atomic masses [u] of the isotopes Sagitta identifies in mass spectra. Source: AME 2020
 * (Huang et al., Chinese Phys. C 45, 030002; Wang et al., 030003 (2021)), the unrounded table
 * mass.mas20, "ATOMIC MASS" column (μu) with its uncertainty; the same numbers are in
 * test/fixtures/ame2020 and a test keeps the two equal. Neutral-atom masses.
 */
export interface Isotope {
  /** Name as written in tables: "20Ne". */
  readonly name: string;
  readonly element: string;
  readonly z: number;
  readonly a: number;
  /** Atomic mass [u]. */
  readonly massU: number;
  readonly sigmaMassU: number;
}

/** [element, Z, A, atomic mass μu, σ μu] (AME 2020, mass.mas20). */
const AME2020_MICRO_U: readonly (readonly [string, number, number, number, number])[] = [
  ['H', 1, 1, 1007825.031898, 0.000014],
  ['H', 1, 2, 2014101.777844, 0.000015],
  ['He', 2, 4, 4002603.25413, 0.00016],
  ['Li', 3, 6, 6015122.88742, 0.00155],
  ['Li', 3, 7, 7016003.43426, 0.0045],
  ['B', 5, 10, 10012936.862, 0.016],
  ['B', 5, 11, 11009305.166, 0.013],
  ['C', 6, 12, 12000000.0, 0.0],
  ['C', 6, 13, 13003354.83534, 0.00025],
  ['N', 7, 14, 14003074.00425, 0.00024],
  ['N', 7, 15, 15000108.89827, 0.00062],
  ['O', 8, 16, 15994914.61926, 0.00032],
  ['O', 8, 18, 17999159.61214, 0.00069],
  ['Ne', 10, 20, 19992440.17525, 0.00165],
  ['Ne', 10, 21, 20993846.685, 0.041],
  ['Ne', 10, 22, 21991385.113, 0.018],
  ['Na', 11, 23, 22989769.28195, 0.00194],
  ['Mg', 12, 24, 23985041.689, 0.013],
  ['Mg', 12, 25, 24985836.966, 0.05],
  ['Mg', 12, 26, 25982592.972, 0.031],
  ['Cl', 17, 35, 34968852.694, 0.038],
  ['Ar', 18, 36, 35967545.106, 0.028],
  ['Cl', 17, 37, 36965902.573, 0.055],
  ['Ar', 18, 38, 37962732.102, 0.209],
  ['K', 19, 39, 38963706.48482, 0.00489],
  ['Ar', 18, 40, 39962383.12204, 0.00234],
  ['K', 19, 40, 39963998.165, 0.06],
  ['Ca', 20, 40, 39962590.85, 0.022],
  ['K', 19, 41, 40961825.25611, 0.00403],
];

export const ISOTOPES: readonly Isotope[] = Object.freeze(AME2020_MICRO_U.map(([element, z, a, mu, s]) =>
  Object.freeze({ name: `${a}${element}`, element, z, a, massU: mu * 1e-6, sigmaMassU: s * 1e-6 })));

/** Electron mass [u], CODATA 2018: 5.48579909065(16)e-4 u. */
export const ELECTRON_MASS_U = 5.48579909065e-4;

/** One candidate identification of a measured m/q. */
export interface IsotopeMatch {
  readonly isotope: Isotope;
  /** Charge state (electrons removed). */
  readonly charge: number;
  /** Ion mass over charge [u/e]: (atomic mass − charge·m_e)/charge. */
  readonly massToChargeU: number;
  /** (measured − expected)/σ. */
  readonly pull: number;
}

/**
 * Isotopes (of `ISOTOPES`, or the list given) whose positive ions of charge 1…`maxCharge` have
 * m/q within `maxPull` standard deviations of the measured `massToChargeU` ± `sigmaU` [u/e],
 * best first. Ion mass = atomic mass − z·m_e (binding energies of the removed electrons, below
 * 10⁻⁷ u for these ions, neglected). An empty list means no listed isotope fits.
 * @example identifyIsotope(19.9919, 0.002)[0].isotope.name // '20Ne'
 */
export function identifyIsotope(massToChargeU: number, sigmaU: number, options: { readonly maxCharge?: number; readonly maxPull?: number; readonly isotopes?: readonly Isotope[] } = {}): IsotopeMatch[] {
  if (!(sigmaU > 0)) throw msg.badArgument('sigmaU', sigmaU, 'a positive error in u');
  const maxCharge = options.maxCharge ?? 1;
  const maxPull = options.maxPull ?? 3;
  const out: IsotopeMatch[] = [];
  for (const iso of options.isotopes ?? ISOTOPES) {
    for (let q = 1; q <= maxCharge; q++) {
      const expected = (iso.massU - q * ELECTRON_MASS_U) / q;
      const pull = (massToChargeU - expected) / Math.hypot(sigmaU, iso.sigmaMassU / q);
      if (Math.abs(pull) <= maxPull) out.push({ isotope: iso, charge: q, massToChargeU: expected, pull });
    }
  }
  return out.sort((a, b) => Math.abs(a.pull) - Math.abs(b.pull));
}

/** The isotope named like "20Ne" or "Ne-20". Throws BAD_ARGUMENT with the known names. */
export function isotope(name: string): Isotope {
  const m = /^(\d+)\s*-?\s*([A-Za-z]+)$|^([A-Za-z]+)\s*-?\s*(\d+)$/.exec(name.trim());
  const found = m && ISOTOPES.find((i) => i.a === Number(m[1] ?? m[4]) && i.element.toLowerCase() === (m[2] ?? m[3]).toLowerCase());
  if (!found) throw msg.badArgument('isotope', name, `one of ${ISOTOPES.map((i) => i.name).join(', ')}`);
  return found;
}

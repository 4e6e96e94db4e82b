import { msg } from '../errors.js';
import { type DensityEffect, sternheimerPeierls } from './densityEffect.js';
import { ELEMENTS, element } from './elements.js';

export type { DensityEffect } from './densityEffect.js';

/** One atomic species in a material, by mass fraction. */
export interface Constituent {
  readonly atomicNumber: number;
  readonly atomicMassGmol: number;
  readonly massFraction: number;
}

/**
 * A stopping medium. Units: g/cm³, eV, g/cm². `approximate` is true when any of the numbers
 * comes from an additivity rule or the Sternheimer–Peierls prescription instead of a table.
 */
export interface Material {
  readonly name: string;
  readonly state: 'solid' | 'liquid' | 'gas';
  readonly densityGcm3: number;
  /** ⟨Z/A⟩ [mol/g]. */
  readonly zOverA: number;
  /** Mean excitation energy I [eV]. */
  readonly meanExcitationEV: number;
  /** Radiation length X₀ [g/cm²]. */
  readonly radiationLengthGcm2: number;
  /** Sternheimer density-effect parameters. */
  readonly densityEffect: DensityEffect;
  /** Elemental make-up by mass; needed for the electron radiative term. */
  readonly composition: readonly Constituent[];
  readonly approximate: boolean;
  /** Where the numbers come from. */
  readonly source: string;
}

const PDG = 'PDG RPP "Atomic and Nuclear Properties of Materials" (ρ, Z/A, I, X₀); density-effect set of Sternheimer, Berger & Seltzer, At. Data Nucl. Data Tables 30 (1984) 261';

/** Mass fractions from a chemical formula, e.g. { C: 3, H: 8 }. */
function byFormula(formula: Readonly<Record<string, number>>): Constituent[] {
  const parts = Object.entries(formula).map(([sym, n]) => ({ e: element(sym), n }));
  const molar = parts.reduce((s, p) => s + p.n * p.e.atomicMassGmol, 0);
  return parts.map((p) => ({ atomicNumber: p.e.atomicNumber, atomicMassGmol: p.e.atomicMassGmol, massFraction: (p.n * p.e.atomicMassGmol) / molar }));
}

function byMass(fractions: Readonly<Record<string, number>>): Constituent[] {
  return Object.entries(fractions).map(([sym, w]) => {
    const e = element(sym);
    return { atomicNumber: e.atomicNumber, atomicMassGmol: e.atomicMassGmol, massFraction: w };
  });
}

const DE = (cBar: number, x0: number, x1: number, a: number, k: number, delta0 = 0): DensityEffect => Object.freeze({ cBar, x0, x1, a, k, delta0 });

function M(m: Material): Material {
  return Object.freeze({ ...m, composition: Object.freeze(m.composition.map((c) => Object.freeze({ ...c }))) });
}

/**
 * The built-in table. Values as carried by the PDG tables (edition 2022 web tables); entries whose
 * values were recalled rather than read from the publication are marked (memory) in their source
 * string (test/fixtures/pdg-materials/README.md says which rows were read). Water uses I = 75.0 eV (ICRU Report 49, the value NIST PSTAR/ESTAR use) so that the
 * PSTAR comparison tests the formula, not a different I; PDG ≥ 2019 lists 79.7 eV.
 */
const PDG_MEMORY = `${PDG}; values recalled from the PDG table (memory), checked by the C̄ identity and the minimum dE/dx test`;

const ARGON_GAS = M({ name: 'argon-gas', state: 'gas', densityGcm3: 1.662e-3, zOverA: 0.45059, meanExcitationEV: 188.0, radiationLengthGcm2: 19.55,
  densityEffect: DE(11.948, 1.7635, 4.4855, 0.19714, 2.9618), composition: byMass({ Ar: 1 }), approximate: false, source: `${PDG}; 20 °C, 1 atm; X₀ (memory)` });
const CO2_GAS = M({ name: 'carbon-dioxide-gas', state: 'gas', densityGcm3: 1.842e-3, zOverA: 0.49989, meanExcitationEV: 85.0, radiationLengthGcm2: 36.2,
  densityEffect: DE(10.1537, 1.6294, 4.1825, 0.11768, 3.3227), composition: byFormula({ C: 1, O: 2 }), approximate: false, source: `${PDG_MEMORY}; CO₂ at 20 °C, 1 atm` });

export const MATERIALS: readonly Material[] = Object.freeze([
  M({ name: 'liquid-hydrogen', state: 'liquid', densityGcm3: 0.0708, zOverA: 0.99212, meanExcitationEV: 21.8, radiationLengthGcm2: 63.04,
    densityEffect: DE(3.0977, 0.44, 1.8856, 0.1348, 5.6249), composition: byMass({ H: 1 }), approximate: false, source: PDG }),
  M({ name: 'hydrogen-gas', state: 'gas', densityGcm3: 8.375e-5, zOverA: 0.99212, meanExcitationEV: 19.2, radiationLengthGcm2: 63.04,
    densityEffect: DE(9.5835, 1.8639, 3.2718, 0.14092, 5.7273), composition: byMass({ H: 1 }), approximate: false, source: `${PDG}; 20 °C, 1 atm (memory)` }),
  M({ name: 'helium-gas', state: 'gas', densityGcm3: 1.663e-4, zOverA: 0.49967, meanExcitationEV: 41.8, radiationLengthGcm2: 94.32,
    densityEffect: DE(11.1393, 2.2017, 3.6122, 0.13443, 5.8347), composition: byMass({ He: 1 }), approximate: false, source: `${PDG}; 20 °C, 1 atm (memory)` }),
  M({ name: 'water', state: 'liquid', densityGcm3: 1.0, zOverA: 0.55509, meanExcitationEV: 75.0, radiationLengthGcm2: 36.08,
    densityEffect: DE(3.5017, 0.24, 2.8004, 0.09116, 3.4773), composition: byFormula({ H: 2, O: 1 }), approximate: false,
    source: `${PDG}; I = 75.0 eV from ICRU Report 49 as used by NIST PSTAR (PDG ≥ 2019: 79.7 eV)` }),
  M({ name: 'air', state: 'gas', densityGcm3: 1.205e-3, zOverA: 0.49919, meanExcitationEV: 85.7, radiationLengthGcm2: 36.62,
    densityEffect: DE(10.5961, 1.7418, 4.2759, 0.10914, 3.3994), composition: byMass({ C: 0.000124, N: 0.755267, O: 0.231781, Ar: 0.012827 }), approximate: false,
    source: `${PDG}; dry air near sea level, 20 °C (memory)` }),
  ARGON_GAS,
  M({ name: 'liquid-propane', state: 'liquid', densityGcm3: 0.43, zOverA: 0.58962, meanExcitationEV: 52.0, radiationLengthGcm2: 45.37,
    densityEffect: DE(3.5529, 0.2861, 2.6568, 0.10329, 3.562), composition: byFormula({ C: 3, H: 8 }), approximate: false,
    source: `${PDG}; C₃H₈ at ρ = 0.430 g/cm³, the density the tabulated C̄ belongs to (bubble-chamber liquid) (memory)` }),
  M({ name: 'neon-gas', state: 'gas', densityGcm3: 8.385e-4, zOverA: 0.49555, meanExcitationEV: 137.0, radiationLengthGcm2: 28.93,
    densityEffect: DE(11.9041, 2.0735, 4.6421, 0.08064, 3.5771), composition: byMass({ Ne: 1 }), approximate: false, source: `${PDG}; 20 °C, 1 atm (memory)` }),
  M({ name: 'liquid-neon', state: 'liquid', densityGcm3: 1.204, zOverA: 0.49555, meanExcitationEV: 137.0, radiationLengthGcm2: 28.93,
    densityEffect: sternheimerPeierls(137.0, 1.204, 0.49555, false), composition: byMass({ Ne: 1 }), approximate: true,
    source: 'PDG RPP tables (ρ, Z/A, I, X₀) (memory); density-effect parameters from the Sternheimer–Peierls general prescription (approximate)' }),
  M({ name: 'silicon', state: 'solid', densityGcm3: 2.329, zOverA: 0.49848, meanExcitationEV: 173.0, radiationLengthGcm2: 21.82,
    densityEffect: DE(4.4355, 0.2015, 2.8716, 0.14921, 3.2546, 0.14), composition: byMass({ Si: 1 }), approximate: false, source: `${PDG}; X₀ (memory)` }),
  M({ name: 'polystyrene', state: 'solid', densityGcm3: 1.06, zOverA: 0.53768, meanExcitationEV: 68.7, radiationLengthGcm2: 43.79,
    densityEffect: DE(3.2999, 0.1647, 2.5031, 0.16454, 3.2224), composition: byFormula({ C: 8, H: 8 }), approximate: false,
    source: `${PDG}; (C₈H₈)ₙ, the base of polystyrene scintillator` }),
  M({ name: 'nuclear-emulsion', state: 'solid', densityGcm3: 3.815, zOverA: 0.45453, meanExcitationEV: 331.0, radiationLengthGcm2: 11.38,
    densityEffect: DE(5.3319, 0.1009, 3.4866, 0.12399, 3.0094),
    composition: byMass({ H: 0.0141, C: 0.072261, N: 0.01932, O: 0.066101, S: 0.00189, Br: 0.349103, Ag: 0.474105, I: 0.00312 }), approximate: false,
    source: `${PDG}; standard nuclear (photographic) emulsion, composition by mass (memory)` }),
  M({ name: 'aluminium', state: 'solid', densityGcm3: 2.699, zOverA: 0.48181, meanExcitationEV: 166.0, radiationLengthGcm2: 24.01,
    densityEffect: DE(4.2395, 0.1708, 3.0127, 0.08024, 3.6345, 0.12), composition: byMass({ Al: 1 }), approximate: false, source: PDG_MEMORY }),
  M({ name: 'iron', state: 'solid', densityGcm3: 7.874, zOverA: 0.46557, meanExcitationEV: 286.0, radiationLengthGcm2: 13.84,
    densityEffect: DE(4.2911, -0.0012, 3.1531, 0.1468, 2.9632, 0.12), composition: byMass({ Fe: 1 }), approximate: false, source: PDG_MEMORY }),
  M({ name: 'copper', state: 'solid', densityGcm3: 8.96, zOverA: 0.45636, meanExcitationEV: 322.0, radiationLengthGcm2: 12.86,
    densityEffect: DE(4.419, -0.0254, 3.2792, 0.14339, 2.9044, 0.08), composition: byMass({ Cu: 1 }), approximate: false, source: PDG_MEMORY }),
  M({ name: 'tungsten', state: 'solid', densityGcm3: 19.3, zOverA: 0.4025, meanExcitationEV: 727.0, radiationLengthGcm2: 6.76,
    densityEffect: DE(5.4059, 0.2167, 3.496, 0.15509, 2.8447, 0.14), composition: byMass({ W: 1 }), approximate: false, source: PDG_MEMORY }),
  M({ name: 'lead', state: 'solid', densityGcm3: 11.35, zOverA: 0.39575, meanExcitationEV: 823.0, radiationLengthGcm2: 6.37,
    densityEffect: DE(6.2018, 0.3776, 3.8073, 0.09359, 3.1608, 0.14), composition: byMass({ Pb: 1 }), approximate: false, source: PDG_MEMORY }),
  M({ name: 'pmma', state: 'solid', densityGcm3: 1.19, zOverA: 0.53937, meanExcitationEV: 74.0, radiationLengthGcm2: 40.55,
    densityEffect: DE(3.3297, 0.1824, 2.6681, 0.11433, 3.3836), composition: byFormula({ C: 5, H: 8, O: 2 }), approximate: false,
    source: `${PDG_MEMORY}; polymethyl methacrylate (C₅H₈O₂)ₙ` }),
  M({ name: 'pvt-scintillator', state: 'solid', densityGcm3: 1.032, zOverA: 0.54141, meanExcitationEV: 64.7, radiationLengthGcm2: 43.83,
    densityEffect: DE(3.1997, 0.1464, 2.4855, 0.16101, 3.2393), composition: byFormula({ C: 9, H: 10 }), approximate: false,
    source: `${PDG_MEMORY}; plastic scintillator, polyvinyltoluene base (C₉H₁₀)ₙ` }),
  M({ name: 'nitrogen-gas', state: 'gas', densityGcm3: 1.165e-3, zOverA: 0.49976, meanExcitationEV: 82.0, radiationLengthGcm2: 37.99,
    densityEffect: DE(10.54, 1.7378, 4.1323, 0.15349, 3.2125), composition: byMass({ N: 1 }), approximate: false, source: `${PDG_MEMORY}; N₂ at 20 °C, 1 atm` }),
  CO2_GAS,
  // Ar/CO₂ 70/30 by volume at 20 °C, 1 atm: mass fractions 0.6793/0.3207 from the molar masses,
  // ρ = 0.7·ρ_Ar + 0.3·ρ_CO₂ (ideal gases); I, X₀ and δ by the mixture rules (approximate).
  Object.freeze({ ...mixture('ar-co2-70-30', [{ of: ARGON_GAS, massFraction: 0.6793 }, { of: CO2_GAS, massFraction: 0.3207 }], { densityGcm3: 0.7 * 1.662e-3 + 0.3 * 1.842e-3, state: 'gas' }),
    source: 'Ar/CO₂ 70/30 by volume, 20 °C, 1 atm, from the PDG argon and CO₂ entries by Bragg additivity and the Sternheimer–Peierls density effect (approximate)' }),
]);

const ALIASES: Readonly<Record<string, string>> = Object.freeze({
  lh2: 'liquid-hydrogen', 'hydrogen-liquid': 'liquid-hydrogen', h2: 'hydrogen-gas', hydrogen: 'hydrogen-gas',
  he: 'helium-gas', helium: 'helium-gas', h2o: 'water', 'liquid-water': 'water', 'dry-air': 'air',
  ar: 'argon-gas', argon: 'argon-gas', propane: 'liquid-propane', c3h8: 'liquid-propane',
  ne: 'neon-gas', neon: 'neon-gas', lne: 'liquid-neon', si: 'silicon', scintillator: 'polystyrene',
  'polystyrene-scintillator': 'polystyrene', emulsion: 'nuclear-emulsion',
  al: 'aluminium', aluminum: 'aluminium', fe: 'iron', cu: 'copper', w: 'tungsten', pb: 'lead',
  perspex: 'pmma', lucite: 'pmma', pvt: 'pvt-scintillator', polyvinyltoluene: 'pvt-scintillator',
  n2: 'nitrogen-gas', nitrogen: 'nitrogen-gas', co2: 'carbon-dioxide-gas', 'carbon-dioxide': 'carbon-dioxide-gas',
  'ar-co2': 'ar-co2-70-30', 'arco2': 'ar-co2-70-30',
});

/**
 * Looks a material up by name or alias, case-insensitively; spaces and underscores count as
 * hyphens ("liquid hydrogen", "LH2", "Si"). Throws UNKNOWN_MATERIAL listing the known names.
 */
export function material(name: string): Material {
  const key = name.trim().toLowerCase().replace(/[\s_]+/g, '-');
  const target = ALIASES[key] ?? key;
  const found = MATERIALS.find((m) => m.name === target);
  if (!found) throw msg.unknownMaterial(name, MATERIALS.map((m) => m.name));
  return found;
}

/** Σ w Z(Z+1)/A over the composition [mol/g]: the weight of nuclear + electron bremsstrahlung. */
export function zz1OverA(m: Material): number {
  let s = 0;
  for (const c of m.composition) s += (c.massFraction * c.atomicNumber * (c.atomicNumber + 1)) / c.atomicMassGmol;
  return s;
}

export interface MixturePart {
  /** A material from the table (or built by `compound`/`mixture`), or an element symbol. */
  readonly of: Material | string;
  readonly massFraction: number;
}

export interface MixtureOptions {
  readonly densityGcm3: number;
  readonly state?: 'solid' | 'liquid' | 'gas';
  /** Override I [eV] when a measured value is known; additivity is used otherwise. */
  readonly meanExcitationEV?: number;
}

interface Part { zOverA: number; lnI: number; x0: number; composition: readonly Constituent[]; w: number }

function partOf(p: MixturePart): Part {
  if (typeof p.of === 'string') {
    const e = ELEMENTS[p.of];
    if (!e) {
      // A material name is accepted too: "water" in a water–air mix.
      const m = material(p.of);
      return { zOverA: m.zOverA, lnI: Math.log(m.meanExcitationEV), x0: m.radiationLengthGcm2, composition: m.composition, w: p.massFraction };
    }
    return { zOverA: e.atomicNumber / e.atomicMassGmol, lnI: Math.log(e.meanExcitationEV), x0: e.radiationLengthGcm2,
      composition: [{ atomicNumber: e.atomicNumber, atomicMassGmol: e.atomicMassGmol, massFraction: 1 }], w: p.massFraction };
  }
  const m = p.of;
  return { zOverA: m.zOverA, lnI: Math.log(m.meanExcitationEV), x0: m.radiationLengthGcm2, composition: m.composition, w: p.massFraction };
}

/**
 * A user-defined mixture by mass fraction, density supplied by the user. Rules (PDG RPP and
 * ICRU Report 37; common practice): Bragg additivity ⟨Z/A⟩ = Σ wⱼ (Z/A)ⱼ and
 * ln I = Σ wⱼ (Z/A)ⱼ ln Iⱼ / ⟨Z/A⟩; radiation length 1/X₀ = Σ wⱼ / X₀ⱼ; density-effect
 * parameters from the Sternheimer–Peierls general prescription. The result is marked
 * `approximate: true` — additivity of ln I neglects chemical binding (a few per cent in I, a
 * fraction of a per cent in dE/dx near minimum ionisation). Mass fractions are renormalised
 * when they sum to within 1 % of 1; otherwise BAD_ARGUMENT.
 * @example mixture('ne-h2', [{ of: 'liquid-neon', massFraction: 0.7 }, { of: 'liquid-hydrogen', massFraction: 0.3 }], { densityGcm3: 0.7 })
 */
export function mixture(name: string, parts: readonly MixturePart[], options: MixtureOptions): Material {
  if (!(options.densityGcm3 > 0) || !Number.isFinite(options.densityGcm3)) throw msg.badArgument('densityGcm3', options.densityGcm3, 'a positive density in g/cm³');
  if (parts.length === 0) throw msg.badArgument('parts', parts, 'at least one constituent');
  const ps = parts.map(partOf);
  const sum = ps.reduce((s, p) => s + p.w, 0);
  if (ps.some((p) => !(p.w >= 0)) || Math.abs(sum - 1) > 0.01) throw msg.badArgument('massFraction', ps.map((p) => p.w), 'non-negative mass fractions summing to 1');
  for (const p of ps) p.w /= sum;
  const zOverA = ps.reduce((s, p) => s + p.w * p.zOverA, 0);
  const lnI = ps.reduce((s, p) => s + p.w * p.zOverA * p.lnI, 0) / zOverA;
  const meanExcitationEV = options.meanExcitationEV ?? Math.exp(lnI);
  const radiationLengthGcm2 = 1 / ps.reduce((s, p) => s + p.w / p.x0, 0);
  const state = options.state ?? 'solid';
  const merged = new Map<number, Constituent>();
  for (const p of ps) {
    for (const c of p.composition) {
      const prev = merged.get(c.atomicNumber);
      merged.set(c.atomicNumber, { atomicNumber: c.atomicNumber, atomicMassGmol: c.atomicMassGmol, massFraction: (prev?.massFraction ?? 0) + p.w * c.massFraction });
    }
  }
  return M({
    name, state, densityGcm3: options.densityGcm3, zOverA, meanExcitationEV, radiationLengthGcm2,
    densityEffect: sternheimerPeierls(meanExcitationEV, options.densityGcm3, zOverA, state === 'gas'),
    composition: [...merged.values()], approximate: true,
    source: 'user mixture: Bragg additivity for Z/A and ln I, 1/X₀ = Σ w/X₀, Sternheimer–Peierls density effect (approximate)',
  });
}

/**
 * A compound from a chemical formula, e.g. compound('propane-gas', { C: 3, H: 8 }, { densityGcm3:
 * 1.879e-3, state: 'gas' }). Same rules and caveats as `mixture` (elemental I values, so the
 * additivity estimate of I can differ from a measured compound I by several per cent: pass
 * `meanExcitationEV` when one is known).
 */
export function compound(name: string, formula: Readonly<Record<string, number>>, options: MixtureOptions): Material {
  const atoms = Object.entries(formula);
  if (atoms.length === 0 || atoms.some(([, n]) => !(n > 0))) throw msg.badArgument('formula', formula, 'element symbols with positive atom counts, e.g. { C: 3, H: 8 }');
  const parts = byFormula(formula).map((c, i) => ({ of: atoms[i][0], massFraction: c.massFraction }));
  return mixture(name, parts, options);
}

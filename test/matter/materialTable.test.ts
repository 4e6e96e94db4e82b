import { describe, expect, it, vi } from 'vitest';
import pdgMin from '../fixtures/pdg-materials/min-ionization.json' with { type: 'json' };
import pdgX0 from '../fixtures/pdg-materials/radiation-lengths.json' with { type: 'json' };
import { MUON_MINUS } from '../../lib/particles.js';
import { kineticFromBetaGamma } from '../../lib/matter/kinematics.js';
import { massStoppingPower } from '../../lib/matter/stoppingPower.js';
import type { Material } from '../../lib/matter/materials.js';
import { sternheimerPeierls } from '../../lib/matter/densityEffect.js';

/**
 * The built-in material table, row by row, from a module imported afresh inside each test: the
 * table is a module-level constant, and code run before a test starts is never mutated
 * (test/mutation.md). Checks against the outside: the PDG minimum ionisation of muons and the
 * PDG elemental radiation lengths (test/fixtures/pdg-materials, recalled values marked there);
 * Bragg additivity of the composition against the tabulated ⟨Z/A⟩ and the Sternheimer identity
 * C̄ = 1 + 2 ln(I/ħω_p) with ħω_p = 28.816 √(ρ⟨Z/A⟩) eV (PDG RPP, "Passage of particles
 * through matter"; Sternheimer, Berger & Seltzer 1984) tie each row's numbers to one another.
 */
async function freshTable() {
  vi.resetModules();
  return import('../../lib/matter/materials.js');
}

/** Minimum of S over βγ (muons, as the PDG tables), on a log grid of 0.001 in log₁₀ βγ. */
function minimumIonisation(m: Material): number {
  let min = Infinity;
  for (let l = 0; l <= 1.5; l += 0.001) min = Math.min(min, massStoppingPower(MUON_MINUS, m, kineticFromBetaGamma(MUON_MINUS, 10 ** l)));
  return min;
}

describe('the built-in material table', () => {
  it('lists 22 materials by name, states, and which rows rest on additivity or Sternheimer–Peierls', async () => {
    const { MATERIALS } = await freshTable();
    expect(MATERIALS.map((m) => m.name)).toEqual([
      'liquid-hydrogen', 'hydrogen-gas', 'helium-gas', 'water', 'air', 'argon-gas', 'liquid-propane', 'neon-gas', 'liquid-neon',
      'silicon', 'polystyrene', 'nuclear-emulsion', 'aluminium', 'iron', 'copper', 'tungsten', 'lead', 'pmma', 'pvt-scintillator',
      'nitrogen-gas', 'carbon-dioxide-gas', 'ar-co2-70-30',
    ]);
    const gases = ['hydrogen-gas', 'helium-gas', 'air', 'argon-gas', 'neon-gas', 'nitrogen-gas', 'carbon-dioxide-gas', 'ar-co2-70-30'];
    const liquids = ['liquid-hydrogen', 'water', 'liquid-propane', 'liquid-neon'];
    for (const m of MATERIALS) {
      expect(m.state, m.name).toBe(gases.includes(m.name) ? 'gas' : liquids.includes(m.name) ? 'liquid' : 'solid');
      // Only liquid neon (Sternheimer–Peierls δ) and the Ar/CO₂ mixture are not tabulated sets.
      expect(m.approximate, m.name).toBe(m.name === 'liquid-neon' || m.name === 'ar-co2-70-30');
      expect(m.source, m.name).toMatch(m.approximate && m.name !== 'liquid-neon' ? /Bragg additivity/ : /PDG RPP/);
      expect(Object.isFrozen(m) && Object.isFrozen(m.composition) && m.composition.every((c) => Object.isFrozen(c)), m.name).toBe(true);
    }
    expect(Object.isFrozen(MATERIALS)).toBe(true);
  });

  it('every composition sums to 1 and reproduces the tabulated ⟨Z/A⟩ by Bragg additivity (measured ≤ 6e-5, PVT 2.9e-4)', async () => {
    const { MATERIALS } = await freshTable();
    for (const m of MATERIALS) {
      const sum = m.composition.reduce((s, c) => s + c.massFraction, 0);
      expect(Math.abs(sum - 1), m.name).toBeLessThan(2e-6);
      const zOverA = m.composition.reduce((s, c) => s + (c.massFraction * c.atomicNumber) / c.atomicMassGmol, 0);
      expect(Math.abs(zOverA / m.zOverA - 1), m.name).toBeLessThan(m.name === 'pvt-scintillator' ? 3.5e-4 : 1e-4);
    }
  });

  it('every tabulated density-effect set satisfies C̄ = 1 + 2 ln(I/ħω_p) within 1e-3 and starts at δ₀ ≥ 0', async () => {
    const { MATERIALS } = await freshTable();
    let checked = 0;
    for (const m of MATERIALS) {
      const hbarOmegaP = 28.816 * Math.sqrt(m.densityGcm3 * m.zOverA);
      expect(Math.abs(m.densityEffect.cBar - (1 + 2 * Math.log(m.meanExcitationEV / hbarOmegaP))), m.name).toBeLessThan(1e-3);
      expect(m.densityEffect.x1, m.name).toBeGreaterThan(m.densityEffect.x0);
      expect(m.densityEffect.delta0, m.name).toBeGreaterThanOrEqual(0);
      checked++;
    }
    expect(checked).toBe(22);
  });

  it('gives the PDG muon minimum ionisation of every listed material within 0.1 % (emulsion at its documented +0.43 %)', async () => {
    const { material } = await freshTable();
    let checked = 0;
    for (const row of pdgMin.rows) {
      const d = minimumIonisation(material(row.material)) / row.minDedx - 1;
      if (row.material === 'nuclear-emulsion') expect(Math.abs(d - 0.0043), row.material).toBeLessThan(5e-4);
      else expect(Math.abs(d), row.material).toBeLessThan(1e-3);
      checked++;
    }
    expect(checked).toBe(pdgMin.rows.length);
  });

  it('the elemental rows carry the PDG radiation lengths within 0.3 %', async () => {
    const { material } = await freshTable();
    const rows: Record<string, string> = { Al: 'aluminium', Si: 'silicon', Fe: 'iron', Cu: 'copper', Pb: 'lead', Ar: 'argon-gas', Ne: 'neon-gas', N: 'nitrogen-gas', H: 'liquid-hydrogen', He: 'helium-gas' };
    let checked = 0;
    for (const row of pdgX0.rows) {
      const name = rows[row.symbol];
      if (!name) continue;
      expect(Math.abs(material(name).radiationLengthGcm2 / row.x0 - 1), name).toBeLessThan(0.003);
      checked++;
    }
    expect(checked).toBe(10);
  });

  it('material() resolves every alias, any case, spaces and underscores, and refuses an unknown name listing the known', async () => {
    const { material, MATERIALS } = await freshTable();
    const pairs: [string, string][] = [
      ['LH2', 'liquid-hydrogen'], ['hydrogen liquid', 'liquid-hydrogen'], ['H2', 'hydrogen-gas'], ['Hydrogen', 'hydrogen-gas'],
      ['He', 'helium-gas'], ['helium', 'helium-gas'], ['H2O', 'water'], ['liquid_water', 'water'], ['dry air', 'air'],
      ['Ar', 'argon-gas'], ['argon', 'argon-gas'], ['propane', 'liquid-propane'], ['C3H8', 'liquid-propane'], ['ne', 'neon-gas'],
      ['neon', 'neon-gas'], ['LNe', 'liquid-neon'], ['Si', 'silicon'], ['scintillator', 'polystyrene'],
      ['polystyrene scintillator', 'polystyrene'], ['emulsion', 'nuclear-emulsion'], ['Al', 'aluminium'], ['aluminum', 'aluminium'],
      ['Fe', 'iron'], ['Cu', 'copper'], ['W', 'tungsten'], ['Pb', 'lead'], ['perspex', 'pmma'], ['lucite', 'pmma'],
      ['PVT', 'pvt-scintillator'], ['polyvinyltoluene', 'pvt-scintillator'], ['N2', 'nitrogen-gas'], ['nitrogen', 'nitrogen-gas'],
      ['CO2', 'carbon-dioxide-gas'], ['carbon dioxide', 'carbon-dioxide-gas'], ['Ar-CO2', 'ar-co2-70-30'], ['ArCO2', 'ar-co2-70-30'],
      ['  Liquid Propane ', 'liquid-propane'],
    ];
    for (const [alias, name] of pairs) expect(material(alias).name, alias).toBe(name);
    expect(material('liquid  hydrogen').name).toBe('liquid-hydrogen');
    for (const m of MATERIALS) expect(material(m.name.toUpperCase())).toBe(m);
    expect(() => material('unobtainium')).toThrow(`unknown material "unobtainium"; known: ${MATERIALS.map((m) => m.name).join(', ')} (or define a compound or mixture)`);
  });

  it('the Ar/CO₂ 70/30 row is Bragg additivity of the argon and CO₂ rows, worked out here, with the gas Sternheimer–Peierls δ', async () => {
    // Rules (PDG RPP; ICRU 37; common practice): ⟨Z/A⟩ = Σ w (Z/A), ln I = Σ w (Z/A) ln I / ⟨Z/A⟩,
    // 1/X₀ = Σ w/X₀; density 0.7 ρ_Ar + 0.3 ρ_CO₂ (ideal gases, 70/30 by volume).
    const { material } = await freshTable();
    const ar = material('argon-gas'), co2 = material('carbon-dioxide-gas'), mix = material('ar-co2-70-30');
    const w = [0.6793, 0.3207], parts = [ar, co2];
    const zOverA = w[0] * ar.zOverA + w[1] * co2.zOverA;
    const lnI = (w[0] * ar.zOverA * Math.log(ar.meanExcitationEV) + w[1] * co2.zOverA * Math.log(co2.meanExcitationEV)) / zOverA;
    expect(mix.densityGcm3).toBeCloseTo(0.7 * 1.662e-3 + 0.3 * 1.842e-3, 15);
    expect(mix.zOverA).toBeCloseTo(zOverA, 14);
    expect(mix.meanExcitationEV).toBeCloseTo(Math.exp(lnI), 10);
    expect(mix.radiationLengthGcm2).toBeCloseTo(1 / (w[0] / ar.radiationLengthGcm2 + w[1] / co2.radiationLengthGcm2), 10);
    expect(mix.densityEffect).toEqual(sternheimerPeierls(mix.meanExcitationEV, mix.densityGcm3, mix.zOverA, true));
    // Composition: Ar, C and O by mass, from the parts' own compositions.
    const byZ = new Map(mix.composition.map((c) => [c.atomicNumber, c.massFraction]));
    expect([...byZ.keys()].sort((a, b) => a - b)).toEqual([6, 8, 18]);
    expect(byZ.get(18)).toBeCloseTo(w[0], 12);
    const co2C = co2.composition.find((c) => c.atomicNumber === 6)!.massFraction;
    expect(byZ.get(6)).toBeCloseTo(w[1] * co2C, 12);
    expect(byZ.get(8)).toBeCloseTo(w[1] * (1 - co2C), 12);
    expect(parts.every((p) => p.approximate === false)).toBe(true);
  });

  it('liquid neon takes the condensed-phase Sternheimer–Peierls δ (not the gas one)', async () => {
    const { material } = await freshTable();
    const ne = material('liquid-neon');
    expect(ne.densityEffect).toEqual(sternheimerPeierls(137.0, 1.204, 0.49555, false));
    expect(ne.densityEffect).not.toEqual(sternheimerPeierls(137.0, 1.204, 0.49555, true));
  });

  it('zz1OverA is Σ w Z(Z + 1)/A: water 4.2187 mol/g from its H and O fractions', async () => {
    const { material, zz1OverA } = await freshTable();
    const w = material('water');
    const h = w.composition.find((c) => c.atomicNumber === 1)!.massFraction;
    const expected = (h * 2) / 1.00794 + ((1 - h) * 72) / 15.9994;
    expect(zz1OverA(w)).toBeCloseTo(expected, 10);
    expect(zz1OverA(w)).toBeCloseTo(4.2187, 3);
  });
});

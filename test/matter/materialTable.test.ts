import { describe, expect, it, vi } from 'vitest';
import pdgMin from '../fixtures/pdg-materials/min-ionization.json' with { type: 'json' };
import pdgX0 from '../fixtures/pdg-materials/radiation-lengths.json' with { type: 'json' };
import { MUON_MINUS } from '../../lib/particles.js';
import { kineticFromBetaGamma } from '../../lib/matter/kinematics.js';
import { massStoppingPower } from '../../lib/matter/stoppingPower.js';
import type { Material } from '../../lib/matter/materials.js';

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
    for (const m of MATERIALS) expect(material(m.name.toUpperCase())).toBe(m);
    expect(() => material('unobtainium')).toThrow(`unknown material "unobtainium"; known: ${MATERIALS.map((m) => m.name).join(', ')} (or define a compound or mixture)`);
  });
});

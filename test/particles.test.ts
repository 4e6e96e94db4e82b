import { describe, expect, it } from 'vitest';
import pdg from './fixtures/pdg-particles/particles.json' with { type: 'json' };
import { PARTICLES, particle } from '../lib/particles.js';

// Source: PDG RPP 2022 (Workman et al., PTEP 2022 083C01) and CODATA 2018, literal digits in
// test/fixtures/pdg-particles/particles.json (rows marked (memory) there were recalled).
const C_M_PER_S = 299_792_458; // exact (SI 2019); a literal, not the library's constant

describe('lib/particles against the literal PDG / CODATA values', () => {
  it('every species has a fixture row and every row names a species (14 of each)', () => {
    expect(PARTICLES.length).toBe(14);
    expect(pdg.rows.length).toBe(PARTICLES.length);
    expect(new Set(pdg.rows.map((r) => r.name))).toEqual(new Set(PARTICLES.map((p) => p.name)));
  });
  it('each mass equals the printed PDG/CODATA digits (relative 1e-12)', () => {
    let checked = 0;
    for (const row of pdg.rows) {
      expect(Math.abs(particle(row.name).massMeV / row.massMeV - 1), row.name).toBeLessThan(1e-12);
      checked++;
    }
    expect(checked).toBe(14);
  });
  it('each cτ equals c·τ from the printed mean life within the rounding of τ, and the printed cτ within its last digit', () => {
    let unstable = 0, stable = 0;
    for (const row of pdg.rows) {
      const p = particle(row.name);
      if (row.meanLifeS === null) { expect(p.ctauM, row.name).toBe(Infinity); stable++; continue; }
      // τ is printed to 5 significant digits (μ: 8): half a unit of the last digit is ≤ 1e-4 relative.
      expect(Math.abs(p.ctauM / (C_M_PER_S * row.meanLifeS) - 1), row.name).toBeLessThan(1e-4);
      const printed = row.printedCtauM as number;
      const lastDigit = 10 ** (Math.floor(Math.log10(printed)) - (String(printed).replace(/^0\.0*|\./g, '').length - 1));
      expect(Math.abs(p.ctauM - printed), row.name).toBeLessThanOrEqual(0.5 * lastDigit + 1e-12);
      unstable++;
    }
    expect([unstable, stable]).toEqual([8, 6]);
  });
  it('the charged kaon: τ 1.2380e-8 s gives cτ 3.7114 m (PDG prints 3.711 m), not 3.7101 m', () => {
    expect(particle('K+').ctauM).toBeCloseTo(3.7114, 4);
    expect(particle('K-').ctauM).toBeCloseTo(3.7114, 4);
  });
  it('charges are the literal charge numbers (common practice)', () => {
    const z: Record<string, number> = { electron: -1, positron: 1, 'mu-': -1, 'mu+': 1, 'pi+': 1, 'pi-': -1, 'K+': 1, 'K-': -1, K0S: 0, proton: 1, antiproton: -1, Lambda: 0, deuteron: 1, alpha: 2 };
    expect(Object.fromEntries(PARTICLES.map((p) => [p.name, p.charge]))).toEqual(z);
  });
});

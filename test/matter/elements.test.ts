import { describe, expect, it, vi } from 'vitest';
import type { Particle } from '../../lib/particles.js';

/**
 * The element table and the vacuum medium are module-level constants: each test imports its
 * module afresh (vi.resetModules), so the table is built while the test runs — code run before a
 * test starts is never mutated (test/mutation.md).
 * Check values: standard atomic weights and mean excitation energies as carried in the PDG
 * "Atomic and Nuclear Properties of Materials" tables (I from ICRU Report 37), recalled (memory),
 * as the module says; Bloch's rule I ≈ 10 eV·Z for heavy elements is common practice.
 */
async function freshElements() {
  vi.resetModules();
  return import('../../lib/matter/elements.js');
}

describe('ELEMENTS', () => {
  it('holds 22 elements, each under its own symbol, in increasing atomic number', async () => {
    const { ELEMENTS } = await freshElements();
    const keys = Object.keys(ELEMENTS);
    expect(keys).toEqual(['H', 'He', 'C', 'N', 'O', 'F', 'Ne', 'Na', 'Al', 'Si', 'S', 'Cl', 'Ar', 'Ca', 'Fe', 'Cu', 'Br', 'Ag', 'I', 'Xe', 'W', 'Pb']);
    let z = 0;
    for (const k of keys) {
      const e = ELEMENTS[k];
      expect(e.symbol, k).toBe(k);
      expect(e.atomicNumber, k).toBeGreaterThan(z);
      z = e.atomicNumber;
      // A/Z from 1.008 (H) to 2.53 (Pb); I/Z from 8.9 (Xe) to 20.9 (He) eV.
      expect(e.atomicMassGmol / e.atomicNumber, k).toBeGreaterThan(1);
      expect(e.atomicMassGmol / e.atomicNumber, k).toBeLessThan(2.6);
      expect(e.meanExcitationEV / e.atomicNumber, k).toBeGreaterThan(8);
      expect(e.meanExcitationEV / e.atomicNumber, k).toBeLessThan(21);
      expect(Object.isFrozen(e), k).toBe(true);
    }
    expect(Object.isFrozen(ELEMENTS)).toBe(true);
  });

  it('carries the PDG/ICRU 37 values (memory) for H, C, O, Ar and Pb, and Bloch’s rule holds for Pb within 1 %', async () => {
    const { ELEMENTS } = await freshElements();
    const expected: Record<string, [number, number, number]> = {
      H: [1, 1.00794, 19.2], C: [6, 12.0107, 78.0], O: [8, 15.9994, 95.0], Ar: [18, 39.948, 188.0], Pb: [82, 207.2, 823.0],
    };
    for (const [k, [z, a, i]] of Object.entries(expected)) {
      expect([ELEMENTS[k].atomicNumber, ELEMENTS[k].atomicMassGmol, ELEMENTS[k].meanExcitationEV], k).toEqual([z, a, i]);
    }
    expect(Math.abs(ELEMENTS.Pb.meanExcitationEV / (10 * 82) - 1)).toBeLessThan(0.01);
  });

  it('radiation lengths come from Tsai’s formula: PDG 63.04 g/cm² for H and 6.37 for Pb, within 0.5 %', async () => {
    const { ELEMENTS } = await freshElements();
    // Source: PDG Atomic and Nuclear Properties (X₀ of H₂ 63.04, Pb 6.37 g/cm²), recalled (memory).
    expect(Math.abs(ELEMENTS.H.radiationLengthGcm2 / 63.04 - 1)).toBeLessThan(0.005);
    expect(Math.abs(ELEMENTS.Pb.radiationLengthGcm2 / 6.37 - 1)).toBeLessThan(0.005);
  });

  it('element(symbol) finds one and refuses an unknown symbol word for word', async () => {
    const { ELEMENTS, element } = await freshElements();
    expect(element('Ag')).toBe(ELEMENTS.Ag);
    expect(() => element('Xx')).toThrow(`element = "Xx" is not valid: expected one of ${Object.keys(ELEMENTS).join(', ')}`);
    expect(() => element('pb')).toThrow('element = "pb" is not valid');
  });
});

describe('VACUUM', () => {
  it('is a medium with no loss and no scattering for every species', async () => {
    vi.resetModules();
    const { VACUUM } = await import('../../lib/matter/medium.js');
    expect([VACUUM.name, VACUUM.densityGPerCm3, VACUUM.radiationLengthM, VACUUM.zOverA]).toEqual(['vacuum', 0, Infinity, 0]);
    const loss = VACUUM.forSpecies({ name: 'proton', massMeV: 938.27208816, charge: 1 } as Particle);
    expect(loss.rangeM(100)).toBe(Infinity);
    expect(loss.kineticFromRangeM(1)).toBe(Infinity);
    expect(loss.stragglingVarianceMeV2PerM).toBe(0);
    expect(loss.theta0Rad(1, 0.7, 0.1, 0.5)).toBe(0);
    expect(Object.isFrozen(VACUUM) && Object.isFrozen(loss)).toBe(true);
  });
});

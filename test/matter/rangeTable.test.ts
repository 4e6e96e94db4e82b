import { beforeEach, describe, expect, it } from 'vitest';
import { ALPHA, ELECTRON, MUON_PLUS, PROTON } from '../../lib/particles.js';
import { provenanceSnapshot, resetProvenance } from '../../lib/provenance.js';
import { consumeWarnings } from '../../lib/warnings.js';
import { csdaRange, energyAtRange, massStoppingPower, material, rangeAt, rangeMaxMeV, rangeTable } from '../../lib/matter/index.js';
import { pstarTable } from './pstarTables.js';

/**
 * rangeTable's grid, its refusals and warnings word for word, and the ends of its interpolation.
 * Every table is built inside its test (never at collection: see test/mutation.md).
 * Check values: NIST PSTAR water (test/fixtures/pstar/water.txt); the proton mass is PDG 2022,
 * 938.27208816 MeV, typed here as a literal.
 */
const PROTON_MASS_MEV = 938.27208816;
const water = () => material('water');
const rel = (a: number, b: number) => Math.abs(a / b - 1);

beforeEach(() => {
  consumeWarnings();
  resetProvenance();
});

describe('rangeTable: the grid', () => {
  it('defaults to 200 log-spaced energies from 1 to 1000 MeV, both ends exact, with a constant ratio', () => {
    const t = rangeTable(PROTON, water());
    const e = t.kineticEnergyMeV;
    expect(e.length).toBe(200);
    expect(e[0]).toBe(1);
    expect(e[199]).toBe(1000);
    const ratio = 1000 ** (1 / 199);
    for (const i of [1, 57, 100, 198]) expect(e[i] / e[i - 1]).toBeCloseTo(ratio, 12);
    expect(t.particle).toBe('proton');
    expect(t.material).toBe('water');
    expect(t.densityGcm3).toBe(water().densityGcm3);
    expect(consumeWarnings()).toEqual([]);
  });

  it('holds p = √(T² + 2MT), the total stopping power and the CSDA range at every node', () => {
    const t = rangeTable(PROTON, water(), { fromMeV: 10, toMeV: 100, points: 7 });
    for (let i = 0; i < 7; i++) {
      const T = t.kineticEnergyMeV[i];
      expect(t.momentumMeV[i] / Math.sqrt(T * T + 2 * PROTON_MASS_MEV * T)).toBeCloseTo(1, 9);
      // Closure: the columns are the library's own functions at the node.
      expect(t.stoppingPowerMeVcm2g[i]).toBe(massStoppingPower(PROTON, water(), T));
      expect(t.csdaRangeGcm2[i]).toBe(csdaRange(PROTON, water(), T));
    }
    // Against PSTAR water at both ends (10 MeV: S 45.67, R 0.1230; 100 MeV: S 7.289, R 7.718).
    const rows = pstarTable('water');
    const at = (T: number) => rows.find((r) => r.t === T)!;
    expect(rel(t.stoppingPowerMeVcm2g[0], at(10).total)).toBeLessThan(0.004);
    expect(rel(t.csdaRangeGcm2[0], at(10).range)).toBeLessThan(0.002);
    expect(rel(t.stoppingPowerMeVcm2g[6], at(100).total)).toBeLessThan(0.001);
    expect(rel(t.csdaRangeGcm2[6], at(100).range)).toBeLessThan(0.001);
  });

  it('takes two points (just the ends)', () => {
    const t = rangeTable(MUON_PLUS, material('liquid-hydrogen'), { fromMeV: 3, toMeV: 30, points: 2 });
    expect(Array.from(t.kineticEnergyMeV)).toEqual([3, 30]);
    expect(t.csdaRangeGcm2[1]).toBeGreaterThan(t.csdaRangeGcm2[0]);
  });

  it('records the clinical caution in the provenance (range tables reach dose planning)', () => {
    expect(provenanceSnapshot().cautions).toEqual([]);
    rangeTable(PROTON, water(), { points: 2 });
    expect(provenanceSnapshot().cautions).toEqual(['stopping-power']);
  });
});

describe('rangeTable: refusals and clamps, word for word', () => {
  it('refuses fewer than two points or a fractional count', () => {
    expect(() => rangeTable(PROTON, water(), { points: 1 })).toThrow('points = 1 is not valid: expected an integer ≥ 2');
    expect(() => rangeTable(PROTON, water(), { points: 2.5 })).toThrow('points = 2.5 is not valid: expected an integer ≥ 2');
  });

  it('refuses a non-positive start or an empty interval', () => {
    const expected = 'is not valid: expected 0 < fromMeV < toMeV';
    expect(() => rangeTable(PROTON, water(), { fromMeV: 0, toMeV: 5 })).toThrow(`fromMeV/toMeV = [0,5] ${expected}`);
    expect(() => rangeTable(PROTON, water(), { fromMeV: 5, toMeV: 5 })).toThrow(`fromMeV/toMeV = [5,5] ${expected}`);
    expect(() => rangeTable(PROTON, water(), { fromMeV: 6, toMeV: 5 })).toThrow(`fromMeV/toMeV = [6,5] ${expected}`);
  });

  it('raises an electron table start below 10 keV to it, with the warning text', () => {
    const t = rangeTable(ELECTRON, water(), { fromMeV: 0.001, toMeV: 1, points: 3 });
    expect(t.kineticEnergyMeV[0]).toBe(0.01);
    expect(t.kineticEnergyMeV[2]).toBe(1);
    expect(consumeWarnings()).toEqual([{ code: 'RANGE_TABLE_CLAMPED', message: 'rangeTable: fromMeV 0.001 is below the electron cutoff; table starts at 0.01 MeV', source: 'rangeTable', count: 1 }]);
    // Exactly at the cutoff: no clamp, no warning.
    rangeTable(ELECTRON, water(), { fromMeV: 0.01, toMeV: 1, points: 3 });
    expect(consumeWarnings()).toEqual([]);
  });

  it('lowers an end above the validity limit to it (e±: 10 GeV), with the warning text; at the limit no warning', () => {
    const t = rangeTable(ELECTRON, water(), { fromMeV: 1, toMeV: 20000, points: 3 });
    expect(t.kineticEnergyMeV[2]).toBe(10000);
    expect(rangeMaxMeV(ELECTRON)).toBe(10000);
    expect(consumeWarnings()).toEqual([{ code: 'RANGE_TABLE_CLAMPED', message: 'rangeTable: toMeV 20000 is above the electron validity limit; table ends at 10000 MeV', source: 'rangeTable', count: 1 }]);
    rangeTable(ELECTRON, water(), { fromMeV: 1, toMeV: 10000, points: 3 });
    expect(consumeWarnings()).toEqual([]);
  });

  it('refuses a start on the top limit (clamped to an empty interval)', () => {
    expect(() => rangeTable(ELECTRON, water(), { fromMeV: 10000, toMeV: 20000 }))
      .toThrow('fromMeV/toMeV = [10000,20000] is not valid: expected an interval overlapping the validity range 0.01–10000 MeV');
  });

  it('refuses an interval wholly outside the validity range once clamped', () => {
    expect(() => rangeTable(ELECTRON, water(), { fromMeV: 20000, toMeV: 30000 }))
      .toThrow('fromMeV/toMeV = [20000,30000] is not valid: expected an interval overlapping the validity range 0.01–10000 MeV');
  });

  it('a heavy particle may start at any positive energy (ranges run to zero energy)', () => {
    const t = rangeTable(ALPHA, water(), { fromMeV: 1e-4, toMeV: 1, points: 3 });
    expect(t.kineticEnergyMeV[0]).toBe(1e-4);
    expect(consumeWarnings().filter((w) => w.code === 'RANGE_TABLE_CLAMPED')).toEqual([]);
  });
});

describe('rangeAt / energyAtRange at and beyond the table ends', () => {
  it('return the node values exactly at the first, an inner and the last node', () => {
    const t = rangeTable(PROTON, water(), { fromMeV: 2, toMeV: 200, points: 9 });
    for (const i of [0, 4, 8]) {
      expect(rangeAt(t, t.kineticEnergyMeV[i])).toBeCloseTo(t.csdaRangeGcm2[i], 12);
      expect(energyAtRange(t, t.csdaRangeGcm2[i])).toBeCloseTo(t.kineticEnergyMeV[i], 10);
    }
    expect(rangeAt(t, 200)).toBe(t.csdaRangeGcm2[8]);
    expect(energyAtRange(t, t.csdaRangeGcm2[8])).toBe(200);
    expect(consumeWarnings()).toEqual([]);
  });

  it('interpolate between nodes of a 9-point table (two decades) as measured: R(T) within 2e-4, T(R) within 3e-3', () => {
    // Measured: R(T) −0.7e-4 … −1.4e-4, T(R) +1.7e-3 … +2.5e-3 at these energies (cubic Hermite, slopes from S).
    const t = rangeTable(PROTON, water(), { fromMeV: 2, toMeV: 200, points: 9 });
    for (const T of [2.5, 9, 47, 150]) {
      expect(rel(rangeAt(t, T), csdaRange(PROTON, water(), T)), `R at ${T} MeV`).toBeLessThan(2e-4);
      expect(rel(energyAtRange(t, csdaRange(PROTON, water(), T)), T), `T at ${T} MeV`).toBeLessThan(3e-3);
    }
  });

  it('answer NaN with the OUTSIDE_TABLE text just outside either end', () => {
    const t = rangeTable(PROTON, water(), { fromMeV: 2, toMeV: 200, points: 9 });
    expect(rangeAt(t, 1.999)).toBeNaN();
    expect(rangeAt(t, 200.001)).toBeNaN();
    const rLo = t.csdaRangeGcm2[0], rHi = t.csdaRangeGcm2[8];
    expect(energyAtRange(t, rLo * 0.999)).toBeNaN();
    expect(energyAtRange(t, rHi * 1.001)).toBeNaN();
    expect(consumeWarnings().map((w) => [w.code, w.source, w.message])).toEqual([
      ['OUTSIDE_TABLE', 'rangeAt', 'rangeAt: T = 1.999 MeV is outside the table 2–200 MeV; result is NaN'],
      ['OUTSIDE_TABLE', 'rangeAt', 'rangeAt: T = 200.001 MeV is outside the table 2–200 MeV; result is NaN'],
      ['OUTSIDE_TABLE', 'energyAtRange', `energyAtRange: R = ${rLo * 0.999} g/cm² is outside the table ${rLo}–${rHi} g/cm²; result is NaN`],
      ['OUTSIDE_TABLE', 'energyAtRange', `energyAtRange: R = ${rHi * 1.001} g/cm² is outside the table ${rLo}–${rHi} g/cm²; result is NaN`],
    ]);
  });
});

import { describe, expect, it } from 'vitest';
import { ALPHA, MUON_MINUS, PROTON } from '../../lib/particles.js';
import { material, nuclearStoppingPower } from '../../lib/matter/index.js';
import { pstarTable } from './pstarTables.js';

// ZBL universal nuclear stopping (Ziegler, Biersack & Littmark 1985), lib/matter/nuclearStopping.ts,
// against the nuclear column of NIST PSTAR (ICRU Report 49), test/fixtures/pstar/<material>.txt.

describe('nuclearStoppingPower against PSTAR nuclear stopping (protons)', () => {
  // Measured deviations [%] (issue 15), asserted ± 0.1 points: ZBL's universal form is 5–22 % low
  // below 1 MeV in light media (where nuclear stopping is ≤ 25 % of the total at 1 keV and < 0.5 %
  // from 50 keV) and drifts high above 20 MeV, where it is < 0.1 % of the total.
  const documented: Record<string, Record<number, number>> = {
    water: { 0.001: -22.25, 0.01: -13.99, 0.1: -10.13, 1: -5.23, 10: 2.30, 100: 10.95 },
    air: { 0.001: -18.23, 0.01: -11.84, 0.1: -8.92, 1: -6.15, 10: 0.03, 100: 8.73 },
    aluminium: { 0.001: -14.80, 0.01: -9.20, 0.1: -7.67, 1: -5.67, 10: -1.99, 100: 5.32 },
    copper: { 0.001: -8.60, 0.01: -2.97, 0.1: -4.98, 1: -4.11, 10: -2.54, 100: 1.57 },
    lead: { 0.01: 9.87, 0.1: 3.47, 1: -0.94, 10: -1.15, 100: 0.20 },
  };
  for (const [name, rows] of Object.entries(documented)) {
    it(`${name}: ${Object.entries(rows).map(([t, d]) => `${t} MeV ${d > 0 ? '+' : ''}${d} %`).join(', ')}`, () => {
      let checked = 0;
      for (const row of pstarTable(name)) {
        if (!(row.t in rows)) continue;
        const d = 100 * (nuclearStoppingPower(PROTON, material(name), row.t) / row.nuclear - 1);
        expect(Math.abs(d - rows[row.t]), `${name} ${row.t} MeV: ${d.toFixed(2)} %`).toBeLessThan(0.1);
        checked++;
      }
      expect(checked).toBe(Object.keys(rows).length);
    });
  }
});

describe('nuclearStoppingPower: the ZBL expressions worked out', () => {
  // S_n = 8.462 Z₁Z₂M₁ s_n(ε) / ((M₁+M₂)(Z₁^0.23 + Z₂^0.23)) eV/(10¹⁵ atoms/cm²),
  // ε = 32.53 M₂ E[keV] / (Z₁Z₂(M₁+M₂)(Z₁^0.23 + Z₂^0.23)); per gram × N_A/M₂ · 10⁻¹⁵ eV → MeV.
  const sn = (e: number) => (e <= 30 ? Math.log(1 + 1.1383 * e) / (2 * (e + 0.01321 * e ** 0.21226 + 0.19593 * Math.sqrt(e))) : Math.log(e) / (2 * e));
  const zbl = (z1: number, m1: number, z2: number, m2: number, tMeV: number) => {
    const screen = z1 ** 0.23 + z2 ** 0.23;
    const eps = (32.53 * m2 * tMeV * 1000) / (z1 * z2 * (m1 + m2) * screen);
    return ((8.462 * z1 * z2 * m1 * sn(eps)) / ((m1 + m2) * screen)) * (6.02214076e23 * 1e-21) / m2;
  };
  it('an α in aluminium: 50 keV (ε = 18.3 ≤ 30, the low-ε branch) 17.1397, 1 MeV (ε = 366) 1.71790 MeV cm²/g', () => {
    // M₁ = 3727.3794066/931.49410242 u (CODATA 2018), Al: Z = 13, M = 26.9815386 (PDG, memory); Z₁^0.23 = 2^0.23.
    const ma = 3727.3794066 / 931.49410242;
    expect(zbl(2, ma, 13, 26.9815386, 0.05)).toBeCloseTo(17.1397, 3);
    expect(nuclearStoppingPower(ALPHA, material('aluminium'), 0.05) / zbl(2, ma, 13, 26.9815386, 0.05)).toBeCloseTo(1, 5);
    expect(nuclearStoppingPower(ALPHA, material('aluminium'), 1) / zbl(2, ma, 13, 26.9815386, 1)).toBeCloseTo(1, 5);
  });
  it('a proton of 10 keV in lead (ε = 1.05) and of 1 MeV in aluminium (ε = 860 > 30, the ln ε/2ε branch)', () => {
    const mp = 938.27208816 / 931.49410242;
    expect(nuclearStoppingPower(PROTON, material('lead'), 0.01) / zbl(1, mp, 82, 207.2, 0.01)).toBeCloseTo(1, 4);
    expect(nuclearStoppingPower(PROTON, material('aluminium'), 1) / zbl(1, mp, 13, 26.9815386, 1)).toBeCloseTo(1, 5);
  });
  it('sums the elements by mass fraction (water: H and O); a muon gets its own (small) mass', () => {
    const mp = 938.27208816 / 931.49410242;
    const wH = 2 * 1.00794 / (2 * 1.00794 + 15.9994);
    const water = wH * zbl(1, mp, 1, 1.00794, 0.05) + (1 - wH) * zbl(1, mp, 8, 15.9994, 0.05);
    expect(nuclearStoppingPower(PROTON, material('water'), 0.05) / water).toBeCloseTo(1, 4);
    const mm = 105.6583755 / 931.49410242;
    const muon = wH * zbl(1, mm, 1, 1.00794, 1) + (1 - wH) * zbl(1, mm, 8, 15.9994, 1);
    expect(nuclearStoppingPower(MUON_MINUS, material('water'), 1) / muon).toBeCloseTo(1, 4);
  });
  it('is 0 at T ≤ 0', () => {
    expect(nuclearStoppingPower(PROTON, material('water'), 0)).toBe(0);
    expect(nuclearStoppingPower(PROTON, material('water'), -1)).toBe(0);
  });
});

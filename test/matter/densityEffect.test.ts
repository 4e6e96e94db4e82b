import { describe, expect, it } from 'vitest';
import { cBarFromPlasma, densityEffectDelta, plasmaEnergyEV, sternheimerPeierls, type DensityEffect } from '../../lib/matter/index.js';

// Sternheimer density effect, lib/matter/densityEffect.ts. Parameter sets written here as literals
// from R.M. Sternheimer, M.J. Berger, S.M. Seltzer, At. Data Nucl. Data Tables 30 (1984) 261 as
// carried by the PDG "Atomic and Nuclear Properties" tables (memory), not read from materials.ts.
const SILICON: DensityEffect = { cBar: 4.4355, x0: 0.2015, x1: 2.8716, a: 0.14921, k: 3.2546, delta0: 0.14 };
const WATER: DensityEffect = { cBar: 3.5017, x0: 0.24, x1: 2.8004, a: 0.09116, k: 3.4773, delta0: 0 };
const LN10 = 2.302585092994046;

describe('densityEffectDelta (Sternheimer 1984 parametrisation, PDG RPP)', () => {
  it('x ≥ x₁: δ = 2 ln10 x − C̄ (water at βγ = 10⁴: 18.42068 − 3.5017 = 14.91898)', () => {
    expect(densityEffectDelta(WATER, 1e4)).toBeCloseTo(14.91898, 5);
    expect(densityEffectDelta(SILICON, 1e3)).toBeCloseTo(6 * LN10 - 4.4355, 10);
  });
  it('x₀ ≤ x < x₁: δ = 2 ln10 x − C̄ + a (x₁ − x)^k (silicon at βγ = 10: 1.31714; water at βγ = 100: 5.75067)', () => {
    // Worked by hand from the literal parameters (common practice).
    expect(densityEffectDelta(SILICON, 10)).toBeCloseTo(1.3171432, 6);
    expect(densityEffectDelta(WATER, 100)).toBeCloseTo(5.7506718, 6);
  });
  it('x < x₀: δ₀ 10^{2(x − x₀)} for a conductor (silicon at βγ = 1: 0.14·10^{−0.403} = 0.055351), 0 for an insulator', () => {
    expect(densityEffectDelta(SILICON, 1)).toBeCloseTo(0.0553513, 6);
    expect(densityEffectDelta(WATER, 1)).toBe(0);
    expect(densityEffectDelta(WATER, 0.1)).toBe(0);
  });
  it('the branches meet at x₁ exactly and at x₀ to the rounding of the tabulated a, k', () => {
    // At x = x₁ the middle branch adds a·0^k = 0; at x₀ it reaches δ₀ up to the printed digits.
    expect(densityEffectDelta(SILICON, 10 ** 2.8716)).toBeCloseTo(2 * LN10 * 2.8716 - 4.4355, 9);
    expect(densityEffectDelta(SILICON, 10 ** (2.8716 - 1e-9))).toBeCloseTo(2 * LN10 * 2.8716 - 4.4355, 6);
    // At x₀ from above: 2 ln10·0.2015 − 4.4355 + 0.14921·2.6701^3.2546 = 0.13977 (≈ δ₀ = 0.14).
    expect(densityEffectDelta(SILICON, 10 ** 0.2015)).toBeCloseTo(0.13977, 5);
    expect(densityEffectDelta(SILICON, 10 ** (0.2015 - 1e-9))).toBeCloseTo(0.14, 6);
  });
  it('at high energy δ/2 → ln(ħω_p/I) + ln βγ − ½ (PDG RPP limit), silicon at βγ = 10⁴ from ρ, Z/A, I alone', () => {
    // ħω_p = 28.816 √(2.329 · 0.49848) = 31.0486 eV, I = 173 eV (PDG, memory).
    const limit = 2 * (Math.log(31.0486 / 173) + Math.log(1e4) - 0.5);
    expect(densityEffectDelta(SILICON, 1e4)).toBeCloseTo(limit, 3);
  });
});

describe('plasma energy and C̄ (PDG RPP: ħω_p = 28.816 √(ρ⟨Z/A⟩) eV, C̄ = 1 + 2 ln(I/ħω_p))', () => {
  it('ħω_p of silicon 31.05, aluminium 32.86 and lead 61.07 eV (PDG table values, memory)', () => {
    expect(plasmaEnergyEV(2.329, 0.49848)).toBeCloseTo(31.05, 2);
    expect(plasmaEnergyEV(2.699, 0.48181)).toBeCloseTo(32.86, 2);
    expect(plasmaEnergyEV(11.35, 0.39575)).toBeCloseTo(61.07, 2);
  });
  it('C̄ of water (I = 75 eV) 3.5017, silicon 4.4355 and lead 6.2018 as tabulated by Sternheimer et al. 1984 (memory)', () => {
    expect(cBarFromPlasma(75.0, 1.0, 0.55509)).toBeCloseTo(3.5017, 3);
    expect(cBarFromPlasma(173.0, 2.329, 0.49848)).toBeCloseTo(4.4355, 3);
    expect(cBarFromPlasma(823.0, 11.35, 0.39575)).toBeCloseTo(6.2018, 3);
  });
});

describe('sternheimerPeierls: the general prescription (Sternheimer & Peierls, Phys. Rev. B 3 (1971) 3681; rules as recalled, memory)', () => {
  // Rules: condensed, I < 100 eV: x₁ = 2, x₀ = 0.2 (C̄ < 3.681) or 0.326 C̄ − 1.0; I ≥ 100 eV:
  // x₁ = 3, x₀ = 0.2 (C̄ < 5.215) or 0.326 C̄ − 1.5. Gases: x₁ = 4 and x₀ = 1.6, 1.7, 1.8, 1.9,
  // 2.0 for C̄ below 10, 10.5, 11, 11.5, 12.25; then x₀ = 2, x₁ = 5 below 13.804; above,
  // x₀ = 0.326 C̄ − 2.5, x₁ = 5. Always k = 3, δ₀ = 0, a fixed by δ(x₀) = 0.
  /** A medium with I [eV] and Z/A = 0.5 whose C̄ is `cBar`: ρ from C̄ = 1 + 2 ln(I/(28.816 √(ρ/2))). */
  const withCBar = (cBar: number, iEV: number) => {
    const hw = iEV / Math.exp((cBar - 1) / 2);
    return { iEV, rho: 2 * (hw / 28.816) ** 2 };
  };
  const cases: [string, number, number, boolean, number, number][] = [
    // [label, C̄, I, gas, x₀, x₁]
    ['condensed, I < 100 eV, C̄ < 3.681', 3.5, 75, false, 0.2, 2],
    ['condensed, I < 100 eV, C̄ ≥ 3.681', 4.2, 75, false, 0.326 * 4.2 - 1, 2],
    ['condensed, I ≥ 100 eV, C̄ < 5.215', 4.4, 173, false, 0.2, 3],
    ['condensed, I ≥ 100 eV, C̄ ≥ 5.215', 6.2, 823, false, 0.326 * 6.2 - 1.5, 3],
    ['gas, C̄ < 10', 9.6, 19.2, true, 1.6, 4],
    ['gas, 10 ≤ C̄ < 10.5', 10.2, 85, true, 1.7, 4],
    ['gas, 10.5 ≤ C̄ < 11', 10.6, 85.7, true, 1.8, 4],
    ['gas, 11 ≤ C̄ < 11.5', 11.2, 41.8, true, 1.9, 4],
    ['gas, 11.5 ≤ C̄ < 12.25', 11.9, 188, true, 2.0, 4],
    ['gas, 12.25 ≤ C̄ < 13.804', 13.0, 188, true, 2.0, 5],
    ['gas, C̄ ≥ 13.804', 14.5, 188, true, 0.326 * 14.5 - 2.5, 5],
  ];
  for (const [label, cBar, iEV, gas, x0, x1] of cases) {
    it(`${label}: x₀ = ${Number(x0.toFixed(4))}, x₁ = ${x1}`, () => {
      const { rho } = withCBar(cBar, iEV);
      const p = sternheimerPeierls(iEV, rho, 0.5, gas);
      expect(p.cBar).toBeCloseTo(cBar, 10);
      expect(p.x0).toBeCloseTo(x0, 12);
      expect(p.x1).toBe(x1);
      expect(p.k).toBe(3);
      expect(p.delta0).toBe(0);
      expect(p.a).toBeCloseTo((cBar - 2 * LN10 * x0) / (x1 - x0) ** 3, 12);
      // δ is continuous at x₀ (it starts from 0) and equals 2 ln10 x − C̄ from x₁ on.
      expect(densityEffectDelta(p, 10 ** x0)).toBeCloseTo(0, 10);
      expect(densityEffectDelta(p, 10 ** (x0 - 0.1))).toBe(0);
      expect(densityEffectDelta(p, 10 ** (x1 + 0.5))).toBeCloseTo(2 * LN10 * (x1 + 0.5) - cBar, 10);
    });
  }
  it('a value exactly on a rule boundary takes the rule above it (the rules read C̄ < bound, I < 100 eV)', () => {
    // Densities found (to the last bit) so that C̄ = 1 + 2 ln(I/ħω_p) equals the bound exactly, Z/A = 0.5.
    const onBound: [number, number, number, boolean, number, number][] = [
      // [C̄, I, ρ, gas, x₀, x₁]
      [3.681, 75, 0.9279864299193066, false, 0.326 * 3.681 - 1, 2],
      [5.215, 173, 1.0648871090898535, false, 0.326 * 5.215 - 1.5, 3],
      [10.0, 85, 0.002147583798758357, true, 1.7, 4],
      [10.5, 85, 0.0013025754182490693, true, 1.8, 4],
      [11.0, 85, 0.0007900519277560676, true, 1.9, 4],
      [11.5, 85, 0.00047919071694912555, true, 2.0, 4],
      [12.25, 188, 0.0011073002088510336, true, 2.0, 5],
      [13.804, 188, 0.00023408401451698206, true, 0.326 * 13.804 - 2.5, 5],
    ];
    let checked = 0;
    for (const [cBar, iEV, rho, gas, x0, x1] of onBound) {
      const p = sternheimerPeierls(iEV, rho, 0.5, gas);
      expect(p.cBar, `C̄ = ${cBar}`).toBe(cBar);
      expect(p.x0, `C̄ = ${cBar}`).toBe(x0);
      expect(p.x1, `C̄ = ${cBar}`).toBe(x1);
      checked++;
    }
    expect(checked).toBe(8);
    // I = 100 eV exactly is in the I ≥ 100 eV rule: x₁ = 3 (a condensed medium with C̄ < 5.215).
    expect(sternheimerPeierls(100, 2, 0.5, false).x1).toBe(3);
    expect(sternheimerPeierls(99.99, 2, 0.5, false).x1).toBe(2);
  });
});

import { beforeEach, describe, expect, it } from 'vitest';
import { ELECTRON, KAON_SHORT, PION_PLUS, MUON_MINUS, PROTON } from '../../lib/particles.js';
import { consumeWarnings } from '../../lib/warnings.js';
import { kineticFromBetaGamma, massStoppingPower, material, mostProbableEnergyLoss } from '../../lib/matter/index.js';

beforeEach(() => void consumeWarnings());
const si = material('silicon');

/**
 * Landau universal density φ(λ) = (1/π) ∫₀^∞ exp(−t ln t − λt) sin(πt) dt (Landau, J. Phys. USSR
 * 8 (1944) 201), by Simpson on [0, 30] (the integrand falls like t^(−t): below 1e−40 there).
 */
function landauDensity(lambda: number): number {
  const n = 6000, h = 30 / n;
  const g = (t: number) => (t === 0 ? 0 : Math.exp(-t * Math.log(t) - lambda * t) * Math.sin(Math.PI * t));
  let sum = g(0) + g(30);
  for (let i = 1; i < n; i++) sum += (i % 2 ? 4 : 2) * g(i * h);
  return (sum * h) / 3 / Math.PI;
}

/** Position of the maximum of φ by golden-section search on [−1, 1]. */
function landauMode(): number {
  let a = -1, b = 1;
  const r = (Math.sqrt(5) - 1) / 2;
  for (let k = 0; k < 60; k++) {
    const c = b - r * (b - a), d = a + r * (b - a);
    if (landauDensity(c) > landauDensity(d)) b = d; else a = c;
  }
  return (a + b) / 2;
}

describe('mostProbableEnergyLoss (Landau–Vavilov, PDG form)', () => {
  it('300 µm of silicon at minimum ionisation: Δp ≈ 80 keV (common practice: ≈ 22 000 e–h pairs × 3.6 eV), within 8 %', () => {
    // Fact of the trade (memory): a MIP in 300 µm Si gives an MPV near 80 keV.
    const x = 300e-4 * si.densityGcm3;
    const mp = mostProbableEnergyLoss(MUON_MINUS, si, kineticFromBetaGamma(MUON_MINUS, 3.5), x);
    expect(Math.abs(mp.mostProbableMeV / 0.08 - 1)).toBeLessThan(0.08);
  });
  it('sits well below the mean loss and Δp/x grows with thickness (ln x), as the PDG straggling figures show', () => {
    const t = 500; // MeV pion
    const thin = mostProbableEnergyLoss(PION_PLUS, si, t, 0.01);
    const thick = mostProbableEnergyLoss(PION_PLUS, si, t, 0.1);
    const mean = massStoppingPower(PION_PLUS, si, t);
    expect(thin.mostProbableMeV / 0.01).toBeLessThan(0.8 * mean);
    expect(thick.mostProbableMeV / 0.1).toBeGreaterThan(thin.mostProbableMeV / 0.01);
    // Δp(10x) − 10 Δp(x) = ξ₁₀ ln 10 exactly in this form (ξ ∝ x).
    expect(thick.mostProbableMeV - 10 * thin.mostProbableMeV).toBeCloseTo(thick.xiMeV * Math.log(10), 12);
  });
  it('ξ = (K/2) ⟨Z/A⟩ x / β² (PDG)', () => {
    const r = mostProbableEnergyLoss(PROTON, si, 1000, 0.1);
    const bg = Math.sqrt(1000 * (1000 + 2 * PROTON.massMeV)) / PROTON.massMeV;
    const beta2 = bg * bg / (1 + bg * bg);
    expect(r.xiMeV).toBeCloseTo((0.307075 / 2) * si.zOverA * 0.1 / beta2, 5);
  });
  it('equals Landau’s own most probable loss, ξ[ln(ξ/ε′) + 1 − γ_E + λ₀], with the mode λ₀ of the universal density computed here (published −0.22278)', () => {
    // Independent of the code’s j = 0.200: Landau (1944) gives Δ = ξ[λ + ln(ξ/ε′) + 1 − γ_E] with
    // ln ε′ = ln(I²(1 − β²)/(2 m_e c² β²)) + β², and Δp at the mode λ₀ of φ(λ). The mode is
    // λ₀ = −0.22278 (Kölbig & Schorr, Comput. Phys. Commun. 31 (1984) 97; (memory)), checked
    // against our quadrature. Cases have δ = 0 (βγ below the Sternheimer x₀ of the material,
    // Landau’s theory has no density effect): 500 MeV π⁺ in 1 cm of argon gas, 600 MeV p in 1 mm of water.
    const lambda0 = landauMode();
    expect(Math.abs(lambda0 - -0.22278)).toBeLessThan(1e-5);
    const eulerGamma = 0.5772156649015329;
    expect(Math.abs(1 - eulerGamma + lambda0 - 0.2)).toBeLessThan(1e-4); // PDG’s j = 0.200
    const cases = [
      { p: PION_PLUS, m: material('argon-gas'), t: 500, x: 1.662e-3 },
      { p: PROTON, m: material('water'), t: 600, x: 0.1 },
      { p: PROTON, m: material('water'), t: 200, x: 0.05 }, // βγ = 0.68: below 1, still δ = 0
    ];
    let checked = 0;
    for (const c of cases) {
      const mass = c.p.massMeV;
      const gamma = 1 + c.t / mass, beta2 = 1 - 1 / (gamma * gamma);
      const iMeV = c.m.meanExcitationEV * 1e-6, me = 0.51099895; // CODATA 2018 m_e c² (literal)
      const xi = (0.307075 / 2) * c.m.zOverA * c.x / beta2; // PDG K (literal)
      const lnEps = Math.log((iMeV * iMeV * (1 - beta2)) / (2 * me * beta2)) + beta2;
      const landau = xi * (Math.log(xi) - lnEps + 1 - eulerGamma + lambda0);
      const r = mostProbableEnergyLoss(c.p, c.m, c.t, c.x);
      // Agreement to 1e-3 ξ: a change of j by 0.01 (5 %) is ten times that.
      expect(Math.abs(r.mostProbableMeV - landau) / xi, c.m.name).toBeLessThan(1e-3);
      checked++;
    }
    expect(checked).toBe(3);
  });
  it('with the density effect: 500 MeV π⁺ in 300 µm of silicon equals the Landau form minus ξδ, δ from the Sternheimer silicon parameters (≈ 0.42)', () => {
    // Sternheimer, Berger & Seltzer, At. Data Nucl. Data Tables 30 (1984) 261, silicon as carried in the
    // PDG tables: C̄ 4.4355, x₀ 0.2015, x₁ 2.8716, a 0.1492, k 3.2546 (memory). For x₀ ≤ x < x₁:
    // δ = 2 ln10 x − C̄ + a (x₁ − x)^k with x = log₁₀ βγ (PDG RPP).
    const t = 500, x = 300e-4 * 2.329;
    const gamma = 1 + t / PION_PLUS.massMeV, beta2 = 1 - 1 / (gamma * gamma), bgLog = Math.log10(Math.sqrt(gamma * gamma - 1));
    const delta = 2 * Math.LN10 * bgLog - 4.4355 + 0.1492 * (2.8716 - bgLog) ** 3.2546;
    expect(delta).toBeGreaterThan(0.3);
    const xi = (0.307075 / 2) * 0.49848 * x / beta2, iMeV = 173e-6, me = 0.51099895;
    const lnEps = Math.log((iMeV * iMeV * (1 - beta2)) / (2 * me * beta2)) + beta2;
    const expected = xi * (Math.log(xi) - lnEps + 1 - 0.5772156649015329 + landauMode() - delta);
    const r = mostProbableEnergyLoss(PION_PLUS, si, t, x);
    expect(Math.abs(r.mostProbableMeV - expected) / xi).toBeLessThan(2e-3);
  });
  it('returns NaN + warning for a thick layer (κ ≥ 0.05 or Δp > 10 % of T)', () => {
    expect(mostProbableEnergyLoss(PROTON, si, 5, 1).mostProbableMeV).toBeNaN();
    expect(consumeWarnings()[0].code).toBe('OUTSIDE_VALIDITY');
  });
  it('each validity limit alone gives NaN and a warning that names it: κ ≥ 0.05, an electron, βγ < 0.045, Δp > 10 % of T', () => {
    // κ = ξ/T_max ≈ 0.7 for a 50 MeV proton in 1 mm of silicon, while Δp ≈ 1 MeV stays under 10 % of T.
    const thick = mostProbableEnergyLoss(PROTON, si, 50, 0.1);
    expect(thick.mostProbableMeV).toBeNaN();
    expect(thick.kappa).toBeGreaterThan(0.05);
    const [w1] = consumeWarnings();
    expect([w1.code, w1.source]).toEqual(['OUTSIDE_VALIDITY', 'mostProbableEnergyLoss']);
    expect(w1.message).toMatch(/^mostProbableEnergyLoss: proton at T = 50 MeV through 0.1 g\/cm² has κ = 0\.\d+ \(needs < 0.05, heavy particle, βγ ≥ 0.045\); result is NaN$/);
    // Electrons are outside the form (Landau–Vavilov for heavy particles) whatever κ is.
    expect(mostProbableEnergyLoss(ELECTRON, si, 500, 0.0699).mostProbableMeV).toBeNaN();
    expect(consumeWarnings()[0].message).toMatch(/electron at T = 500 MeV/);
    // βγ = 0.033 for a 0.5 MeV proton: below 0.045 even for a layer thin enough that κ < 0.05.
    const slow = mostProbableEnergyLoss(PROTON, si, 0.5, 1e-7);
    expect(slow.mostProbableMeV).toBeNaN();
    expect(slow.kappa).toBeLessThan(0.05);
    expect(consumeWarnings()[0].code).toBe('OUTSIDE_VALIDITY');
    // 3 GeV π⁺ through 200 g/cm² of silicon: κ ≈ 0.03, but Δp ≈ 0.36 GeV > 10 % of T.
    const long = mostProbableEnergyLoss(PION_PLUS, si, 3000, 200);
    expect(long.mostProbableMeV).toBeNaN();
    expect(long.kappa).toBeLessThan(0.05);
    const [w4] = consumeWarnings();
    expect([w4.code, w4.source]).toEqual(['OUTSIDE_VALIDITY', 'mostProbableEnergyLoss']);
    expect(w4.message).toMatch(/^mostProbableEnergyLoss: Δp = \d{3} MeV is more than 10 % of T = 3000 MeV; use a thinner layer or step through the range table; result is NaN$/);
    // Just inside every limit a number comes back, with no warning.
    expect(mostProbableEnergyLoss(PION_PLUS, si, 3000, 20).mostProbableMeV).toBeGreaterThan(0);
    expect(consumeWarnings()).toEqual([]);
  });
  it('a neutral particle and a thickness ≤ 0 are bad calls that say what is expected; ξ scales with z²', () => {
    expect(() => mostProbableEnergyLoss(KAON_SHORT, si, 500, 0.1)).toThrow(/particle = .*K0S.*a charged particle/);
    expect(() => mostProbableEnergyLoss(PION_PLUS, si, 500, 0)).toThrow(/thicknessGcm2 = 0.*a positive thickness in g\/cm²/);
    expect(() => mostProbableEnergyLoss(PION_PLUS, si, 500, -1)).toThrow(/thicknessGcm2 = -1/);
    const alpha = { ...PION_PLUS, name: 'z2', charge: 2 };
    expect(mostProbableEnergyLoss(alpha, si, 500, 0.01).xiMeV / mostProbableEnergyLoss(PION_PLUS, si, 500, 0.01).xiMeV).toBeCloseTo(4, 12);
  });
});

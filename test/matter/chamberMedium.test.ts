import { beforeEach, describe, expect, it } from 'vitest';
import { ALPHA, ELECTRON, KAON_SHORT, PROTON, type Particle } from '../../lib/particles.js';
import { chamberMedium, csdaRange, kineticEnergyFromRange, material } from '../../lib/matter/index.js';
import { consumeWarnings } from '../../lib/warnings.js';

/**
 * The chamber medium the simulator transports through, checked against formulas typed here:
 * Highland's θ₀ (PDG RPP, "Passage of particles through matter", eq. 34.15:
 * θ₀ = 13.6 MeV/(βcp)·z·√(x/X₀)·[1 + 0.038 ln(x z²/(X₀β²))]) and Bohr's straggling variance
 * σ² = K·mₑc²·z²·(Z/A)·ρx with K = 0.307075 MeV cm²/mol (PDG) and mₑc² = 0.51099895 MeV
 * (CODATA 2018). Each medium is made inside its test (never at collection: test/mutation.md).
 */
const K_MEV_CM2_PER_MOL = 0.307075;
const ELECTRON_MASS_MEV = 0.51099895;

function highland(pGeV: number, beta: number, z: number, xOverX0: number): number {
  return (0.0136 / (beta * pGeV)) * Math.abs(z) * Math.sqrt(xOverX0) * (1 + 0.038 * Math.log((xOverX0 * z * z) / (beta * beta)));
}

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const betaOf = (p: Particle, pGeV: number) => pGeV / Math.hypot(pGeV, p.massMeV / 1000);

beforeEach(() => void consumeWarnings());

describe('chamberMedium: the medium', () => {
  it('carries the material’s name, density, Z/A and radiation length in metres, from a name or a material', () => {
    const mat = material('liquid-propane');
    for (const m of [chamberMedium('liquid-propane'), chamberMedium(mat)]) {
      expect(m.name).toBe(mat.name);
      expect(m.densityGPerCm3).toBe(mat.densityGcm3);
      expect(m.zOverA).toBe(mat.zOverA);
      expect(m.radiationLengthM / (mat.radiationLengthGcm2 / mat.densityGcm3 / 100)).toBeCloseTo(1, 12);
    }
  });

  it('gives one loss model per species, made once', () => {
    const m = chamberMedium('liquid-hydrogen');
    expect(m.forSpecies(PROTON)).toBe(m.forSpecies(PROTON));
    expect(m.forSpecies(PROTON)).not.toBe(m.forSpecies(ALPHA));
  });

  it('refuses a neutral species word for word', () => {
    expect(() => chamberMedium('liquid-hydrogen').forSpecies(KAON_SHORT))
      .toThrow(`species = "${KAON_SHORT.name}" is not valid: expected a charged particle (neutral particles are not transported through matter)`);
  });
});

describe('chamberMedium: range, straggling and scattering of one species', () => {
  it('rangeM is the CSDA range in metres (ρ in g/cm³ × 100) and kineticFromRangeM its inverse, to 1e-6', () => {
    const mat = material('liquid-propane');
    const loss = chamberMedium(mat).forSpecies(PROTON);
    for (const T of [2, 30, 150]) {
      const r = csdaRange(PROTON, mat, T) / (mat.densityGcm3 * 100);
      expect(rel(loss.rangeM(T), r), `R(${T} MeV)`).toBeLessThan(1e-6);
      expect(rel(loss.kineticFromRangeM(r), kineticEnergyFromRange(PROTON, mat, r * mat.densityGcm3 * 100)), `T(R) at ${T} MeV`).toBeLessThan(1e-6);
    }
  });

  it('straggling is Bohr’s variance per metre: K·mₑc²·z²·(Z/A)·ρ·100 (×4 for an alpha)', () => {
    const mat = material('liquid-propane');
    const bohr = K_MEV_CM2_PER_MOL * ELECTRON_MASS_MEV * mat.zOverA * mat.densityGcm3 * 100;
    expect(rel(chamberMedium(mat).forSpecies(PROTON).stragglingVarianceMeV2PerM, bohr)).toBeLessThan(1e-4);
    expect(rel(chamberMedium(mat).forSpecies(ALPHA).stragglingVarianceMeV2PerM, 4 * bohr)).toBeLessThan(1e-4);
  });

  it('θ₀ of a first step is Highland for that step; later steps add up to Highland for the whole path', () => {
    const m = chamberMedium('liquid-hydrogen');
    const loss = m.forSpecies(PROTON);
    const p = 0.5, beta = betaOf(PROTON, p), x0 = m.radiationLengthM;
    const first = loss.theta0Rad(p, beta, 0.01, 0);
    expect(rel(first, highland(p, beta, 1, 0.01 / x0))).toBeLessThan(1e-9);
    // Twenty 1 cm steps: Σ Δθ₀² equals Highland² of 20 cm, where per-step Highland would fall short.
    let sum = 0, naive = 0;
    for (let k = 0; k < 20; k++) {
      sum += loss.theta0Rad(p, beta, 0.01, 0.01 * k) ** 2;
      naive += highland(p, beta, 1, 0.01 / x0) ** 2;
    }
    const whole = highland(p, beta, 1, 0.2 / x0) ** 2;
    expect(rel(sum, whole)).toBeLessThan(1e-9);
    expect(naive / whole).toBeLessThan(0.9);
    // A later step scatters more than the first (the log term grows with the path).
    expect(loss.theta0Rad(p, beta, 0.01, 0.1)).toBeGreaterThan(first);
  });

  it('θ₀ for charge 2 is Highland with z = 2; a step of zero or negative length scatters nothing', () => {
    const m = chamberMedium('liquid-hydrogen');
    const loss = m.forSpecies(ALPHA);
    const p = 1, beta = betaOf(ALPHA, p), x0 = m.radiationLengthM;
    expect(rel(loss.theta0Rad(p, beta, 0.05, 0), highland(p, beta, 2, 0.05 / x0))).toBeLessThan(1e-9);
    expect(loss.theta0Rad(p, beta, 0, 0.1)).toBe(0);
    expect(loss.theta0Rad(p, beta, -0.01, 0.1)).toBe(0);
  });

  it('continues θ₀² linearly in x below 1e-3 X₀ and above 100 X₀ (where Highland is not quoted)', () => {
    const m = chamberMedium('lead');
    const loss = m.forSpecies(ELECTRON);
    const p = 2, beta = betaOf(ELECTRON, p), x0 = m.radiationLengthM;
    const atLow = highland(p, beta, -1, 1e-3) ** 2;
    expect(rel(loss.theta0Rad(p, beta, 1e-4 * x0, 0) ** 2, 0.1 * atLow)).toBeLessThan(1e-9);
    const atHigh = highland(p, beta, -1, 100) ** 2;
    expect(rel(loss.theta0Rad(p, beta, 300 * x0, 0) ** 2, 3 * atHigh)).toBeLessThan(1e-9);
    // Across the top: the step from 50 X₀ to 150 X₀ takes 1.5 × θ₀²(100 X₀) − θ₀²(50 X₀).
    const mid = highland(p, beta, -1, 50) ** 2;
    expect(rel(loss.theta0Rad(p, beta, 100 * x0, 50 * x0) ** 2, 1.5 * atHigh - mid)).toBeLessThan(1e-9);
  });
});

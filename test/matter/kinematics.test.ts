import { describe, expect, it } from 'vitest';
import { ELECTRON, PROTON } from '../../lib/particles.js';
import {
  betaFromKinetic, betaFromMomentum, betaGamma, gammaFromKinetic, kinematicsFromKinetic, kineticFromBetaGamma, kineticFromMomentum,
  momentumFromKinetic,
} from '../../lib/matter/kinematics.js';

describe('kinematics (E² = p² + M², common practice)', () => {
  it('momentumFromKinetic(proton, 100 MeV) = 444.58 MeV/c', () => {
    expect(momentumFromKinetic(PROTON, 100)).toBeCloseTo(Math.sqrt(100 * (100 + 2 * 938.27208816)), 10);
    expect(momentumFromKinetic(PROTON, 100)).toBeCloseTo(444.58, 2);
  });
  it('kineticFromMomentum inverts momentumFromKinetic to 1e-12, even at 1 eV', () => {
    for (const t of [1e-6, 0.01, 1, 100, 1e5]) expect(kineticFromMomentum(PROTON, momentumFromKinetic(PROTON, t)) / t).toBeCloseTo(1, 12);
  });
  it('β, γ and βγ agree with each other', () => {
    const k = kinematicsFromKinetic(ELECTRON, 1);
    expect(k.beta * k.gamma).toBeCloseTo(k.betaGamma, 12);
    expect(betaFromKinetic(ELECTRON, 1)).toBeCloseTo(0.941, 3); // 1 MeV electron, β = 0.9411 (common practice)
    expect(kineticFromBetaGamma(PROTON, betaGamma(PROTON, 250))).toBeCloseTo(250, 9);
  });
  it('negative energies give NaN', () => {
    expect(momentumFromKinetic(PROTON, -1)).toBeNaN();
  });
});

describe('kinematics at T = M (γ = 2, β = √3/2, βγ = √3), each function against the textbook values (common practice)', () => {
  const M = 938.27208816; // proton rest energy [MeV] (PDG / CODATA 2018)
  it('momentum √3 M, γ = 2, β = √3/2, βγ = √3, and back', () => {
    expect(momentumFromKinetic(PROTON, M)).toBeCloseTo(Math.sqrt(3) * M, 9);
    expect(gammaFromKinetic(PROTON, M)).toBeCloseTo(2, 14);
    expect(betaFromKinetic(PROTON, M)).toBeCloseTo(Math.sqrt(3) / 2, 14);
    expect(betaGamma(PROTON, M)).toBeCloseTo(Math.sqrt(3), 14);
    expect(kineticFromBetaGamma(PROTON, Math.sqrt(3))).toBeCloseTo(M, 9);
    expect(kineticFromMomentum(PROTON, Math.sqrt(3) * M)).toBeCloseTo(M, 9);
    expect(kineticFromMomentum(PROTON, -Math.sqrt(3) * M)).toBeCloseTo(M, 9);
    expect(betaFromMomentum(PROTON, M)).toBeCloseTo(Math.SQRT1_2, 14);
    expect(betaFromMomentum(PROTON, -M)).toBeCloseTo(Math.SQRT1_2, 14);
  });
  it('kinematicsFromKinetic fills every field: E = 2M, p = √3 M, β = √3/2, γ = 2, βγ = √3', () => {
    const k = kinematicsFromKinetic(PROTON, M);
    expect(k.kineticEnergyMeV).toBe(M);
    expect(k.totalEnergyMeV).toBeCloseTo(2 * M, 9);
    expect(k.momentumMeV).toBeCloseTo(Math.sqrt(3) * M, 9);
    expect(k.beta).toBeCloseTo(Math.sqrt(3) / 2, 14);
    expect(k.gamma).toBeCloseTo(2, 14);
    expect(k.betaGamma).toBeCloseTo(Math.sqrt(3), 14);
    expect(Object.isFrozen(k)).toBe(true);
  });
  it('keeps full precision at small T: βγ = 1e-6 gives T = M βγ²/2 (1 − βγ²/4) to 1e-12', () => {
    expect(kineticFromBetaGamma(PROTON, 1e-6) / (M * 0.5e-12)).toBeCloseTo(1, 12);
    expect(kineticFromMomentum(PROTON, 1e-3) / (1e-6 / (2 * M))).toBeCloseTo(1, 12);
  });
  it('at rest: p = 0, β = 0, γ = 1, βγ = 0', () => {
    expect(momentumFromKinetic(PROTON, 0)).toBe(0);
    expect(betaFromKinetic(PROTON, 0)).toBe(0);
    expect(gammaFromKinetic(PROTON, 0)).toBe(1);
    expect(betaGamma(PROTON, 0)).toBe(0);
    expect(kineticFromBetaGamma(PROTON, 0)).toBe(0);
    expect(kineticFromMomentum(PROTON, 0)).toBe(0);
  });
  it('negative or NaN input gives NaN in every function', () => {
    for (const f of [momentumFromKinetic, gammaFromKinetic, betaFromKinetic, betaGamma, kineticFromBetaGamma]) {
      expect(f(PROTON, -1e-9), f.name).toBeNaN();
      expect(f(PROTON, Number.NaN), f.name).toBeNaN();
    }
    expect(kineticFromMomentum(PROTON, Number.NaN)).toBeNaN();
    // T < −2M would make T(T + 2M) positive again: still NaN, not √3 M.
    expect(momentumFromKinetic(PROTON, -3 * M)).toBeNaN();
    expect(gammaFromKinetic(PROTON, -3 * M)).toBeNaN();
  });
});

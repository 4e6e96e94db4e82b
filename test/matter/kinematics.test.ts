import { describe, expect, it } from 'vitest';
import { ELECTRON, PROTON } from '../../lib/particles.js';
import { betaFromKinetic, betaGamma, kinematicsFromKinetic, kineticFromBetaGamma, kineticFromMomentum, momentumFromKinetic } from '../../lib/matter/kinematics.js';

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

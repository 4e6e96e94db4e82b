import { beforeEach, describe, expect, it } from 'vitest';
import { PION_PLUS, MUON_MINUS, PROTON } from '../../lib/particles.js';
import { consumeWarnings } from '../../lib/warnings.js';
import { kineticFromBetaGamma, massStoppingPower, material, mostProbableEnergyLoss } from '../../lib/matter/index.js';

beforeEach(() => void consumeWarnings());
const si = material('silicon');

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
  it('returns NaN + warning for a thick layer (κ ≥ 0.05 or Δp > 10 % of T)', () => {
    expect(mostProbableEnergyLoss(PROTON, si, 5, 1).mostProbableMeV).toBeNaN();
    expect(consumeWarnings()[0].code).toBe('OUTSIDE_VALIDITY');
  });
});

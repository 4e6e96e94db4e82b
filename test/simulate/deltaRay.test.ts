import { describe, expect, it } from 'vitest';
import { BETHE_K_MEV_CM2_PER_MOL } from '../../lib/constants.js';
import { maxEnergyTransferMeV } from '../../lib/matter/index.js';
import { MUON_MINUS } from '../../lib/particles.js';
import { chamber, deltaRayCosTheta, deltaRayRatePerM, seededRandom, transportTrack, TRANSPORT_DEFAULTS } from '../../lib/simulate/index.js';
import { bohrVarianceMeV2, chamberMedium } from '../../lib/matter/index.js';

describe('knock-on electrons and Bohr straggling', () => {
  it('deltaRayRatePerM uses K = 0.307075 MeV mol⁻¹ cm² (PDG RPP Table "Summary of variables"): ≈ 1.07 per metre above 1 MeV in liquid hydrogen at β = 1', () => {
    expect(BETHE_K_MEV_CM2_PER_MOL).toBeCloseTo(0.307075, 5);
    const rate = deltaRayRatePerM(0.99212, 0.0708, 1, 1, 1, Infinity);
    expect(rate).toBeCloseTo(100 * 0.5 * 0.307075 * 0.99212 * 0.0708, 4);
    expect(rate).toBeGreaterThan(1.07);
    expect(rate).toBeLessThan(1.08);
    expect(deltaRayRatePerM(0.99212, 0.0708, 1, 1, 5, 5)).toBe(0);
  });

  it('emission angle: cos θ = 1 at T = W_max (head-on) and falls for softer electrons', () => {
    const w = maxEnergyTransferMeV(MUON_MINUS.massMeV, 5);
    expect(deltaRayCosTheta(w, w)).toBeCloseTo(1, 12);
    expect(deltaRayCosTheta(1, w)).toBeLessThan(deltaRayCosTheta(10, w));
  });

  it('a 2 GeV/c μ⁻ crossing 1 m of liquid hydrogen 500 times makes the predicted number of δ rays above 2 MeV (Poisson, within 4σ)', () => {
    const box = chamber({ sizeM: [1, 1, 1], medium: chamberMedium('liquid hydrogen'), fieldT: [0, 0, 0] });
    const rng = seededRandom(31);
    let n = 0;
    for (let i = 0; i < 500; i++) {
      transportTrack({ species: MUON_MINUS, xM: -0.5, yM: 0, zM: 0, ux: 1, uy: 0, uz: 0, momentumGeV: 2 }, box,
        { ...TRANSPORT_DEFAULTS, energyLoss: 'off', scattering: false, deltaRayMinMeV: 2 }, rng, () => {}, () => { n++; });
    }
    const beta = 2 / Math.hypot(2, MUON_MINUS.massMeV / 1000);
    const w = maxEnergyTransferMeV(MUON_MINUS.massMeV, 2000 / MUON_MINUS.massMeV);
    const expected = 500 * deltaRayRatePerM(0.99212, 0.0708, -1, beta, 2, w);
    expect(Math.abs(n - expected)).toBeLessThan(4 * Math.sqrt(expected));
  });

  it('bohrVarianceMeV2: K m_e c² = 0.1569 MeV² cm²/g per unit Z/A (Bohr 1915, as quoted by Leo §2.7: 0.157 (memory))', () => {
    expect(bohrVarianceMeV2(1, 1, 1)).toBeCloseTo(0.1569, 4);
    expect(bohrVarianceMeV2(0.5, 2, 10)).toBeCloseTo(0.1569 * 0.5 * 4 * 10, 3);
  });
});

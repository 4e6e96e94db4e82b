import { describe, expect, it } from 'vitest';
import { bohrVarianceMeV2 } from '../../lib/matter/index.js';

// Bohr's thick-absorber energy-loss variance (N. Bohr, Phil. Mag. 30 (1915) 581; W.R. Leo,
// "Techniques for Nuclear and Particle Physics Experiments", 2nd ed., §2.7 (memory)).

describe('bohrVarianceMeV2: σ² = 4π N_A r_e² (m_e c²)² z² (Z/A) ρx', () => {
  it('10 g/cm² of hydrogen (Z/A = 0.99212), z = 1: σ² = 0.307075 · 0.51099895 · 0.99212 · 10 = 1.55679 MeV²', () => {
    // K = 0.307075 MeV cm²/mol (PDG RPP), m_e c² = 0.51099895 MeV (CODATA 2018): K m_e = 0.156915 MeV² cm²/g,
    // Leo's "0.157 z² (Z/A) x" (memory).
    expect(bohrVarianceMeV2(0.99212, 1, 10)).toBeCloseTo(1.55679, 4);
    expect(bohrVarianceMeV2(1, 1, 1)).toBeCloseTo(0.156915, 5);
  });
  it('scales as z², Z/A and the path: α (z = 2) in 5 g/cm² of water (Z/A = 0.55509): 4 · 0.156915 · 0.55509 · 5 = 1.74204 MeV²', () => {
    expect(bohrVarianceMeV2(0.55509, 2, 5)).toBeCloseTo(1.74204, 4);
    expect(bohrVarianceMeV2(0.55509, -1, 5)).toBeCloseTo(1.74204 / 4, 5);
  });
});

import { beforeEach, describe, expect, it } from 'vitest';
import { consumeWarnings } from '../../lib/warnings.js';
import { ALPHA, MUON_MINUS, PROTON } from '../../lib/particles.js';
import { SagittaError } from '../../lib/errors.js';
import { material } from '../../lib/matter/materials.js';
import { highlandTheta0, highlandTheta0InMaterial, radiationLengthM } from '../../lib/matter/highland.js';

beforeEach(() => void consumeWarnings());

describe('highlandTheta0 (Lynch & Dahl 1991; PDG RPP)', () => {
  it('gives 13.6 mrad for βcp = 1 GeV through one radiation length', () => {
    expect(highlandTheta0({ momentumGeV: 1, beta: 1, charge: 1, thicknessOverX0: 1 })).toBeCloseTo(0.0136, 12);
  });
  it('carries the logarithmic term: 0.01 X₀ at 1 GeV gives 13.6·0.1·(1 + 0.038 ln 0.01) mrad', () => {
    expect(highlandTheta0({ momentumGeV: 1, beta: 1, charge: 1, thicknessOverX0: 0.01 })).toBeCloseTo(0.00136 * (1 + 0.038 * Math.log(0.01)), 14);
  });
  it('scales as |z| √(x/X₀) / (βp) up to the log term, e.g. an α (z = 2)', () => {
    const one = highlandTheta0({ momentumGeV: 2, beta: 0.9, charge: 1, thicknessOverX0: 0.1 });
    const two = highlandTheta0({ momentumGeV: 2, beta: 0.9, charge: 2, thicknessOverX0: 0.1 });
    expect(two / one).toBeCloseTo((2 * (1 + 0.038 * Math.log(0.4 / 0.81))) / (1 + 0.038 * Math.log(0.1 / 0.81)), 12);
  });
  it('in silicon: 300 µm for a 1 GeV/c muon gives ≈ 0.60 mrad (x/X₀ = 0.32 %, log term −22 %)', () => {
    const si = material('silicon');
    expect(radiationLengthM(si)).toBeCloseTo(0.09369, 4); // 21.82 g/cm² / 2.329 g/cm³ = 9.37 cm (PDG)
    const t = highlandTheta0InMaterial(MUON_MINUS, si, 1, 300e-6);
    expect(t).toBeGreaterThan(0.00055);
    expect(t).toBeLessThan(0.00065);
  });
  it('is NaN + warning outside 1e-3 < x/X₀ < 100 (the stated 11 % band)', () => {
    expect(highlandTheta0({ momentumGeV: 1, beta: 1, charge: 1, thicknessOverX0: 1e-5 })).toBeNaN();
    expect(highlandTheta0({ momentumGeV: 1, beta: 1, charge: 1, thicknessOverX0: 500 })).toBeNaN();
    expect(consumeWarnings()).toHaveLength(2);
  });
});

describe('highlandTheta0 in a material and its argument checks (PDG RPP, Lynch & Dahl 1991)', () => {
  it('1 GeV/c muon, 300 µm silicon: θ₀ = 0.60528 mrad (β = 0.994464, x/X₀ = 300 µm / 9.3688 cm, worked by hand)', () => {
    // X₀(Si) = 21.82 g/cm² and ρ = 2.329 g/cm³ (PDG, memory); β = p/√(p² + m_μ²), m_μ = 105.6583755 MeV (PDG).
    expect(highlandTheta0InMaterial(MUON_MINUS, material('silicon'), 1, 300e-6)).toBeCloseTo(6.052834e-4, 9);
  });
  it('0.5 GeV/c proton through 1 cm of water: 8.8689 mrad; 2 GeV/c α through 1 cm of aluminium: 9.9002 mrad', () => {
    // Water X₀ = 36.08 g/cm², aluminium 24.01 g/cm² at 2.699 g/cm³ (PDG, memory); the α's log carries z².
    expect(highlandTheta0InMaterial(PROTON, material('water'), 0.5, 0.01)).toBeCloseTo(8.868886e-3, 8);
    expect(highlandTheta0InMaterial(ALPHA, material('aluminium'), 2, 0.01)).toBeCloseTo(9.900174e-3, 8);
  });
  it('radiationLengthM = X₀ / ρ in metres: water 0.3608 m, aluminium 0.08896 m', () => {
    expect(radiationLengthM(material('water'))).toBeCloseTo(0.3608, 10);
    expect(radiationLengthM(material('aluminium'))).toBeCloseTo(24.01 / 2.699 / 100, 12);
  });
  it('the validity window 1e-3 ≤ x/X₀ ≤ 100 is closed; outside the warning names the value', () => {
    expect(Number.isFinite(highlandTheta0({ momentumGeV: 1, beta: 1, charge: 1, thicknessOverX0: 1e-3 }))).toBe(true);
    expect(Number.isFinite(highlandTheta0({ momentumGeV: 1, beta: 1, charge: 1, thicknessOverX0: 100 }))).toBe(true);
    expect(consumeWarnings()).toHaveLength(0);
    expect(highlandTheta0({ momentumGeV: 1, beta: 1, charge: 1, thicknessOverX0: 100.001 })).toBeNaN();
    const w = consumeWarnings();
    expect(w.map((x) => [x.code, x.source])).toEqual([['OUTSIDE_VALIDITY', 'highlandTheta0']]);
    expect(w[0].message).toBe('highlandTheta0: x/X₀ = 100.001 is outside 0.001–100 where the formula holds to 11 %; result is NaN');
  });
  it('refuses p ≤ 0, β ≤ 0, β > 1 and a non-positive path as bad calls; β = 1 is allowed', () => {
    const ok = { momentumGeV: 1, beta: 1, charge: 1, thicknessOverX0: 0.1 };
    expect(() => highlandTheta0(ok)).not.toThrow();
    expect(() => highlandTheta0({ ...ok, momentumGeV: 0 })).toThrow(SagittaError);
    expect(() => highlandTheta0({ ...ok, momentumGeV: 0 })).toThrow('momentumGeV/beta = [0,1] is not valid: expected p > 0 GeV/c and 0 < β ≤ 1');
    expect(() => highlandTheta0({ ...ok, beta: 0 })).toThrow(SagittaError);
    expect(() => highlandTheta0({ ...ok, beta: 1.0000001 })).toThrow(/p > 0 GeV\/c and 0 < β ≤ 1/);
    expect(() => highlandTheta0InMaterial(MUON_MINUS, material('silicon'), 1, 0)).toThrow('pathM = 0 is not valid: expected a positive path length in metres');
    expect(() => highlandTheta0InMaterial(MUON_MINUS, material('silicon'), 1, -1e-3)).toThrow(SagittaError);
  });
  it('negative charge enters as |z|', () => {
    const a = highlandTheta0({ momentumGeV: 1, beta: 0.9, charge: -2, thicknessOverX0: 0.05 });
    expect(a).toBe(highlandTheta0({ momentumGeV: 1, beta: 0.9, charge: 2, thicknessOverX0: 0.05 }));
    expect(a).toBeGreaterThan(0);
  });
});

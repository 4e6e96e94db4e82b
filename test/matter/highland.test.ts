import { beforeEach, describe, expect, it } from 'vitest';
import { consumeWarnings } from '../../lib/warnings.js';
import { MUON_MINUS } from '../../lib/particles.js';
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

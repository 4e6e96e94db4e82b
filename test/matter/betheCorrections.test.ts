import { describe, expect, it } from 'vitest';
import { ELEMENTS, material, type Material } from '../../lib/matter/index.js';
import { blochCorrection, materialShellCorrection, shellCorrectionOverZ, shellFromMoments, shellMoments } from '../../lib/matter/betheCorrections.js';

// Shell correction (Barkas & Berger 1964, as in ICRU Report 37 and Leo 2nd ed. eq. 2.33, form
// recalled (memory)) and Bloch term (PDG RPP), lib/matter/betheCorrections.ts.

/** The Barkas–Berger C(I [eV], η) worked out here from the published coefficients. */
function barkasBerger(iEV: number, eta: number): number {
  const e2 = eta ** -2;
  return (0.422377 * e2 + 0.0304043 * e2 ** 2 - 0.00038106 * e2 ** 3) * 1e-6 * iEV ** 2
    + (3.858019 * e2 - 0.1667989 * e2 ** 2 + 0.00157955 * e2 ** 3) * 1e-9 * iEV ** 3;
}

describe('shellCorrectionOverZ (Barkas–Berger)', () => {
  it('aluminium (I = 166 eV, Z = 13) at βγ = 0.5: C/Z = 0.0090873; lead (823 eV, 82) at βγ = 1: 0.028841', () => {
    // Evaluated by hand from the coefficients above (common practice).
    expect(shellCorrectionOverZ(ELEMENTS.Al, 0.5)).toBeCloseTo(0.0090873, 6);
    expect(shellCorrectionOverZ(ELEMENTS.Pb, 1)).toBeCloseTo(0.028841, 5);
    expect(shellCorrectionOverZ(ELEMENTS.Al, 0.5)).toBeCloseTo(barkasBerger(166, 0.5) / 13, 14);
  });
  it('every one of the six terms counts: agreement to 1e-12 over η = 0.13 … 3 with the formula written out', () => {
    let checked = 0;
    for (const eta of [0.13, 0.2, 0.35, 0.7, 1.5, 3]) {
      for (const el of [ELEMENTS.H, ELEMENTS.O, ELEMENTS.Pb]) {
        expect(shellCorrectionOverZ(el, eta) / (barkasBerger(el.meanExcitationEV, eta) / el.atomicNumber), `${el.symbol} η = ${eta}`).toBeCloseTo(1, 12);
        checked++;
      }
    }
    expect(checked).toBe(18);
  });
  it('is frozen below η = 0.13 (the formula turns over there): η = 0.05 gives the η = 0.13 value, 0.101263 for Al', () => {
    expect(shellCorrectionOverZ(ELEMENTS.Al, 0.13)).toBeCloseTo(0.1012631, 6);
    expect(shellCorrectionOverZ(ELEMENTS.Al, 0.05)).toBe(shellCorrectionOverZ(ELEMENTS.Al, 0.13));
    expect(shellCorrectionOverZ(ELEMENTS.Al, 0.1300001)).toBeLessThan(shellCorrectionOverZ(ELEMENTS.Al, 0.13));
  });
});

describe('materialShellCorrection: Bragg additivity over electrons (common practice)', () => {
  it('water at βγ = 0.3 is (2 C_H + C_O)/10 = 0.0098657 (H: I = 19.2 eV, O: 95 eV)', () => {
    // Per gram, H₂O has 2 electrons of H and 8 of O per molecule: ⟨C/Z⟩ = (2·C_H/1 + 8·C_O/8)/10.
    const expected = (2 * barkasBerger(19.2, 0.3) + barkasBerger(95, 0.3)) / 10;
    expect(expected).toBeCloseTo(0.0098657, 6);
    expect(materialShellCorrection(material('water'), 0.3) / expected).toBeCloseTo(1, 3);
  });
  it('a one-element material gives that element’s C/Z; its moments are I²/Z and I³/Z', () => {
    const al = material('aluminium');
    expect(materialShellCorrection(al, 0.4)).toBeCloseTo(shellCorrectionOverZ(ELEMENTS.Al, 0.4), 14);
    const [i2, i3] = shellMoments(al);
    expect(i2).toBeCloseTo(166 ** 2 / 13, 9);
    expect(i3).toBeCloseTo(166 ** 3 / 13, 6);
    expect(shellFromMoments(i2, i3, 0.05)).toBe(shellFromMoments(i2, i3, 0.13));
  });
  it('skips a constituent that is not in the element list (its electrons go to the rest); none known → 0', () => {
    const al = material('aluminium');
    const withUnknown: Material = { ...al, composition: [...al.composition, { atomicNumber: 119, atomicMassGmol: 300, massFraction: 0.5 }] };
    expect(shellMoments(withUnknown)).toEqual(shellMoments(al));
    const none: Material = { ...al, composition: [{ atomicNumber: 119, atomicMassGmol: 300, massFraction: 1 }] };
    expect(shellMoments(none)).toEqual([0, 0]);
    expect(materialShellCorrection(none, 0.5)).toBe(0);
  });
});

describe('blochCorrection (PDG RPP closed form of ψ(1) − Re ψ(1 + iy))', () => {
  /** −y² Σ 1/(n(n² + y²)): the defining series (Bloch 1933; PDG RPP), summed to n = 10⁵. */
  const series = (y: number) => {
    let s = 0;
    for (let n = 1; n <= 100000; n++) s += 1 / (n * (n * n + y * y));
    return -y * y * s;
  };
  it('proton at β = 0.1 (y = α/β = 0.072974): −0.0063717, the series −0.0063719', () => {
    expect(blochCorrection(1, 0.1)).toBeCloseTo(-0.0063717, 7);
    expect(blochCorrection(-1, 0.1)).toBe(blochCorrection(1, 0.1));
  });
  it('follows the defining series to its stated accuracy: within 2.5e-3 relative for y ≤ 0.4 (α at β = 0.04)', () => {
    // Measured: 2.4e-5 at y = 0.073, 1.4e-4 at 0.146, 1.1e-3 at 0.29, 2.0e-3 at 0.365.
    const documented: [number, number, number][] = [[1, 0.1, 2.4e-5], [2, 0.1, 1.43e-4], [2, 0.05, 1.06e-3], [1, 0.02, 1.96e-3]];
    for (const [z, beta, dev] of documented) {
      const y = (z * 7.2973525693e-3) / beta;
      const d = Math.abs(blochCorrection(z, beta) / series(y) - 1);
      expect(Math.abs(d - dev), `z = ${z}, β = ${beta}`).toBeLessThan(0.1 * dev);
    }
  });
  it('goes as −1.20206 y² (ζ(3)) for small y and scales with z² at leading order (α vs proton at β = 0.9)', () => {
    const y = 7.2973525693e-3 / 0.9;
    // Next order of the closed form: 1 − (1.042/1.20206) y² (ζ(3) = 1.2020569, common practice).
    expect(blochCorrection(1, 0.9) / (-1.20206 * y * y)).toBeCloseTo(1 - (1.042 / 1.20206) * y * y, 8);
    expect(blochCorrection(1, 0.9) / (-1.2020569 * y * y)).toBeCloseTo(1, 3);
    // z² at leading order; the y⁴ term lowers the ratio by 1.042·3y²/1.20206 = 1.7e-4 (common practice).
    expect(blochCorrection(2, 0.9) / blochCorrection(1, 0.9)).toBeCloseTo(4 * (1 - (3 * 1.042 / 1.20206) * y * y), 5);
  });
});

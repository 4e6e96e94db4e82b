import { beforeEach, describe, expect, it } from 'vitest';
import { consumeWarnings } from '../../lib/warnings.js';
import { material } from '../../lib/matter/materials.js';
import {
  curvatureSigmaEquallySpaced, curvatureSigmaLeastSquares, glucksternCurvatureSigma, momentumResolution,
  multipleScatteringCurvatureSigma,
} from '../../lib/track/resolution.js';

// Edge cases and an independent normal-matrix inversion for lib/track/resolution (added when
// mutation testing showed them untested; test/mutation.md). Weighted least squares: common practice.
beforeEach(() => void consumeWarnings());

/** σ(κ) of y = a + b s + κ s²/2 by inverting AᵀWA with the general 3×3 adjugate, uncentred. */
function sigmaKappaByInversion(s: number[], sigma: number[]): number {
  const m = [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
  for (let i = 0; i < s.length; i++) {
    const row = [1, s[i], 0.5 * s[i] * s[i]], w = 1 / sigma[i] ** 2;
    for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) m[r][c] += w * row[r] * row[c];
  }
  const det = m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) - m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) + m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0]);
  return Math.sqrt((m[0][0] * m[1][1] - m[0][1] * m[1][0]) / det);
}

describe('curvatureSigmaLeastSquares against an independent inversion', () => {
  it('uneven positions with per-point errors agree to 1e-9, and a shift by 1 km changes nothing', () => {
    const s = [-0.4, -0.31, -0.05, 0.02, 0.2, 0.33, 0.61], sigma = [1e-4, 2e-4, 1.5e-4, 3e-4, 1e-4, 2.5e-4, 1.2e-4];
    const got = curvatureSigmaLeastSquares(Float64Array.from(s), Float64Array.from(sigma));
    expect(Math.abs(got / sigmaKappaByInversion(s, sigma) - 1)).toBeLessThan(1e-9);
    // κ does not depend on where s = 0 is; far from the origin only the centred sums stay accurate.
    const far = curvatureSigmaLeastSquares(Float64Array.from(s, (v) => v + 1000), Float64Array.from(sigma));
    expect(Math.abs(far / got - 1)).toBeLessThan(1e-9);
  });
  it('bad calls name the argument and what is expected', () => {
    expect(() => curvatureSigmaLeastSquares(Float64Array.of(0, 1), 1e-4)).toThrow(/positionsM = 2.*at least 3 measured points/);
    expect(() => curvatureSigmaLeastSquares(Float64Array.of(0, 1, 2), Float64Array.of(1e-4, 1e-4))).toThrow(/sigmaM = 2.*one error per point \(3\)/);
    expect(() => curvatureSigmaLeastSquares(Float64Array.of(0, 1, 2), Float64Array.of(1e-4, 0, 1e-4))).toThrow(/sigmaM = 0.*positive point errors in metres/);
    expect(() => curvatureSigmaLeastSquares(Float64Array.of(0, 1, 2), -1e-4)).toThrow(/sigmaM = -0.0001/);
  });
  it('points at only two distinct positions cannot fix a parabola: NaN, not Infinity', () => {
    // Centred sums are exact here and the normal matrix is singular (det = 0, cofactor 16).
    expect(curvatureSigmaLeastSquares(Float64Array.of(-1, -1, 1, 1), 1)).toBeNaN();
  });
});

describe('equally spaced forms: bad calls and the Gluckstern warning', () => {
  it('nPoints must be an integer ≥ 3, σ and L positive, each named in the message', () => {
    for (const f of [curvatureSigmaEquallySpaced, glucksternCurvatureSigma]) {
      expect(() => f({ nPoints: 2, sigmaM: 1e-4, lengthM: 1 })).toThrow(/nPoints = 2.*an integer ≥ 3/);
      expect(() => f({ nPoints: 10.5, sigmaM: 1e-4, lengthM: 1 })).toThrow(/nPoints = 10.5/);
      expect(() => f({ nPoints: 10, sigmaM: 0, lengthM: 1 })).toThrow(/sigmaM = 0.*a positive point error in metres/);
      expect(() => f({ nPoints: 10, sigmaM: 1e-4, lengthM: 0 })).toThrow(/lengthM = 0.*a positive track length in metres/);
    }
    expect(curvatureSigmaEquallySpaced({ nPoints: 3, sigmaM: 1e-4, lengthM: 1 })).toBeGreaterThan(0);
  });
  it('Gluckstern below N = 10 warns with the reason and where it came from', () => {
    expect(glucksternCurvatureSigma({ nPoints: 9, sigmaM: 1e-4, lengthM: 1 })).toBeNaN();
    const [w] = consumeWarnings();
    expect([w.code, w.source]).toEqual(['OUTSIDE_VALIDITY', 'glucksternCurvatureSigma']);
    expect(w.message).toBe('glucksternCurvatureSigma: N = 9 < 10 where the (N+4) form holds; use curvatureSigmaEquallySpaced; result is NaN');
  });
});

describe('multipleScatteringCurvatureSigma and momentumResolution: scaling and bad calls', () => {
  const base = { momentumGeV: 1, beta: 1, lengthM: 1, radiationLengthM: 100 };
  it('σ(κ)_MS ∝ |z| and ∝ 1/cos²λ (PDG detector review form)', () => {
    const one = multipleScatteringCurvatureSigma(base);
    expect(multipleScatteringCurvatureSigma({ ...base, charge: -2 }) / one).toBeCloseTo(2, 12);
    expect(multipleScatteringCurvatureSigma({ ...base, dipAngleRad: 0.5 }) / one).toBeCloseTo(1 / Math.cos(0.5) ** 2, 12);
  });
  it('each of p, β, L and X₀ out of range is a bad call (β may be 1, not above)', () => {
    for (const bad of [{ momentumGeV: 0 }, { beta: 0 }, { beta: 1.01 }, { lengthM: 0 }, { radiationLengthM: 0 }]) {
      expect(() => multipleScatteringCurvatureSigma({ ...base, ...bad }), JSON.stringify(bad)).toThrow(/momentumGeV\/beta\/lengthM\/radiationLengthM = .*positive values with β ≤ 1/);
    }
    expect(() => multipleScatteringCurvatureSigma({ ...base, momentumGeV: 0 })).toThrow('momentumGeV/beta/lengthM/radiationLengthM = [0,1,1,100] is not valid');
    expect(multipleScatteringCurvatureSigma({ ...base, beta: 1 })).toBeGreaterThan(0);
  });
  it('momentumResolution uses the nPoints given, divides by |z|, and refuses a zero or non-finite field and p ≤ 0', () => {
    const r = momentumResolution({ momentumGeV: 2, fieldT: 1.5, lengthM: 1, sigmaM: 1e-4, nPoints: 20 });
    const kappaSigma = curvatureSigmaEquallySpaced({ nPoints: 20, sigmaM: 1e-4, lengthM: 1 });
    expect(r.measurement).toBeCloseTo((kappaSigma * 2) / (0.299792458 * 1.5), 12);
    const alpha = momentumResolution({ momentumGeV: 2, fieldT: 1.5, lengthM: 1, sigmaM: 1e-4, nPoints: 20, charge: 2, material: material('argon-gas') });
    const single = momentumResolution({ momentumGeV: 2, fieldT: 1.5, lengthM: 1, sigmaM: 1e-4, nPoints: 20, material: material('argon-gas') });
    expect(alpha.measurement / single.measurement).toBeCloseTo(0.5, 12);
    expect(alpha.multipleScattering / single.multipleScattering).toBeCloseTo(1, 12); // |z| in the kick cancels the |z| in the bend
    const ok = { momentumGeV: 1, lengthM: 1, sigmaM: 1e-4 };
    expect(() => momentumResolution({ ...ok, fieldT: 0 })).toThrow(/fieldT = 0.*a non-zero magnetic field in tesla/);
    expect(() => momentumResolution({ ...ok, fieldT: Number.NaN })).toThrow(/fieldT = NaN/);
    expect(() => momentumResolution({ ...ok, fieldT: Infinity })).toThrow(/fieldT = Infinity/);
    expect(() => momentumResolution({ ...ok, fieldT: 1, momentumGeV: 0 })).toThrow(/momentumGeV = 0.*a positive momentum in GeV\/c/);
    expect(momentumResolution({ ...ok, fieldT: -1 }).measurement).toBeCloseTo(momentumResolution({ ...ok, fieldT: 1 }).measurement, 15);
  });
});

import { beforeEach, describe, expect, it } from 'vitest';
import { consumeWarnings } from '../../lib/warnings.js';
import { material } from '../../lib/matter/materials.js';
import {
  curvatureSigmaEquallySpaced, curvatureSigmaLeastSquares, glucksternCurvatureSigma, momentumResolution,
  multipleScatteringCurvatureSigma,
} from '../../lib/track/resolution.js';
import { radiationLengthM } from '../../lib/matter/highland.js';

beforeEach(() => void consumeWarnings());
const rel = (a: number, b: number) => Math.abs(a / b - 1);

/** Small seeded generator for the Monte-Carlo (mulberry32 + Box–Muller); test-local on purpose. */
function gaussianStream(seed: number): () => number {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

/** Plain least-squares parabola through (s, y): returns κ = 2c of y = a + b s + c s² (Cramer's rule). */
function fitCurvature(s: Float64Array, y: Float64Array): number {
  let n = 0, sx = 0, sx2 = 0, sx3 = 0, sx4 = 0, sy = 0, sxy = 0, sx2y = 0;
  for (let i = 0; i < s.length; i++) {
    const x = s[i], x2 = x * x;
    n++; sx += x; sx2 += x2; sx3 += x2 * x; sx4 += x2 * x2; sy += y[i]; sxy += x * y[i]; sx2y += x2 * y[i];
  }
  const det3 = (m: number[][]) => m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) - m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) + m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0]);
  const A = [[n, sx, sx2], [sx, sx2, sx3], [sx2, sx3, sx4]];
  const C = [[n, sx, sy], [sx, sx2, sxy], [sx2, sx3, sx2y]];
  return (2 * det3(C)) / det3(A);
}

describe('curvature error from the point errors', () => {
  it('Gluckstern: σ(κ) = (σ/L²)√(720/(N+4)) (Gluckstern, NIM 24 (1963) 381)', () => {
    expect(glucksternCurvatureSigma({ nPoints: 10, sigmaM: 1e-4, lengthM: 1 })).toBeCloseTo(1e-4 * Math.sqrt(720 / 14), 15);
  });
  it('the exact least-squares σ(κ) equals the closed equally-spaced form for N = 3…100', () => {
    for (const n of [3, 4, 7, 10, 33, 100]) {
      const s = new Float64Array(n).map((_, i) => (0.8 * i) / (n - 1));
      expect(rel(curvatureSigmaLeastSquares(s, 2e-4), curvatureSigmaEquallySpaced({ nPoints: n, sigmaM: 2e-4, lengthM: 0.8 })), `N = ${n}`).toBeLessThan(1e-9);
    }
  });
  it('Gluckstern’s (N+4) form is within 3.5 % of the exact value for N ≥ 10 and converges as N grows', () => {
    for (const n of [10, 20, 50, 200]) {
      const g = glucksternCurvatureSigma({ nPoints: n, sigmaM: 1e-4, lengthM: 1 });
      expect(rel(g, curvatureSigmaEquallySpaced({ nPoints: n, sigmaM: 1e-4, lengthM: 1 }))).toBeLessThan(0.035);
    }
  });
  it('halving the track length quadruples σ(κ) (fact of the trade: σ(κ) ∝ L⁻²)', () => {
    const a = curvatureSigmaEquallySpaced({ nPoints: 12, sigmaM: 1e-4, lengthM: 1 });
    const b = curvatureSigmaEquallySpaced({ nPoints: 12, sigmaM: 1e-4, lengthM: 0.5 });
    expect(b / a).toBeCloseTo(4, 12);
  });
  it('matches a Monte-Carlo of the fit itself: 4000 arcs of N = 12 points, spread of fitted κ within 5 %', () => {
    const gauss = gaussianStream(20260402);
    const n = 12, L = 0.6, sigma = 3e-4, kTrue = 0.5; // R = 2 m, sagitta ≈ 22 mm
    const s = new Float64Array(n).map((_, i) => (L * i) / (n - 1));
    const trials = 4000;
    let sum = 0, sum2 = 0;
    const y = new Float64Array(n);
    for (let t = 0; t < trials; t++) {
      for (let i = 0; i < n; i++) y[i] = 0.5 * kTrue * s[i] * s[i] + sigma * gauss();
      const k = fitCurvature(s, y);
      sum += k; sum2 += k * k;
    }
    const mean = sum / trials;
    const sd = Math.sqrt(sum2 / trials - mean * mean);
    // Statistical error of an rms from 4000 draws ≈ 1/√(2·4000) ≈ 1.1 %; 5 % is > 4σ.
    expect(rel(sd, curvatureSigmaEquallySpaced({ nPoints: n, sigmaM: sigma, lengthM: L }))).toBeLessThan(0.05);
    expect(Math.abs(mean - kTrue)).toBeLessThan(4 * sd / Math.sqrt(trials));
  });
  it('uneven points: clustering the points at the ends beats equal spacing (least-squares design)', () => {
    const even = new Float64Array(10).map((_, i) => i / 9);
    const ends = Float64Array.from([0, 0, 0, 0.5, 0.5, 0.5, 0.5, 1, 1, 1]);
    expect(curvatureSigmaLeastSquares(ends, 1e-4)).toBeLessThan(curvatureSigmaLeastSquares(even, 1e-4));
  });
  it('Gluckstern below N = 10 is NaN + warning', () => {
    expect(glucksternCurvatureSigma({ nPoints: 5, sigmaM: 1e-4, lengthM: 1 })).toBeNaN();
    expect(consumeWarnings()[0].code).toBe('OUTSIDE_VALIDITY');
  });
});

describe('multiple-scattering term and the budget', () => {
  it('σ(κ)_MS equals the PDG 0.016 GeV/c · √(L/X₀) / (L β p) within 2 % ((memory) for the constant)', () => {
    const L = 1, X0 = 110, p = 2;
    const pdg = (0.016 * Math.sqrt(L / X0)) / (L * p);
    expect(rel(multipleScatteringCurvatureSigma({ momentumGeV: p, beta: 1, lengthM: L, radiationLengthM: X0 }), pdg)).toBeLessThan(0.02);
  });
  it('momentumResolution: measurement ∝ p, MS flat in p for β = 1, total in quadrature', () => {
    const base = { fieldT: 1.5, lengthM: 1, sigmaM: 1.5e-4, nPoints: 40, material: material('argon-gas') } as const;
    const a = momentumResolution({ ...base, momentumGeV: 1 });
    const b = momentumResolution({ ...base, momentumGeV: 10 });
    expect(b.measurement / a.measurement).toBeCloseTo(10, 10);
    expect(b.multipleScattering).toBeCloseTo(a.multipleScattering, 14);
    expect(a.total).toBeCloseTo(Math.hypot(a.measurement, a.multipleScattering), 15);
    // σp/p from the MS term = σκ_MS / κ with κ = 0.2998 B / p (p_T = 0.2998 B R, common practice).
    const k = (0.299792458 * 1.5) / 1;
    expect(a.multipleScattering).toBeCloseTo(multipleScatteringCurvatureSigma({ momentumGeV: 1, beta: 1, lengthM: 1, radiationLengthM: radiationLengthM(material('argon-gas')) }) / k, 12);
  });
  it('without a material the MS term is 0; with uneven positions the measurement term uses them', () => {
    const r = momentumResolution({ momentumGeV: 1, fieldT: 1, lengthM: 1, sigmaM: 1e-4, positionsM: Float64Array.from([0, 0.1, 0.5, 0.9, 1]) });
    expect(r.multipleScattering).toBe(0);
    expect(r.measurement).toBeCloseTo(curvatureSigmaLeastSquares(Float64Array.from([0, 0.1, 0.5, 0.9, 1]), 1e-4) / 0.299792458, 12);
  });
});

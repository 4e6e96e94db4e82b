import { describe, expect, it } from 'vitest';
import { KAON_SHORT, LAMBDA, PION_MINUS, PION_PLUS, PROTON } from '../../lib/particles.js';
import { seededRandom } from '../../lib/simulate/rng.js';
import { twoBodyDecay } from '../../lib/simulate/twoBodyDecay.js';
import { armenteros, boostFourVector, fourMomentum, invariantMassMeV, invariantMassWithError, toRestFrame, twoBodyMomentumMeV } from '../../lib/vertex/index.js';

// PDG RPP 2022 listings; see test/fixtures/pdg-decays/README.md.
const PDG_P_KS_PIPI = 206;
const PDG_P_LAMBDA_PPI = 101;

describe('four-vectors and boosts (special relativity; PDG RPP "Kinematics")', () => {
  it('twoBodyMomentumMeV: K⁰_S → π⁺π⁻ 206 MeV/c and Λ → pπ⁻ 101 MeV/c (PDG listings, rounded to 1 MeV/c: ±0.5)', () => {
    expect(Math.abs(twoBodyMomentumMeV(KAON_SHORT.massMeV, PION_PLUS.massMeV, PION_MINUS.massMeV) - PDG_P_KS_PIPI)).toBeLessThan(0.5);
    expect(Math.abs(twoBodyMomentumMeV(LAMBDA.massMeV, PROTON.massMeV, PION_MINUS.massMeV) - PDG_P_LAMBDA_PPI)).toBeLessThan(0.5);
    expect(twoBodyMomentumMeV(200, 139.57, 139.57)).toBeNaN();
  });

  it('toRestFrame(parent, parent) is (m, 0, 0, 0); boosting by β then −β is the identity (1e-9 relative); mass is invariant', () => {
    const rng = seededRandom(3);
    let runs = 0;
    for (let i = 0; i < 200; i++) {
      const p = fourMomentum(2000 * (rng.uniform() - 0.5), 2000 * (rng.uniform() - 0.5), 3000 * rng.uniform(), LAMBDA.massMeV);
      const rest = toRestFrame(p, p);
      expect(Math.abs(rest[0] - LAMBDA.massMeV)).toBeLessThan(1e-9 * p[0]);
      for (const k of [1, 2, 3]) expect(Math.abs(rest[k])).toBeLessThan(1e-9 * p[0]);
      const b = [0.9 * (rng.uniform() - 0.5), 0.9 * (rng.uniform() - 0.5), 0.9 * (rng.uniform() - 0.5)];
      const there = boostFourVector(p, b[0], b[1], b[2]);
      const back = boostFourVector(there, -b[0], -b[1], -b[2]);
      for (const k of [0, 1, 2, 3]) expect(Math.abs(back[k] - p[k])).toBeLessThan(1e-9 * p[0]);
      expect(Math.abs(invariantMassMeV(there) - LAMBDA.massMeV)).toBeLessThan(1e-8 * p[0]);
      runs++;
    }
    expect(runs).toBe(200);
    expect(boostFourVector([1, 0, 0, 0], 0.6, 0.6, 0.6)[0]).toBeNaN();
  });

  it('invariantMassMeV of N bodies: three photons of a π⁰-like system at rest (exact), and space-like input is NaN', () => {
    const e = 45;
    const gammas = [0, 2, 4].map((k) => [e, e * Math.cos((k * Math.PI) / 3), e * Math.sin((k * Math.PI) / 3), 0]);
    expect(invariantMassMeV(...gammas)).toBeCloseTo(135, 10);
    expect(invariantMassMeV([1, 5, 0, 0])).toBeNaN();
  });
});

describe('armenteros (Podolanski & Armenteros, Phil. Mag. 45 (1954) 13)', () => {
  it('a symmetric pair has α = 0 and q_T = the transverse momentum', () => {
    const a = armenteros([100, 50, 0], [100, -50, 0]);
    expect(a.alpha).toBeCloseTo(0, 12);
    expect(a.qtMeV).toBeCloseTo(50, 12);
  });

  it('Λ → pπ⁻ at any momentum lies on the ellipse ((α − α₀)βM/2p*)² + (q_T/p*)² = 1, α₀ = (m_p² − m_π²)/M² (1e-9)', () => {
    const rng = seededRandom(11);
    const pStar = twoBodyMomentumMeV(LAMBDA.massMeV, PROTON.massMeV, PION_MINUS.massMeV);
    const alpha0 = (PROTON.massMeV ** 2 - PION_MINUS.massMeV ** 2) / LAMBDA.massMeV ** 2;
    let runs = 0;
    for (let i = 0; i < 500; i++) {
      const p = [400 * rng.gaussian(), 400 * rng.gaussian(), 300 + 3000 * rng.uniform()];
      const d = twoBodyDecay(LAMBDA.massMeV, p[0], p[1], p[2], PROTON.massMeV, PION_MINUS.massMeV, rng);
      const beta = Math.hypot(p[0], p[1], p[2]) / Math.hypot(Math.hypot(p[0], p[1], p[2]), LAMBDA.massMeV);
      const a = armenteros(d.first.slice(1), d.second.slice(1));
      const u = ((a.alpha - alpha0) * beta * LAMBDA.massMeV) / (2 * pStar);
      expect(Math.abs(u * u + (a.qtMeV / pStar) ** 2 - 1)).toBeLessThan(1e-9);
      runs++;
    }
    expect(runs).toBe(500);
  });
});

describe('invariantMassWithError (first-order propagation)', () => {
  it('σ_m matches the spread of m over 4000 Gaussian draws of the momenta (±5 %; statistical σ of the spread 1.1 %)', () => {
    const rng = seededRandom(5);
    const p1 = [180, 40, 30], p2 = [-60, 150, 20];
    // Covariances: diagonal 2–4 (MeV/c)² plus a correlation.
    const c1 = [4, 1, 0, 1, 3, 0.5, 0, 0.5, 2], c2 = [3, -0.8, 0, -0.8, 4, 0, 0, 0, 2.5];
    const { massMeV, sigmaMeV } = invariantMassWithError([
      { pMeV: p1, covMeV2: c1, massMeV: PION_PLUS.massMeV }, { pMeV: p2, covMeV2: c2, massMeV: PION_MINUS.massMeV },
    ]);
    const draw = (p: number[], c: number[]) => {
      // Cholesky of the 3×3 covariance.
      const l00 = Math.sqrt(c[0]), l10 = c[3] / l00, l20 = c[6] / l00;
      const l11 = Math.sqrt(c[4] - l10 * l10), l21 = (c[7] - l20 * l10) / l11, l22 = Math.sqrt(c[8] - l20 * l20 - l21 * l21);
      const g = [rng.gaussian(), rng.gaussian(), rng.gaussian()];
      return [p[0] + l00 * g[0], p[1] + l10 * g[0] + l11 * g[1], p[2] + l20 * g[0] + l21 * g[1] + l22 * g[2]];
    };
    const n = 4000;
    let s = 0, s2 = 0;
    for (let i = 0; i < n; i++) {
      const a = draw(p1, c1), b = draw(p2, c2);
      const m = invariantMassMeV(fourMomentum(a[0], a[1], a[2], PION_PLUS.massMeV), fourMomentum(b[0], b[1], b[2], PION_MINUS.massMeV));
      s += m; s2 += m * m;
    }
    const mean = s / n, sd = Math.sqrt(s2 / n - mean * mean);
    expect(Math.abs(mean - massMeV)).toBeLessThan(4 * sd / Math.sqrt(n));
    expect(Math.abs(sd / sigmaMeV - 1)).toBeLessThan(0.05);
  });
});

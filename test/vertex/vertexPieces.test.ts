import { describe, expect, it } from 'vitest';
import { chamberMedium, type Medium, type SpeciesLoss } from '../../lib/matter/index.js';
import { ALPHA, PION_MINUS, PION_PLUS, PROTON, type Particle } from '../../lib/particles.js';
import {
  arcLengthNear, armenteros, boostFourVector, circleCrossings, closestApproach, decayWindowInBox, energyLossFactor, fitLifetime, fitMassPeak,
  fitTwoTrackVertex, fourMomentum, helixCentre, helixPoint, helixPointJacobian, invariantMassMeV, invariantMassWithError,
  nearestArcLength, newClosestApproachScratch, newHelixParameters, newTrackState, refineClosestApproach, sumFourVectors, trackStateAt, twoBodyMomentumMeV, type HelixParameters,
} from '../../lib/vertex/index.js';
import { sinc } from '../../lib/vertex/helixParameters.js';
import { kineticFromMomentum, momentumFromKinetic } from '../../lib/matter/kinematics.js';
import { seededRandom } from '../../lib/simulate/rng.js';

// Hand-derived cases for the small pieces of lib/vertex: each expected number is computed here
// by a different route (closed forms, finite differences, exact arithmetic) from the code's.

function helix(p: Partial<Omit<HelixParameters, 'cov'>>): HelixParameters {
  return Object.assign(newHelixParameters(), p);
}

describe('four-vectors, boosts and two-body momenta (hand-derived values)', () => {
  it('fourMomentum gives E = √(p² + m²) (3-4-12-13 exact); sumFourVectors adds components, and of nothing is 0', () => {
    expect(fourMomentum(3, 4, 12, 0)).toEqual([13, 3, 4, 12]);
    expect(fourMomentum(0, 0, 0, 139.5)).toEqual([139.5, 0, 0, 0]);
    expect(fourMomentum(2, 3, 6, 24)[0]).toBe(25);
    expect(sumFourVectors([1, 2, 3, 4], [10, 20, 30, 40], [100, 200, 300, 400])).toEqual([111, 222, 333, 444]);
    expect(sumFourVectors()).toEqual([0, 0, 0, 0]);
  });

  it('invariantMassMeV: back-to-back photons 2E; collinear ones 0, also when rounding makes m² −5e-18; m² below −1e-9 E² is NaN, above it 0', () => {
    expect(invariantMassMeV([5, 5, 0, 0], [5, -5, 0, 0])).toBe(10);
    expect(invariantMassMeV([0, 0, 3, 4], [0, 0, -3, -4], [26, 0, 0, 0])).toBe(26);
    // 0.3² − (0.1 + 0.2)² = −5.6e-18 in doubles: rounding, returned as 0.
    expect(invariantMassMeV([0.3, 0.1 + 0.2, 0, 0])).toBe(0);
    // m² = 1 − (1 + 1e-10)² ≈ −2e-10 > −1e-9 · E²: 0;  with 1e-8: −2e-8, NaN.
    expect(invariantMassMeV([1, 1 + 1e-10, 0, 0])).toBe(0);
    expect(invariantMassMeV([1, 0, 1 + 1e-8, 0])).toBeNaN();
    expect(invariantMassMeV([1, 0, 0, 1 + 1e-8])).toBeNaN();
    // The bound scales with E²: at E = 100, m² = −4e-6 is above −1e-5 (0), −4e-4 below (NaN).
    expect(invariantMassMeV([100, 100 + 2e-8, 0, 0])).toBe(0);
    expect(invariantMassMeV([100, 100 + 2e-6, 0, 0])).toBeNaN();
  });

  it('boostFourVector: a mass at rest seen from a frame moving at β = 0.6 along x, y, z (γ = 1.25 exact) has E = 1.25 m, p = −0.75 m along β', () => {
    const m = 2;
    expect(boostFourVector([m, 0, 0, 0], 0.6, 0, 0)).toEqual([2.5, -1.5, 0, 0]);
    expect(boostFourVector([m, 0, 0, 0], 0, 0.6, 0)).toEqual([2.5, 0, -1.5, 0]);
    expect(boostFourVector([m, 0, 0, 0], 0, 0, 0.6)).toEqual([2.5, 0, 0, -1.5]);
    // |β| = 1 exactly and above: no frame, NaN components.
    for (const b of [[1, 0, 0], [0.8, 0.6, 0], [0, 0, 1.2]]) for (const c of boostFourVector([m, 0.3, 0.2, 0.1], b[0], b[1], b[2])) expect(c).toBeNaN();
    expect(boostFourVector([m, 0.3, 0.2, 0.1], 0, 0, 0)).toEqual([m, 0.3, 0.2, 0.1]);
  });

  it('boostFourVector agrees with the matrix form Λ = [[γ, −γβᵀ], [−γβ, 1 + (γ − 1) β βᵀ/β²]] for 100 random vectors and velocities (1e-12 relative)', () => {
    const rng = seededRandom(41);
    for (let i = 0; i < 100; i++) {
      const v = fourMomentum(400 * (rng.uniform() - 0.5), 400 * (rng.uniform() - 0.5), 400 * (rng.uniform() - 0.5), 100 * rng.uniform());
      const b = [rng.uniform() - 0.5, rng.uniform() - 0.5, rng.uniform() - 0.5];
      const b2 = b[0] ** 2 + b[1] ** 2 + b[2] ** 2;
      const g = 1 / Math.sqrt(1 - b2);
      const bp = b[0] * v[1] + b[1] * v[2] + b[2] * v[3];
      const expected = [g * v[0] - g * bp, ...[0, 1, 2].map((k) => v[k + 1] - g * b[k] * v[0] + ((g - 1) * b[k] * bp) / b2)];
      const got = boostFourVector(v, b[0], b[1], b[2]);
      for (let k = 0; k < 4; k++) expect(Math.abs(got[k] - expected[k])).toBeLessThan(1e-12 * v[0] * g);
    }
  });

  it('twoBodyMomentumMeV: p* = √(E₁² − m₁²) with E₁ = (M² + m₁² − m₂²)/2M for unequal masses; 0 at threshold; NaN below', () => {
    for (const [M, m1, m2] of [[10, 3, 4], [10, 4, 3], [1115.683, 938.272, 139.570], [5, 0, 3], [7, 2, 0]]) {
      const e1 = (M * M + m1 * m1 - m2 * m2) / (2 * M);
      expect(Math.abs(twoBodyMomentumMeV(M, m1, m2) - Math.sqrt(e1 * e1 - m1 * m1))).toBeLessThan(1e-12 * M);
    }
    expect(twoBodyMomentumMeV(7, 3, 4)).toBe(0);
    expect(twoBodyMomentumMeV(6.999, 3, 4)).toBeNaN();
    // Below |m₁ − m₂| both factors are negative and their product positive: still closed, NaN.
    expect(twoBodyMomentumMeV(1, 5, 1)).toBeNaN();
  });

  it('armenteros: p⁺ = (4, 3, 0), p⁻ = (6, −3, 0) give α = −0.2, q_T = 3 (and the same along z); q_T = |p⁺ × n̂| for random pairs; no net momentum is NaN', () => {
    const a = armenteros([4, 3, 0], [6, -3, 0]);
    expect(a.alpha).toBeCloseTo(-0.2, 15);
    expect(a.qtMeV).toBeCloseTo(3, 14);
    const b = armenteros([0, 3, 4], [0, -3, 6]);
    expect(b.alpha).toBeCloseTo(-0.2, 15);
    expect(b.qtMeV).toBeCloseTo(3, 14);
    const rng = seededRandom(2);
    for (let i = 0; i < 50; i++) {
      const p = [rng.gaussian(), rng.gaussian(), rng.gaussian()].map((x) => 100 * x), q = [rng.gaussian(), rng.gaussian(), rng.gaussian()].map((x) => 100 * x);
      const s = [p[0] + q[0], p[1] + q[1], p[2] + q[2]], sn = Math.hypot(s[0], s[1], s[2]);
      const cross = Math.hypot(p[1] * s[2] - p[2] * s[1], p[2] * s[0] - p[0] * s[2], p[0] * s[1] - p[1] * s[0]) / sn;
      const lp = (p[0] * s[0] + p[1] * s[1] + p[2] * s[2]) / sn, lq = (q[0] * s[0] + q[1] * s[1] + q[2] * s[2]) / sn;
      const r = armenteros(p, q);
      expect(Math.abs(r.qtMeV - cross)).toBeLessThan(1e-10);
      expect(Math.abs(r.alpha - (lp - lq) / (lp + lq))).toBeLessThan(1e-10 * Math.max(1, Math.abs(r.alpha)));
    }
    const z = armenteros([1, 2, 3], [-1, -2, -3]);
    expect(z.alpha).toBeNaN();
    expect(z.qtMeV).toBeNaN();
  });
});

describe('invariantMassWithError: the first-order error equals gᵀCg with g from central differences of the mass', () => {
  it('two and three tracks with full covariances: σ_m to 1e-6 relative of the finite-difference propagation; m as invariantMassMeV', () => {
    const tracks = [
      { pMeV: [180, 40, 30], covMeV2: [4, 1, 0.3, 1, 3, 0.5, 0.3, 0.5, 2], massMeV: PION_PLUS.massMeV },
      { pMeV: [-60, 150, 20], covMeV2: [3, -0.8, 0.2, -0.8, 4, 0.1, 0.2, 0.1, 2.5], massMeV: PION_MINUS.massMeV },
      { pMeV: [20, -30, 250], covMeV2: [1.5, 0.2, -0.4, 0.2, 2, 0.3, -0.4, 0.3, 5], massMeV: PROTON.massMeV },
    ];
    for (const set of [tracks.slice(0, 2), tracks]) {
      const mass = (ps: number[][]) => invariantMassMeV(...ps.map((p, i) => fourMomentum(p[0], p[1], p[2], set[i].massMeV)));
      const base = set.map((t) => [...t.pMeV]);
      let variance = 0;
      for (let i = 0; i < set.length; i++) {
        const g = [0, 1, 2].map((k) => {
          const up = base.map((p) => [...p]), dn = base.map((p) => [...p]);
          up[i][k] += 1e-3; dn[i][k] -= 1e-3;
          return (mass(up) - mass(dn)) / 2e-3;
        });
        const c = set[i].covMeV2;
        for (let r = 0; r < 3; r++) for (let q = 0; q < 3; q++) variance += g[r] * c[3 * r + q] * g[q];
      }
      const got = invariantMassWithError(set);
      expect(Math.abs(got.massMeV - mass(base))).toBeLessThan(1e-9);
      expect(Math.abs(got.sigmaMeV / Math.sqrt(variance) - 1)).toBeLessThan(1e-6);
    }
  });

  it('refuses fewer than two tracks with the catalogue message; a massless collinear pair has m = 0 and σ NaN', () => {
    expect(() => invariantMassWithError([{ pMeV: [1, 0, 0], covMeV2: [1, 0, 0, 0, 1, 0, 0, 0, 1], massMeV: 0 }])).toThrow(
      'tracks.length = 1 is not valid: expected at least two tracks');
    const eye = [1, 0, 0, 0, 1, 0, 0, 0, 1];
    const r = invariantMassWithError([{ pMeV: [3, 0, 0], covMeV2: eye, massMeV: 0 }, { pMeV: [5, 0, 0], covMeV2: eye, massMeV: 0 }]);
    expect(r.massMeV).toBe(0);
    expect(r.sigmaMeV).toBeNaN();
    // Collinear photons of TeV energies: rounding leaves m² = −9.8e-4 MeV² (a bound of −1e-9 E² = −1.1e4): m = 0.
    const big = invariantMassWithError([
      { pMeV: [600000.222, 800000.2960000001, 0], covMeV2: eye, massMeV: 0 }, { pMeV: [1380000.6779999998, 1840000.904, 0], covMeV2: eye, massMeV: 0 },
    ]);
    expect(big.massMeV).toBe(0);
    expect(big.sigmaMeV).toBeNaN();
  });
});

describe('helix geometry (circle identities and finite differences)', () => {
  it('sinc: 1 at 0, the series below 1e-4 and sin h/h above agree with sin h/h to 1e-16', () => {
    expect(sinc(0)).toBe(1);
    for (const h of [5e-5, -9e-5, 2e-4, 0.3, -2]) expect(Math.abs(sinc(h) - Math.sin(h) / h)).toBeLessThan(2e-16);
  });

  it('helixPoint: at s = 0 the point is ref + d0 (sin φ0, −cos φ0); every point lies 1/|κ| from helixCentre, z rises by s tan λ', () => {
    const h = helix({ xRef: 0.3, yRef: -0.1, kappa: -2.5, phi0: 0.7, d0: 0.004, z0: 0.02, tanLambda: 0.35 });
    const p = [0, 0, 0];
    helixPoint(h, 0, p);
    expect(Math.abs(p[0] - (0.3 + 0.004 * Math.sin(0.7)))).toBeLessThan(1e-15);
    expect(Math.abs(p[1] - (-0.1 - 0.004 * Math.cos(0.7)))).toBeLessThan(1e-15);
    expect(p[2]).toBe(0.02);
    const [cx, cy] = helixCentre(h);
    // Centre from the direction: P0 + n/κ with n = (−sin φ0, cos φ0) the left normal.
    expect(Math.abs(cx - (0.3 + 0.004 * Math.sin(0.7) - Math.sin(0.7) / -2.5))).toBeLessThan(1e-15);
    expect(Math.abs(cy - (-0.1 - 0.004 * Math.cos(0.7) + Math.cos(0.7) / -2.5))).toBeLessThan(1e-15);
    for (const s of [-1.2, -0.3, 0.05, 0.4, 1.1]) {
      helixPoint(h, s, p);
      expect(Math.abs(Math.hypot(p[0] - cx, p[1] - cy) - 0.4)).toBeLessThan(1e-14);
      expect(Math.abs(p[2] - (0.02 + 0.35 * s))).toBeLessThan(1e-15);
      // The chord from s = 0 subtends the angle κs: its length is (2/|κ|) |sin(κs/2)|.
      const q = [0, 0, 0];
      helixPoint(h, 0, q);
      expect(Math.abs(Math.hypot(p[0] - q[0], p[1] - q[1]) - 0.8 * Math.abs(Math.sin(-1.25 * s)))).toBeLessThan(1e-14);
    }
  });

  it('helixPointJacobian matches central differences of helixPoint in (κ, φ0, d0, z0, tan λ), for κs/2 below and above the series switch (1e-7)', () => {
    const h = helix({ xRef: 0.1, yRef: 0.2, kappa: 1.7, phi0: -0.4, d0: 0.003, z0: 0.01, tanLambda: -0.6 });
    const jac = new Float64Array(15);
    const keys = ['kappa', 'phi0', 'd0', 'z0', 'tanLambda'] as const;
    for (const [kappa, s] of [[1.7, 0.8], [1.7, -0.35], [1e-4, 0.5], [-3, 2e-4], [0, 0.3]]) {
      h.kappa = kappa;
      helixPointJacobian(h, s, jac);
      for (let i = 0; i < 5; i++) {
        const k = keys[i], v = h[k], step = 1e-6;
        const up = [0, 0, 0], dn = [0, 0, 0];
        h[k] = v + step; helixPoint(h, s, up);
        h[k] = v - step; helixPoint(h, s, dn);
        h[k] = v;
        for (let r = 0; r < 3; r++) expect(Math.abs(jac[5 * r + i] - (up[r] - dn[r]) / (2 * step))).toBeLessThan(1e-7);
      }
    }
  });

  it('helixPointJacobian ∂x/∂κ just inside the series of sinc′ (κs/2 = 9e-4, φ0 + κs/2 = 0): (s²/2)·sinc′ with sinc′ to h⁵ (1e-12 relative)', () => {
    const s = 0.6, kappa = 3e-3, h = (kappa * s) / 2;
    const hx = helix({ kappa, phi0: -h });
    const jac = new Float64Array(15);
    helixPointJacobian(hx, s, jac);
    // sinc′(h) = −h/3 + h³/30 − h⁵/840 + … (Taylor series of (h cos h − sin h)/h²).
    const slope = -h / 3 + h ** 3 / 30 - h ** 5 / 840;
    expect(Math.abs(jac[0] / ((s * s / 2) * slope) - 1)).toBeLessThan(1e-12);
  });

  it('arcLengthNear returns s for points of the circle and for points moved radially off it (|κs| < π); for a straight track the projection', () => {
    const h = helix({ xRef: -0.2, yRef: 0.1, kappa: 2, phi0: 2.5, d0: -0.002, z0: 0, tanLambda: 0 });
    const [cx, cy] = helixCentre(h);
    const p = [0, 0, 0];
    for (const s of [-1.4, -0.6, 0, 0.2, 1.5]) {
      helixPoint(h, s, p);
      expect(Math.abs(arcLengthNear(h, p[0], p[1]) - s)).toBeLessThan(1e-12);
      expect(Math.abs(arcLengthNear(h, cx + 1.3 * (p[0] - cx), cy + 1.3 * (p[1] - cy)) - s)).toBeLessThan(1e-12);
    }
    const line = helix({ xRef: 0.5, yRef: 0.5, kappa: 0, phi0: Math.PI / 6, d0: 0.01 });
    const px = 0.5 + 0.01 * 0.5, py = 0.5 - 0.01 * Math.cos(Math.PI / 6);
    const x = px + 0.7 * Math.cos(Math.PI / 6) - 0.2 * Math.sin(Math.PI / 6), y = py + 0.7 * Math.sin(Math.PI / 6) + 0.2 * Math.cos(Math.PI / 6);
    expect(Math.abs(arcLengthNear(line, x, y) - 0.7)).toBeLessThan(1e-14);
  });
});

describe('closestApproach in the cases the circles decide (flat helices: DCA = distance of the circles)', () => {
  it('circles apart: DCA = d − r₁ − r₂; nested: r₁ − r₂ − d; a line missing a circle: its distance from the centre − r; a line through it: 0', () => {
    // Flat helices (tan λ = 0, same z), centres and radii chosen: first (0, 0) r = 0.5, second elsewhere.
    const around = (cx: number, cy: number, r: number, phi: number, kappaSign: number) => {
      // Point of the circle at direction φ of travel: P = C + (sin φ, −cos φ)/κ.
      const kappa = kappaSign / r;
      return helix({ xRef: cx + Math.sin(phi) / kappa, yRef: cy - Math.cos(phi) / kappa, kappa, phi0: phi });
    };
    const a = around(0, 0, 0.5, 0.3, 1);
    const apart = closestApproach(a, around(1.2, 0.4, 0.3, 2, -1));
    expect(apart.status).toBe('ok');
    expect(Math.abs(apart.distanceM - (Math.hypot(1.2, 0.4) - 0.8))).toBeLessThan(1e-10);
    const apartSame = closestApproach(a, around(-0.9, 0.9, 0.2, 1, 1));
    expect(Math.abs(apartSame.distanceM - (Math.hypot(0.9, 0.9) - 0.7))).toBeLessThan(1e-10);
    for (const [second, first] of [[around(0.1, -0.05, 0.3, -1, -1), a], [a, around(0.1, -0.05, 0.3, -1, -1)]]) {
      const nested = closestApproach(first, second);
      expect(Math.abs(nested.distanceM - (0.2 - Math.hypot(0.1, 0.05)))).toBeLessThan(1e-10);
    }
    // A straight track y = 0.7 (along +x): 0.2 from the circle of radius 0.5.
    const line = helix({ xRef: -1, yRef: 0.7, kappa: 0, phi0: 0 });
    for (const [p, q] of [[line, a], [a, line]]) {
      const miss = closestApproach(p, q);
      expect(Math.abs(miss.distanceM - 0.2)).toBeLessThan(1e-10);
    }
    const through = closestApproach(helix({ xRef: -1, yRef: 0.3, kappa: 0, phi0: 0 }), a);
    expect(through.distanceM).toBeLessThan(1e-10);
    // Of the line's two crossings x = ±0.4, the refined approach picks one of them.
    const p = [0, 0, 0];
    helixPoint(a, through.s2, p);
    expect(Math.abs(Math.abs(p[0]) - 0.4)).toBeLessThan(1e-9);
  });

  it('two straight tracks meeting in x–y at (0.3, 0.4), 5 mm apart in z: DCA 5 mm × |(t₁ × t₂)_z|/|t₁ × t₂|; parallel ones have no start', () => {
    const a = helix({ xRef: 0, yRef: 0, kappa: 0, phi0: Math.atan2(0.4, 0.3), z0: 0.005, tanLambda: 0 });
    const b = helix({ xRef: 1, yRef: 0.4, kappa: 0, phi0: Math.PI, z0: 0, tanLambda: 0.5 });
    const ca = closestApproach(a, b);
    const t1 = [0.6, 0.8, 0], t2 = [-1, 0, 0.5];
    const c = [t1[1] * t2[2] - t1[2] * t2[1], t1[2] * t2[0] - t1[0] * t2[2], t1[0] * t2[1] - t1[1] * t2[0]];
    // Lines through (0.3, 0.4, 0.005) and (0.3, 0.4, 0.35) (b's z at x = 0.3 is 0.5·0.7): the 3-D distance of skew lines.
    const d = [0, 0, 0.35 - 0.005];
    expect(Math.abs(ca.distanceM - Math.abs(d[2] * c[2]) / Math.hypot(c[0], c[1], c[2]))).toBeLessThan(1e-12);
    const parallel = closestApproach(a, helix({ xRef: 0.1, yRef: 0, kappa: 0, phi0: Math.atan2(0.4, 0.3) }));
    expect(parallel.status).toBe('no-start');
    expect(parallel.distanceM).toBeNaN();
    expect(parallel.s1).toBeNaN();
  });

  it('prefer vetoes: vetoing every start gives no-start; vetoing one crossing keeps the other', () => {
    const a = helix({ xRef: -1, yRef: 0.3, kappa: 0, phi0: 0 });
    const c = helix({ xRef: 0.5 * Math.sin(0.3), yRef: -0.5 * Math.cos(0.3), kappa: 2, phi0: 0.3 });
    expect(closestApproach(a, c, { prefer: () => false }).status).toBe('no-start');
    // The line meets the circle at x = −0.4 (s₁ = 0.6) and x = +0.4 (s₁ = 1.4).
    for (const want of [0.6, 1.4]) {
      const ca = closestApproach(a, c, { prefer: (s1) => Math.abs(s1 - want) < 0.3 });
      expect(ca.status).toBe('ok');
      expect(Math.abs(ca.s1 - want)).toBeLessThan(1e-9);
    }
  });
});

describe('circleCrossings: the starting arc lengths themselves (points computed back with helixPoint)', () => {
  const at = (h: HelixParameters, s: number) => { const p = [0, 0, 0]; helixPoint(h, s, p); return p; };
  const centreOf = (h: HelixParameters) => helixCentre(h);
  const dist = (p: number[], c: readonly number[]) => Math.hypot(p[0] - c[0], p[1] - c[1]);
  // Tracks with d0 ≠ 0, so that the perigee offsets enter every branch.
  const a = helix({ xRef: 0.02, yRef: -0.01, kappa: 2, phi0: 0.4, d0: 0.003 });

  it('crossing circles: two starts, each the same x–y point on both circles, and the two points differ', () => {
    const b = helix({ xRef: 0.3, yRef: 0.1, kappa: -1.5, phi0: 2.2, d0: -0.002 });
    const out = new Float64Array(4);
    expect(circleCrossings(a, b, out)).toBe(2);
    const p0 = at(a, out[0]), q0 = at(b, out[1]), p1 = at(a, out[2]), q1 = at(b, out[3]);
    expect(Math.hypot(p0[0] - q0[0], p0[1] - q0[1])).toBeLessThan(1e-12);
    expect(Math.hypot(p1[0] - q1[0], p1[1] - q1[1])).toBeLessThan(1e-12);
    expect(Math.hypot(p0[0] - p1[0], p0[1] - p1[1])).toBeGreaterThan(0.01);
    for (const p of [p0, p1]) { expect(Math.abs(dist(p, centreOf(a)) - 0.5)).toBeLessThan(1e-12); expect(Math.abs(dist(p, centreOf(b)) - 1 / 1.5)).toBeLessThan(1e-12); }
  });

  it('circles apart or nested: one start, each point on the line of centres, nearest the other circle', () => {
    const out = new Float64Array(4);
    const [ax, ay] = centreOf(a);
    // Apart: second circle of radius 0.25 with centre 1 m away along (0.6, 0.8).
    const apart = helix({ xRef: ax + 0.6 + 0.25 * Math.sin(1), yRef: ay + 0.8 - 0.25 * Math.cos(1), kappa: 4, phi0: 1, d0: 0 });
    expect(circleCrossings(a, apart, out)).toBe(1);
    expect(Math.abs(dist(at(a, out[0]), centreOf(apart)) - 0.5)).toBeLessThan(1e-12); // 1 − r₁
    expect(Math.abs(dist(at(apart, out[1]), [ax, ay]) - 0.75)).toBeLessThan(1e-12); // 1 − r₂
    // Nested: radius 0.1 with centre 0.2 from a's (r₁ = 0.5 > r₂): a's point is r₁ − d = 0.3 from it, its point d + r₂ = 0.3 from a's centre.
    for (const [first, second, big] of [[a, 0, 1], [0, a, 2]] as const) {
      const small = helix({ xRef: ax + 0.2 * 0.6 + 0.1 * Math.sin(-2), yRef: ay + 0.2 * 0.8 - 0.1 * Math.cos(-2), kappa: 10, phi0: -2 });
      const h1 = first === 0 ? small : first, h2 = second === 0 ? small : second;
      expect(circleCrossings(h1, h2, out)).toBe(1);
      const onBig = big === 1 ? at(h1, out[0]) : at(h2, out[1]), onSmall = big === 1 ? at(h2, out[1]) : at(h1, out[0]);
      expect(Math.abs(dist(onBig, centreOf(small)) - 0.3)).toBeLessThan(1e-12);
      expect(Math.abs(dist(onSmall, [ax, ay]) - 0.3)).toBeLessThan(1e-12);
      // Both on the ray from a's centre through the small one's (same side).
      const e = [0.6, 0.8];
      expect(Math.abs((onBig[0] - ax) * e[1] - (onBig[1] - ay) * e[0])).toBeLessThan(1e-12);
      expect((onBig[0] - ax) * e[0] + (onBig[1] - ay) * e[1]).toBeGreaterThan(0);
    }
    // The same circle twice (centres exactly equal): no direction to start along.
    expect(circleCrossings(a, helix({ ...a }), out)).toBe(0);
  });

  it('a line and a circle, in either order: two starts on both where it cuts the circle; one, the foot of the perpendicular from the centre, where it misses', () => {
    const out = new Float64Array(4);
    const [cx, cy] = centreOf(a);
    for (const offset of [0.3, 0.7]) {
      // A line along φ = 0.3 whose perigee sits `offset` from a's centre (d0 = 0.004 m).
      const u = [Math.cos(0.3), Math.sin(0.3)], nrm = [-u[1], u[0]];
      const line = helix({ xRef: cx + offset * nrm[0] - 0.004 * Math.sin(0.3) - 0.2 * u[0], yRef: cy + offset * nrm[1] + 0.004 * Math.cos(0.3) - 0.2 * u[1], kappa: 0, phi0: 0.3, d0: 0.004 });
      for (const lineFirst of [true, false]) {
        const n = lineFirst ? circleCrossings(line, a, out) : circleCrossings(a, line, out);
        const sl = (i: number) => out[2 * i + (lineFirst ? 0 : 1)], sc = (i: number) => out[2 * i + (lineFirst ? 1 : 0)];
        if (offset < 0.5) {
          expect(n).toBe(2);
          for (const i of [0, 1]) {
            const p = at(line, sl(i)), q = at(a, sc(i));
            expect(Math.hypot(p[0] - q[0], p[1] - q[1])).toBeLessThan(1e-12);
            expect(Math.abs(dist(p, [cx, cy]) - 0.5)).toBeLessThan(1e-12);
          }
          expect(Math.abs(sl(1) - sl(0) - 2 * Math.sqrt(0.25 - offset * offset))).toBeLessThan(1e-12);
        } else {
          expect(n).toBe(1);
          const p = at(line, sl(0));
          expect(Math.abs((p[0] - cx) * u[0] + (p[1] - cy) * u[1])).toBeLessThan(1e-12);
          expect(Math.abs(dist(p, [cx, cy]) - offset)).toBeLessThan(1e-12);
          const q = at(a, sc(0));
          expect(Math.abs(dist(q, p) - (offset - 0.5))).toBeLessThan(1e-12);
        }
      }
    }
  });

  it('two lines: one start at their intersection (d0 ≠ 0 on both); parallel lines none', () => {
    const out = new Float64Array(4);
    const l1 = helix({ xRef: 0.1, yRef: 0.2, kappa: 0, phi0: 0.3, d0: 0.005 }), l2 = helix({ xRef: -0.3, yRef: 0.5, kappa: 0, phi0: -1.1, d0: -0.002 });
    expect(circleCrossings(l1, l2, out)).toBe(1);
    const p = at(l1, out[0]), q = at(l2, out[1]);
    expect(Math.hypot(p[0] - q[0], p[1] - q[1])).toBeLessThan(1e-12);
    expect(circleCrossings(l1, helix({ xRef: 0.5, yRef: 0, kappa: 0, phi0: 0.3 + Math.PI }), out)).toBe(0);
  });
});

describe('nearestArcLength and the Newton refinement', () => {
  it('a point 1 cm off a helix along its in-plane normal at s = 0.5 m is found at s = 0.5 (1e-9 m) from near and from 2 m away (steps capped at a quarter turn)', () => {
    const hx = helix({ xRef: 0.1, yRef: 0.2, kappa: 1.5, phi0: 0.3, tanLambda: 0.4, z0: 0.01 });
    const p = [0, 0, 0];
    helixPoint(hx, 0.5, p);
    const phi = 0.3 + 1.5 * 0.5;
    const q = [p[0] - 0.01 * Math.sin(phi), p[1] + 0.01 * Math.cos(phi), p[2]];
    for (const start of [0.3, 0.9, 2.5]) expect(Math.abs(nearestArcLength(hx, q[0], q[1], q[2], start, new Float64Array(3)) - 0.5)).toBeLessThan(1e-9);
  });

  it('refineClosestApproach with one iteration from a distant start is not converged; with the default count it is, at the crossing', () => {
    const a = helix({ kappa: 2, phi0: 0.2 }), b = helix({ xRef: 0.05, yRef: -0.1, kappa: -1.2, phi0: 1.4 });
    const out = { s1: NaN, s2: NaN, distanceM: NaN, status: 'ok' as const } as { s1: number; s2: number; distanceM: number; status: 'ok' | 'not-converged' | 'no-start' };
    expect(refineClosestApproach(a, b, 0.3, 0.3, out, newClosestApproachScratch(), 1).status).toBe('not-converged');
    const ref = closestApproach(a, b);
    refineClosestApproach(a, b, ref.s1 + 0.02, ref.s2 - 0.02, out, newClosestApproachScratch());
    expect(out.status).toBe('ok');
    expect(Math.abs(out.s1 - ref.s1) + Math.abs(out.s2 - ref.s2)).toBeLessThan(1e-9);
    expect(out.distanceM).toBeLessThan(1e-9);
  });
});

describe('refineClosestApproach on parallel tracks (the degenerate case: any pair of points across)', () => {
  it('two parallel straight tracks 10 mm apart, started 0.2 m out of step: distance 10 mm, converged', () => {
    // Lines along x at y = 0 and y = 0.01 m (tan λ = 0 and 0.5): the closest distance is 0.01 m
    // wherever the points sit along them (geometry, common practice).
    for (const tanLambda of [0, 0.5]) {
      const a = helix({ kappa: 0, phi0: 0, tanLambda }), b = helix({ yRef: 0.01, kappa: 0, phi0: 0, tanLambda });
      const out = { s1: NaN, s2: NaN, distanceM: NaN, status: 'ok' as const } as { s1: number; s2: number; distanceM: number; status: 'ok' | 'not-converged' | 'no-start' };
      refineClosestApproach(a, b, 0.3, 0.1, out, newClosestApproachScratch());
      expect(out.status, `tan λ ${tanLambda}`).toBe('ok');
      expect(Math.abs(out.distanceM - 0.01), `tan λ ${tanLambda}`).toBeLessThan(1e-12);
      expect(Math.abs(out.s1 - out.s2), `tan λ ${tanLambda}`).toBeLessThan(1e-9);
    }
  });
});

describe('fitTwoTrackVertex on two straight tracks with diagonal covariances (closed-form weighted mean)', () => {
  it('tracks along x at z = +δ/2 and along y at z = −δ/2: V = weighted means, χ² = δ²/(σ_a² + σ_b²), cov from the weights (1e-12)', () => {
    const delta = 0.004, sa = 1e-3, sb = 2e-3, da = 3e-4, db = 5e-4;
    // a: along +x through (0, 0, δ/2), first hit at x = −0.2; b: along +y through (0, 0, −δ/2), first hit at y = −0.3.
    const a = helix({ xRef: -0.2, yRef: 0, kappa: 0, phi0: 0, d0: 0, z0: delta / 2, tanLambda: 0 });
    const b = helix({ xRef: 0, yRef: -0.3, kappa: 0, phi0: Math.PI / 2, d0: 0, z0: -delta / 2, tanLambda: 0 });
    a.cov[12] = da * da; a.cov[18] = sa * sa; a.cov[0] = 1e-6; a.cov[24] = 1e-8;
    b.cov[12] = db * db; b.cov[18] = sb * sb; b.cov[0] = 1e-6; b.cov[24] = 1e-8;
    // Transverse to each line only d0 and z0 (and tan λ·s, κs²/2) matter; at the crossing s = 0.2, 0.3 those add
    // σ_tanλ² s² to z and σ_κ² s⁴/4 across.
    const za = sa * sa + 1e-8 * 0.04, zb = sb * sb + 1e-8 * 0.09;
    const ya = da * da + 1e-6 * 0.2 ** 4 / 4, xb = db * db + 1e-6 * 0.3 ** 4 / 4;
    const fit = fitTwoTrackVertex(a, b, 0.1, 0.5);
    expect(fit.status).toBe('ok');
    const zV = (delta / 2 / za - delta / 2 / zb) / (1 / za + 1 / zb);
    expect(Math.abs(fit.xM)).toBeLessThan(1e-12);
    expect(Math.abs(fit.yM)).toBeLessThan(1e-12);
    expect(Math.abs(fit.zM - zV)).toBeLessThan(1e-12);
    expect(Math.abs(fit.chi2 / (delta * delta / (za + zb)) - 1)).toBeLessThan(1e-9);
    expect(Math.abs(fit.cov[0] / xb - 1)).toBeLessThan(1e-9);
    expect(Math.abs(fit.cov[3] / ya - 1)).toBeLessThan(1e-9);
    expect(Math.abs(fit.cov[5] / (1 / (1 / za + 1 / zb)) - 1)).toBeLessThan(1e-9);
    for (const k of [1, 2, 4]) expect(Math.abs(fit.cov[k])).toBeLessThan(1e-20);
    expect(Math.abs(fit.s1 - 0.2)).toBeLessThan(1e-12);
    expect(Math.abs(fit.s2 - 0.3)).toBeLessThan(1e-12);
  });

  it('a track without covariance makes the fit singular: NaN vertex, χ², arc lengths and covariance', () => {
    const a = helix({ xRef: -0.2, kappa: 0, phi0: 0 }), b = helix({ yRef: -0.3, kappa: 0, phi0: Math.PI / 2 });
    for (let i = 0; i < 5; i++) a.cov[6 * i] = 1e-6;
    const fit = fitTwoTrackVertex(a, b, 0.2, 0.3);
    expect(fit.status).toBe('singular');
    for (const v of [fit.xM, fit.yM, fit.zM, fit.chi2, fit.s1, fit.s2, ...fit.cov]) expect(v).toBeNaN();
  });
});

/** A medium of constant stopping power k [MeV/m] for every species: R(T) = T/k, T(R) = kR (exact, hand-made). */
function constantLoss(kMeVPerM: number): Medium {
  const loss: SpeciesLoss = { rangeM: (t) => t / kMeVPerM, kineticFromRangeM: (r) => kMeVPerM * r, stragglingVarianceMeV2PerM: 0, theta0Rad: () => 0 };
  return { name: 'constant', densityGPerCm3: 1, radiationLengthM: Infinity, zOverA: 0.5, forSpecies: () => loss };
}

describe('trackStateAt and energyLossFactor (constant dE/dx medium: T changes by k·path exactly)', () => {
  const pion: Particle = PION_PLUS;

  it('energyLossFactor: upstream the kinetic energy is T₁ + k|L|, downstream T₁ − kL; ranging out is NaN; no path or no loss is 1', () => {
    const medium = constantLoss(20);
    const p1 = 150, t1 = kineticFromMomentum(pion, p1);
    for (const path of [-0.1, -0.02, 0.03, 0.5]) {
      const expected = momentumFromKinetic(pion, t1 - 20 * path) / p1;
      expect(Math.abs(energyLossFactor(p1, path, pion, medium) - expected)).toBeLessThan(1e-12);
    }
    expect(energyLossFactor(p1, t1 / 20, pion, medium)).toBeNaN();
    expect(energyLossFactor(p1, t1 / 20 + 0.01, pion, medium)).toBeNaN();
    expect(energyLossFactor(p1, 0, pion, medium)).toBe(1);
    // With tabulated ranges the round trip T → R → T is not exact, so no path must short-cut to exactly 1.
    expect(energyLossFactor(p1, 0, pion, chamberMedium('liquid-hydrogen'))).toBe(1);
    const none: Medium = { ...medium, forSpecies: () => ({ ...medium.forSpecies(pion), rangeM: () => Infinity }) };
    expect(energyLossFactor(p1, -0.3, pion, none)).toBe(1);
  });

  it('trackStateAt: point on the helix, p = loss·p_T (cos φ, sin φ, tan λ) at φ = φ0 + κs, the 3-D path (s − s_ref)·sec λ, covariance J C Jᵀ by finite differences (1e-6)', () => {
    const fieldT = 1.5;
    const h = helix({ xRef: 0.05, yRef: -0.02, kappa: -0.9, phi0: 0.4, d0: 0.001, z0: 0.03, tanLambda: 0.25 });
    // A full symmetric positive covariance of (κ, φ0, d0, z0, tan λ).
    const rng = seededRandom(9);
    const l = Array.from({ length: 25 }, (_, i) => (i % 6 === 0 ? 1 : 0) * 0.01 + 0.003 * rng.gaussian());
    for (let r = 0; r < 5; r++) for (let q = 0; q < 5; q++) { let v = 0; for (let k = 0; k < 5; k++) v += l[5 * r + k] * l[5 * q + k]; h.cov[5 * r + q] = v; }
    const medium = constantLoss(30);
    const pt0 = (1e3 * 0.299792458 * fieldT) / 0.9;
    for (const [s, sRef, withMedium] of [[-0.08, 0.2, true], [0.02, 0.1, true], [-0.05, 0.3, false]] as const) {
      const st = trackStateAt(h, s, { fieldT, species: pion, medium: withMedium ? medium : undefined, momentumArcM: sRef });
      const sec = Math.hypot(1, 0.25);
      const f = withMedium ? momentumFromKinetic(pion, kineticFromMomentum(pion, pt0 * sec) - 30 * (s - sRef) * sec) / (pt0 * sec) : 1;
      expect(Math.abs(st.lossFactor - f)).toBeLessThan(1e-12);
      expect(st.status).toBe('ok');
      const p = [0, 0, 0];
      helixPoint(h, s, p);
      for (let k = 0; k < 3; k++) expect(Math.abs(st.point[k] - p[k])).toBeLessThan(1e-15);
      const mom = (kappa: number, phi0: number, t: number) => {
        const pt = (f * 1e3 * 0.299792458 * fieldT) / Math.abs(kappa);
        return [pt * Math.cos(phi0 + kappa * s), pt * Math.sin(phi0 + kappa * s), pt * t];
      };
      const m0 = mom(h.kappa, h.phi0, h.tanLambda);
      for (let k = 0; k < 3; k++) expect(Math.abs(st.pMeV[k] - m0[k])).toBeLessThan(1e-9);
      const e = 1e-7;
      const cols = [
        [mom(h.kappa + e, h.phi0, h.tanLambda), mom(h.kappa - e, h.phi0, h.tanLambda)],
        [mom(h.kappa, h.phi0 + e, h.tanLambda), mom(h.kappa, h.phi0 - e, h.tanLambda)],
        [mom(h.kappa, h.phi0, h.tanLambda + e), mom(h.kappa, h.phi0, h.tanLambda - e)],
      ].map(([u, d]) => [0, 1, 2].map((r) => (u[r] - d[r]) / (2 * e)));
      const idx = [0, 1, 4];
      for (let r = 0; r < 3; r++) for (let q = 0; q < 3; q++) {
        let v = 0;
        for (let i = 0; i < 3; i++) for (let k = 0; k < 3; k++) v += cols[i][r] * h.cov[5 * idx[i] + idx[k]] * cols[k][q];
        expect(Math.abs(st.covMeV2[3 * r + q] - v)).toBeLessThan(1e-6 * Math.sqrt(st.covMeV2[4 * r] * st.covMeV2[4 * q]));
      }
    }
  });

  it('a fresh state is ok with loss factor 1; an α (|z| = 2) has twice the p_T of a unit charge on the same helix', () => {
    expect(newTrackState().status).toBe('ok');
    expect(newTrackState().lossFactor).toBe(1);
    const h = helix({ kappa: 2, phi0: 0, tanLambda: 0 });
    const one = trackStateAt(h, 0, { fieldT: 1, species: pion }).pMeV[0];
    expect(Math.abs(one - (1e3 * 0.299792458) / 2)).toBeLessThan(1e-9);
    expect(Math.abs(trackStateAt(h, 0, { fieldT: 1, species: ALPHA }).pMeV[0] - 2 * one)).toBeLessThan(1e-9);
  });

  it('trackStateAt downstream beyond the range: status ranged-out, loss factor 0, momentum 0', () => {
    const h = helix({ kappa: 4, phi0: 0, tanLambda: 0 });
    const st = trackStateAt(h, 5, { fieldT: 1, species: pion, medium: constantLoss(50) });
    expect(st.status).toBe('ranged-out');
    expect(st.lossFactor).toBe(0);
    expect(Math.hypot(st.pMeV[0], st.pMeV[1], st.pMeV[2])).toBe(0);
  });
});

describe('fitLifetime against closed forms', () => {
  /** Root of g on [lo, hi] by bisection (g changes sign). */
  const root = (g: (x: number) => number, lo: number, hi: number) => {
    for (let i = 0; i < 200; i++) { const m = 0.5 * (lo + hi); if (Math.sign(g(m)) === Math.sign(g(lo))) lo = m; else hi = m; }
    return 0.5 * (lo + hi);
  };

  it('no truncation (a = 0, b = ∞): λ̂ = mean t, −ln L = n(ln λ̂ + 1), the ½-interval solves n(ln x + 1/x − 1) = ½ (1e-7 relative: the golden section in ln λ stops at ≈ 2e-8)', () => {
    const t = [0.011, 0.034, 0.002, 0.071, 0.019, 0.026, 0.048];
    const n = t.length, mean = t.reduce((x, y) => x + y, 0) / n;
    const f = fitLifetime(t, t.map(() => 0), t.map(() => Infinity));
    expect(f.status).toBe('ok');
    expect(f.used).toBe(n);
    expect(f.skipped).toBe(0);
    expect(Math.abs(f.ctauM / mean - 1)).toBeLessThan(1e-7);
    expect(Math.abs(f.negLogLikelihood - n * (Math.log(mean) + 1))).toBeLessThan(1e-12);
    const g = (x: number) => n * (Math.log(x) + 1 / x - 1) - 0.5;
    const lo = root(g, 1e-3, 1) * mean, hi = root(g, 1, 1e3) * mean;
    expect(Math.abs(f.lowerM / lo - 1)).toBeLessThan(1e-7);
    expect(Math.abs(f.upperM / hi - 1)).toBeLessThan(1e-7);
    expect(Math.abs(f.sigmaM - 0.5 * (hi - lo))).toBeLessThan(1e-7 * mean);
  });

  it('common window [a, b]: λ̂ solves mean(t) − a = λ − (b − a)/(e^{(b−a)/λ} − 1) (1e-7 relative)', () => {
    const a = 0.01, b = 0.08;
    const t = [0.012, 0.02, 0.031, 0.015, 0.044, 0.027, 0.011, 0.06, 0.018, 0.023];
    const mean = t.reduce((x, y) => x + y, 0) / t.length;
    const f = fitLifetime(t, t.map(() => a), t.map(() => b));
    const lambda = root((l) => l - (b - a) / Math.expm1((b - a) / l) - (mean - a), 1e-4, 10);
    expect(f.status).toBe('ok');
    expect(Math.abs(f.ctauM / lambda - 1)).toBeLessThan(1e-7);
  });

  it('skips each kind of bad candidate and keeps those on their window edges; two candidates suffice; a flat sample is at the limit; unequal lengths are refused', () => {
    const t = [0.02, 0.05, NaN, 0.03, 0.03, 0.001, 0.5, 0.04];
    const a = [0.02, 0.01, 0.01, -0.01, 0.03, 0.01, 0.01, 0.01];
    const b = [0.3, 0.05, 0.3, 0.3, 0.03, 0.3, 0.3, 0.3];
    const f = fitLifetime(t, a, b);
    // Used: t = a (0.02), t = b (0.05), and the last; skipped: NaN, a < 0, b = a, t < a, t > b.
    expect(f.used).toBe(3);
    expect(f.skipped).toBe(5);
    expect(fitLifetime([0.01, 0.02], [0, 0], [1, 1]).status).toBe('ok');
    // Uniform in the window (mean at its centre): the likelihood rises towards λ → ∞.
    const flat = fitLifetime([0.2, 0.8, 0.5, 0.4, 0.6], [0, 0, 0, 0, 0], [1, 1, 1, 1, 1]);
    expect(flat.status).toBe('at-limit');
    expect(flat.upperM).toBeNaN();
    expect(() => fitLifetime([1, 2], [0], [3, 3])).toThrow('window lengths = [1,2] is not valid: expected 2 (one window per candidate)');
    expect(() => fitLifetime([1, 2], [0, 0], [3])).toThrow('window lengths = [2,1] is not valid');
  });

  it('decayWindowInBox: leaving along −x and along (3, 4, 0)/5, the nearest wall sets the window', () => {
    const box: [number, number][] = [[-0.6, 0.6], [-0.4, 0.4], [-0.25, 0.25]];
    const back = decayWindowInBox([0.1, 0, 0], [-1, 0, 0], box, 0.02, 0.2);
    expect(back[0]).toBe(0.02);
    expect(back[1]).toBeCloseTo(0.5, 14);
    // (0.6, 0.8, 0) from the origin: x wall at 1, y wall at 0.5; y hits first (1.25 m... scaled: 0.4/0.8 = 0.5).
    expect(decayWindowInBox([0, 0, 0], [3, 4, 0], [[-1, 1], [-0.4, 0.4], [-1, 1]], 0, 0.1)[1]).toBeCloseTo(0.4, 14);
    expect(decayWindowInBox([0, 0, 0], [0, -3, -4], [[-1, 1], [-1, 1], [-0.2, 0.2]], 0, 0)[1]).toBeCloseTo(0.25, 14);
    // A primary on a wall the direction runs along: that wall is never reached (no 0/0).
    expect(decayWindowInBox([0, 0.4, 0], [1, 0, 0], box, 0.02, 0.2)[1]).toBeCloseTo(0.4, 14);
  });
});

describe('fitMassPeak: refusals and the likelihood optimum', () => {
  it('refuses a window with high ≤ low (catalogue message); fewer than 5 in the window is too-few, counting only [lo, hi] inclusive', () => {
    expect(() => fitMassPeak([1, 2, 3], [5, 5])).toThrow('window = [5,5] is not valid: expected a mass window [low, high] with high > low, in MeV');
    const few = fitMassPeak([470, 471, 500, 530, 531, 469.9], [470, 530]);
    expect(few.status).toBe('too-few');
    expect(few.inWindow).toBe(4);
    expect(few.meanMeV).toBeNaN();
    // Five equal masses: enough to start, but the width collapses to 0 in the first step.
    const equal = fitMassPeak([500, 500, 500, 500, 500], [470, 530]);
    expect(equal.status).toBe('not-converged');
    expect(equal.iterations).toBe(0);
    expect(equal.inWindow).toBe(5);
    expect(equal.widthMeV).toBeNaN();
  });

  it('at the fit the gradient of −ln L in (f, μ, σ) vanishes and the errors are those of the inverse Hessian (independent finite differences, 1e-5)', () => {
    const rng = seededRandom(123);
    const m: number[] = [];
    // A skewed peak (a third of it with a one-sided tail), so that f and μ are correlated in the Hessian.
    for (let i = 0; i < 120; i++) m.push(1115.683 + 1.5 * rng.gaussian() + (i % 3 === 0 ? 2 * Math.abs(rng.gaussian()) : 0));
    // Background rising across the window (density ∝ m − 1100), so that f and μ are correlated.
    for (let i = 0; i < 80; i++) m.push(1100 + 30 * Math.sqrt(rng.uniform()));
    const fit = fitMassPeak(m, [1100, 1130]);
    expect(fit.status).toBe('ok');
    expect(fit.iterations).toBeGreaterThan(1);
    expect(fit.iterations).toBeLessThan(500);
    expect(fit.inWindow).toBe(m.filter((x) => x >= 1100 && x <= 1130).length);
    const n = fit.inWindow, fr = fit.signal / n;
    const nll = (p: number[]) => {
      let s = 0;
      for (const x of m) if (x >= 1100 && x <= 1130) s -= Math.log((p[0] * Math.exp(-0.5 * ((x - p[1]) / p[2]) ** 2)) / (p[2] * Math.sqrt(2 * Math.PI)) + (1 - p[0]) / 30);
      return s;
    };
    const p0 = [fr, fit.meanMeV, fit.widthMeV];
    const h = [1e-4, 1e-3, 1e-3];
    const at = (d: number[]) => nll(p0.map((v, i) => v + d[i]));
    const H: number[][] = [[0, 0, 0], [0, 0, 0], [0, 0, 0]];
    const grads: number[] = [];
    for (let i = 0; i < 3; i++) {
      const e = [0, 0, 0]; e[i] = h[i];
      const grad = (at(e) - at(e.map((x) => -x))) / (2 * h[i]);
      // Gradient small against the curvature: the step to the optimum is below 1e-4 of an error.
      for (let j = 0; j < 3; j++) {
        const u = [0, 0, 0]; u[j] = h[j];
        H[i][j] = (at(e.map((x, k) => x + u[k])) - at(e.map((x, k) => x - u[k])) - at(e.map((x, k) => -x + u[k])) + at(e.map((x, k) => -x - u[k]))) / (4 * h[i] * h[j]);
      }
      grads.push(Math.abs(grad) / Math.sqrt(H[i][i]));
    }
    // Measured: 8e-8, 1e-9, 1.6e-6 (EM stops at steps of 1e-9 of the window).
    for (const g of grads) expect(g).toBeLessThan(1e-5);
    expect(Math.abs(H[0][1]) / Math.sqrt(H[0][0] * H[1][1])).toBeGreaterThan(0.03); // measured 0.062
    const [[a, b, c], [, e, f], [, , i]] = H;
    const det = a * (e * i - f * f) - b * (b * i - f * c) + c * (b * f - e * c);
    const c00 = (e * i - f * f) / det, c11 = (a * i - c * c) / det, c22 = (a * e - b * b) / det;
    // Measured agreement 1e-7 to 4e-7 (the two Hessians use different steps).
    expect(Math.abs(fit.sigmaMeanMeV / Math.sqrt(c11) - 1)).toBeLessThan(1e-5);
    expect(Math.abs(fit.sigmaWidthMeV / Math.sqrt(c22) - 1)).toBeLessThan(1e-5);
    expect(Math.abs(fit.sigmaSignal / Math.sqrt(n * n * c00 + fr * fr * n) - 1)).toBeLessThan(1e-5);
    // A start given by the caller reaches the same optimum.
    const started = fitMassPeak(m, [1100, 1130], { meanMeV: 1112, widthMeV: 3 });
    expect(Math.abs(started.meanMeV - fit.meanMeV)).toBeLessThan(1e-6);
  });
});

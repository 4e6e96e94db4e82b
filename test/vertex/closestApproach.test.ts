import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../lib/simulate/rng.js';
import { closestApproach, fitTwoTrackVertex, helixPoint, newHelixParameters, type HelixParameters } from '../../lib/vertex/index.js';

/**
 * A helix that passes through `v` with direction φ at the point, curvature κ and slope t, whose
 * first hit (reference point) lies `lengthM` of transverse arc downstream of `v`.
 */
function helixThrough(v: readonly number[], phi: number, kappa: number, t: number, lengthM: number): HelixParameters {
  const h = newHelixParameters();
  Object.assign(h, { xRef: v[0], yRef: v[1], kappa, phi0: phi, d0: 0, z0: v[2], tanLambda: t });
  const ref = [0, 0, 0];
  helixPoint(h, lengthM, ref);
  Object.assign(h, { xRef: ref[0], yRef: ref[1], phi0: phi + kappa * lengthM, z0: ref[2] });
  return h;
}

describe('closestApproach of two helices (analytic cases)', () => {
  it('helices built to cross at a known point: DCA < 1e-9 m, the point and both arc lengths recovered (1e-9 m), for 200 random geometries', () => {
    const rng = seededRandom(17);
    let runs = 0;
    for (let i = 0; i < 200; i++) {
      const v = [rng.uniform() - 0.5, rng.uniform() - 0.5, 0.4 * (rng.uniform() - 0.5)];
      const phi = 2 * Math.PI * rng.uniform();
      const open = 0.2 + 1.2 * rng.uniform();
      const l1 = 0.02 + 0.2 * rng.uniform(), l2 = 0.02 + 0.2 * rng.uniform();
      const a = helixThrough(v, phi, 0.5 + 2 * rng.uniform(), 0.6 * (rng.uniform() - 0.5), l1);
      const b = helixThrough(v, phi + open, -(0.5 + 2 * rng.uniform()), 0.6 * (rng.uniform() - 0.5), l2);
      const ca = closestApproach(a, b);
      expect(ca.status).toBe('ok');
      expect(ca.distanceM).toBeLessThan(1e-9);
      expect(Math.abs(ca.s1 + l1)).toBeLessThan(1e-9);
      expect(Math.abs(ca.s2 + l2)).toBeLessThan(1e-9);
      const p = [0, 0, 0];
      helixPoint(a, ca.s1, p);
      for (let k = 0; k < 3; k++) expect(Math.abs(p[k] - v[k])).toBeLessThan(1e-9);
      runs++;
    }
    expect(runs).toBe(200);
  });

  it('two skew straight tracks: DCA = |(P₂ − P₁)·(u₁ × u₂)|/|u₁ × u₂| (1e-12 m)', () => {
    const a = newHelixParameters(), b = newHelixParameters();
    Object.assign(a, { xRef: 0, yRef: 0, kappa: 0, phi0: 0, d0: 0, z0: 0, tanLambda: 0.1 });
    Object.assign(b, { xRef: 0.3, yRef: -0.2, kappa: 0, phi0: 1.2, d0: 0, z0: 0.05, tanLambda: -0.3 });
    const u1 = [1, 0, 0.1], u2 = [Math.cos(1.2), Math.sin(1.2), -0.3];
    const n = [u1[1] * u2[2] - u1[2] * u2[1], u1[2] * u2[0] - u1[0] * u2[2], u1[0] * u2[1] - u1[1] * u2[0]];
    const d = [0.3, -0.2, 0.05];
    const expected = Math.abs(d[0] * n[0] + d[1] * n[1] + d[2] * n[2]) / Math.hypot(n[0], n[1], n[2]);
    const ca = closestApproach(a, b);
    expect(Math.abs(ca.distanceM - expected)).toBeLessThan(1e-12);
  });

  it('crossing circles whose helices are 3 mm apart in z at the crossing: the 3-D DCA is below 3 mm and above 0', () => {
    const v = [0.1, 0.05, 0];
    const a = helixThrough(v, 0.3, 1.5, 0, 0.1);
    const b = helixThrough([v[0], v[1], 0.003], 1.1, -1.2, 0, 0.08);
    const ca = closestApproach(a, b);
    expect(ca.distanceM).toBeLessThanOrEqual(0.003 + 1e-12);
    expect(ca.distanceM).toBeGreaterThan(0.0025);
  });
});

describe('fitTwoTrackVertex', () => {
  it('for exact crossing tracks with small covariances: vertex = crossing point (1e-9 m), χ² ≈ 0, covariance positive', () => {
    const v = [0.2, -0.1, 0.05];
    const a = helixThrough(v, 0.2, 1, 0.2, 0.1), b = helixThrough(v, 1.0, -2, -0.1, 0.05);
    for (const h of [a, b]) for (let i = 0; i < 5; i++) h.cov[6 * i] = 1e-8;
    const ca = closestApproach(a, b);
    const fit = fitTwoTrackVertex(a, b, ca.s1, ca.s2);
    expect(fit.status).toBe('ok');
    expect(Math.abs(fit.xM - v[0]) + Math.abs(fit.yM - v[1]) + Math.abs(fit.zM - v[2])).toBeLessThan(1e-9);
    expect(fit.chi2).toBeLessThan(1e-12);
    expect(fit.cov[0]).toBeGreaterThan(0);
    expect(fit.cov[3]).toBeGreaterThan(0);
    expect(fit.cov[5]).toBeGreaterThan(0);
  });
});

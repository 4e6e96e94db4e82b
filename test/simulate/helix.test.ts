import { describe, expect, it } from 'vitest';
import { GEV_PER_TESLA_METRE } from '../../lib/constants.js';
import { PION_MINUS, PROTON } from '../../lib/particles.js';
import { chamber, seededRandom, simulateChamber, transportTrack, TRANSPORT_DEFAULTS, type Sampling } from '../../lib/simulate/index.js';
import { VACUUM } from '../../lib/matter/index.js';

/**
 * Analytic helix in a field B along +z (Lorentz force with exact c; common practice): with
 * a = 0.299792458·q·B/p [1/m], the transverse direction angle is φ(s) = φ₀ − a s, so
 * x(s) = x₀ + cosλ (sin φ₀ − sin(φ₀ − a s))/a, y(s) = y₀ + cosλ (cos(φ₀ − a s) − cos φ₀)/a,
 * z(s) = z₀ + s sinλ. Written independently of lib/simulate/helixStep.ts.
 */
function analytic(s: number, q: number, bT: number, pGeV: number, phi0: number, lambda: number, r0: [number, number, number]): [number, number, number] {
  const a = (GEV_PER_TESLA_METRE * q * bT) / pGeV;
  const c = Math.cos(lambda);
  return [r0[0] + (c * (Math.sin(phi0) - Math.sin(phi0 - a * s))) / a, r0[1] + (c * (Math.cos(phi0 - a * s) - Math.cos(phi0))) / a, r0[2] + s * Math.sin(lambda)];
}

/** Rotation matrix (rows) taking +z to the unit vector n (Rodrigues). */
function rotationTo(n: [number, number, number]): number[][] {
  const [x, y, z] = n;
  const v = [-y, x, 0];
  const s = Math.hypot(v[0], v[1]);
  const c = z;
  if (s === 0) return [[1, 0, 0], [0, 1, 0], [0, 0, c]];
  const k = [v[0] / s, v[1] / s, 0];
  const K = [[0, -k[2], k[1]], [k[2], 0, -k[0]], [-k[1], k[0], 0]];
  const I = [[1, 0, 0], [0, 1, 0], [0, 0, 1]];
  return I.map((row, i) => row.map((_, j) => I[i][j] + s * K[i][j] + (1 - c) * K[i].reduce((acc, _k, m) => acc + K[i][m] * K[m][j], 0)));
}
const apply = (R: number[][], v: number[]) => R.map((row) => row[0] * v[0] + row[1] * v[1] + row[2] * v[2]) as [number, number, number];

describe('transportTrack without loss or scattering follows the analytic helix', () => {
  const noLoss = { ...TRANSPORT_DEFAULTS, energyLoss: 'off' as const, scattering: false, maxPathM: 40 };

  it('field along z: hits every 1 cm of a 1 GeV/c π⁻ lie on the helix within 1e-9 m', () => {
    const box = chamber({ sizeM: [4, 4, 4], medium: VACUUM, fieldT: [0, 0, 1.5] });
    const phi0 = 0.3, lambda = 0.2, p = 1;
    const hits: number[][] = [];
    transportTrack({ species: PION_MINUS, xM: 0.1, yM: -0.2, zM: 0.05, ux: Math.cos(lambda) * Math.cos(phi0), uy: Math.cos(lambda) * Math.sin(phi0), uz: Math.sin(lambda), momentumGeV: p },
      box, { ...noLoss, sampling: { kind: 'spacing', spacingM: 0.01 } }, seededRandom(1), (x, y, z) => hits.push([x, y, z]));
    expect(hits.length).toBeGreaterThan(100);
    let worst = 0;
    hits.forEach((h, k) => {
      const a = analytic((k + 1) * 0.01, -1, 1.5, p, phi0, lambda, [0.1, -0.2, 0.05]);
      worst = Math.max(worst, Math.hypot(h[0] - a[0], h[1] - a[1], h[2] - a[2]));
    });
    expect(worst).toBeLessThan(1e-9);
  });

  it('a looping 0.2 GeV/c proton makes several turns and stays on the helix within 1e-9 m', () => {
    const box = chamber({ sizeM: [4, 4, 40], medium: VACUUM, fieldT: [0, 0, 2] });
    const hits: number[][] = [];
    transportTrack({ species: PROTON, xM: 0, yM: 0, zM: 0, ux: Math.cos(0.05), uy: 0, uz: Math.sin(0.05), momentumGeV: 0.2 },
      box, { ...noLoss, maxPathM: 10, sampling: { kind: 'spacing', spacingM: 0.02 } }, seededRandom(1), (x, y, z) => hits.push([x, y, z]));
    let worst = 0;
    hits.forEach((h, k) => {
      const a = analytic((k + 1) * 0.02, 1, 2, 0.2, 0, 0.05, [0, 0, 0]);
      worst = Math.max(worst, Math.hypot(h[0] - a[0], h[1] - a[1], h[2] - a[2]));
    });
    expect(hits.length).toBe(500);
    expect(worst).toBeLessThan(1e-9);
  });

  it('field in an oblique direction: the same helix, rotated, within 1e-9 m', () => {
    const n: [number, number, number] = [0.48, -0.6, 0.64];
    const R = rotationTo(n);
    const b = 1.2;
    const box = chamber({ sizeM: [6, 6, 6], medium: VACUUM, fieldT: [b * n[0], b * n[1], b * n[2]] });
    const phi0 = -0.7, lambda = 0.4, p = 0.8;
    const d0 = [Math.cos(lambda) * Math.cos(phi0), Math.cos(lambda) * Math.sin(phi0), Math.sin(lambda)];
    const d = apply(R, d0);
    const hits: number[][] = [];
    transportTrack({ species: PION_MINUS, xM: 0, yM: 0, zM: 0, ux: d[0], uy: d[1], uz: d[2], momentumGeV: p },
      box, { ...noLoss, maxPathM: 3, sampling: { kind: 'spacing', spacingM: 0.05 } }, seededRandom(1), (x, y, z) => hits.push([x, y, z]));
    let worst = 0;
    hits.forEach((h, k) => {
      const a = apply(R, analytic((k + 1) * 0.05, -1, b, p, phi0, lambda, [0, 0, 0]));
      worst = Math.max(worst, Math.hypot(h[0] - a[0], h[1] - a[1], h[2] - a[2]));
    });
    expect(hits.length).toBe(60);
    expect(worst).toBeLessThan(1e-9);
  });

  it('detector planes: each hit lies on its plane and on the helix within 1e-9 m', () => {
    const box = chamber({ sizeM: [2, 2, 2], medium: VACUUM, fieldT: [0, 0, 1] });
    const planes = Array.from({ length: 19 }, (_, i) => -0.9 + 0.1 * i);
    const sampling: Sampling = { kind: 'planes', axis: 0, positionsM: planes };
    const hits: number[][] = [];
    transportTrack({ species: PION_MINUS, xM: -0.95, yM: 0, zM: 0, ux: Math.cos(0.1), uy: 0, uz: Math.sin(0.1), momentumGeV: 2 },
      box, { ...noLoss, sampling }, seededRandom(1), (x, y, z) => hits.push([x, y, z]));
    expect(hits.length).toBe(19);
    // Helix points: x(s) is monotonic here, so find s for each plane by bisection on the analytic form.
    hits.forEach((h, k) => {
      expect(Math.abs(h[0] - planes[k])).toBeLessThan(1e-9);
      let lo = 0, hi = 3;
      for (let it = 0; it < 200; it++) {
        const mid = 0.5 * (lo + hi);
        if (analytic(mid, -1, 1, 2, 0, 0.1, [-0.95, 0, 0])[0] < planes[k]) lo = mid; else hi = mid;
      }
      const a = analytic(lo, -1, 1, 2, 0, 0.1, [-0.95, 0, 0]);
      expect(Math.hypot(h[1] - a[1], h[2] - a[2])).toBeLessThan(1e-9);
    });
  });

  it('simulateChamber with zero smearing writes the true points; a field map equal to the uniform field gives the same hits', () => {
    const measurement = { sampling: { kind: 'spacing' as const, spacingM: 0.02 }, sigmaXM: 0, sigmaYM: 0, sigmaZM: 0, efficiency: 1, noiseHitsPerEvent: 0 };
    const transport = { energyLoss: 'off' as const, scattering: false, maxStepM: 0.02, maxPathM: 5, deltaRayMinMeV: 0 };
    const source = { kind: 'beam' as const, events: 5, species: [{ particle: PION_MINUS, weight: 1 }], momentumGeV: 0.7, momentumSpread: 0.05, originM: [-0.5, 0, 0] as [number, number, number], direction: [1, 0, 0.1] as [number, number, number], spotSigmaM: 0.01, divergenceRad: 0.01 };
    const uniform = simulateChamber({ name: 'u', chamber: chamber({ sizeM: [1.2, 1.2, 1.2], medium: VACUUM, fieldT: [0, 0, 1.5] }), transport, measurement, sources: [source] }, 3);
    const mapped = simulateChamber({ name: 'm', chamber: chamber({ sizeM: [1.2, 1.2, 1.2], medium: VACUUM, fieldT: (_x, _y, _z, out) => { out[0] = 0; out[1] = 0; out[2] = 1.5; } }), transport, measurement, sources: [source] }, 3);
    expect(uniform.hits.length).toBeGreaterThan(100);
    expect(Array.from(uniform.hits.x)).toEqual(Array.from(uniform.hitTruth.x));
    expect(Array.from(mapped.hits.x)).toEqual(Array.from(uniform.hits.x));
    expect(Array.from(mapped.hits.y)).toEqual(Array.from(uniform.hits.y));
  });

  it('a field-map callback: field only for x < 0 — helix there, a straight line (1e-9) once past the edge', () => {
    const box = chamber({ sizeM: [2, 2, 2], medium: VACUUM, fieldT: (x, _y, _z, out) => { out[0] = 0; out[1] = 0; out[2] = x < 0 ? 1.5 : 0; } });
    const hits: number[][] = [];
    transportTrack({ species: PION_MINUS, xM: -0.5, yM: 0, zM: 0, ux: 1, uy: 0, uz: 0, momentumGeV: 1 },
      box, { ...noLoss, maxPathM: 1.2, sampling: { kind: 'spacing', spacingM: 0.01 } }, seededRandom(1), (x, y, z) => hits.push([x, y, z]));
    const before = hits.filter((h) => h[0] < -0.01);
    before.forEach((h, k) => {
      const a = analytic((k + 1) * 0.01, -1, 1.5, 1, 0, 0, [-0.5, 0, 0]);
      expect(Math.hypot(h[0] - a[0], h[1] - a[1])).toBeLessThan(1e-9);
    });
    const after = hits.filter((h) => h[0] > 0.02);
    expect(after.length).toBeGreaterThan(40);
    const [p, q] = [after[0], after[after.length - 1]];
    const len = Math.hypot(q[0] - p[0], q[1] - p[1]);
    for (const h of after) expect(Math.abs(((q[0] - p[0]) * (h[1] - p[1]) - (q[1] - p[1]) * (h[0] - p[0])) / len)).toBeLessThan(1e-9);
  });
});

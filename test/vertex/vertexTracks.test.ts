import { describe, expect, it } from 'vitest';
import { hitTableFromColumns } from '../../lib/io/hitTableFromColumns.js';
import { measureTracks } from '../../lib/track/measureTracks.js';
import { vertexTracks } from '../../lib/vertex/vertexTracks.js';

/**
 * vertexTracks on hand-made circles: two arcs of R = 1 m turning opposite ways (8 hits each, in
 * metres, errors 200 µm), one straight track, one of two hits (not fittable), with and without z.
 * Checked: the charge sign from the turning sense and the field's sign (F = q v × B: seen from
 * +z a positive particle turns clockwise for B along +z), the full symmetric 5×5 covariance, the
 * no-z stand-ins (z0 = tan λ = 0 with 1 m² variances), the last hit's arc length R·Δφ, and which
 * rows are usable.
 */
function hits(withZ: boolean, withSigma: boolean) {
  const ev: number[] = [], tr: number[] = [], x: number[] = [], y: number[] = [], z: number[] = [], s: number[] = [];
  const add = (t: number, px: number, py: number, pz: number) => { ev.push(1); tr.push(t); x.push(px); y.push(py); z.push(pz); s.push(2e-4); };
  // Track 0: counter-clockwise about (0, 1) from the origin, 0.05 rad a hit; track 1: clockwise about (0, −1).
  for (let i = 0; i < 8; i++) add(0, Math.sin(0.05 * i), 1 - Math.cos(0.05 * i), 0.3 * 0.05 * i);
  for (let i = 0; i < 8; i++) add(1, Math.sin(0.05 * i), -1 + Math.cos(0.05 * i), -0.2 * 0.05 * i);
  for (let i = 0; i < 6; i++) add(2, 0.1 * i, 0.5, 0.01 * i);
  for (let i = 0; i < 2; i++) add(3, 0.1 * i, -0.5, 0);
  const names = ['event', 'track', 'x [m]', 'y [m]', ...(withZ ? ['z [m]'] : []), ...(withSigma ? ['sigma [m]'] : [])];
  const cols = [ev, tr, x, y, ...(withZ ? [z] : []), ...(withSigma ? [s] : [])];
  return hitTableFromColumns(names, cols, 'hand.csv', { lengthUnit: 'm', rowBase: 0 });
}

describe('vertexTracks', () => {
  it('charges from the turning sense and the field sign; straight tracks 0; the arc length of the last hit', () => {
    for (const fieldT of [1.5, -1.5]) {
      const v = vertexTracks(measureTracks(hits(true, true), { fieldT }));
      expect(v.count).toBe(4);
      expect(Math.sign(v.kappa[0])).toBe(1);
      expect(Array.from(v.charge.slice(0, 2))).toEqual(fieldT > 0 ? [-1, 1] : [1, -1]);
      expect(v.charge[2]).toBe(0);
      expect(Array.from(v.usable)).toEqual([1, 1, 1, 0]);
      expect(v.lastArcM[0]).toBeCloseTo(0.35, 9);
      expect(v.lastArcM[1]).toBeCloseTo(0.35, 9);
      expect(v.lastArcM[2]).toBeCloseTo(0.5, 9);
      expect(v.lastArcM[3]).toBeNaN();
      expect(v.tanLambda[0]).toBeCloseTo(0.3, 9);
      expect(v.tanLambda[1]).toBeCloseTo(-0.2, 9);
      expect(v.hasZ).toBe(true);
      expect(v.fieldT).toBe(fieldT);
    }
  });

  it('the 5×5 covariance is the helix fit’s, filled symmetric from its upper triangle', () => {
    const table = measureTracks(hits(true, true), { fieldT: 1.5 });
    const v = vertexTracks(table);
    for (let k = 0; k < 3; k++) {
      const c = v.cov.subarray(25 * k, 25 * k + 25);
      for (let r = 0; r < 5; r++) for (let u = 0; u < 5; u++) expect(c[5 * r + u], `track ${k} (${r},${u})`).toBe(c[5 * u + r]);
      for (let r = 0; r < 5; r++) expect(c[6 * r], `track ${k} variance ${r}`).toBeGreaterThan(0);
      // z0 and tan λ of a track are correlated (the line fit), and κ–φ0 through the circle fit.
      expect(c[5 * 3 + 4]).not.toBe(0);
      expect(c[1]).not.toBe(0);
    }
  });

  it('without z: z0 = tan λ = 0 with unit variances and no correlation to the circle; the circle block kept', () => {
    const v = vertexTracks(measureTracks(hits(false, true), { fieldT: 1.5 }));
    expect(v.hasZ).toBe(false);
    expect(Array.from(v.usable)).toEqual([1, 1, 1, 0]);
    const c = v.cov.subarray(0, 25);
    expect([c[18], c[24]]).toEqual([1, 1]);
    for (const i of [3, 4, 8, 9, 13, 14, 15, 16, 17, 19, 20, 21, 22, 23]) expect(c[i], `cov[${i}]`).toBe(0);
    for (let r = 0; r < 3; r++) for (let u = 0; u < 3; u++) {
      expect(Number.isFinite(c[5 * r + u]), `cov[${5 * r + u}]`).toBe(true);
      expect(c[5 * r + u]).toBe(c[5 * u + r]);
    }
    // The circle block is the no-z circle fit's: κ, φ0, d0 variances as the helix fit gives them
    // (the circle part of a two-step helix fit is the same circle fit).
    const withZ = vertexTracks(measureTracks(hits(true, true), { fieldT: 1.5 })).cov.subarray(0, 25);
    for (const i of [0, 1, 2, 6, 7, 12]) expect(c[i] / withZ[i], `cov[${i}]`).toBeCloseTo(1, 9);
    expect(c[0]).toBeGreaterThan(0);
    expect([v.z0[0], v.tanLambda[0]]).toEqual([0, 0]);
  });

  it('hits without errors take hitErrorM: the covariance scales with its square', () => {
    const table = measureTracks(hits(true, false), { fieldT: 1.5, hitErrorM: 2e-4 });
    const a = vertexTracks(table, { hitErrorM: 2e-4 }), b = vertexTracks(table, { hitErrorM: 4e-4 });
    expect(b.cov[0] / a.cov[0]).toBeCloseTo(4, 9);
    expect(b.cov[24] / a.cov[24]).toBeCloseTo(4, 6);
    const withSigma = vertexTracks(measureTracks(hits(true, true), { fieldT: 1.5 }));
    expect(a.cov[0] / withSigma.cov[0]).toBeCloseTo(1, 9);
    // Hits that carry their own errors keep them: hitErrorM is only for hits without.
    const own = measureTracks(hits(true, true), { fieldT: 1.5 });
    expect(vertexTracks(own, { hitErrorM: 4e-4 }).cov[0]).toBe(vertexTracks(own).cov[0]);
  });
});

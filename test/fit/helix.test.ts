import { describe, expect, it } from 'vitest';
import { fitHelix, fitHelices } from '../../lib/fit/fitHelices.js';
import { arcLengthsAndSlopes, newArcLengthSlopes } from '../../lib/fit/arcLengths.js';

/** Arc lengths alone (the s column of arcLengthsAndSlopes), in the argument order of the circle parametrisation. */
function arcLengths(x: Float64Array, y: Float64Array, from: number, to: number, kappa: number, phi: number, d: number, xRef: number, yRef: number, out: Float64Array): void {
  const scratch = newArcLengthSlopes(to - from);
  arcLengthsAndSlopes({ x, y, from, to }, { kappa, phi, d, xRef, yRef }, scratch);
  out.set(scratch.s.subarray(0, to - from));
}
import { fitLine } from '../../lib/fit/fitLine.js';
import { gaussian } from './helpers.js';

/** Hits on a helix about +z: centre (xc, yc), radius R, turning sense, dz/ds = tanL, z at start z0. */
function helix(xc: number, yc: number, R: number, a0: number, span: number, n: number, tanL: number, z0: number) {
  const x = new Float64Array(n), y = new Float64Array(n), z = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const da = (span * i) / (n - 1);
    x[i] = xc + R * Math.cos(a0 + da);
    y[i] = yc + R * Math.sin(a0 + da);
    z[i] = z0 + tanL * R * Math.abs(da);
  }
  return { x, y, z };
}

describe('fitHelix (derived checks on constructed helices)', () => {
  it('recovers tan λ and z0 of exact points within 1e-9, for arcs and for 2.5-turn spirals, both senses', () => {
    for (const [span, n] of [[0.8, 20], [-0.8, 20], [5 * Math.PI, 80], [-5 * Math.PI, 80]] as const) {
      const h = helix(0.2, -0.1, 0.4, 1.0, span, n, 0.35, -0.02);
      const f = fitHelix(h.x, h.y, h.z, { sigma: 1e-4, sigmaZ: 1e-4 });
      expect(f.status).toBe('ok');
      expect(f.tanLambda).toBeCloseTo(0.35, 9);
      expect(f.z0).toBeCloseTo(-0.02, 9);
      expect(f.circle.radius).toBeCloseTo(0.4, 9);
    }
  });

  it('arc length along a full turn equals 2πR (unwrapping works)', () => {
    const h = helix(0, 0, 0.5, 0, 2 * Math.PI * 1.25, 101, 0, 0);
    const s = new Float64Array(101);
    arcLengths(h.x, h.y, 0, 101, 1 / 0.5, Math.PI / 2, 0, h.x[0], h.y[0], s);
    expect(s[100]).toBeCloseTo(2 * Math.PI * 0.5 * 1.25, 9);
  });

  it('the 5×5 covariance is symmetric, positive on the diagonal, and its tan λ block matches the pulls', () => {
    const g = gaussian(11);
    const trials = 800, n = 25, sigma = 2e-4;
    const x = new Float64Array(n * trials), y = new Float64Array(n * trials), z = new Float64Array(n * trials);
    const offsets = new Int32Array(trials + 1);
    for (let k = 0; k < trials; k++) {
      const h = helix(0, 0, 0.8, 0.1 * k, 1.0, n, 0.5, 0.01);
      for (let i = 0; i < n; i++) {
        x[k * n + i] = h.x[i] + sigma * g();
        y[k * n + i] = h.y[i] + sigma * g();
        z[k * n + i] = h.z[i] + sigma * g();
      }
      offsets[k + 1] = (k + 1) * n;
    }
    const s = new Float64Array(n * trials).fill(sigma);
    const fits = fitHelices({ x, y, z, sigmaX: s, sigmaY: s, sigmaZ: s }, offsets);
    let sum2 = 0;
    for (let k = 0; k < trials; k++) {
      const pull = (fits.tanLambda[k] - 0.5) / Math.sqrt(fits.cov[15 * k + 14]);
      sum2 += pull * pull;
    }
    // RMS pull of tan λ within 8 % of 1 (statistical precision of 800 tracks ≈ 2.5 %).
    expect(Math.sqrt(sum2 / trials)).toBeGreaterThan(0.92);
    expect(Math.sqrt(sum2 / trials)).toBeLessThan(1.08);
    // Circle block unchanged by the helix step, diagonal positive.
    for (const idx of [0, 5, 9, 12, 14]) expect(fits.cov[idx]).toBeGreaterThan(0);
  });
});

describe('fitLine (textbook weighted least squares)', () => {
  it('fits exact data and gives the closed-form errors: var(slope) = σ²/Σ(u−ū)²', () => {
    const u = Float64Array.of(0, 1, 2, 3, 4), v = Float64Array.of(1, 3, 5, 7, 9);
    const s = new Float64Array(5).fill(0.5);
    const f = fitLine(u, v, s);
    expect(f.slope).toBeCloseTo(2, 12);
    expect(f.intercept).toBeCloseTo(1, 12);
    expect(f.cov[2]).toBeCloseTo(0.25 / 10, 12);
    expect(f.cov[0]).toBeCloseTo(0.25 * (1 / 5 + 4 / 10), 12);
  });
});

describe('arcLengthsAndSlopes (analytic ∂s/∂(κ, φ, d) used by the helix covariance)', () => {
  it('matches central finite differences of arcLengths, for curved, nearly straight and spiralling tracks', async () => {
    const cases: [number, number, number][] = [[1.7, 0.3, 0.002], [1e-6, -0.4, 0.001], [-25, 1.0, -0.0005], [40, 2.0, 0.0003]];
    for (const [kappa, phi, d] of cases) {
      const n = 40, R = 1 / Math.abs(kappa);
      const span = Math.min(5 * Math.PI, 1.2 / Math.abs(kappa) > 10 ? 0.5 : 5 * Math.PI);
      const x = new Float64Array(n), y = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        // Points near the circle defined by (κ, φ, d) at the origin: P0 = −d n, centre P0 + n/κ.
        const t = (span * i) / (n - 1);
        const nx = -Math.sin(phi), ny = Math.cos(phi);
        const cx = -d * nx + nx / kappa, cy = -d * ny + ny / kappa;
        const a0 = Math.atan2(-d * ny - cy, -d * nx - cx);
        const ang = a0 + Math.sign(kappa) * (Math.abs(kappa) > 1e-3 ? t : t * 1e-3);
        x[i] = cx + R * Math.cos(ang) + 1e-4 * Math.sin(3 * i);
        y[i] = cy + R * Math.sin(ang) + 1e-4 * Math.cos(5 * i);
      }
      const s = new Float64Array(n), dK = new Float64Array(n), dP = new Float64Array(n), dD = new Float64Array(n);
      arcLengthsAndSlopes({ x, y, from: 0, to: n }, { kappa, phi, d, xRef: 0, yRef: 0 }, { s, dsK: dK, dsP: dP, dsD: dD });
      const up = new Float64Array(n), dn = new Float64Array(n);
      const steps = [1e-6 * Math.max(Math.abs(kappa), 1), 1e-7, 1e-8];
      const analytic = [dK, dP, dD];
      for (let j = 0; j < 3; j++) {
        const h = steps[j];
        arcLengths(x, y, 0, n, kappa + (j === 0 ? h : 0), phi + (j === 1 ? h : 0), d + (j === 2 ? h : 0), 0, 0, up);
        arcLengths(x, y, 0, n, kappa - (j === 0 ? h : 0), phi - (j === 1 ? h : 0), d - (j === 2 ? h : 0), 0, 0, dn);
        for (let i = 0; i < n; i++) {
          const numeric = (up[i] - dn[i]) / (2 * h);
          expect(Math.abs(analytic[j][i] - numeric)).toBeLessThan(1e-5 * Math.max(1, Math.abs(numeric)));
        }
      }
    }
  });
});

describe('fitHelices joint covariance against a Monte Carlo of the fit itself (derived check)', () => {
  it('the 5×5 covariance of (κ, φ0, d0, z0, tan λ) matches the spread of 2500 noisy fits: variances within 8 %, correlations within 0.06', () => {
    const g = gaussian(5);
    const trials = 2500, n = 20, R = 0.5, span = 2.5, t = 1.0, sxy = 5e-4, sz = 2e-4;
    const x = new Float64Array(n * trials), y = new Float64Array(n * trials), z = new Float64Array(n * trials);
    const offsets = new Int32Array(trials + 1);
    for (let k = 0; k < trials; k++) {
      for (let i = 0; i < n; i++) {
        const a = (span * i) / (n - 1);
        x[k * n + i] = R * Math.sin(a) + sxy * g();
        y[k * n + i] = R * (1 - Math.cos(a)) + sxy * g();
        z[k * n + i] = t * R * a + sz * g();
      }
      offsets[k + 1] = (k + 1) * n;
    }
    const S = new Float64Array(n * trials).fill(sxy), Z = new Float64Array(n * trials).fill(sz);
    const f = fitHelices({ x, y, z, sigmaX: S, sigmaY: S, sigmaZ: Z }, offsets);
    // The parameters refer to each track's own first (measured) hit, so the truth is taken there:
    // the true circle has centre (0, R) and is travelled counter-clockwise from the origin.
    const res: number[][] = [[], [], [], [], []];
    for (let k = 0; k < trials; k++) {
      const ux = x[k * n], uy = y[k * n] - R;
      const alpha = Math.atan2(ux, -uy);
      const truth = [1 / R, alpha, -(Math.hypot(ux, uy) - R), t * R * alpha, t];
      const fit = [f.circle.kappa[k], f.circle.phi0[k], f.circle.d0[k], f.z0[k], f.tanLambda[k]];
      for (let j = 0; j < 5; j++) res[j].push(fit[j] - truth[j]);
    }
    const upper = (r: number, c: number) => 5 * r - (r * (r - 1)) / 2 + (c - r);
    for (let r = 0; r < 5; r++) {
      for (let c = r; c < 5; c++) {
        let sample = 0, predicted = 0;
        for (let k = 0; k < trials; k++) { sample += res[r][k] * res[c][k]; predicted += f.cov[15 * k + upper(r, c)]; }
        const vr = res[r].reduce((a, v) => a + v * v, 0), vc = res[c].reduce((a, v) => a + v * v, 0);
        if (r === c) expect(Math.abs(sample / predicted - 1)).toBeLessThan(0.08);
        else expect(Math.abs(sample / Math.sqrt(vr * vc) - predicted / Math.sqrt(vr * vc))).toBeLessThan(0.06);
      }
    }
  });
});

import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { fitCircle, fitCircles } from '../../lib/fit/fitCircles.js';
import { BUILT_IN_FIT_METHODS } from '../../lib/fit/fitMethods.js';
import { preparePlaneHits } from '../../lib/fit/preparePlaneHits.js';
import { circleFitAt } from '../../lib/fit/circleFit.js';
import { normalEquations } from '../../lib/fit/curvatureResidual.js';
import { arc, gaussian } from './helpers.js';

const METHODS = BUILT_IN_FIT_METHODS;

describe('fitCircle on exact points (derived check: the points are constructed on the circle)', () => {
  const cases: [string, number, number, number, number, number, number][] = [
    // label, xc, yc, R, start angle, span (signed), n
    ['2 m radius, 0.6 rad arc, ccw', 0.3, -1.1, 2, 0.2, 0.6, 20],
    ['2 m radius, 0.6 rad arc, cw', 0.3, -1.1, 2, 0.2, -0.6, 20],
    ['5 cm radius, two and a half turns (spiral-like)', 0.01, 0.02, 0.05, 1, 5 * Math.PI, 60],
    ['50 m radius, 1 m chord (short, stiff track)', -3, 40, 50, -1.2, 0.02, 12],
    ['3 points only', 1, 1, 0.7, 0, 1.5, 3],
    ['far from the origin: centre (800 m, −350 m), 1.5 m radius, 0.4 rad', 800, -350, 1.5, 2.2, 0.4, 15],
  ];
  for (const method of METHODS) {
    for (const [label, xc, yc, R, a0, span, n] of cases) {
      it(`${method}: ${label} recovers centre and radius within 1e-9·R`, () => {
        const { x, y } = arc(xc, yc, R, a0, span, n);
        const f = fitCircle(x, y, { method, sigma: 1e-4 });
        expect(f.status).toBe('ok');
        expect(Math.abs(f.radius - R) / R).toBeLessThan(1e-9);
        expect(Math.abs(f.xc - xc) / R).toBeLessThan(1e-9);
        expect(Math.abs(f.yc - yc) / R).toBeLessThan(1e-9);
        // Turning sense from the hit order: ccw → κ > 0.
        expect(Math.sign(f.kappa)).toBe(Math.sign(span));
        // Direction of travel at the first hit is the tangent of the arc there.
        const tangent = Math.atan2(Math.sign(span) * Math.cos(a0), -Math.sign(span) * Math.sin(a0));
        expect(Math.abs(Math.atan2(Math.sin(f.phi0 - tangent), Math.cos(f.phi0 - tangent)))).toBeLessThan(1e-9);
        expect(Math.abs(f.d0)).toBeLessThan(1e-9 * R);
      });
    }
  }

  it('geometric: a straight track gives κ ≈ 0 with a finite error, not R = ∞ trouble', () => {
    const n = 15;
    const x = new Float64Array(n), y = new Float64Array(n);
    for (let i = 0; i < n; i++) { x[i] = 0.1 * i; y[i] = 0.3 + 0.5 * 0.1 * i; }
    const f = fitCircle(x, y, { method: 'geometric', sigma: 1e-4 });
    expect(f.status).toBe('ok');
    expect(Math.abs(f.kappa)).toBeLessThan(1e-9);
    expect(f.phi0).toBeCloseTo(Math.atan2(0.5, 1), 12);
    expect(Number.isFinite(f.cov[0]) && f.cov[0] > 0).toBe(true);
  });
});

describe('fitCircle on the six-point example of Gander, Golub & Strebel, BIT 34 (1994) 558', () => {
  // Source and provenance: test/fixtures/gander-golub-strebel-1994/README.md (values recalled from memory).
  const x = Float64Array.of(1, 2, 5, 7, 9, 3);
  const y = Float64Array.of(7, 6, 8, 7, 5, 7);

  it('geometric fit gives centre (4.7398, 2.9835), radius 4.7142 as published (memory)', () => {
    const f = fitCircle(x, y, { method: 'geometric' });
    expect(f.xc).toBeCloseTo(4.7398, 4);
    expect(f.yc).toBeCloseTo(2.9835, 4);
    expect(f.radius).toBeCloseTo(4.7142, 4);
  });

  it('geometric fit agrees with an independent general-purpose Levenberg–Marquardt solver (ml-levenberg-marquardt)', () => {
    const f = fitCircle(x, y, { method: 'geometric' });
    // Independent model: residual_i = |P_i − C| − R in centre/radius parameters, target 0.
    const result = levenbergMarquardt(
      { x: [0, 1, 2, 3, 4, 5], y: [0, 0, 0, 0, 0, 0] },
      ([a, b, r]: number[]) => (i: number) => Math.hypot(x[i] - a, y[i] - b) - r,
      { initialValues: [5, 5, 3], maxIterations: 2000, errorTolerance: 1e-14, gradientDifference: 1e-8, damping: 1e-3 },
    );
    const [a, b, r] = result.parameterValues;
    expect(f.xc).toBeCloseTo(a, 5);
    expect(f.yc).toBeCloseTo(b, 5);
    expect(f.radius).toBeCloseTo(r, 5);
    // Our χ² (unit weights) is the same sum of squared distances the solver minimised.
    expect(f.chi2).toBeCloseTo(result.parameterError, 8);
  });

  it('the algebraic fits are not the geometric optimum (their χ² is larger), as expected', () => {
    const g = fitCircle(x, y, { method: 'geometric' });
    for (const method of ['kasa', 'taubin'] as const) {
      expect(fitCircle(x, y, { method }).chi2).toBeGreaterThan(g.chi2);
    }
  });
});

describe('fitCircle invariance (property tests)', () => {
  const rotate = (x: Float64Array, y: Float64Array, theta: number, tx: number, ty: number) => {
    const c = Math.cos(theta), s = Math.sin(theta);
    const X = new Float64Array(x.length), Y = new Float64Array(y.length);
    for (let i = 0; i < x.length; i++) { X[i] = c * x[i] - s * y[i] + tx; Y[i] = s * x[i] + c * y[i] + ty; }
    return { X, Y };
  };
  for (const method of METHODS) {
    it(`${method}: rotating and translating noisy hits rotates φ0 and leaves κ, d0 and χ² unchanged`, () => {
      fc.assert(
        fc.property(
          fc.record({
            R: fc.double({ min: 0.2, max: 20, noNaN: true }),
            span: fc.double({ min: 0.3, max: 3, noNaN: true }),
            sense: fc.constantFrom(-1, 1),
            theta: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
            tx: fc.double({ min: -5, max: 5, noNaN: true }),
            ty: fc.double({ min: -5, max: 5, noNaN: true }),
            seed: fc.integer({ min: 1, max: 1e6 }),
          }),
          ({ R, span, sense, theta, tx, ty, seed }) => {
            const n = 12;
            const { x, y } = arc(0.2, -0.4, R, 0.5, sense * span, n);
            const g = gaussian(seed);
            for (let i = 0; i < n; i++) { x[i] += 1e-3 * R * g(); y[i] += 1e-3 * R * g(); }
            const a = fitCircle(x, y, { method, sigma: 1e-3 * R });
            const { X, Y } = rotate(x, y, theta, tx, ty);
            const b = fitCircle(X, Y, { method, sigma: 1e-3 * R });
            expect(b.status).toBe(a.status);
            expect(Math.abs(b.kappa - a.kappa) * R).toBeLessThan(1e-8);
            expect(Math.abs(b.d0 - a.d0) / R).toBeLessThan(1e-8);
            const dphi = b.phi0 - a.phi0 - theta;
            expect(Math.abs(Math.atan2(Math.sin(dphi), Math.cos(dphi)))).toBeLessThan(1e-8);
            expect(Math.abs(b.chi2 - a.chi2)).toBeLessThan(1e-6 * Math.max(1, a.chi2));
          },
        ),
        { numRuns: 60, seed: 20261202 },
      );
    });
  }
});

describe('fitCircle covariance is honest (derived check by simulation)', () => {
  it('geometric: pulls of κ over 2000 noisy 20-hit tracks have mean ≈ 0 and width ≈ 1', () => {
    const n = 20, tracks = 2000, R = 1.5, sigma = 3e-4;
    const g = gaussian(7);
    const x = new Float64Array(n * tracks), y = new Float64Array(n * tracks);
    const offsets = new Int32Array(tracks + 1);
    for (let k = 0; k < tracks; k++) {
      const a = arc(0, 0, R, 0.3 * k, 0.8, n);
      for (let i = 0; i < n; i++) { x[k * n + i] = a.x[i] + sigma * g(); y[k * n + i] = a.y[i] + sigma * g(); }
      offsets[k + 1] = (k + 1) * n;
    }
    const s = new Float64Array(n * tracks).fill(sigma);
    const fits = fitCircles({ x, y, sigmaX: s, sigmaY: s }, offsets, { method: 'geometric' });
    let sum = 0, sum2 = 0, chi2 = 0;
    for (let k = 0; k < tracks; k++) {
      const pull = (fits.kappa[k] - 1 / R) / Math.sqrt(fits.cov[6 * k]);
      sum += pull; sum2 += pull * pull; chi2 += fits.chi2[k];
    }
    const mean = sum / tracks, width = Math.sqrt(sum2 / tracks - mean * mean);
    expect(Math.abs(mean)).toBeLessThan(0.1);
    expect(Math.abs(width - 1)).toBeLessThan(0.06);
    // Mean χ²/ndf ≈ 1 for Gaussian errors of the stated size.
    expect(chi2 / tracks / (n - 3)).toBeCloseTo(1, 1);
  });

  it('the Jacobian of the residual matches finite differences', () => {
    const { x, y } = arc(0.1, 0.2, 0.9, 0.4, 1.2, 8);
    for (let i = 0; i < 8; i++) x[i] += 1e-3 * Math.sin(7 * i);
    const base = { kappa: 1.1, phi: 2.0, d: 0.01 };
    const A = new Float64Array(6), G = new Float64Array(3);
    const span = { hits: preparePlaneHits({ x, y }), from: 0, to: 8 };
    const chi2 = (p: typeof base) => normalEquations(span, x[0], y[0], p, A, G);
    chi2(base);
    const grad = Array.from(G).map((v) => 2 * v); // ∂χ²/∂p = 2 Jᵀr
    const h = 1e-7;
    const keys = ['kappa', 'phi', 'd'] as const;
    keys.forEach((key, j) => {
      const up = { ...base, [key]: base[key] + h }, dn = { ...base, [key]: base[key] - h };
      const numeric = (chi2(up) - chi2(dn)) / (2 * h);
      expect(numeric).toBeCloseTo(grad[j], 6);
    });
  });
});

describe('fitCircles never throws on bad numbers: failures are statuses', () => {
  it('too few hits, identical hits and non-finite values give a status and NaN parameters', () => {
    const x = Float64Array.of(0, 1, /* track 2 */ 5, 5, 5, /* track 3 */ 0, NaN, 2, 3);
    const y = Float64Array.of(0, 1, /* track 2 */ 2, 2, 2, /* track 3 */ 0, 1, 2, 2);
    const fits = fitCircles({ x, y }, Int32Array.of(0, 2, 5, 9));
    expect([0, 1, 2].map((k) => circleFitAt(fits, k).status)).toEqual(['too-few-hits', 'degenerate', 'bad-input']);
    expect(Number.isNaN(fits.kappa[0])).toBe(true);
  });

  it('a bad method name is a bad call and throws', () => {
    expect(() => fitCircles({ x: new Float64Array(3), y: new Float64Array(3) }, Int32Array.of(0, 3), { method: 'nope' })).toThrow(/method = "nope"/);
  });

  it('without hit errors, the error is estimated from the residuals (χ²/ndf scaling)', () => {
    const g = gaussian(3);
    const { x, y } = arc(0, 0, 1, 0, 1, 30);
    for (let i = 0; i < 30; i++) { x[i] += 1e-3 * g(); y[i] += 1e-3 * g(); }
    const est = fitCircle(x, y, { method: 'geometric' });
    const known = fitCircle(x, y, { method: 'geometric', sigma: 1e-3 });
    expect(est.errorsEstimated).toBe(true);
    expect(known.errorsEstimated).toBe(false);
    // Same κ; errors agree within the statistical precision of a 27-ndf variance estimate (~±30 %).
    expect(est.kappa).toBeCloseTo(known.kappa, 10);
    expect(Math.sqrt(est.cov[0] / known.cov[0])).toBeGreaterThan(0.6);
    expect(Math.sqrt(est.cov[0] / known.cov[0])).toBeLessThan(1.4);
  });
});

describe('fitCircle on a tightening spiral (a track losing momentum is not a circle)', () => {
  it('geometric: still converges to the best circle, with a χ² that says the model does not fit', () => {
    const n = 120, x = new Float64Array(n), y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const a = (4 * Math.PI * i) / (n - 1);
      const r = 0.05 * (1 - 0.3 * (i / (n - 1)));
      x[i] = r * Math.cos(a);
      y[i] = r * Math.sin(a);
    }
    const f = fitCircle(x, y, { method: 'geometric', sigma: 3.5e-4 });
    expect(f.status).toBe('ok');
    expect(f.kappa).toBeGreaterThan(0);
    expect(f.chi2 / f.ndf).toBeGreaterThan(100);
  });
});

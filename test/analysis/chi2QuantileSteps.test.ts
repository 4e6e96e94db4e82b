import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';

// Counts the evaluations of the regularised gamma function a quantile takes: the doc comment of
// chi2Quantile promises a handful (Newton steps in ln x from a good start), which is what keeps
// a goodness-of-fit column over a million tracks cheap.
const calls = vi.hoisted(() => ({ n: 0 }));
vi.mock('../../lib/analysis/regularizedGamma.js', async (importOriginal) => {
  const real = await importOriginal<typeof import('../../lib/analysis/regularizedGamma.js')>();
  return {
    regularizedGammaP: (a: number, x: number) => { calls.n++; return real.regularizedGammaP(a, x); },
    regularizedGammaQ: (a: number, x: number) => { calls.n++; return real.regularizedGammaQ(a, x); },
  };
});
const { chi2Quantile } = await import('../../lib/analysis/chi2Quantile.js');
const { regularizedGammaP, regularizedGammaQ } = await vi.importActual<typeof import('../../lib/analysis/regularizedGamma.js')>('../../lib/analysis/regularizedGamma.js');

describe('chi2Quantile: few steps, any tail', () => {
  it('at most 10 evaluations of the gamma function from 1e-300 to 1 − 1e-9, 0.5 to 1e5 degrees of freedom, each quantile exact to 1e-12 (1e-10 at 1e5 d.o.f.)', () => {
    let worst = 0, checked = 0;
    for (const ndf of [0.5, 1, 2, 3, 10, 50, 400, 1e5]) for (const p of [1e-300, 1e-30, 1e-11, 1e-9, 1e-3, 0.05, 0.5, 0.95, 0.999, 1 - 1e-9]) {
      calls.n = 0;
      const x = chi2Quantile(p, ndf);
      worst = Math.max(worst, calls.n);
      if (x === 0) continue; // underflows a double (½ and 1 d.o.f. at 1e-300)
      const back = p > 0.5 ? regularizedGammaQ(ndf / 2, x / 2) / (1 - p) : regularizedGammaP(ndf / 2, x / 2) / p;
      // At 1e5 d.o.f. P itself carries ~1e-11: its exponent a·ln y ≈ 5e5 is rounded to ~1e-16 of that.
      expect(Math.abs(back - 1), `ndf ${ndf}, p ${p}`).toBeLessThan(ndf > 1e3 ? 1e-10 : 1e-12);
      checked++;
    }
    expect(checked).toBe(78);
    expect(worst).toBeLessThanOrEqual(10);
  });
  it('very few degrees of freedom (0.001–0.3), where the quantile of p = 0.7 is a subnormal number: still exact or 0', () => {
    let checked = 0;
    for (const ndf of [1e-3, 0.01, 0.1, 0.3]) for (const p of [1e-5, 0.3, 0.7, 1 - 1e-5, 1 - 1e-15]) {
      const x = chi2Quantile(p, ndf);
      if (x === 0) continue;
      const back = p > 0.5 ? regularizedGammaQ(ndf / 2, x / 2) / (1 - p) : regularizedGammaP(ndf / 2, x / 2) / p;
      expect(Math.abs(back - 1), `ndf ${ndf}, p ${p}`).toBeLessThan(x < 1e-300 ? 1e-9 : 1e-12);
      checked++;
    }
    expect(checked).toBe(17); // 20 less three that underflow (0.001 d.o.f. at 1e-5 and 0.3, 0.01 at 1e-5)
  });
  it('property: for any d.o.f. in 1e-3–1e6 and any p in either tail (1e-300 … 1 − 3e-16), the quantile inverts the gamma function to 1e-10 + 2e-15·ndf or underflows to 0, in at most 12 evaluations', () => {
    fc.assert(fc.property(fc.double({ min: -3, max: 6, noNaN: true }), fc.double({ min: -300, max: -0.31, noNaN: true }), fc.boolean(), (lgNdf, lgTail, upperTail) => {
      const ndf = 10 ** lgNdf, tail = 10 ** (upperTail ? Math.max(lgTail, -15.5) : lgTail), p = upperTail ? 1 - tail : tail;
      calls.n = 0;
      const x = chi2Quantile(p, ndf);
      if (calls.n > 12) return false;
      if (x === 0 || (x > 0 && x < 1e-300)) return !upperTail || ndf < 0.1; // underflow: lower tail, or an upper tail of tiny d.o.f.
      const back = upperTail ? regularizedGammaQ(ndf / 2, x / 2) / (1 - p) : regularizedGammaP(ndf / 2, x / 2) / p;
      // P and Q themselves carry ~1e-16 of their exponent a·ln y: 2e-15·ndf covers it at many d.o.f.
      return Math.abs(back - 1) < 1e-10 + 2e-15 * ndf;
    }), { numRuns: 3000, seed: 20261204 });
  });
});

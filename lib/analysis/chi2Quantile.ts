import { lnGamma } from './lnGamma.js';
import { normalQuantile } from './normalQuantile.js';
import { regularizedGammaP, regularizedGammaQ } from './regularizedGamma.js';

/**
 * Quantile of the χ² distribution with `ndf` degrees of freedom: the x with P(χ²_ndf ≤ x) = p.
 * Works on the smaller tail T (the regularised gamma function P below the median side, Q above)
 * and solves ln T(x) = ln(tail probability) in u = ln x, so tails down to the smallest doubles keep
 * their accuracy: Newton steps inside a bracket (a step that would leave it bisects instead),
 * from the Wilson–Hilferty cube-root approximation (E. B. Wilson & M. M. Hilferty, PNAS 17 (1931)
 * 684) and, in the lower tail, from the series' leading term P(a, y) ≈ yᵃ/Γ(a + 1) where that is
 * larger (it never exceeds the root, since P(a, y) ≤ yᵃ/Γ(a + 1)). Relative accuracy ~1e-12;
 * at most 10 evaluations of T from p = 1e-300 to 1 − 1e-9 for 0.5–1e5 d.o.f. (tested). ndf may be any positive real number.
 * NaN for ndf ≤ 0 or p outside [0, 1]; 0 at p = 0 and where the quantile underflows a double
 * (e.g. 1 d.o.f. at p = 1e-300, x ≈ 1.6e-600); Infinity at p = 1.
 * @example chi2Quantile(0.95, 1) // ≈ 3.841458821 (the 5 % critical value for 1 degree of freedom)
 */
export function chi2Quantile(p: number, ndf: number): number {
  if (!(ndf > 0) || !(p >= 0 && p <= 1)) return NaN;
  if (p === 0) return 0;
  if (p === 1) return Infinity;
  const a = ndf / 2;
  const upper = p > 0.5;
  const lnTarget = upper ? Math.log1p(-p) : Math.log(p);
  // G(u) = ±(ln T(eᵘ) − ln target), rising in u in both tails; G′(u) = x·f(x)/T (f the χ² density).
  const logNorm = a * Math.LN2 + lnGamma(a); // ln(2^a Γ(a))
  let u = 0, G = 0, slope = 0;
  const evaluate = (at: number): void => {
    u = at;
    const x = Math.exp(at);
    const T = upper ? regularizedGammaQ(a, x / 2) : regularizedGammaP(a, x / 2);
    G = upper ? lnTarget - Math.log(T) : Math.log(T) - lnTarget;
    slope = Math.exp(a * at - x / 2 - logNorm) / T;
  };
  const h = 2 / (9 * ndf);
  const cube = 1 - h + normalQuantile(p) * Math.sqrt(h);
  // Far in the lower tail the cube root goes negative: no start there (the series gives one).
  let start = cube > 1e-3 ? Math.log(ndf) + 3 * Math.log(cube) : upper ? Math.log(ndf) : -Infinity;
  let lo = -Infinity, hi = Infinity;
  if (!upper) {
    const series = Math.LN2 + (lnTarget + lnGamma(a + 1)) / a; // G(series) ≤ 0
    if (Math.exp(series) === 0) return 0;
    lo = series;
    if (!(start > series)) start = series;
  }
  evaluate(start);
  for (let it = 0; it < 200; it++) {
    if (G === 0) return Math.exp(u);
    if (G < 0) lo = u; else hi = u;
    const step = G / slope, tol = 1e-15 * Math.max(1, Math.abs(u));
    if (Math.abs(step) <= tol) return Math.exp(u - step);
    let next = u - step;
    if (!(next > lo && next < hi)) {
      // Newton left the bracket (or T underflowed): bisect it, or walk out by e-folds of x
      // towards its open side.
      next = Number.isFinite(lo) && Number.isFinite(hi) ? 0.5 * (lo + hi) : Number.isFinite(hi) ? u - 1 : u + 1;
    } else if (!Number.isFinite(lo) || !Number.isFinite(hi)) {
      next = u - Math.max(-30, Math.min(30, step)); // at most 30 e-folds a step towards an open side
    }
    if (hi - lo <= tol) return Math.exp(next);
    evaluate(next);
  }
  return Math.exp(u);
}

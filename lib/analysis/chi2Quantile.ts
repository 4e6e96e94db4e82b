import { lnGamma } from './lnGamma.js';
import { normalQuantile } from './normalQuantile.js';
import { regularizedGammaP, regularizedGammaQ } from './regularizedGamma.js';

/**
 * Quantile of the χ² distribution with `ndf` degrees of freedom: the x with P(χ²_ndf ≤ x) = p.
 * Starts from the Wilson–Hilferty cube-root approximation (E. B. Wilson & M. M. Hilferty,
 * PNAS 17 (1931) 684) and refines by Newton steps on the regularised gamma function, kept
 * inside a bracket so every step is safe; relative accuracy ~1e-12. ndf may be any positive
 * real number. NaN for ndf ≤ 0 or p outside [0, 1]; 0 at p = 0 and Infinity at p = 1. Far in the
 * lower tail (p < 1e-10, down to the smallest doubles) the root is found on ln P against ln x
 * instead, from the series' leading term P(a, y) ≈ yᵃ/Γ(a + 1): a bisection from x = 0 cannot
 * reach quantiles like 1e-150 within its steps. 0 where the quantile itself underflows a double.
 * @example chi2Quantile(0.95, 1) // ≈ 3.841458821 (the 5 % critical value for 1 degree of freedom)
 */
export function chi2Quantile(p: number, ndf: number): number {
  if (!(ndf > 0) || !(p >= 0 && p <= 1)) return NaN;
  if (p === 0) return 0;
  if (p === 1) return Infinity;
  const a = ndf / 2;
  // Work on the smaller tail so that p near 1 keeps its accuracy.
  const upper = p > 0.5;
  const target = upper ? 1 - p : p;
  // g(x) rises with x in both cases: P(a, x/2) − p, or (1 − p) − Q(a, x/2).
  const g = (x: number) => (upper ? target - regularizedGammaQ(a, x / 2) : regularizedGammaP(a, x / 2) - target);
  const logNorm = a * Math.LN2 + lnGamma(a); // ln(2^a Γ(a))
  if (!upper && target < 1e-10) return lowerTailQuantile(a, target, logNorm);
  const h = 2 / (9 * ndf);
  let x = ndf * Math.pow(Math.max(1 - h + normalQuantile(p) * Math.sqrt(h), 1e-3), 3);
  if (!(x > 0) || !Number.isFinite(x)) x = ndf;
  let lo = 0, hi = Math.max(2 * x, 1);
  while (g(hi) < 0) hi *= 2;
  for (let it = 0; it < 300; it++) {
    const f = g(x);
    if (f < 0) lo = x; else hi = x;
    const density = Math.exp((a - 1) * Math.log(x) - x / 2 - logNorm); // χ² density at x
    let next = x - f / density;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - x) <= 1e-15 * x || hi - lo <= 1e-15 * hi) return next;
    x = next;
  }
  return x;
}

/**
 * The x with P(a, x/2) = p for tiny p: Newton steps on ln P(a, x/2) − ln p in u = ln x. The start,
 * ln x = ln 2 + (ln p + ln Γ(a + 1))/a, lies at or left of the root (P(a, y) ≤ yᵃ/Γ(a + 1)), and
 * ln P is increasing and concave in u there, so the steps approach the root from the left.
 */
function lowerTailQuantile(a: number, p: number, logNorm: number): number {
  const lnP = Math.log(p);
  let u = Math.LN2 + (lnP + lnGamma(a + 1)) / a;
  for (let it = 0; it < 200; it++) {
    const x = Math.exp(u);
    const P = regularizedGammaP(a, x / 2);
    const density = Math.exp((a - 1) * u - x / 2 - logNorm);
    const slope = (x * density) / P; // d ln P / d ln x
    if (!(P > 0) || !(slope > 0)) return x;
    const step = (Math.log(P) - lnP) / slope;
    u -= step;
    if (Math.abs(step) <= 1e-15 * Math.max(1, Math.abs(u))) return Math.exp(u);
  }
  return Math.exp(u);
}

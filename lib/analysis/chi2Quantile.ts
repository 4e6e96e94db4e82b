import { lnGamma } from './lnGamma.js';
import { normalQuantile } from './normalQuantile.js';
import { regularizedGammaP, regularizedGammaQ } from './regularizedGamma.js';

/** The smallest normal double; below it a double keeps fewer digits. */
const MIN_NORMAL = 2.2250738585072014e-308;

/**
 * Quantile of the χ² distribution with `ndf` degrees of freedom: the x with P(χ²_ndf ≤ x) = p.
 * Works on the smaller tail T (the regularised gamma function P below the median, Q above) and
 * solves ln T(x) = ln(tail probability) in u = ln x, so tails down to the smallest doubles keep
 * their accuracy: Newton steps inside a bracket (a step that would leave it bisects instead),
 * from the Wilson–Hilferty cube-root approximation (E. B. Wilson & M. M. Hilferty, PNAS 17 (1931)
 * 684), or from the series' leading term P(a, y) ≈ yᵃ/Γ(a + 1) where that is larger (it never
 * exceeds the root, since P(a, y) ≤ yᵃ/Γ(a + 1)), or for very few d.o.f. in the upper tail from
 * Q(a, y) ≈ a·e^(−y)/y. Relative accuracy ~1e-12 (at many d.o.f. that of P and Q themselves,
 * ~1e-15·ndf); at most 10 evaluations of T from p = 1e-300 to 1 − 1e-9 for 0.5–1e5 d.o.f., at
 * most 12 from 1e-3 to 1e6 d.o.f. (tested, the latter as a property). ndf may be any positive
 * real number. NaN for ndf ≤ 0 or p outside [0, 1]; 0 at p = 0; a quantile below the smallest
 * normal double is the series value, 0 where it underflows (1 d.o.f. at p = 1e-300: x ≈ 1.6e-600);
 * Infinity at p = 1.
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
  // The series bound holds in both tails (P there is at most p): the root is not below it, and
  // where it is subnormal or underflows, it is the root (x that small makes the bound exact).
  const series = Math.LN2 + (Math.log(p) + lnGamma(a + 1)) / a;
  if (Math.exp(series) < MIN_NORMAL) return Math.exp(series);
  let lo = series, hi = Infinity, previous = Infinity;
  // Where the cube root goes negative (far lower tail, or very few d.o.f.) it gives no start; in
  // the upper tail of very few d.o.f. Q(a, y) ≈ a·E₁(y) ≈ a·e^(−y)/y does (y ≈ ln a − ln Q).
  let start = cube > 1e-3 ? Math.log(ndf) + 3 * Math.log(cube) : -Infinity;
  if (upper && !(cube > 1e-3) && Math.log(a) - lnTarget > 1) start = Math.log(2 * (Math.log(a) - lnTarget));
  if (!(start > series)) start = series;
  evaluate(start);
  for (let it = 0; it < 200; it++) {
    if (G === 0) return Math.exp(u);
    if (G < 0) lo = u; else hi = u;
    const step = G / slope, tol = 1e-15 * Math.max(1, Math.abs(u));
    // Done at the tolerance, or where the steps stop shrinking (many d.o.f.: T itself is then only
    // good to ~1e-16 of its exponent a·ln y, and that noise sets the steps).
    if (Math.abs(step) <= tol || (Math.abs(step) < 1e-9 * Math.max(1, Math.abs(u)) && Math.abs(step) >= 0.5 * Math.abs(previous))) return Math.exp(u - step);
    previous = step;
    let next = u - step;
    // Newton left the bracket (or T underflowed or rounded to 1): bisect it, or step an e-fold of x
    // up while no upper end is known (the lower end, the series bound, always is). Without this
    // test very few d.o.f. in the upper tail went to NaN.
    if (!(next > lo && next < hi)) next = Number.isFinite(hi) ? 0.5 * (lo + hi) : u + 1;
    if (hi - lo <= tol) return Math.exp(next);
    evaluate(next);
  }
  return Math.exp(u);
}

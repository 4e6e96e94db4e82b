import { lnGamma } from './lnGamma.js';

/**
 * Upper tail of the χ² distribution, P(χ²_ndf ≥ x) = Q(ndf/2, x/2), with Q the regularised upper
 * incomplete gamma function: series for x < a + 1, Lentz continued fraction otherwise
 * (Abramowitz & Stegun 6.5.29 and 6.5.31; W. H. Press et al., Numerical Recipes, 3rd ed., §6.2).
 * ln Γ from `lnGamma`. Relative accuracy ~1e-12 for ndf ≤ 1000.
 * NaN for ndf ≤ 0 or a non-finite χ²; 1 for χ² ≤ 0.
 * @example chi2Survival(3.841, 1) // ≈ 0.05 (χ² tables: 5 % critical value for 1 degree of freedom)
 */
export function chi2Survival(chi2: number, ndf: number): number {
  if (!(ndf > 0) || !Number.isFinite(chi2)) return NaN;
  if (chi2 <= 0) return 1;
  const a = ndf / 2, x = chi2 / 2;
  return x < a + 1 ? 1 - lowerSeries(a, x) : upperFraction(a, x);
}

/** Regularised lower gamma P(a, x) by its series. */
function lowerSeries(a: number, x: number): number {
  let term = 1 / a, sum = term;
  for (let n = 1; n < 10_000; n++) {
    term *= x / (a + n);
    sum += term;
    if (Math.abs(term) < Math.abs(sum) * 1e-16) break;
  }
  return sum * Math.exp(-x + a * Math.log(x) - lnGamma(a));
}

/** Regularised upper gamma Q(a, x) by the continued fraction (modified Lentz). */
function upperFraction(a: number, x: number): number {
  const tiny = 1e-300;
  let b = x + 1 - a, c = 1 / tiny, d = 1 / b, h = d;
  for (let i = 1; i < 10_000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(-x + a * Math.log(x) - lnGamma(a)) * h;
}

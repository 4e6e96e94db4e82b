import { regularizedGammaQ } from './regularizedGamma.js';

/**
 * Upper tail of the χ² distribution, P(χ²_ndf ≥ x) = Q(ndf/2, x/2), with Q the regularised upper
 * incomplete gamma function (`regularizedGammaQ`: series or continued fraction, Abramowitz &
 * Stegun 6.5.29 and 6.5.31; Numerical Recipes, 3rd ed., §6.2). Relative accuracy ~1e-12 for
 * ndf ≤ 1000. NaN for ndf ≤ 0 or a non-finite χ²; 1 for χ² ≤ 0.
 * @example chi2Survival(3.841, 1) // ≈ 0.05 (χ² tables: 5 % critical value for 1 degree of freedom)
 */
export function chi2Survival(chi2: number, ndf: number): number {
  if (!(ndf > 0) || !Number.isFinite(chi2)) return NaN;
  if (chi2 <= 0) return 1;
  return regularizedGammaQ(ndf / 2, chi2 / 2);
}

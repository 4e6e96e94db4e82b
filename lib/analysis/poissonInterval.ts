import { msg } from '../errors.js';
import { chi2Quantile } from './chi2Quantile.js';

/** A confidence interval [lower, upper] for the mean of a Poisson count. */
export interface PoissonInterval {
  readonly lower: number;
  readonly upper: number;
}

/** The central confidence level of ±1σ of a normal distribution, erf(1/√2). */
export const ONE_SIGMA_CL = 0.6826894921370859;

/**
 * Exact (Garwood) central confidence interval for the mean μ of a Poisson variable after
 * observing `n` events: each tail holds (1 − cl)/2, so
 * lower = ½ χ²((1 − cl)/2; 2n) and upper = ½ χ²((1 + cl)/2; 2n + 2), with lower = 0 for n = 0
 * (F. Garwood, Biometrika 28 (1936) 437; N. Gehrels, ApJ 303 (1986) 336, eqs. 1–2 and
 * Tables 1–2; PDG RPP, "Statistics", §40.4.2.3). The default `cl` is that of ±1σ, whose
 * one-sided tails are Gehrels' 0.8413 columns. Coverage is at least `cl` for every μ.
 * `n` must be a whole number ≥ 0; 0 < cl < 1.
 * @example poissonInterval(0) // { lower: 0, upper: 1.841… }   (Gehrels 1986, Table 1: 1.841)
 * @example poissonInterval(3, 0.9) // { lower: 0.818, upper: 7.754 }
 */
export function poissonInterval(n: number, cl: number = ONE_SIGMA_CL): PoissonInterval {
  checkCount(n, cl);
  const tail = (1 - cl) / 2;
  return {
    lower: n === 0 ? 0 : chi2Quantile(tail, 2 * n) / 2,
    upper: chi2Quantile(1 - tail, 2 * n + 2) / 2,
  };
}

/**
 * One-sided exact Poisson limit at confidence level `cl`: the `upper` limit μ_u with
 * P(N ≤ n | μ_u) = 1 − cl, or the `lower` limit μ_l with P(N ≥ n | μ_l) = 1 − cl (0 for n = 0).
 * These are the entries of Gehrels (1986) Tables 1 and 2 and of the PDG table of Poisson limits
 * without background (RPP, "Statistics", Table 40.3).
 * @example poissonLimit(0, 0.9, 'upper') // 2.303 (= ln 10)
 */
export function poissonLimit(n: number, cl: number, side: 'upper' | 'lower'): number {
  checkCount(n, cl);
  if (side === 'upper') return chi2Quantile(cl, 2 * n + 2) / 2;
  return n === 0 ? 0 : chi2Quantile(1 - cl, 2 * n) / 2;
}

function checkCount(n: number, cl: number): void {
  if (!Number.isInteger(n) || n < 0) throw msg.badArgument('n', n, 'a whole number of events ≥ 0');
  if (!(cl > 0 && cl < 1)) throw msg.badArgument('cl', cl, 'a confidence level between 0 and 1, e.g. 0.6827 or 0.95');
}

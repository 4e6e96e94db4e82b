import { erfc } from './erf.js';

/**
 * Standard normal distribution function Φ(z) = P(Z ≤ z) = ½ erfc(−z/√2) (Abramowitz & Stegun
 * 26.2.29). Relative accuracy ~1e-14, also deep in the lower tail (Φ(−30) ≈ 4.9e-198).
 * @example normalCdf(1.959963985) // ≈ 0.975
 */
export function normalCdf(z: number): number {
  return 0.5 * erfc(-z / Math.SQRT2);
}

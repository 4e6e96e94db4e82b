/**
 * Armenteros–Podolanski variables of a two-prong decay (Podolanski & Armenteros, Phil. Mag. 45
 * (1954) 13): with the parent direction n̂ = (p⁺ + p⁻)/|p⁺ + p⁻|,
 *   α = (p⁺·n̂ − p⁻·n̂)/(p⁺·n̂ + p⁻·n̂),   q_T = |p⁺ − (p⁺·n̂) n̂| (= the same for p⁻).
 * Momenta in MeV/c (any unit; q_T comes back in it). For a K⁰_S the points lie on a symmetric
 * ellipse with q_T ≤ 206 MeV/c; for Λ (α > 0) and Λ̄ (α < 0) on shifted ones with q_T ≤ 101.
 * NaN when the pair has no net momentum.
 * @example armenteros([100, 50, 0], [100, -50, 0]) // { alpha: 0, qtMeV: 50 }
 */
export function armenteros(positive: ArrayLike<number>, negative: ArrayLike<number>): { readonly alpha: number; readonly qtMeV: number } {
  const sx = positive[0] + negative[0], sy = positive[1] + negative[1], sz = positive[2] + negative[2];
  const s = Math.hypot(sx, sy, sz);
  if (!(s > 0)) return { alpha: NaN, qtMeV: NaN };
  const nx = sx / s, ny = sy / s, nz = sz / s;
  const lp = positive[0] * nx + positive[1] * ny + positive[2] * nz;
  const ln = negative[0] * nx + negative[1] * ny + negative[2] * nz;
  const tx = positive[0] - lp * nx, ty = positive[1] - lp * ny, tz = positive[2] - lp * nz;
  return { alpha: (lp - ln) / (lp + ln), qtMeV: Math.hypot(tx, ty, tz) };
}

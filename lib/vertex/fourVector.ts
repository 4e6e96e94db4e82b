/**
 * Four-momenta (E, px, py, pz) in MeV with c = 1 (special relativity; common practice, PDG RPP
 * "Kinematics"). A plain readonly tuple so that hot loops can keep them in typed arrays and
 * callers can write literals. This module imports nothing but the error catalogue, so the
 * simulator may use it too (lib/simulate → lib/vertex kinematics leaves only).
 */
export type FourVector = readonly [number, number, number, number];

/**
 * Four-momentum [MeV] of a particle of mass `massMeV` with momentum components in MeV/c:
 * E = √(p² + m²). Valid for any finite input.
 * @example fourMomentum(0, 0, 100, 139.57039) // [172.05…, 0, 0, 100]
 */
export function fourMomentum(pxMeV: number, pyMeV: number, pzMeV: number, massMeV: number): FourVector {
  return [Math.sqrt(pxMeV * pxMeV + pyMeV * pyMeV + pzMeV * pzMeV + massMeV * massMeV), pxMeV, pyMeV, pzMeV];
}

/** Component-wise sum of four-vectors (the four-momentum of a system). */
export function sumFourVectors(...vectors: readonly FourVector[]): FourVector {
  let e = 0, x = 0, y = 0, z = 0;
  for (const v of vectors) { e += v[0]; x += v[1]; y += v[2]; z += v[3]; }
  return [e, x, y, z];
}

/**
 * Invariant mass [MeV] of a system of any number of four-momenta:
 * m² = (ΣE)² − |Σp|² (PDG RPP "Kinematics"). NaN when the sum is space-like (m² < 0), which a
 * set of physical particles cannot give beyond rounding; a tiny negative m² from rounding of a
 * massless pair is returned as 0.
 * @example invariantMassMeV(a, b) // 497.611 for the π⁺π⁻ of a K⁰_S
 */
export function invariantMassMeV(...vectors: readonly ArrayLike<number>[]): number {
  let e = 0, x = 0, y = 0, z = 0;
  for (const v of vectors) { e += v[0]; x += v[1]; y += v[2]; z += v[3]; }
  const m2 = e * e - x * x - y * y - z * z;
  if (m2 >= 0) return Math.sqrt(m2);
  return m2 > -1e-9 * e * e ? 0 : NaN;
}

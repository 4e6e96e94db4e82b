/**
 * Momentum [MeV/c] of either daughter in the rest frame of a parent of mass `parentMeV`
 * decaying to masses `m1MeV` + `m2MeV`:
 * p* = √[(M² − (m₁+m₂)²)(M² − (m₁−m₂)²)] / 2M (relativistic two-body kinematics; PDG RPP
 * "Kinematics", two-body decays). NaN when the decay is closed (M < m₁ + m₂).
 * The one definition of this formula: the simulator's two-body decays use it too.
 * @example twoBodyMomentumMeV(497.611, 139.57039, 139.57039) // 205.97 (PDG listing: 206 MeV/c)
 */
export function twoBodyMomentumMeV(parentMeV: number, m1MeV: number, m2MeV: number): number {
  const s = parentMeV * parentMeV;
  const a = s - (m1MeV + m2MeV) ** 2;
  const b = s - (m1MeV - m2MeV) ** 2;
  if (a < 0) return NaN;
  return Math.sqrt(a * b) / (2 * parentMeV);
}

import { AVOGADRO_PER_MOL, CLASSICAL_ELECTRON_RADIUS_CM, FINE_STRUCTURE } from '../constants.js';

/**
 * Radiation length of an element [g/cm²] from Tsai's formula as given in the PDG Review of
 * Particle Physics, "Passage of particles through matter", eq. for X₀ (Tsai, Rev. Mod. Phys. 46
 * (1974) 815):
 *
 *   1/X₀ = 4 α r_e² N_A / A · { Z² [L_rad − f(Z)] + Z L'_rad }
 *
 * with L_rad, L'_rad tabulated for Z ≤ 4 and ln(184.15 Z^−1/3), ln(1194 Z^−2/3) above, and the
 * Coulomb correction f(Z) = a² [(1 + a²)⁻¹ + 0.20206 − 0.0369 a² + 0.0083 a⁴ − 0.002 a⁶],
 * a = αZ. Valid for every element Z = 1…92 (the PDG tables are computed from it).
 * @example radiationLengthTsai(6, 12.0107) // ≈ 42.70 (PDG table for carbon)
 */
export function radiationLengthTsai(atomicNumber: number, atomicMassGmol: number): number {
  const z = atomicNumber;
  if (!(z >= 1) || !(atomicMassGmol > 0)) return NaN;
  const a = FINE_STRUCTURE * z;
  const a2 = a * a;
  const fz = a2 * (1 / (1 + a2) + 0.20206 - 0.0369 * a2 + 0.0083 * a2 * a2 - 0.002 * a2 * a2 * a2);
  // Light elements: Tsai's Table B.2 values as carried by the PDG review.
  const LOW: Readonly<Record<number, readonly [number, number]>> = { 1: [5.31, 6.144], 2: [4.79, 5.621], 3: [4.74, 5.805], 4: [4.71, 5.924] };
  const low = LOW[z];
  const lrad = low ? low[0] : Math.log(184.15 * z ** (-1 / 3));
  const lradPrime = low ? low[1] : Math.log(1194 * z ** (-2 / 3));
  const coeff = 4 * FINE_STRUCTURE * CLASSICAL_ELECTRON_RADIUS_CM ** 2 * AVOGADRO_PER_MOL;
  return atomicMassGmol / (coeff * (z * z * (lrad - fz) + z * lradPrime));
}

import { describe, expect, it } from 'vitest';
import { scaledRadiativeCrossSection } from '../../lib/matter/bremsstrahlung.js';

// Tsai-screened Bethe–Heitler radiative cross section (Y.S. Tsai, Rev. Mod. Phys. 46 (1974) 815;
// PDG RPP "Passage of particles through matter"), lib/matter/bremsstrahlung.ts.

const ALPHA_FS = 7.2973525693e-3; // CODATA 2018
/** Coulomb correction f(Z) as printed in the PDG RPP (Davies–Bethe–Maximon; closed form). */
const coulomb = (z: number) => {
  const a2 = (ALPHA_FS * z) ** 2;
  return a2 * (1 / (1 + a2) + 0.20206 - 0.0369 * a2 + 0.0083 * a2 * a2 - 0.002 * a2 ** 3);
};
/** Tsai's L_rad, L′_rad for Z ≤ 4 (Tsai Table B.2 as carried by the PDG), the Thomas–Fermi forms above. */
const LOW: Record<number, [number, number]> = { 1: [5.31, 6.144], 2: [4.79, 5.621], 3: [4.74, 5.805], 4: [4.71, 5.924] };
/**
 * Complete-screening limit of φ_rad: ∫₀¹ y dσ/dy /(α r_e² Z²) = 4 [L_rad − f + L′_rad/Z] + (2/9)(1 + 1/Z)
 * (PDG RPP: the (4/3 − 4/3 y + y²) term integrates to 1, the (1 − y)(Z² + Z)/9 term to 1/18).
 */
const completeScreening = (z: number) => {
  const l = LOW[z] ? LOW[z][0] : Math.log(184.15 * z ** (-1 / 3));
  const lp = LOW[z] ? LOW[z][1] : Math.log(1194 * z ** (-2 / 3));
  return 4 * (l - coulomb(z) + lp / z) + (2 / 9) * (1 + 1 / z);
};

describe('scaledRadiativeCrossSection → the complete-screening limit as 1/E', () => {
  // Measured relative deviation from the limit at E = 10 GeV and 1 TeV (the unscreened tip y → 1
  // where E′ → 0); asserted within 2 % of itself, so any change of the screening functions shows.
  const documented: [number, number, number][] = [
    [1, -0.0183233, -4.16365e-4], [2, -0.0118556, -2.27056e-4], [6, -0.0055243, -8.1988e-5],
    [8, -0.0047732, -6.6638e-5], [13, -0.0038667, -4.9637e-5], [29, -0.0029743, -3.4988e-5], [82, -0.0024471, -2.7271e-5],
  ];
  it(`Z = ${documented.map((d) => d[0]).join(', ')}: within 2e-2 of the limit at 10 GeV and 5e-4 at 1 TeV`, () => {
    let checked = 0;
    for (const [z, at1e4, at1e6] of documented) {
      const d4 = scaledRadiativeCrossSection(z, 1e4, 0.51099895) / completeScreening(z) - 1;
      const d6 = scaledRadiativeCrossSection(z, 1e6, 0.51099895) / completeScreening(z) - 1;
      expect(Math.abs(d4 / at1e4 - 1), `Z = ${z} at 10 GeV: ${d4}`).toBeLessThan(0.02);
      expect(Math.abs(d6 / at1e6 - 1), `Z = ${z} at 1 TeV: ${d6}`).toBeLessThan(0.02);
      checked++;
    }
    expect(checked).toBe(7);
  });
  it('the limit itself: lead 4 (ln(184.15/82^⅓) − f(82) + ln(1194/82^⅔)/82) + (2/9)(83/82) = 14.0880 (worked by hand: 4·3.46577 + 0.22493)', () => {
    expect(completeScreening(82)).toBeCloseTo(14.0880, 3);
    expect(scaledRadiativeCrossSection(82, 1e6, 0.51099895)).toBeCloseTo(14.0880 * (1 - 2.7271e-5), 3);
  });
});

describe('scaledRadiativeCrossSection at low energy', () => {
  it('is the non-relativistic Born value 16/3 where the screened form falls below it (oxygen, T = 89 keV), and 0 at T ≤ 0', () => {
    expect(scaledRadiativeCrossSection(8, 0.6, 0.51099895)).toBe(16 / 3);
    expect(scaledRadiativeCrossSection(8, 0.51099895, 0.51099895)).toBe(0);
    expect(scaledRadiativeCrossSection(8, 0.5, 0.51099895)).toBe(0);
  });
  it('lead at E = 2 MeV is above the Born floor: 5.6186 (measured; the exact partial-wave values are not reproduced, README)', () => {
    expect(scaledRadiativeCrossSection(82, 2, 0.51099895)).toBeCloseTo(5.6186, 3);
  });
});

import { AVOGADRO_PER_MOL } from '../constants.js';
import type { Material } from './materials.js';

/**
 * Low-energy electronic stopping fits of ICRU Report 49 (1993), "Stopping Powers and Ranges for
 * Protons and Alpha Particles", the forms its tables (and NIST PSTAR/ASTAR) are built on below
 * about 0.5 MeV for protons and 2 MeV for alphas:
 *
 *  protons (Andersen & Ziegler 1977 form, Varelas–Biersack interpolation; T = proton energy in keV):
 *    S = A1 √T                          T < 10 keV
 *    1/S = 1/S_low + 1/S_high           T ≥ 10 keV,  S_low = A2 T^0.45,
 *                                        S_high = (A3/T) ln(1 + A4/T + A5 T)
 *  alphas (Ziegler 1977 form; T = alpha energy in MeV):
 *    1/S = 1/S_low + 1/S_high,  S_low = A1 (1000 T)^A2,  S_high = (A3/T) ln(1 + A4/T + A5 T)
 *
 * S in eV per 10¹⁵ "units" per cm², the unit being the atom for elements and the molecule (or
 * the mean atom, air) for compounds; `unitMassGmol` converts to MeV cm²/g.
 *
 * Coefficients: ICRU 49 Tables (protons: Andersen–Ziegler coefficients as adopted; alphas:
 * Ziegler's), as transcribed in a public secondary copy — not read from the report itself; each
 * set is checked in test/matter against the NIST PSTAR table it produced (at 0.01–0.15 MeV the
 * water fit reproduces PSTAR to 0.4 %, aluminium and copper to 0.3 %).
 *
 * `joinLowMeV` / `joinHighMeV` (proton energies; for alphas, alpha energies) bound the interval
 * in which the electronic stopping is interpolated between this fit and Bethe with its
 * corrections (see `electronicStopping.ts`). They were chosen by comparison with PSTAR, so the
 * checks inside the join interval are a measure of the interpolation, not an independent test.
 */
export interface FitCoefficients {
  readonly a: readonly [number, number, number, number, number];
  readonly joinLowMeV: number;
  readonly joinHighMeV: number;
}

export interface LowEnergyFit {
  /** Molar mass of the fit unit (atom or molecule) [g/mol]. */
  readonly unitMassGmol: number;
  readonly proton: FitCoefficients;
  readonly helium: FitCoefficients;
}

const F = (a: FitCoefficients['a'], joinLowMeV: number, joinHighMeV: number): FitCoefficients =>
  Object.freeze({ a: Object.freeze([...a]) as FitCoefficients['a'], joinLowMeV, joinHighMeV });

/** The fits by material name (materials of `MATERIALS` with `approximate: false` only). */
const FITS: Readonly<Record<string, LowEnergyFit>> = Object.freeze({
  // H₂O per molecule (M = 18.0152 g/mol).
  water: Object.freeze({ unitMassGmol: 18.0152, proton: F([4.015, 4.542, 3955, 484.7, 7.904e-3], 0.1, 4), helium: F([2.959, 0.53255, 34.247, 60.655, 15.153], 0.6, 16) }),
  // Dry air per mean atom (M = 1 / Σ wᵢ/Aᵢ = 14.547 g/mol for the PDG/PSTAR composition).
  air: Object.freeze({ unitMassGmol: 14.547, proton: F([2.954, 3.35, 1683, 1900, 2.513e-2], 0.2, 10), helium: F([1.9259, 0.555, 27.15125, 26.0665, 6.2768], 0.8, 20) }),
  aluminium: Object.freeze({ unitMassGmol: 26.9815385, proton: F([4.154, 4.739, 2766, 164.5, 2.023e-2], 0.3, 2.5), helium: F([2.5, 0.625, 45.7, 0.1, 4.359], 1.2, 10) }),
  copper: Object.freeze({ unitMassGmol: 63.546, proton: F([3.969, 4.194, 4649, 81.13, 2.242e-2], 0.4, 2.5), helium: F([3.114, 0.5236, 76.67, 7.62, 6.385], 1.6, 10) }),
});

/** The ICRU 49 fit of a tabulated material, or undefined (user mixtures never have one). */
export function lowEnergyFit(material: Material): LowEnergyFit | undefined {
  return material.approximate ? undefined : FITS[material.name];
}

/** eV cm²/10¹⁵ units → MeV cm²/g for a unit of molar mass M [g/mol]. */
function toMassStopping(sEvPer1e15: number, unitMassGmol: number): number {
  return (sEvPer1e15 * AVOGADRO_PER_MOL * 1e-21) / unitMassGmol;
}

/**
 * Proton electronic mass stopping power [MeV cm²/g] from the ICRU 49 low-energy fit at proton
 * kinetic energy T [MeV]. Valid 1 keV to `joinLowMeV` (the fit itself is quoted to ~1 MeV).
 * @example protonFitStopping(lowEnergyFit(material('water'))!, 0.1) // ≈ 813.7 (PSTAR 814.5)
 */
export function protonFitStopping(fit: LowEnergyFit, kineticEnergyMeV: number): number {
  const [a1, a2, a3, a4, a5] = fit.proton.a;
  const t = kineticEnergyMeV * 1000;
  let s: number;
  if (t < 10) {
    s = a1 * Math.sqrt(t);
  } else {
    const low = a2 * Math.pow(t, 0.45);
    const high = (a3 / t) * Math.log(1 + a4 / t + a5 * t);
    s = (low * high) / (low + high);
  }
  return toMassStopping(s, fit.unitMassGmol);
}

/**
 * Alpha electronic mass stopping power [MeV cm²/g] from the ICRU 49 low-energy fit at alpha
 * kinetic energy T [MeV]. Valid 1 keV to `helium.joinLowMeV`.
 * @example heliumFitStopping(lowEnergyFit(material('water'))!, 0.5) // ≈ 2.1e3
 */
export function heliumFitStopping(fit: LowEnergyFit, kineticEnergyMeV: number): number {
  const [a1, a2, a3, a4, a5] = fit.helium.a;
  const t = kineticEnergyMeV;
  const low = a1 * Math.pow(1000 * t, a2);
  const high = (a3 / t) * Math.log(1 + a4 / t + a5 * t);
  return toMassStopping((low * high) / (low + high), fit.unitMassGmol);
}

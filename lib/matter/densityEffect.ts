/**
 * Sternheimer density-effect correction δ(βγ) and its parameters.
 *
 * Parametrisation: R.M. Sternheimer, M.J. Berger, S.M. Seltzer, At. Data Nucl. Data Tables 30
 * (1984) 261, as written in the PDG Review of Particle Physics, "Passage of particles through
 * matter" (x = log₁₀ βγ):
 *
 *   δ = 2 ln10 · x − C̄                       x ≥ x₁
 *   δ = 2 ln10 · x − C̄ + a (x₁ − x)^k        x₀ ≤ x < x₁
 *   δ = δ₀ · 10^{2 (x − x₀)}                  x < x₀ (conductors; 0 for insulators)
 *
 * with C̄ = 1 + 2 ln(I / ħω_p) and the plasma energy ħω_p = 28.816 √(ρ ⟨Z/A⟩) eV (PDG).
 */
export interface DensityEffect {
  readonly cBar: number;
  readonly x0: number;
  readonly x1: number;
  readonly a: number;
  readonly k: number;
  readonly delta0: number;
}

const TWO_LN10 = 2 * Math.LN10;

/** δ(βγ) for the given parameters; dimensionless, ≥ 0. Valid for any βγ > 0. */
export function densityEffectDelta(params: DensityEffect, betaGammaValue: number): number {
  const x = Math.log10(betaGammaValue);
  if (x >= params.x1) return TWO_LN10 * x - params.cBar;
  if (x >= params.x0) return TWO_LN10 * x - params.cBar + params.a * Math.pow(params.x1 - x, params.k);
  return params.delta0 > 0 ? params.delta0 * Math.pow(10, 2 * (x - params.x0)) : 0;
}

/**
 * Plasma energy ħω_p [eV] = 28.816 √(ρ [g/cm³] · Z/A) (PDG RPP, Table "Summary of variables";
 * follows from √(4π N_e r_e³) m_e c² / α with N_e = ρ N_A Z/A).
 * @example plasmaEnergyEV(1.0, 0.55509) // ≈ 21.47 (water)
 */
export function plasmaEnergyEV(densityGcm3: number, zOverA: number): number {
  return 28.816 * Math.sqrt(densityGcm3 * zOverA);
}

/** C̄ = 1 + 2 ln(I / ħω_p): the identity every tabulated C̄ satisfies (Sternheimer 1984). */
export function cBarFromPlasma(meanExcitationEV: number, densityGcm3: number, zOverA: number): number {
  return 1 + 2 * Math.log(meanExcitationEV / plasmaEnergyEV(densityGcm3, zOverA));
}

/**
 * Approximate density-effect parameters for a material without a tabulated set: the general
 * prescription of R.M. Sternheimer and R.F. Peierls, Phys. Rev. B 3 (1971) 3681 (k = 3, δ₀ = 0,
 * x₀ and x₁ chosen from C̄ and I by the rules below; constants recalled, (memory)). Typical
 * deviation of δ from a fitted set is a few per cent at the relativistic rise, which moves the
 * stopping power by well under 1 % near minimum ionisation.
 */
export function sternheimerPeierls(meanExcitationEV: number, densityGcm3: number, zOverA: number, gas: boolean): DensityEffect {
  const cBar = cBarFromPlasma(meanExcitationEV, densityGcm3, zOverA);
  let x0: number;
  let x1: number;
  if (!gas) {
    if (meanExcitationEV < 100) {
      x1 = 2.0;
      x0 = cBar < 3.681 ? 0.2 : 0.326 * cBar - 1.0;
    } else {
      x1 = 3.0;
      x0 = cBar < 5.215 ? 0.2 : 0.326 * cBar - 1.5;
    }
  } else {
    x1 = 4.0;
    if (cBar < 10.0) x0 = 1.6;
    else if (cBar < 10.5) x0 = 1.7;
    else if (cBar < 11.0) x0 = 1.8;
    else if (cBar < 11.5) x0 = 1.9;
    else if (cBar < 12.25) x0 = 2.0;
    else if (cBar < 13.804) { x0 = 2.0; x1 = 5.0; }
    else { x0 = 0.326 * cBar - 2.5; x1 = 5.0; }
  }
  const k = 3;
  // a makes δ continuous at x₀ where the 2 ln10 x − C̄ + a (x₁ − x₀)^k branch reaches 0.
  const a = (cBar - TWO_LN10 * x0) / Math.pow(x1 - x0, k);
  return Object.freeze({ cBar, x0, x1, a, k, delta0: 0 });
}

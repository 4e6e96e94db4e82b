import { BETHE_K_MEV_CM2_PER_MOL, ELECTRON_MASS_MEV } from '../constants.js';
import type { Particle } from '../particles.js';
import { blochCorrection, shellFromMoments, shellMoments } from './betheCorrections.js';
import { densityEffectDelta } from './densityEffect.js';
import { heliumEffectiveChargeSquared } from './heliumEffectiveCharge.js';
import { heliumFitStopping, lowEnergyFit, protonFitStopping, type FitCoefficients, type LowEnergyFit } from './lowEnergyFits.js';
import { MATERIALS, type Material } from './materials.js';

/**
 * Electronic stopping of heavy charged particles (μ, π, K, p, d, α…) at all energies, in the
 * scheme of ICRU Report 49 (1993):
 *
 *  - 'fit': below the join, the ICRU 49 low-energy fit (`lowEnergyFits.ts`) at the same velocity
 *    (proton fit scaled by z² for singly and other charges, the helium fit for alphas);
 *  - 'bethe': above it, Bethe with exact T_max and the density effect (PDG RPP) plus the shell
 *    correction (Barkas & Berger, ICRU 37) and the Bloch term (`betheCorrections.ts`);
 *  - 'join': in between, the correction to the stopping number, ΔL = S/(K z² ⟨Z/A⟩/β²) − L₀, is
 *    a cubic Hermite in ln T matching value and slope of both sides (L₀ = ½ ln(2m_ec²β²γ²T_max/I²)
 *    − β² − δ/2), so S is continuous with a continuous slope;
 *  - 'extrapolated': a material without a fit (elements and compounds not in the fit list,
 *    user mixtures) below the proton-equivalent 2 MeV: the proton curve of the fitted material
 *    nearest in ln I, scaled by the ratio of the two Bethe values at 2 MeV (the stopping-ratio
 *    approximation, common practice: ratios of stopping powers vary slowly with energy).
 *    Checked against PSTAR on silicon (from aluminium: −12 % to +1 % below 2 MeV) and lead (from
 *    copper: −19 % to +14 %); the public functions warn (APPROXIMATION) when they use it. For I > 400 eV the
 *    regime extends to 100 MeV (see HIGH_Z_SHELL_MIN_I_EV).
 *  - alphas in a material without a helium fit: z_eff²·S_p at the same velocity with the
 *    Ziegler–Biersack–Littmark effective charge (`heliumEffectiveCharge.ts`).
 */
export type StoppingRegime = 'fit' | 'join' | 'bethe' | 'extrapolated';

/** Proton and alpha rest energies used to scale energies to the same velocity [MeV] (CODATA 2018). */
const PROTON_MASS_MEV = 938.27208816;
const ALPHA_MASS_MEV = 3727.3794066;
/** Proton-equivalent energy below which a material without a fit is extrapolated [MeV]. */
export const EXTRAPOLATION_BELOW_PROTON_MEV = 2;
/**
 * Without a fit and with I above 400 eV (W, Pb), the Barkas–Berger shell correction is too large:
 * lead is 2–11 % low against PSTAR between 2 and 50 MeV, within 0.6 % from 100 MeV. Such
 * energies are reported as 'extrapolated' (and warned about) below 100 MeV proton-equivalent.
 */
const HIGH_Z_SHELL_MIN_I_EV = 400;
const HIGH_Z_SHELL_BELOW_PROTON_MEV = 100;
/** Proton-equivalent energy (2 MeV/u) below which helium without a fit uses the effective charge [MeV]. */
const HELIUM_EFFECTIVE_BELOW_PROTON_MEV = 8;

interface Join { readonly tLow: number; readonly tHigh: number; readonly u0: number; readonly h: number; readonly y0: number; readonly d0: number; readonly y1: number; readonly d1: number }
interface LossData {
  readonly fit: LowEnergyFit | undefined;
  readonly proton: Join | undefined;
  readonly helium: Join | undefined;
  /** Electron-weighted mean Z, for the helium effective charge. */
  readonly meanZ: number;
  /** ⟨I²/Z⟩ and ⟨I³/Z⟩ for the shell correction (betheCorrections.ts). */
  readonly shellI2: number;
  readonly shellI3: number;
  /** The fitted material whose curve is scaled below 2 MeV when this one has no fit. */
  readonly reference: Material | undefined;
  /** S(2 MeV) of this material over that of the reference (protons). */
  readonly extrapolationScale: number;
}

const CACHE = new WeakMap<Material, LossData>();

/** K z² ⟨Z/A⟩/β² [MeV cm²/g] at kinetic energy t [MeV] for mass m [MeV] and charge z. */
function prefactor(m: number, z: number, material: Material, t: number): number {
  const bg2 = (t * (t + 2 * m)) / (m * m);
  return (BETHE_K_MEV_CM2_PER_MOL * z * z * material.zOverA * (1 + bg2)) / bg2;
}

/** L₀ = ½ ln(2 m_e c² β²γ² T_max / I²) − β² − δ/2 (PDG RPP). */
function stoppingNumber(m: number, material: Material, t: number): number {
  const bg2 = (t * (t + 2 * m)) / (m * m);
  const gamma2 = 1 + bg2;
  const r = ELECTRON_MASS_MEV / m;
  const tmax = (2 * ELECTRON_MASS_MEV * bg2) / (1 + 2 * Math.sqrt(gamma2) * r + r * r);
  const iMeV = material.meanExcitationEV * 1e-6;
  const delta = densityEffectDelta(material.densityEffect, Math.sqrt(bg2));
  return 0.5 * Math.log((2 * ELECTRON_MASS_MEV * bg2 * tmax) / (iMeV * iMeV)) - bg2 / gamma2 - 0.5 * delta;
}

/** Shell + Bloch correction to the stopping number (betheCorrections.ts). */
function highCorrection(m: number, z: number, material: Material, t: number): number {
  const bg2 = (t * (t + 2 * m)) / (m * m);
  const d = lossData(material);
  return -shellFromMoments(d.shellI2, d.shellI3, Math.sqrt(bg2)) + blochCorrection(z, Math.sqrt(bg2 / (1 + bg2)));
}

function makeJoin(material: Material, c: FitCoefficients, refMass: number, z: number, fitAt: (t: number) => number): Join {
  const lowSide = (t: number) => fitAt(t) / prefactor(refMass, z, material, t) - stoppingNumber(refMass, material, t);
  const highSide = (t: number) => highCorrection(refMass, z, material, t);
  const e = 1e-4;
  const y0 = lowSide(c.joinLowMeV), y1 = highSide(c.joinHighMeV);
  const d0 = (lowSide(c.joinLowMeV * (1 + e)) - lowSide(c.joinLowMeV * (1 - e))) / (Math.log1p(e) - Math.log1p(-e));
  const d1 = (highSide(c.joinHighMeV * (1 + e)) - highSide(c.joinHighMeV * (1 - e))) / (Math.log1p(e) - Math.log1p(-e));
  const u0 = Math.log(c.joinLowMeV);
  return Object.freeze({ tLow: c.joinLowMeV, tHigh: c.joinHighMeV, u0, h: Math.log(c.joinHighMeV) - u0, y0, d0, y1, d1 });
}

function joinCorrection(j: Join, t: number): number {
  const u = (Math.log(t) - j.u0) / j.h;
  const u2 = u * u, u3 = u2 * u;
  return (2 * u3 - 3 * u2 + 1) * j.y0 + (u3 - 2 * u2 + u) * j.h * j.d0 + (-2 * u3 + 3 * u2) * j.y1 + (u3 - u2) * j.h * j.d1;
}

function lossData(material: Material): LossData {
  let d = CACHE.get(material);
  if (d) return d;
  const fit = lowEnergyFit(material);
  const [shellI2, shellI3] = shellMoments(material);
  // A first entry without joins, so that the join set-up below can evaluate the corrections.
  CACHE.set(material, Object.freeze({ fit, proton: undefined, helium: undefined, meanZ: 1, shellI2, shellI3, reference: undefined, extrapolationScale: 1 }));
  let electrons = 0, zSum = 0;
  for (const c of material.composition) {
    const w = c.massFraction / c.atomicMassGmol;
    electrons += w * c.atomicNumber;
    zSum += w * c.atomicNumber * c.atomicNumber;
  }
  const t2 = EXTRAPOLATION_BELOW_PROTON_MEV;
  const reference = fit ? undefined : nearestFitted(material);
  const sB = prefactor(PROTON_MASS_MEV, 1, material, t2) * (stoppingNumber(PROTON_MASS_MEV, material, t2) + highCorrection(PROTON_MASS_MEV, 1, material, t2));
  d = Object.freeze({
    fit,
    shellI2,
    shellI3,
    proton: fit ? makeJoin(material, fit.proton, PROTON_MASS_MEV, 1, (t) => protonFitStopping(fit, t)) : undefined,
    helium: fit ? makeJoin(material, fit.helium, ALPHA_MASS_MEV, 2, (t) => heliumFitStopping(fit, t)) : undefined,
    meanZ: electrons > 0 ? zSum / electrons : 1,
    reference,
    extrapolationScale: reference ? sB / heavyElectronicStopping(PROTON_LIKE, reference, t2) : 1,
  });
  CACHE.set(material, d);
  return d;
}

/** The table material with an ICRU 49 fit whose I is nearest in ln I. */
function nearestFitted(material: Material): Material | undefined {
  let best: Material | undefined;
  let gap = Infinity;
  for (const m of MATERIALS) {
    if (!lowEnergyFit(m)) continue;
    const g = Math.abs(Math.log(m.meanExcitationEV / material.meanExcitationEV));
    if (g < gap) { gap = g; best = m; }
  }
  return best;
}

function isAlphaLike(particle: Particle): boolean {
  return Math.abs(particle.charge) === 2 && Math.abs(particle.massMeV - ALPHA_MASS_MEV) < 1;
}

/** Which regime serves `particle` at kinetic energy T [MeV] in `material` (see the module note). */
export function stoppingRegime(particle: Particle, material: Material, kineticEnergyMeV: number): StoppingRegime {
  const d = lossData(material);
  if (isAlphaLike(particle) && d.helium) {
    const ta = (kineticEnergyMeV * ALPHA_MASS_MEV) / particle.massMeV;
    return ta <= d.helium.tLow ? 'fit' : ta < d.helium.tHigh ? 'join' : 'bethe';
  }
  const tp = (kineticEnergyMeV * PROTON_MASS_MEV) / particle.massMeV;
  if (d.proton) return tp <= d.proton.tLow ? 'fit' : tp < d.proton.tHigh ? 'join' : 'bethe';
  if (tp < EXTRAPOLATION_BELOW_PROTON_MEV) return 'extrapolated';
  return material.meanExcitationEV > HIGH_Z_SHELL_MIN_I_EV && tp < HIGH_Z_SHELL_BELOW_PROTON_MEV ? 'extrapolated' : 'bethe';
}

/**
 * Electronic (collision) mass stopping power [MeV cm²/g] of a heavy charged particle at kinetic
 * energy T [MeV] > 0, by the regimes of the module note. No validity checks and no warnings
 * (the callers in stoppingPower.ts and range.ts do those).
 * Accuracy against NIST PSTAR: see lib/matter/README.md.
 * @example heavyElectronicStopping(PROTON, material('water'), 1) // ≈ 260 (PSTAR 260.6)
 */
export function heavyElectronicStopping(particle: Particle, material: Material, kineticEnergyMeV: number): number {
  const d = lossData(material);
  const m = particle.massMeV;
  const z = particle.charge;
  const t = kineticEnergyMeV;
  if (isAlphaLike(particle) && d.helium && d.fit) {
    const ta = (t * ALPHA_MASS_MEV) / m;
    if (ta <= d.helium.tLow) return heliumFitStopping(d.fit, ta);
    if (ta >= d.helium.tHigh) return betheCorrected(m, z, material, d, t);
    return prefactor(m, z, material, t) * (stoppingNumber(m, material, t) + joinCorrection(d.helium, ta));
  }
  const tp = (t * PROTON_MASS_MEV) / m;
  if (Math.abs(z) === 2 && tp < HELIUM_EFFECTIVE_BELOW_PROTON_MEV) {
    // Helium-like ion without a helium fit: effective charge times proton stopping at the same
    // velocity, times the z⁴ (Bloch) difference at 2 MeV/u so that it meets Bethe (z = 2) there.
    const sp = heavyElectronicStopping(PROTON_LIKE, material, tp);
    const tRef = (HELIUM_EFFECTIVE_BELOW_PROTON_MEV * m) / PROTON_MASS_MEV;
    const bg2 = (tRef * (tRef + 2 * m)) / (m * m);
    const beta = Math.sqrt(bg2 / (1 + bg2));
    const lz = stoppingNumber(m, material, tRef) + highCorrection(m, z, material, tRef);
    const factor = lz / (lz - blochCorrection(z, beta) + blochCorrection(1, beta));
    return heliumEffectiveChargeSquared(m, t, d.meanZ) * sp * factor;
  }
  if (d.fit && d.proton) {
    if (tp <= d.proton.tLow) return z * z * protonFitStopping(d.fit, tp);
    if (tp >= d.proton.tHigh) return betheCorrected(m, z, material, d, t);
    return prefactor(m, z, material, t) * (stoppingNumber(m, material, t) + joinCorrection(d.proton, tp));
  }
  if (tp < EXTRAPOLATION_BELOW_PROTON_MEV && d.reference) {
    return z * z * d.extrapolationScale * heavyElectronicStopping(PROTON_LIKE, d.reference, tp);
  }
  return betheCorrected(m, z, material, d, t);
}

/** Bethe with shell and Bloch corrections in one pass (the hot path above the joins). */
function betheCorrected(m: number, z: number, material: Material, d: LossData, t: number): number {
  const bg2 = (t * (t + 2 * m)) / (m * m);
  const gamma2 = 1 + bg2;
  const beta2 = bg2 / gamma2;
  const bg = Math.sqrt(bg2);
  const r = ELECTRON_MASS_MEV / m;
  const tmax = (2 * ELECTRON_MASS_MEV * bg2) / (1 + 2 * Math.sqrt(gamma2) * r + r * r);
  const iMeV = material.meanExcitationEV * 1e-6;
  const l0 = 0.5 * Math.log((2 * ELECTRON_MASS_MEV * bg2 * tmax) / (iMeV * iMeV)) - beta2 - 0.5 * densityEffectDelta(material.densityEffect, bg);
  const corr = -shellFromMoments(d.shellI2, d.shellI3, bg) + blochCorrection(z, Math.sqrt(beta2));
  return ((BETHE_K_MEV_CM2_PER_MOL * z * z * material.zOverA) / beta2) * (l0 + corr);
}

/** True when `material` has an ICRU 49 low-energy fit (then no energy is 'extrapolated'). */
export function hasLowEnergyFit(material: Material): boolean {
  return lossData(material).fit !== undefined;
}

const PROTON_LIKE: Particle = Object.freeze({ name: 'proton', symbol: 'p', massMeV: PROTON_MASS_MEV, charge: 1, ctauM: Infinity });



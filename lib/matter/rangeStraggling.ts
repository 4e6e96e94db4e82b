import { BETHE_K_MEV_CM2_PER_MOL, ELECTRON_MASS_MEV } from '../constants.js';
import { msg } from '../errors.js';
import type { Material } from './materials.js';
import type { Particle } from '../particles.js';
import { cachedCellOf, cachedRange, type CachedRange } from './rangeIntegral.js';

/**
 * Range straggling in the Gaussian approximation: the variance of the path length [(g/cm²)²] a
 * particle of kinetic energy T travels before it stops, at each node of a cached range table
 * (`cachedRange`): σ_R²(T) = ∫₀ᵀ (dΩ²/dx)/S(T′)³ dT′, with S the table's mass stopping power and
 * dΩ²/dx Bohr's energy-loss variance per g/cm² with its relativistic factor,
 * K mₑc² z² (Z/A) (1 − β²/2)/(1 − β²) (N. Bohr, Phil. Mag. 30 (1915) 581; the range integral and
 * the factor as in ICRU Report 49 (1993) and W. R. Leo, "Techniques for Nuclear and Particle
 * Physics Experiments", 2nd ed., §2.7 (memory)). Integrated by the trapezoid rule in ln T on the
 * table's nodes (T/S³ is smooth there), from 0 at node 0 (the table's low cutoff, about 1 keV for
 * a proton: below it Bohr's variance does not hold, and what is gathered there is far below
 * anything a track measures).
 *
 * Validity: heavy charged particles (μ and heavier) whose loss is made of many collisions
 * (the thick-absorber end of a stopping track); the distribution of ranges is then close to a
 * Gaussian. Not for e± (bremsstrahlung makes their range distribution wide and skewed): the
 * function refuses them. Research values, not for treatment planning.
 */
export function rangeStragglingVariances(table: CachedRange, particle: Particle, material: Material): Float64Array {
  if (Math.abs(particle.massMeV - ELECTRON_MASS_MEV) < 1e-6) throw msg.badArgument('particle', particle.name, 'a heavy charged particle (μ or heavier): the range of e± is not Gaussian');
  const t = table.kineticEnergyMeV, s = table.stoppingPowerMeVcm2g;
  const n = t.length, m = particle.massMeV;
  const omega1 = BETHE_K_MEV_CM2_PER_MOL * ELECTRON_MASS_MEV * particle.charge * particle.charge * material.zOverA;
  // dσ_R²/d ln T = Ω₁² (1 − β²/2)/(1 − β²) · T / S³.
  const rate = (i: number): number => {
    const g = 1 + t[i] / m, b2 = 1 - 1 / (g * g);
    return (omega1 * ((1 - b2 / 2) / (1 - b2)) * t[i]) / (s[i] * s[i] * s[i]);
  };
  const out = new Float64Array(n);
  let previous = rate(0);
  for (let i = 1; i < n; i++) {
    const next = rate(i);
    out[i] = out[i - 1] + 0.5 * (Math.log(t[i]) - Math.log(t[i - 1])) * (previous + next);
    previous = next;
  }
  return out;
}

const CACHE = new WeakMap<CachedRange, Float64Array>();

/**
 * σ_R [g/cm²]: the range straggling of `particle` in `material` from kinetic energy
 * `kineticMeV` [MeV] to rest (`rangeStragglingVariances`, interpolated linearly in ln T between
 * its nodes; the table is built once per species and material). Same validity.
 * @example rangeStragglingGcm2(PROTON, material('water'), 150) // ≈ 0.18 g/cm² (1.1 % of 15.8 g/cm²)
 */
export function rangeStragglingGcm2(particle: Particle, material: Material, kineticMeV: number): number {
  if (!(kineticMeV >= 0) || !Number.isFinite(kineticMeV)) throw msg.badArgument('kineticMeV', kineticMeV, 'a finite kinetic energy ≥ 0 in MeV');
  const table = cachedRange(particle, material);
  let v = CACHE.get(table);
  if (!v) {
    v = rangeStragglingVariances(table, particle, material);
    CACHE.set(table, v);
  }
  return Math.sqrt(varianceAtKinetic(table, v, kineticMeV));
}

/**
 * The variance of `rangeStragglingVariances` at kinetic energy T [MeV]: linear in ln T between
 * nodes, 0 below node 0 (and for T ≤ 0), the last node's value above the table, NaN for NaN.
 */
export function varianceAtKinetic(table: CachedRange, variances: Float64Array, kineticMeV: number): number {
  const t = table.kineticEnergyMeV, n = t.length;
  if (Number.isNaN(kineticMeV)) return NaN;
  if (kineticMeV <= t[0]) return 0;
  if (kineticMeV >= t[n - 1]) return variances[n - 1];
  const i = cachedCellOf(table, kineticMeV);
  const u = (Math.log(kineticMeV) - Math.log(t[i])) / (Math.log(t[i + 1]) - Math.log(t[i]));
  return variances[i] + u * (variances[i + 1] - variances[i]);
}

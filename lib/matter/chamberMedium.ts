import { msg } from '../errors.js';
import { material as findMaterial, type Material } from './materials.js';
import { cachedEnergyAt, cachedRange, cachedRangeAt } from './rangeIntegral.js';
import type { Particle } from '../particles.js';
import { highlandTheta0, HIGHLAND_MAX_X_OVER_X0, HIGHLAND_MIN_X_OVER_X0, radiationLengthM } from './highland.js';
import { bohrVarianceMeV2 } from './bohrStraggling.js';
import type { Medium, SpeciesLoss } from './medium.js';

/**
 * The chamber medium made from a lib/matter material: mean energy loss and CSDA range from the
 * matter module's cached per-species range table (`cachedRange`, read with `cachedRangeAt` /
 * `cachedEnergyAt`: the CSDA range integrated from zero energy, ≈ 1e-9 interpolation error),
 * Gaussian straggling from Bohr's variance, multiple scattering from Highland (`highlandTheta0`).
 *
 * Highland in steps: the Highland–Lynch–Dahl θ₀ has a log term that makes θ₀² non-additive, so
 * applying it to each short step separately under-scatters a long track (by ~13 % over 20 cm of
 * liquid hydrogen in 1 cm steps). The step after a path L therefore gets the increment
 * Δθ₀² = θ₀²(L + s) − θ₀²(L) at the current momentum, so that the accumulated variance after any
 * path equals Highland for that path (common practice for stepwise Gaussian scattering). Below
 * 1e-3 X₀, where Highland is not quoted, θ₀² is continued linearly in x from its value at 1e-3 X₀;
 * above 100 X₀ likewise linearly from 100 X₀.
 *
 * Above the top of the table (βγ = 1000) the particle is treated as losing nothing (range
 * Infinity), which a 1 m chamber cannot tell apart.
 * @example chamberMedium('liquid hydrogen').forSpecies(PROTON).rangeM(100) // ≈ 0.9 m (CSDA)
 */
export function chamberMedium(materialOrName: Material | string): Medium {
  const mat = typeof materialOrName === 'string' ? findMaterial(materialOrName) : materialOrName;
  const x0M = radiationLengthM(mat);
  const metresPerGcm2 = 1 / (mat.densityGcm3 * 100);
  const cache = new Map<string, SpeciesLoss>();
  return Object.freeze({
    name: mat.name,
    densityGPerCm3: mat.densityGcm3,
    radiationLengthM: x0M,
    zOverA: mat.zOverA,
    forSpecies(species: Particle): SpeciesLoss {
      let loss = cache.get(species.name);
      if (loss === undefined) {
        loss = speciesLoss(species, mat, x0M, metresPerGcm2);
        cache.set(species.name, loss);
      }
      return loss;
    },
  });
}

function speciesLoss(species: Particle, mat: Material, x0M: number, metresPerGcm2: number): SpeciesLoss {
  if (species.charge === 0) throw msg.badArgument('species', species.name, 'a charged particle (neutral particles are not transported through matter)');
  const table = cachedRange(species, mat);
  const charge = species.charge;
  return Object.freeze({
    rangeM(kineticMeV: number): number {
      return cachedRangeAt(table, kineticMeV) * metresPerGcm2;
    },
    kineticFromRangeM(rangeM: number): number {
      return cachedEnergyAt(table, rangeM / metresPerGcm2);
    },
    stragglingVarianceMeV2PerM: bohrVarianceMeV2(mat.zOverA, charge, 1 / metresPerGcm2),
    theta0Rad(momentumGeV: number, beta: number, stepM: number, pathBeforeM: number): number {
      if (!(stepM > 0)) return 0;
      const before = pathBeforeM > 0 ? highlandVariance(momentumGeV, beta, charge, pathBeforeM / x0M) : 0;
      const after = highlandVariance(momentumGeV, beta, charge, (pathBeforeM + stepM) / x0M);
      return Math.sqrt(Math.max(0, after - before));
    },
  });
}

/** θ₀² of Highland for thickness t = x/X₀, continued linearly in t outside 1e-3…100. */
function highlandVariance(momentumGeV: number, beta: number, charge: number, t: number): number {
  const lo = HIGHLAND_MIN_X_OVER_X0, hi = HIGHLAND_MAX_X_OVER_X0;
  const tt = Math.min(Math.max(t, lo), hi);
  const th = highlandTheta0({ momentumGeV, beta, charge, thicknessOverX0: tt });
  return th * th * (t / tt);
}

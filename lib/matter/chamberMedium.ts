import { msg } from '../errors.js';
import { material as findMaterial, type Material } from './materials.js';
import { energyAtRange, rangeAt, rangeCutoffMeV, rangeMaxMeV, rangeTable, type RangeTable } from './range.js';
import type { Particle } from '../particles.js';
import { highlandTheta0, HIGHLAND_MAX_X_OVER_X0, HIGHLAND_MIN_X_OVER_X0, radiationLengthM } from './highland.js';
import { bohrVarianceMeV2 } from './bohrStraggling.js';
import type { Medium, SpeciesLoss } from './medium.js';

/** Points of the per-species range table (log-spaced from the cutoff to the top energy). */
const TABLE_POINTS = 600;
/** Highest kinetic energy tabulated [MeV]; the simulator is meant for chamber-scale momenta. */
const TABLE_TOP_MEV = 200_000;

/**
 * The chamber medium made from a lib/matter material: mean energy loss and CSDA range from the
 * matter module's range tables (`rangeTable`, interpolated with `rangeAt` / `energyAtRange`),
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
 * Range below the table's first energy (the matter module's cutoff) follows a power law
 * R ∝ T^k with k = T₀/(R₀S₀) matched at the cutoff; above the top energy the particle is
 * treated as losing nothing (range Infinity), which a 1 m chamber cannot tell apart.
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
  const from = rangeCutoffMeV(species);
  const to = Math.min(rangeMaxMeV(species), TABLE_TOP_MEV);
  const table: RangeTable = rangeTable(species, mat, { fromMeV: from, toMeV: to, points: TABLE_POINTS });
  const t0 = table.kineticEnergyMeV[0];
  const r0 = table.csdaRangeGcm2[0];
  const k = t0 / (r0 * table.stoppingPowerMeVcm2g[0]);
  const tTop = table.kineticEnergyMeV[table.kineticEnergyMeV.length - 1];
  const rTop = table.csdaRangeGcm2[table.csdaRangeGcm2.length - 1];
  const charge = species.charge;
  return Object.freeze({
    rangeM(kineticMeV: number): number {
      if (kineticMeV <= 0) return 0;
      if (kineticMeV < t0) return r0 * Math.pow(kineticMeV / t0, k) * metresPerGcm2;
      if (kineticMeV >= tTop) return Infinity;
      return rangeAt(table, kineticMeV) * metresPerGcm2;
    },
    kineticFromRangeM(rangeM: number): number {
      const r = rangeM / metresPerGcm2;
      if (r <= 0) return 0;
      if (r < r0) return t0 * Math.pow(r / r0, 1 / k);
      if (r >= rTop) return tTop;
      return energyAtRange(table, r);
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

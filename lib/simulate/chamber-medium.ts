import { msg } from '../errors';
import { material as findMaterial, type Material } from '../matter/materials';
import { energyAtRange, rangeAt, rangeCutoffMeV, rangeMaxMeV, rangeTable, type RangeTable } from '../matter/range';
import type { Particle } from '../particles';
import { highlandTheta0, HIGHLAND_MIN_X_OVER_X0, radiationLengthM } from '../track/highland';
import { bohrVarianceMeV2 } from './bohr-straggling';
import type { Medium, SpeciesLoss } from './medium';

/** Points of the per-species range table (log-spaced from the cutoff to the top energy). */
const TABLE_POINTS = 600;
/** Highest kinetic energy tabulated [MeV]; the simulator is meant for chamber-scale momenta. */
const TABLE_TOP_MEV = 200_000;

/**
 * The chamber medium made from a lib/matter material: mean energy loss and CSDA range from the
 * matter module's range tables (`rangeTable`, interpolated with `rangeAt` / `energyAtRange`),
 * Gaussian straggling from Bohr's variance, multiple scattering from Highland (`highlandTheta0`).
 *
 * Per-step Highland: the Highland–Lynch–Dahl form is quoted for 1e-3 ≤ x/X₀ ≤ 100 and its log
 * term makes θ₀² non-additive. For a step s shorter than 1e-3 X₀ the variance is scaled from the
 * formula at x = 1e-3 X₀: θ₀²(s) = θ₀²(1e-3 X₀) · s/(1e-3 X₀) (variances of independent steps add;
 * the log term is frozen at the shortest thickness where the formula holds). Steps longer than
 * that use the formula as it stands. Common practice in stepwise Gaussian scattering.
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
  const minStepM = HIGHLAND_MIN_X_OVER_X0 * x0M;
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
    theta0Rad(momentumGeV: number, beta: number, stepM: number): number {
      if (!(stepM > 0)) return 0;
      if (stepM >= minStepM) return highlandTheta0({ momentumGeV, beta, charge, thicknessOverX0: stepM / x0M });
      const ref = highlandTheta0({ momentumGeV, beta, charge, thicknessOverX0: HIGHLAND_MIN_X_OVER_X0 });
      return ref * Math.sqrt(stepM / minStepM);
    },
  });
}

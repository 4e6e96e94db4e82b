import { createRequire } from 'node:module';
import type { DataFrame } from 'danfojs-node';
import type { Particle } from '../particles.js';
import type { Material } from './materials.js';
import { rangeTable, type RangeTableOptions } from './rangeTable.js';

type Danfo = typeof import('danfojs-node');
let danfo: Danfo | undefined;

/**
 * `rangeTable` as a danfojs DataFrame for notebooks (columns kinetic_energy_MeV, momentum_MeV,
 * stopping_power_MeV_cm2_g, csda_range_g_cm2, csda_range_cm — the `sagitta range --json` names).
 * danfojs is loaded on first use only (it brings TensorFlow.js). Same sources, validity and
 * warnings as `rangeTable`; mean CSDA values, not for treatment planning.
 * @example rangeTableFrame(PROTON, material('water'), { fromMeV: 1, toMeV: 250, points: 50 }).head()
 */
export function rangeTableFrame(particle: Particle, material: Material, options: Partial<RangeTableOptions> = {}): DataFrame {
  const t = rangeTable(particle, material, options);
  danfo ??= createRequire(import.meta.url)('danfojs-node') as Danfo;
  return new danfo.DataFrame({
    kinetic_energy_MeV: Array.from(t.kineticEnergyMeV),
    momentum_MeV: Array.from(t.momentumMeV),
    stopping_power_MeV_cm2_g: Array.from(t.stoppingPowerMeVcm2g),
    csda_range_g_cm2: Array.from(t.csdaRangeGcm2),
    csda_range_cm: Array.from(t.csdaRangeGcm2, (r) => r / t.densityGcm3),
  });
}

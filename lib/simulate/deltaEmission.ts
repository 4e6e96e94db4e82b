import { maxEnergyTransferMeV } from '../matter/bethe.js';
import type { Medium } from '../matter/medium.js';
import type { Particle } from '../particles.js';
import { deltaRayCosTheta, deltaRayRatePerM, sampleDeltaRayKineticMeV } from './deltaRay.js';
import type { SeededRandom } from './rng.js';
import { rotateAbout } from './scatteringKick.js';
import type { DeltaSink } from './trackInFlight.js';

/** One step of a heavy parent, as the δ-ray emission needs it (reused from step to step). */
export interface DeltaStep {
  readonly species: Particle;
  readonly medium: Medium;
  /** Emission threshold: kinetic energy [MeV] of the lightest knock-on electron kept. */
  readonly minMeV: number;
  /** Momentum [GeV/c] and velocity at mid-step, and the step length [m]. */
  momentumGeV: number;
  beta: number;
  stepM: number;
}

/**
 * Knock-on electrons of one step by a heavy particle at the state [x, y, z, ux, uy, uz]: a
 * Poisson number with the δ-ray rate above `minMeV` (lib/simulate/deltaRay.ts), each with its
 * kinetic energy and the kinematic emission angle about the parent's direction, handed to `sink`.
 */
export function emitDeltaRays(state: Float64Array, step: DeltaStep, rng: SeededRandom, sink: DeltaSink): void {
  const mass = step.species.massMeV;
  const wMax = maxEnergyTransferMeV(mass, (step.momentumGeV * 1e3) / mass);
  const rate = deltaRayRatePerM(step.medium.zOverA, step.medium.densityGPerCm3, step.species.charge, step.beta, step.minMeV, wMax);
  const n = rate > 0 ? rng.poisson(rate * step.stepM) : 0;
  for (let k = 0; k < n; k++) {
    const t = sampleDeltaRayKineticMeV(rng.uniform(), step.minMeV, wMax);
    const cosT = deltaRayCosTheta(t, wMax);
    const dir = rotateAbout(state[3], state[4], state[5], cosT, 2 * Math.PI * rng.uniform());
    sink(state[0], state[1], state[2], dir[0], dir[1], dir[2], t);
  }
}

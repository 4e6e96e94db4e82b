import { momentumFromKinetic } from '../matter/kinematics.js';
import type { SpeciesLoss } from '../matter/medium.js';
import type { Particle } from '../particles.js';
import type { SeededRandom } from './rng.js';
import type { TransportOptions } from './transportOptions.js';

/** Below this remaining range [m] a track is stopped with one last straight step. */
export const STOP_RANGE_M = 1e-5;

/** Where a track stands before a step (kinetic energy [MeV], remaining CSDA range [m], path [m]). */
export interface TransportState {
  kinetic: number;
  range: number;
  path: number;
  /** Path length [m] at which the next spacing hit is taken (Infinity for plane sampling). */
  nextSample: number;
  /** Proper path [m] left before the particle decays (Infinity: stable). */
  properLeft: number;
}

/** The step chosen by `planStep`. */
export interface StepPlan {
  /** Step length [m]. */
  s: number;
  /** A spacing hit falls at the end of the step. */
  sampleAtEnd: boolean;
  /** The particle ranges out at the end of the step. */
  stopping: boolean;
  /** The particle decays at the end of the step. */
  decaying: boolean;
  kineticEnd: number;
  rangeEnd: number;
}

/** What the planner reads besides the state: the species' loss model and the transport settings. */
export interface StepContext {
  readonly options: TransportOptions;
  readonly loss: SpeciesLoss;
  readonly species: Particle;
  readonly lossOn: boolean;
  readonly straggle: boolean;
  readonly rng: SeededRandom;
}

export function newStepPlan(): StepPlan {
  return { s: 0, sampleAtEnd: false, stopping: false, decaying: false, kineticEnd: 0, rangeEnd: 0 };
}

/**
 * Chooses the next step: the smallest of `maxStepM`, the distance to the next sample and
 * `rangeFraction` of the remaining CSDA range; the kinetic energy after it from the range table,
 * T' = T(R − s) (continuous slowing down), less a Gaussian (Bohr) straggling draw when asked;
 * the last step of a stopping track uses up the range; a decay inside the step shortens it to
 * end at the decay point (lab distance = proper path × p/m at the step start).
 */
export function planStep(plan: StepPlan, state: TransportState, ctx: StepContext): StepPlan {
  const { options, loss, species } = ctx;
  const { kinetic, range, path, nextSample, properLeft } = state;
  let s = options.maxStepM;
  let sampleAtEnd = false;
  if (nextSample - path <= s) { s = nextSample - path; sampleAtEnd = true; }
  let stopping = false;
  let kineticEnd = kinetic;
  let rangeEnd = range;
  if (ctx.lossOn && Number.isFinite(range)) {
    const cap = Math.max(options.rangeFraction * range, STOP_RANGE_M);
    if (cap < s) { s = cap; sampleAtEnd = false; }
    if (range - s <= STOP_RANGE_M) {
      s = range;
      stopping = true;
      kineticEnd = 0;
      rangeEnd = 0;
      sampleAtEnd = nextSample - path <= s;
    } else {
      rangeEnd = range - s;
      kineticEnd = loss.kineticFromRangeM(rangeEnd);
      if (ctx.straggle) {
        kineticEnd -= Math.sqrt(loss.stragglingVarianceMeV2PerM * s) * ctx.rng.gaussian();
        if (kineticEnd > kinetic) kineticEnd = kinetic;
        if (kineticEnd <= 0) { kineticEnd = 0; stopping = true; rangeEnd = 0; }
        else rangeEnd = loss.rangeM(kineticEnd);
      }
    }
  }
  let decaying = false;
  if (properLeft < Infinity && !stopping) {
    const sDecay = (properLeft * momentumFromKinetic(species, kinetic)) / species.massMeV;
    if (sDecay < s) {
      s = sDecay;
      decaying = true;
      sampleAtEnd = nextSample - path <= s;
      if (ctx.lossOn && Number.isFinite(range)) {
        rangeEnd = range - s;
        kineticEnd = loss.kineticFromRangeM(rangeEnd);
      }
    }
  }
  plan.s = s; plan.sampleAtEnd = sampleAtEnd; plan.stopping = stopping; plan.decaying = decaying;
  plan.kineticEnd = kineticEnd; plan.rangeEnd = rangeEnd;
  return plan;
}

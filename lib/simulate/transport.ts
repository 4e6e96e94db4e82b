import { momentumFromKinetic } from '../matter/kinematics.js';
import { insideChamber, type Chamber } from './chamber.js';
import { emitDeltaRays, type DeltaStep } from './deltaEmission.js';
import { helixStep, type HelixMotion } from './helixStep.js';
import { planeCrossing } from './planeCrossing.js';
import type { SeededRandom } from './rng.js';
import { scatteringKick } from './scatteringKick.js';
import { newStepPlan, planStep, type StepContext, type TransportState } from './stepPlan.js';
import type { DeltaSink, EndReason, HitSink, TrackEnd, TrackStart } from './trackInFlight.js';
import type { TransportOptions } from './transportOptions.js';

const MAX_STEPS = 1_000_000;
/** Halvings of the exit search: the exit point to 1e-12 of the step. */
const EXIT_BISECTIONS = 40;

/**
 * Transports one charged particle through the chamber in steps and reports its hits.
 *
 * Each step: (1) `planStep` chooses its length and the energy after it (continuous slowing down
 * from the range table, optional straggling, range-out, decay); (2) the position moves along the
 * exact helix of the mid-step momentum in the field at the mid-point (so the radius shrinks as
 * the particle slows: tracks spiral inwards); (3) a step that leaves the box is cut at the exit
 * point; (4) hits are taken at the sample spacing or at plane crossings; (5) the direction
 * receives two Gaussian projected kicks of width θ₀(p, β, s) (Highland, from the medium);
 * (6) knock-on electrons are emitted with the δ-ray rate. The particle stops when its range is
 * used up, leaves the box, exceeds `maxPathM`, or — when `start.properDecayLengthM` is given —
 * has lived that much proper path (lab path × m/p, accumulated step by step).
 *
 * Internal units: metres, MeV (kinetic), GeV/c. The start point must lie inside the chamber.
 * Validity: the step model assumes θ₀ per step ≪ 1 and a field that varies little over a step.
 */
export function transportTrack(
  start: TrackStart,
  chamber: Chamber,
  options: TransportOptions,
  rng: SeededRandom,
  onHit: HitSink,
  onDelta?: DeltaSink,
): TrackEnd {
  const species = start.species;
  const mass = species.massMeV;
  const loss = chamber.medium.forSpecies(species);
  const lossOn = options.energyLoss !== 'off';
  const ctx: StepContext = { options, loss, species, lossOn, straggle: options.energyLoss === 'straggling' && loss.stragglingVarianceMeV2PerM > 0, rng };
  const field = chamber.field;
  // Per-track scratch: the state, the state at the step start, a trial state, the field.
  const st = Float64Array.of(start.xM, start.yM, start.zM, start.ux, start.uy, start.uz);
  const begin = new Float64Array(6), trial = new Float64Array(6);
  const motion: HelixMotion = { momentumGeV: start.momentumGeV, charge: species.charge, fieldT: new Float64Array(3) };
  if (field.kind === 'uniform') motion.fieldT.set([field.bxT, field.byT, field.bzT]);
  const sampling = options.sampling;
  const spacing = sampling.kind === 'spacing' ? sampling.spacingM : Infinity;
  const planes = sampling.kind === 'planes' ? Float64Array.from(sampling.positionsM).sort() : new Float64Array(0);
  const axis = sampling.kind === 'planes' ? sampling.axis : 0;
  const deltaMin = options.deltaRayMinMeV ?? 0;
  // e± parents would need Møller/Bhabha kinematics (identical or annihilating partners), which the
  // heavy-particle δ-ray spectrum does not describe: they emit none.
  const delta: DeltaStep | undefined = onDelta !== undefined && deltaMin > 0 && chamber.medium.zOverA > 0 && mass > 1
    ? { species, medium: chamber.medium, minMeV: deltaMin, momentumGeV: 0, beta: 0, stepM: 0 } : undefined;

  const kinetic0 = Math.sqrt(start.momentumGeV * start.momentumGeV * 1e6 + mass * mass) - mass;
  const state: TransportState = {
    kinetic: kinetic0, range: lossOn ? loss.rangeM(kinetic0) : Infinity, path: 0, nextSample: spacing,
    properLeft: start.properDecayLengthM ?? Infinity,
  };
  const plan = newStepPlan();
  let hits = 0;
  let reason: EndReason = 'max-path';
  let pEnd = start.momentumGeV;

  for (let iter = 0; iter < MAX_STEPS; iter++) {
    if (state.path >= options.maxPathM) { reason = 'max-path'; break; }
    planStep(plan, state, ctx);
    const { s, kineticEnd } = plan;
    let { sampleAtEnd, stopping, decaying } = plan;
    const kineticMid = 0.5 * (state.kinetic + kineticEnd);
    const pMid = momentumFromKinetic(species, kineticMid) * 1e-3;
    motion.momentumGeV = pMid;
    if (field.kind === 'map') {
      // Field at the predicted mid-point: second-order accurate for a smooth map.
      field.at(st[0], st[1], st[2], motion.fieldT);
      trial.set(st);
      helixStep(trial, 0.5 * s, motion);
      field.at(trial[0], trial[1], trial[2], motion.fieldT);
    }
    begin.set(st);
    helixStep(st, s, motion);

    const inside = insideChamber(chamber, st[0], st[1], st[2]);
    let sUsed = s;
    if (!inside) {
      sUsed = exitLength(chamber, begin, trial, s, motion);
      st.set(begin);
      helixStep(st, sUsed, motion);
      sampleAtEnd = false;
      stopping = false;
      decaying = false;
    }

    if (planes.length > 0) {
      hits += crossPlanes(begin, st, trial, sUsed, motion, axis, planes, onHit);
    } else if (sampleAtEnd) {
      onHit(st[0], st[1], st[2], momentumFromKinetic(species, kineticEnd) * 1e-3);
      hits++;
      state.nextSample += spacing;
    }
    state.path += sUsed;

    if (!inside) {
      reason = 'exited';
      pEnd = pMid;
      break;
    }

    const pEndStep = momentumFromKinetic(species, kineticEnd) * 1e-3;
    if (decaying) {
      reason = 'decayed';
      pEnd = pEndStep;
      break;
    }
    if (state.properLeft < Infinity) state.properLeft -= (sUsed * mass) / (pMid * 1e3);
    const betaMid = Math.min(1, momentumFromKinetic(species, kineticMid) / (kineticMid + mass));
    if (options.scattering && !stopping) {
      const theta0 = loss.theta0Rad(pMid, betaMid, s, state.path - s);
      if (theta0 > 0) scatteringKick(st, theta0 * rng.gaussian(), theta0 * rng.gaussian());
    }
    if (delta !== undefined && !stopping) {
      delta.momentumGeV = pMid;
      delta.beta = betaMid;
      delta.stepM = s;
      emitDeltaRays(st, delta, rng, onDelta!);
    }
    state.kinetic = kineticEnd;
    state.range = plan.rangeEnd;
    pEnd = pEndStep;
    if (stopping) { reason = 'stopped'; pEnd = 0; break; }
  }
  return {
    reason,
    xM: st[0], yM: st[1], zM: st[2],
    ux: st[3], uy: st[4], uz: st[5],
    momentumGeV: pEnd,
    pathM: state.path,
    hits,
  };
}

/** Path length [m] within a step of length `s` from `begin` at which the helix leaves the box (bisection). */
function exitLength(chamber: Chamber, begin: Float64Array, trial: Float64Array, s: number, motion: HelixMotion): number {
  let lo = 0, hi = s;
  for (let k = 0; k < EXIT_BISECTIONS; k++) {
    const mid = 0.5 * (lo + hi);
    trial.set(begin);
    helixStep(trial, mid, motion);
    if (insideChamber(chamber, trial[0], trial[1], trial[2])) lo = mid; else hi = mid;
  }
  return lo;
}

/** Hits where the step from `begin` to `end` crosses the planes, in the order they occur; returns how many. */
function crossPlanes(
  begin: Float64Array, end: Float64Array, trial: Float64Array, sUsed: number, motion: HelixMotion,
  axis: number, planes: Float64Array, onHit: HitSink,
): number {
  const a0 = begin[axis], a1 = end[axis];
  const lo = Math.min(a0, a1), hi = Math.max(a0, a1);
  const increasing = a1 >= a0;
  let hits = 0;
  for (let j = 0; j < planes.length; j++) {
    const plane = planes[increasing ? j : planes.length - 1 - j];
    if (plane <= lo || plane > hi || plane === a0) continue;
    if (planeCrossing(begin, trial, sUsed, motion, axis, plane) < 0) continue;
    onHit(trial[0], trial[1], trial[2], motion.momentumGeV);
    hits++;
  }
  return hits;
}

import type { Particle } from '../particles.js';
import type { Chamber } from './chamber.js';
import { helixStep } from './helixStep.js';
import type { SeededRandom } from './rng.js';
import { maxEnergyTransferMeV } from '../matter/bethe.js';
import { deltaRayCosTheta, deltaRayRatePerM, sampleDeltaRayKineticMeV } from './deltaRay.js';

/** Where hits are taken: every `spacingM` of path length, or where the path crosses planes. */
export type Sampling =
  | { readonly kind: 'spacing'; readonly spacingM: number }
  /** Planes perpendicular to one axis (0 = x, 1 = y, 2 = z) at the given coordinates [m]. */
  | { readonly kind: 'planes'; readonly axis: 0 | 1 | 2; readonly positionsM: readonly number[] };

export type EnergyLossMode = 'mean' | 'straggling' | 'off';

export interface TransportOptions {
  /** Longest step [m]; hits and plane crossings are found exactly within a step. */
  readonly maxStepM: number;
  /** Largest fraction of the remaining range one step may use (keeps the spiral smooth). */
  readonly rangeFraction: number;
  /** 'mean' CSDA loss, 'straggling' adds Gaussian (Bohr) fluctuations, 'off' keeps |p| fixed. */
  readonly energyLoss: EnergyLossMode;
  /** Gaussian multiple scattering with the medium's θ₀ per step. */
  readonly scattering: boolean;
  /** A track is ended after this much path [m] (a looper in a field without loss never leaves). */
  readonly maxPathM: number;
  readonly sampling: Sampling;
  /** Emit knock-on electrons above this kinetic energy [MeV]; 0 or absent: none. */
  readonly deltaRayMinMeV?: number;
}

export const TRANSPORT_DEFAULTS: TransportOptions = Object.freeze({
  maxStepM: 0.01,
  rangeFraction: 0.2,
  energyLoss: 'mean',
  scattering: true,
  maxPathM: 50,
  sampling: Object.freeze({ kind: 'spacing', spacingM: 0.01 }) as Sampling,
});

/** A place and a direction of flight: position [m], unit direction. */
export interface PositionAndDirection {
  readonly xM: number;
  readonly yM: number;
  readonly zM: number;
  readonly ux: number;
  readonly uy: number;
  readonly uz: number;
}

/** A particle of a species in flight: position [m], unit direction, momentum [GeV/c]. */
export interface ParticleInFlight extends PositionAndDirection {
  readonly species: Particle;
  readonly momentumGeV: number;
}

/** A particle entering transport. */
export interface TrackStart extends ParticleInFlight {
  /**
   * Proper decay length [m] this particle will live (drawn by the caller from an exponential of
   * mean cτ); the track ends with reason 'decayed' after that much proper path. Absent: stable.
   */
  readonly properDecayLengthM?: number;
}

/** Receives the true position of each hit and the momentum there. */
export type HitSink = (xM: number, yM: number, zM: number, momentumGeV: number) => void;
/** Receives a knock-on electron (position [m], unit direction, kinetic energy [MeV]). */
export type DeltaSink = (xM: number, yM: number, zM: number, ux: number, uy: number, uz: number, kineticMeV: number) => void;

export type EndReason = 'stopped' | 'exited' | 'max-path' | 'decayed';

/** How and where a track ended. */
export interface TrackEnd extends PositionAndDirection {
  readonly reason: EndReason;
  /** Momentum at the end [GeV/c]; 0 when stopped; at the decay point when decayed. */
  readonly momentumGeV: number;
  /** Path length travelled inside the chamber [m]. */
  readonly pathM: number;
  /** Hits handed to the sink. */
  readonly hits: number;
}

const B_FIELD = new Float64Array(3);
const STATE = new Float64Array(6);
const BEGIN = new Float64Array(6);
const TRIAL = new Float64Array(6);
const NO_PLANES = new Float64Array(0);
const PLANE_CACHE = new WeakMap<readonly number[], Float64Array>();

function sortedPlanes(positions: readonly number[]): Float64Array {
  let p = PLANE_CACHE.get(positions);
  if (p === undefined) {
    p = Float64Array.from(positions).sort();
    PLANE_CACHE.set(positions, p);
  }
  return p;
}

/** Below this remaining range [m] a track is stopped with one last straight step. */
const STOP_RANGE_M = 1e-5;
const MAX_STEPS = 1_000_000;

/**
 * Transports one charged particle through the chamber in steps and reports its hits.
 *
 * Each step: (1) the length is the smallest of `maxStepM`, the distance to the next sample and
 * `rangeFraction` of the remaining CSDA range; (2) the kinetic energy after the step follows from
 * the range table, T' = T(R − s) (continuous slowing down), plus Gaussian straggling when asked;
 * (3) the position moves along the exact helix of the mid-step momentum in the field at the
 * mid-point (so the radius shrinks as the particle slows: tracks spiral inwards); (4) the
 * direction receives two Gaussian projected kicks of width θ₀(p, β, s) (Highland, from the
 * medium); (5) knock-on electrons are emitted with the δ-ray rate. The particle stops when its
 * range is used up, leaves the box, exceeds `maxPathM`, or — when `start.properDecayLengthM` is
 * given — has lived that much proper path (lab path × m/p, accumulated step by step; the step
 * before the decay is shortened to end at the decay point).
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
  const charge = species.charge;
  const loss = chamber.medium.forSpecies(species);
  const lossOn = options.energyLoss !== 'off';
  const straggle = options.energyLoss === 'straggling' && loss.stragglingVarianceMeV2PerM > 0;
  const field = chamber.field;
  // Scratch state lives at module level: transport never re-enters itself (secondaries are
  // queued by the caller), and per-track typed arrays would dominate the garbage collector.
  const bField = B_FIELD, st = STATE, begin = BEGIN, trial = TRIAL;
  if (field.kind === 'uniform') {
    bField[0] = field.bxT; bField[1] = field.byT; bField[2] = field.bzT;
  }
  st[0] = start.xM; st[1] = start.yM; st[2] = start.zM;
  st[3] = start.ux; st[4] = start.uy; st[5] = start.uz;
  const sampling = options.sampling;
  const spacing = sampling.kind === 'spacing' ? sampling.spacingM : Infinity;
  const planes = sampling.kind === 'planes' ? sortedPlanes(sampling.positionsM) : NO_PLANES;
  const axis = sampling.kind === 'planes' ? sampling.axis : 0;
  const deltaMin = options.deltaRayMinMeV ?? 0;
  // e± parents would need Møller/Bhabha kinematics (identical or annihilating partners), which the
  // heavy-particle δ-ray spectrum does not describe: they emit none.
  const wantDelta = onDelta !== undefined && deltaMin > 0 && chamber.medium.zOverA > 0 && mass > 1;

  let kinetic = Math.sqrt(start.momentumGeV * start.momentumGeV * 1e6 + mass * mass) - mass;
  let range = lossOn ? loss.rangeM(kinetic) : Infinity;
  let path = 0;
  let nextSample = spacing;
  let hits = 0;
  let reason: EndReason = 'max-path';
  let pEnd = start.momentumGeV;
  let properLeft = start.properDecayLengthM ?? Infinity;

  for (let iter = 0; iter < MAX_STEPS; iter++) {
    if (path >= options.maxPathM) { reason = 'max-path'; break; }
    let s = options.maxStepM;
    let sampleAtEnd = false;
    if (nextSample - path <= s) { s = nextSample - path; sampleAtEnd = true; }
    let stopping = false;
    let kineticEnd = kinetic;
    let rangeEnd = range;
    if (lossOn && Number.isFinite(range)) {
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
        if (straggle) {
          kineticEnd -= Math.sqrt(loss.stragglingVarianceMeV2PerM * s) * rng.gaussian();
          if (kineticEnd > kinetic) kineticEnd = kinetic;
          if (kineticEnd <= 0) { kineticEnd = 0; stopping = true; rangeEnd = 0; }
          else rangeEnd = loss.rangeM(kineticEnd);
        }
      }
    }
    let decaying = false;
    if (properLeft < Infinity && !stopping) {
      // Lab distance to the decay at the momentum of the step start (p/m = βγ).
      const sDecay = (properLeft * Math.sqrt(kinetic * (kinetic + 2 * mass))) / mass;
      if (sDecay < s) {
        s = sDecay;
        decaying = true;
        sampleAtEnd = nextSample - path <= s;
        if (lossOn && Number.isFinite(range)) {
          rangeEnd = range - s;
          kineticEnd = loss.kineticFromRangeM(rangeEnd);
        }
      }
    }
    const kineticMid = 0.5 * (kinetic + kineticEnd);
    const pMid = Math.sqrt(kineticMid * (kineticMid + 2 * mass)) * 1e-3;
    if (field.kind === 'map') {
      // Field at the predicted mid-point: second-order accurate for a smooth map.
      field.at(st[0], st[1], st[2], bField);
      trial.set(st);
      helixStep(trial, 0.5 * s, pMid, bField[0], bField[1], bField[2], charge);
      field.at(trial[0], trial[1], trial[2], bField);
    }
    begin.set(st);
    helixStep(st, s, pMid, bField[0], bField[1], bField[2], charge);

    const inside = st[0] >= chamber.xMinM && st[0] <= chamber.xMaxM && st[1] >= chamber.yMinM
      && st[1] <= chamber.yMaxM && st[2] >= chamber.zMinM && st[2] <= chamber.zMaxM;
    let sUsed = s;
    if (!inside) {
      // Bisect for the exit point on this step's helix; the track ends there.
      let lo = 0, hi = s;
      for (let k = 0; k < 40; k++) {
        const mid = 0.5 * (lo + hi);
        trial.set(begin);
        helixStep(trial, mid, pMid, bField[0], bField[1], bField[2], charge);
        const inMid = trial[0] >= chamber.xMinM && trial[0] <= chamber.xMaxM && trial[1] >= chamber.yMinM
          && trial[1] <= chamber.yMaxM && trial[2] >= chamber.zMinM && trial[2] <= chamber.zMaxM;
        if (inMid) lo = mid; else hi = mid;
      }
      sUsed = lo;
      st.set(begin);
      helixStep(st, sUsed, pMid, bField[0], bField[1], bField[2], charge);
      sampleAtEnd = false;
      stopping = false;
      decaying = false;
    }

    if (planes.length > 0) {
      const a0 = begin[axis], a1 = st[axis];
      const lo = Math.min(a0, a1), hi = Math.max(a0, a1);
      // Crossings in the order they occur along the step.
      const increasing = a1 >= a0;
      for (let j = 0; j < planes.length; j++) {
        const idx = increasing ? j : planes.length - 1 - j;
        const plane = planes[idx];
        if (plane <= lo || plane > hi || (plane === a0)) continue;
        const sHit = solveCrossing(begin, trial, sUsed, pMid, bField, charge, axis, plane);
        if (sHit < 0) continue;
        onHit(trial[0], trial[1], trial[2], pMid);
        hits++;
      }
    } else if (sampleAtEnd) {
      onHit(st[0], st[1], st[2], Math.sqrt(kineticEnd * (kineticEnd + 2 * mass)) * 1e-3);
      hits++;
      nextSample += spacing;
    }
    path += sUsed;

    if (!inside) {
      reason = 'exited';
      pEnd = pMid;
      break;
    }

    const pEndStep = Math.sqrt(kineticEnd * (kineticEnd + 2 * mass)) * 1e-3;
    if (decaying) {
      reason = 'decayed';
      pEnd = pEndStep;
      break;
    }
    if (properLeft < Infinity) properLeft -= (sUsed * mass) / (pMid * 1e3);
    if (options.scattering && !stopping) {
      const eMid = kineticMid + mass;
      const theta0 = loss.theta0Rad(pMid, Math.min(1, Math.sqrt(kineticMid * (kineticMid + 2 * mass)) / eMid), s, path - s);
      if (theta0 > 0) kick(st, theta0 * rng.gaussian(), theta0 * rng.gaussian());
    }
    if (wantDelta && !stopping) {
      const eMid = kineticMid + mass;
      const beta = Math.sqrt(kineticMid * (kineticMid + 2 * mass)) / eMid;
      const wMax = maxEnergyTransferMeV(mass, (pMid * 1e3) / mass);
      const rate = deltaRayRatePerM(chamber.medium.zOverA, chamber.medium.densityGPerCm3, charge, beta, deltaMin, wMax);
      const n = rate > 0 ? rng.poisson(rate * s) : 0;
      for (let k = 0; k < n; k++) {
        const t = sampleDeltaRayKineticMeV(rng.uniform(), deltaMin, wMax);
        const cosT = deltaRayCosTheta(t, wMax);
        const dir = rotateAbout(st[3], st[4], st[5], cosT, 2 * Math.PI * rng.uniform());
        onDelta!(st[0], st[1], st[2], dir[0], dir[1], dir[2], t);
      }
    }
    kinetic = kineticEnd;
    range = rangeEnd;
    pEnd = pEndStep;
    if (stopping) { reason = 'stopped'; pEnd = 0; break; }
  }
  return {
    reason,
    xM: st[0], yM: st[1], zM: st[2],
    ux: st[3], uy: st[4], uz: st[5],
    momentumGeV: pEnd,
    pathM: path,
    hits,
  };
}

/**
 * Path length within [0, sMax] where the helix from `begin` crosses coordinate `plane` on `axis`;
 * leaves the crossing state in `out`. Newton from the straight-line guess, bisection as fallback.
 * Returns −1 when no crossing is found.
 */
function solveCrossing(
  begin: Float64Array, out: Float64Array, sMax: number, pGeV: number, b: Float64Array,
  charge: number, axis: number, plane: number,
): number {
  const a0 = begin[axis];
  const u0 = begin[3 + axis];
  let s = u0 !== 0 ? (plane - a0) / u0 : 0.5 * sMax;
  if (!(s >= 0 && s <= sMax)) s = 0.5 * sMax;
  for (let k = 0; k < 8; k++) {
    out.set(begin);
    helixStep(out, s, pGeV, b[0], b[1], b[2], charge);
    const f = out[axis] - plane;
    if (Math.abs(f) < 1e-13) return s;
    const d = out[3 + axis];
    if (d === 0) break;
    const next = s - f / d;
    if (!(next >= 0 && next <= sMax)) break;
    s = next;
  }
  // Bisection on the sign change between the step ends.
  let lo = 0, hi = sMax;
  const sign0 = a0 - plane;
  for (let k = 0; k < 60; k++) {
    const mid = 0.5 * (lo + hi);
    out.set(begin);
    helixStep(out, mid, pGeV, b[0], b[1], b[2], charge);
    if ((out[axis] - plane) * sign0 > 0) lo = mid; else hi = mid;
  }
  out.set(begin);
  helixStep(out, hi, pGeV, b[0], b[1], b[2], charge);
  return hi;
}

/** Tilts the direction in state[3..5] by small projected angles (t1, t2) in two perpendicular planes. */
function kick(state: Float64Array, t1: number, t2: number): void {
  const ux = state[3], uy = state[4], uz = state[5];
  // e1 ⟂ u built from the coordinate axis least aligned with u; e2 = u × e1.
  let ex: number, ey: number, ez: number;
  if (Math.abs(ux) <= Math.abs(uy) && Math.abs(ux) <= Math.abs(uz)) { ex = 0; ey = uz; ez = -uy; }
  else if (Math.abs(uy) <= Math.abs(uz)) { ex = -uz; ey = 0; ez = ux; }
  else { ex = uy; ey = -ux; ez = 0; }
  const ne = 1 / Math.sqrt(ex * ex + ey * ey + ez * ez);
  ex *= ne; ey *= ne; ez *= ne;
  const fx = uy * ez - uz * ey, fy = uz * ex - ux * ez, fz = ux * ey - uy * ex;
  const theta = Math.sqrt(t1 * t1 + t2 * t2);
  if (theta === 0) return;
  const c = Math.cos(theta), sn = Math.sin(theta) / theta;
  state[3] = c * ux + sn * (t1 * ex + t2 * fx);
  state[4] = c * uy + sn * (t1 * ey + t2 * fy);
  state[5] = c * uz + sn * (t1 * ez + t2 * fz);
}

/** Unit vector at polar angle acos(cosTheta) and azimuth `phi` about the unit vector u. */
export function rotateAbout(ux: number, uy: number, uz: number, cosTheta: number, phi: number): [number, number, number] {
  const s = Float64Array.of(0, 0, 0, ux, uy, uz);
  const theta = Math.acos(Math.max(-1, Math.min(1, cosTheta)));
  kick(s, theta * Math.cos(phi), theta * Math.sin(phi));
  return [s[3], s[4], s[5]];
}

import type { HitTable } from '../io/hitTable.js';
import { momentumFromKinetic } from '../matter/kinematics.js';
import { ELECTRON } from '../particles.js';
import { msg } from '../errors.js';
import { warn } from '../warnings.js';
import type { Chamber } from './chamber.js';
import { ColumnBuffer } from './columnBuffer.js';
import { DECAY_IN_FLIGHT } from './decays.js';
import { HitRecorder } from './hitRecorder.js';
import { addNoiseHits } from './noiseHits.js';
import { decayAtRest, flyNeutral, type Pending } from './secondaries.js';
import { seededRandom } from './rng.js';
import { beamEvent, type BeamSource } from './sources/beam.js';
import { burstEvent, type BurstSource } from './sources/burst.js';
import { cosmicEvent, type CosmicSource } from './sources/cosmic.js';
import { stoppingEvent, type StoppingSource } from './sources/stopping.js';
import { transportTrack } from './transport.js';
import { TRANSPORT_DEFAULTS, type EnergyLossMode, type Sampling, type TransportOptions } from './transportOptions.js';
import { twoBodyDecay } from './twoBodyDecay.js';

export type { BeamSource, BurstSource, CosmicSource, StoppingSource };
export type Source = BeamSource | BurstSource | CosmicSource | StoppingSource;

/** How hits are measured: where they are taken, Gaussian smearing per coordinate, losses, noise. */
export interface MeasurementModel {
  readonly sampling: Sampling;
  /** Gaussian σ of each coordinate [m]. */
  readonly sigmaXM: number;
  readonly sigmaYM: number;
  readonly sigmaZM: number;
  /** Probability that a true hit is recorded (0…1). */
  readonly efficiency: number;
  /** Mean number of noise hits per event, uniform in the chamber (Poisson count). */
  readonly noiseHitsPerEvent: number;
}

export interface TransportSettings {
  readonly energyLoss: EnergyLossMode;
  readonly scattering: boolean;
  readonly maxStepM: number;
  readonly maxPathM: number;
  /** Knock-on electrons above this kinetic energy [MeV] are made; 0: none. */
  readonly deltaRayMinMeV: number;
  /** Charged pions decay in flight (π → μν) with their lifetime; default true. */
  readonly decaysInFlight?: boolean;
}

/** Everything a run needs, in internal units (what a scenario file resolves to). */
export interface SimulationConfig {
  readonly name: string;
  readonly chamber: Chamber;
  readonly transport: TransportSettings;
  readonly measurement: MeasurementModel;
  readonly sources: readonly Source[];
}

/** One row per simulated particle (neutral parents included). Lengths [m], momenta [GeV/c]. */
export interface TruthTable {
  readonly length: number;
  readonly event: Float64Array;
  readonly track: Float64Array;
  /** Track number of the parent in the same event; 0 for a primary. */
  readonly parent: Float64Array;
  readonly species: readonly string[];
  readonly charge: Float64Array;
  /** 'beam', 'burst', 'cosmic', 'stopping', 'decay', 'decay-at-rest', 'delta'. */
  readonly process: readonly string[];
  readonly vx: Float64Array;
  readonly vy: Float64Array;
  readonly vz: Float64Array;
  readonly px: Float64Array;
  readonly py: Float64Array;
  readonly pz: Float64Array;
  /** 'stopped', 'exited', 'max-path', 'decayed' (neutral parents and pions decaying in flight). */
  readonly end: readonly string[];
  readonly ex: Float64Array;
  readonly ey: Float64Array;
  readonly ez: Float64Array;
  /** Path length inside the chamber [m] (flight length for neutrals). */
  readonly pathM: Float64Array;
  /** Recorded (measured) hits of the track. */
  readonly hits: Float64Array;
}

/** True position and momentum of every row of the hit table (NaN for noise hits). */
export interface HitTruth {
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly z: Float64Array;
  readonly momentumGeV: Float64Array;
}

export interface SimulationResult {
  readonly name: string;
  readonly seed: number;
  readonly events: number;
  readonly hits: HitTable;
  readonly hitTruth: HitTruth;
  readonly truth: TruthTable;
}

/** Safety limit on particles per event (δ-ray showers of a looper could otherwise grow without end). */
const MAX_TRACKS_PER_EVENT = 2000;

const TRUTH_COLUMNS = ['event', 'track', 'parent', 'charge', 'vx', 'vy', 'vz', 'px', 'py', 'pz', 'ex', 'ey', 'ez', 'path', 'hits'] as const;

/**
 * Runs a chamber simulation: events of each source in turn (event numbers from 1, in source
 * order), each particle transported with `transportTrack`, decays of neutral parents and decays
 * at rest followed, hits measured with the measurement model. One seed drives everything; the
 * same config and seed give the same numbers on any machine (pure-rand, no global RNG).
 * Output: the hit table the fitters read (rows of a track contiguous, in travel order; noise hits
 * first in each event with track −1, the lib/io convention for hits on no track) and the truth table.
 * @example simulateChamber(config, 7).hits.length
 */
export function simulateChamber(config: SimulationConfig, seed: number): SimulationResult {
  return simulateEvents(config, seed, Infinity);
}

/** Counts of a whole run simulated in parts (what the run record says). */
export interface SimulationTotals {
  readonly name: string;
  readonly seed: number;
  readonly events: number;
  readonly hitRows: number;
  readonly particles: number;
  readonly particlesBySpecies: Readonly<Record<string, number>>;
}

/**
 * As `simulateChamber`, handing the result over in parts of `eventsPerPart` whole events each
 * (the last part may be shorter or empty) so that memory stays bounded however many events the
 * scenario asks for. The parts, put one after the other, are exactly the rows of the one-piece
 * result (same seed stream, same order). Returns the counts of the whole run.
 * @example simulateChamberInParts(config, 7, (part) => write(formatHitsCsv(part)), 1000)
 */
export function simulateChamberInParts(config: SimulationConfig, seed: number, onPart: (part: SimulationResult) => void, eventsPerPart = 1000): SimulationTotals {
  if (!(Number.isInteger(eventsPerPart) && eventsPerPart > 0)) throw msg.badArgument('eventsPerPart', eventsPerPart, 'a positive whole number of events');
  let hitRows = 0;
  let particles = 0;
  const bySpecies: Record<string, number> = {};
  let events = 0;
  simulateEvents(config, seed, eventsPerPart, (part) => {
    hitRows += part.hits.length;
    particles += part.truth.length;
    for (const sp of part.truth.species) bySpecies[sp] = (bySpecies[sp] ?? 0) + 1;
    events = part.events;
    onPart(part);
  });
  return { name: config.name, seed, events, hitRows, particles, particlesBySpecies: bySpecies };
}

/** The event loop; with `onPart`, the buffers are handed over and emptied every `eventsPerPart` events and at the end. */
function simulateEvents(config: SimulationConfig, seed: number, eventsPerPart: number, onPart?: (part: SimulationResult) => void): SimulationResult {
  const rng = seededRandom(seed, `simulateChamber:${config.name}`);
  const { chamber, measurement } = config;
  const options: TransportOptions = {
    ...TRANSPORT_DEFAULTS,
    energyLoss: config.transport.energyLoss,
    scattering: config.transport.scattering,
    maxStepM: config.transport.maxStepM,
    maxPathM: config.transport.maxPathM,
    deltaRayMinMeV: config.transport.deltaRayMinMeV,
    sampling: measurement.sampling,
  };
  const partRows = Number.isFinite(eventsPerPart) ? Math.min(expectedHitRows(config), 1 << 16) : expectedHitRows(config);
  let hits = new HitRecorder(partRows);
  let truth = new ColumnBuffer(TRUTH_COLUMNS, 1024);
  let species: string[] = [];
  let process: string[] = [];
  let ends: string[] = [];
  let event = 0;
  const hand = () => {
    onPart!(collect(config, seed, event, hits, truth, { species, process, ends }));
    hits = new HitRecorder(partRows);
    truth = new ColumnBuffer(TRUTH_COLUMNS, 1024);
    species = [];
    process = [];
    ends = [];
  };

  for (const src of config.sources) {
    for (let e = 0; e < src.events; e++) {
      event++;
      const primaries = src.kind === 'beam' ? beamEvent(src, rng)
        : src.kind === 'burst' ? burstEvent(src, rng)
        : src.kind === 'cosmic' ? cosmicEvent(src, chamber, rng)
        : stoppingEvent(src, chamber, rng);
      addNoiseHits(hits, event, chamber, measurement.noiseHitsPerEvent, rng);
      const stack: Pending[] = primaries.map((p) => ({ ...p, parent: 0 }));
      let trackId = 0;
      while (stack.length > 0) {
        const item = stack.shift()!;
        if (trackId >= MAX_TRACKS_PER_EVENT) {
          warn('SIM_TRACK_LIMIT', `event ${event}: more than ${MAX_TRACKS_PER_EVENT} particles; the rest were dropped`, 'simulateChamber');
          break;
        }
        const id = ++trackId;
        const sp = item.species;
        const pGeV = item.momentumGeV;
        let end: string, ex: number, ey: number, ez: number, path: number, nHits = 0;
        if (sp.charge === 0) {
          ({ end, ex, ey, ez, path } = flyNeutral(item, id, chamber, rng, stack));
        } else {
          const first = hits.n;
          const { efficiency, sigmaXM, sigmaYM, sigmaZM } = measurement;
          const inFlight = config.transport.decaysInFlight !== false ? DECAY_IN_FLIGHT[sp.name] : undefined;
          const start = inFlight !== undefined && Number.isFinite(sp.ctauM) ? { ...item, properDecayLengthM: rng.exponential(sp.ctauM) } : item;
          const r = transportTrack(start, chamber, options, rng,
            (x, y, z, p) => {
              if (efficiency < 1 && rng.uniform() >= efficiency) return;
              hits.add(event, id,
                sigmaXM > 0 ? x + sigmaXM * rng.gaussian() : x,
                sigmaYM > 0 ? y + sigmaYM * rng.gaussian() : y,
                sigmaZM > 0 ? z + sigmaZM * rng.gaussian() : z,
                x, y, z, p);
            },
            (x, y, z, ux, uy, uz, t) => {
              stack.push({ species: ELECTRON, xM: x, yM: y, zM: z, ux, uy, uz, momentumGeV: momentumFromKinetic(ELECTRON, t) * 1e-3, process: 'delta', parent: id });
            });
          nHits = hits.n - first;
          end = r.reason; ex = r.xM; ey = r.yM; ez = r.zM; path = r.pathM;
          if (r.reason === 'stopped') decayAtRest(sp, r.xM, r.yM, r.zM, id, rng, stack);
          if (r.reason === 'decayed' && inFlight !== undefined) {
            const pMeV = r.momentumGeV * 1e3;
            const d = twoBodyDecay(sp.massMeV, pMeV * r.ux, pMeV * r.uy, pMeV * r.uz, inFlight.massMeV, 0, rng);
            const pm = Math.hypot(d.first[1], d.first[2], d.first[3]);
            stack.push({ species: inFlight, xM: r.xM, yM: r.yM, zM: r.zM, ux: d.first[1] / pm, uy: d.first[2] / pm, uz: d.first[3] / pm, momentumGeV: pm * 1e-3, process: 'decay', parent: id });
          }
        }
        species.push(sp.name);
        process.push(item.process);
        ends.push(end);
        truth.push(event, id, item.parent, sp.charge, item.xM, item.yM, item.zM,
          pGeV * item.ux, pGeV * item.uy, pGeV * item.uz, ex, ey, ez, path, nHits);
      }
      if (onPart !== undefined && event % eventsPerPart === 0) hand();
    }
  }
  if (onPart !== undefined) {
    if (event % eventsPerPart !== 0 || event === 0) hand();
    return collect(config, seed, event, hits, truth, { species, process, ends });
  }
  return collect(config, seed, event, hits, truth, { species, process, ends });
}

/** The result of the events in the buffers (the whole run, or one part of it). */
function collect(config: SimulationConfig, seed: number, event: number, hits: HitRecorder, truth: ColumnBuffer<typeof TRUTH_COLUMNS[number]>, names: { species: string[]; process: string[]; ends: string[] }): SimulationResult {
  const { measurement } = config;
  const { species, process, ends } = names;
  const h = {
    event: hits.column('event'), track: hits.column('track'), x: hits.column('x'), y: hits.column('y'), z: hits.column('z'),
    tx: hits.column('tx'), ty: hits.column('ty'), tz: hits.column('tz'), tp: hits.column('tp'),
  };
  const t = truth.finish();
  const sameSigma = measurement.sigmaXM === measurement.sigmaYM;
  // The measurement errors are the same for every hit of a run: filled once here.
  const rows = h.event.length;
  const sx = new Float64Array(rows).fill(measurement.sigmaXM);
  const sy = sameSigma ? sx : new Float64Array(rows).fill(measurement.sigmaYM);
  const sz = new Float64Array(rows).fill(measurement.sigmaZM);
  return {
    name: config.name,
    seed,
    events: event,
    hits: {
      length: h.event.length,
      event: h.event, track: h.track, x: h.x, y: h.y, z: h.z,
      sigmaX: sx, sigmaY: sy, sigmaZ: sz,
      source: { file: `(simulated: ${config.name}, seed ${seed})`, units: { x: 'm', y: 'm', z: 'm' }, ignoredColumns: [] },
    },
    hitTruth: { x: h.tx, y: h.ty, z: h.tz, momentumGeV: h.tp },
    truth: {
      length: t.event.length,
      event: t.event, track: t.track, parent: t.parent, species, charge: t.charge, process,
      vx: t.vx, vy: t.vy, vz: t.vz, px: t.px, py: t.py, pz: t.pz,
      end: ends, ex: t.ex, ey: t.ey, ez: t.ez, pathM: t.path, hits: t.hits,
    },
  };
}

/**
 * A first guess of the number of hit rows (one primary per event crossing the box diagonal), so
 * that the hit columns rarely need to grow; they still grow when the guess is short.
 */
function expectedHitRows(config: SimulationConfig): number {
  const c = config.chamber;
  const diagonal = Math.hypot(c.xMaxM - c.xMinM, c.yMaxM - c.yMinM, c.zMaxM - c.zMinM);
  const s = config.measurement.sampling;
  const perTrack = s.kind === 'spacing' ? Math.ceil(diagonal / s.spacingM) : s.positionsM.length;
  const events = config.sources.reduce((sum, src) => sum + src.events * (src.kind === 'burst' ? 0.5 * (src.multiplicity[0] + src.multiplicity[1]) : 1), 0);
  const rows = Math.ceil(events) * (perTrack + Math.ceil(config.measurement.noiseHitsPerEvent)) + 1024;
  return Math.min(1 << 24, Math.max(1 << 12, rows));
}

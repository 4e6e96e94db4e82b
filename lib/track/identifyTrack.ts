import { msg } from '../errors.js';
import { material as lookupMaterial, type Material } from '../matter/materials.js';
import { particle as lookupParticle, type Particle } from '../particles.js';
import { chargedSpecies, PID_SPECIES } from './chargedSpecies.js';
import { filterTrack, newFilterScratch } from './bendingPlaneFilter.js';
import { fitHypothesis, type HypothesisFit } from './fitHypothesis.js';
import { meanHitSpacingM } from './pathLength.js';
import { segmentCurvatures, type SegmentCurvatures, type SegmentHits } from './segmentCurvatures.js';
import { speciesRange } from './speciesRange.js';
import { stopsInside, type FiducialBox, type StopDecision } from './stopsInside.js';

export interface IdentifyTrackOptions {
  /** B_z [T], signed. */
  readonly fieldT: number;
  /** The chamber medium (a lib/matter material or its name). */
  readonly material: Material | string;
  /** Mass hypotheses (objects or names); default e, μ, π, K, p. The charge sign comes from the track. */
  readonly species?: readonly (Particle | string)[];
  /** Fiducial volume for the stop decision (`stopsInside`). */
  readonly volume?: FiducialBox;
  readonly marginM?: number;
  /** Force the stop decision instead of `stopsInside`. */
  readonly stops?: boolean;
  /** Hit error [m] when the hits carry none; default 200 µm. */
  readonly hitErrorM?: number;
  /** Hits per curvature segment (stop decision and figures); default 8. */
  readonly hitsPerSegment?: number;
  /** |z|; default 1. */
  readonly chargeMagnitude?: number;
  /**
   * Least −2 ln L difference between the best and the runner-up for a track that leaves the
   * volume to be identified; default 9 (a 3σ preference for one parameter). Below it: 'undecided'.
   */
  readonly minDeltaExiting?: number;
}

/** Fewest hits a track needs to be identified. */
export const MIN_HITS = 6;

export const IDENTIFY_DEFAULTS = Object.freeze({ minDeltaExiting: 9, chargeMagnitude: 1 });

/** The name `identifyTrack` gives a track it cannot identify. */
export const UNDECIDED = 'undecided';

/** One hypothesis of one track, named with the measured charge sign. */
export interface TrackHypothesis extends HypothesisFit {
  readonly species: string;
}

export interface TrackIdentity {
  /** Chosen species ('sagitta range --particle' names), or 'undecided'. */
  readonly pid: string;
  /** −2 ln L of the runner-up minus that of the best hypothesis (≥ 0). */
  readonly deltaM2lnL: number;
  /** First-hit momentum [GeV/c] and error under the best hypothesis (also when undecided). */
  readonly pGeV: number;
  readonly sigmaPGeV: number;
  /** For a track that leaves: least momentum [GeV/c] that reaches its last hit under the best hypothesis; for a stopping one, the same bound. */
  readonly pMinGeV: number;
  readonly stop: StopDecision;
  readonly charge: number;
  /** Every hypothesis, in the order given, and the index of the best. */
  readonly hypotheses: readonly TrackHypothesis[];
  readonly best: number;
  readonly segments: SegmentCurvatures;
  readonly status: 'ok' | 'too-few-hits';
}

/**
 * Identifies one track by range and curvature: fits each mass hypothesis (`fitHypothesis`:
 * segment curvatures along the track against the CSDA momentum–range relation of lib/matter,
 * with multiple scattering, plus for a stopping track the consistency of its length with the
 * range of the fitted first-hit momentum, straggling included) and picks the smallest −2 ln L.
 * A track that does not stop keeps its best momentum and the bound `pMinGeV`, and is named only
 * when the curvature change along it separates the hypotheses by `minDeltaExiting`.
 * Valid for singly charged tracks with ≥ 6 hits, in a uniform field along z; the medium
 * must fill the volume (range tables: research values, not for treatment planning).
 * @example identifyTrack(trackHits(tracks, 0), { fieldT: 2, material: 'liquid-propane', stops: true }).pid
 */
export function identifyTrack(hits: SegmentHits, options: IdentifyTrackOptions): TrackIdentity {
  if (!Number.isFinite(options.fieldT) || options.fieldT === 0) throw msg.badArgument('fieldT', options.fieldT, 'a non-zero magnetic field in tesla');
  const mat = typeof options.material === 'string' ? lookupMaterial(options.material) : options.material;
  const species = (options.species ?? PID_SPECIES).map((s) => (typeof s === 'string' ? lookupParticle(s) : s));
  if (species.length === 0) throw msg.badArgument('species', '[]', 'at least one species, e.g. ["mu-", "pi-", "proton"]');
  const seg = segmentCurvatures(hits, { hitsPerSegment: options.hitsPerSegment });
  const n = hits.x.length;
  const end: [number, number, number] = [hits.x[n - 1], hits.y[n - 1], hits.z ? hits.z[n - 1] : 0];
  const stop = options.stops !== undefined
    ? Object.freeze({ stops: options.stops, endInside: options.stops, riseSignificance: NaN })
    : stopsInside(seg, end, { volume: options.volume, marginM: options.marginM });
  const base = {
    fieldT: options.fieldT,
    chargeMagnitude: options.chargeMagnitude ?? IDENTIFY_DEFAULTS.chargeMagnitude,
    radiationLengthM: mat.radiationLengthGcm2 / mat.densityGcm3 / 100,
    densityGcm3: mat.densityGcm3,
    zOverA: mat.zOverA,
    stops: stop.stops,
    spacingM: meanHitSpacingM(seg.pathM),
  };
  const ft = filterTrack(hits.x, hits.y, seg.pathM, hits.sigmaX ?? options.hitErrorM ?? 200e-6);
  // Seen from +z a positive particle turns clockwise when B points along +z (F = q v × B).
  const charge = -ft.turn * Math.sign(options.fieldT);
  const scratch = { ...newFilterScratch(n), p: new Float64Array(n) };
  const enough = n >= MIN_HITS;
  const hypotheses = species.map((s) => ({
    species: chargedSpecies(s, charge).name,
    ...(enough ? fitHypothesis(ft, speciesRange(s, mat), { ...base, massGeV: s.massMeV / 1000 }, scratch) : noFit()),
  }));
  let best = 0, second = -1;
  for (let i = 1; i < hypotheses.length; i++) if (hypotheses[i].m2lnL < hypotheses[best].m2lnL) best = i;
  for (let i = 0; i < hypotheses.length; i++) if (i !== best && (second < 0 || hypotheses[i].m2lnL < hypotheses[second].m2lnL)) second = i;
  const delta = second < 0 ? Infinity : hypotheses[second].m2lnL - hypotheses[best].m2lnL;
  const minDelta = options.minDeltaExiting ?? IDENTIFY_DEFAULTS.minDeltaExiting;
  const decided = enough && Number.isFinite(hypotheses[best].m2lnL) && (stop.stops || delta >= minDelta);
  const h = hypotheses[best];
  return Object.freeze({
    pid: decided ? h.species : UNDECIDED,
    deltaM2lnL: delta,
    pGeV: h.pGeV,
    sigmaPGeV: h.sigmaPGeV,
    pMinGeV: h.pMinGeV,
    stop,
    charge,
    hypotheses: Object.freeze(hypotheses.map((x) => Object.freeze(x))),
    best,
    segments: seg,
    status: enough ? 'ok' : 'too-few-hits',
  });
}

function noFit(): HypothesisFit {
  return { m2lnL: NaN, chi2: NaN, rangeChi2: NaN, ndf: 0, pGeV: NaN, sigmaPGeV: NaN, pMinGeV: NaN, rangeEndM: NaN };
}

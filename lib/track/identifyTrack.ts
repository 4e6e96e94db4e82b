import { msg } from '../errors.js';
import { fitTrackInMatter } from '../fit/matter/fitTrackInMatter.js';
import type { MatterFitStatus, MatterTrackFit } from '../fit/matter/matterTrackFit.js';
import type { HitCoordinates } from '../io/hitCoordinates.js';
import { material as lookupMaterial, type Material } from '../matter/materials.js';
import { particle as lookupParticle, type Particle } from '../particles.js';
import { chargedSpecies, PID_SPECIES } from './chargedSpecies.js';
import { filterTrack, newFilterScratch } from './bendingPlaneFilter.js';
import { fitHypothesis, type HypothesisFit } from './fitHypothesis.js';
import { meanHitSpacingM } from './pathLength.js';
import { segmentCurvatures, type SegmentCurvatures } from './segmentCurvatures.js';
import { speciesRange, type SpeciesRange } from './speciesRange.js';
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
   * Turning sense in travel order seen from +z (+1 counter-clockwise), e.g. the sign of a circle
   * fit's κ; default: from the hits' consecutive chords, which a nearly straight track's hit
   * errors can flip (`identifyTracks` passes the plain fit's sign).
   */
  readonly turn?: 1 | -1;
  /**
   * Least −2 ln L difference between the best and the runner-up for a track that leaves the
   * volume to be identified; default 9 (a 3σ preference for one parameter). Below it: 'undecided'.
   */
  readonly minDeltaExiting?: number;
  /**
   * Without a `volume`: how much worse (in −2 ln L) the best fit that stops just past the last
   * hit may be than the best fit that leaves, for the track to count as stopping; default 9.
   */
  readonly maxStopExcess?: number;
}

/** Fewest hits a track needs to be identified. */
export const MIN_HITS = 6;

export const IDENTIFY_DEFAULTS = Object.freeze({ minDeltaExiting: 9, chargeMagnitude: 1, maxStopExcess: 9 });

/** The name `identifyTrack` gives a track it cannot identify. */
export const UNDECIDED = 'undecided';

/**
 * One hypothesis of one track, named with the measured charge sign. For a stopping track
 * `m2lnL` is the value the choice is made on (see `identifyTrack`): the χ² of the fit with
 * material plus the pull² of its residual range at the last hit against a stop within one
 * spacing (`endTerm`), Infinity when that fit could not reach the hits or did not settle.
 */
export interface TrackHypothesis extends HypothesisFit {
  readonly species: string;
  /** Stopping tracks: status and χ² of the fit with material (lib/fit/matter) under this mass. */
  readonly fitStatus?: MatterFitStatus;
  readonly fitChi2?: number;
  /** Stopping tracks: the bending-plane filter's −2 ln L (the score before the re-scoring). */
  readonly filterM2lnL?: number;
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
 * A stopping track is then re-scored with the fit with material under each mass that the filter
 * does not reject outright (`withMatterFits`). Without a `volume`, a rising curvature makes a
 * stop only when stopping just past the last hit explains the hits within `maxStopExcess` of the
 * best fit that leaves. A track that does not stop keeps its best momentum and the bound
 * `pMinGeV`, and is named only when the curvature change along it separates the hypotheses by
 * `minDeltaExiting`.
 * Valid for singly charged tracks with ≥ 6 hits, in a uniform field along z; the medium
 * must fill the volume (range tables: research values, not for treatment planning).
 * @example identifyTrack(trackHits(tracks, 0), { fieldT: 2, material: 'liquid-propane', stops: true }).pid
 */
export function identifyTrack(hits: HitCoordinates, options: IdentifyTrackOptions): TrackIdentity {
  if (!Number.isFinite(options.fieldT) || options.fieldT === 0) throw msg.badArgument('fieldT', options.fieldT, 'a non-zero magnetic field in tesla');
  const mat = typeof options.material === 'string' ? lookupMaterial(options.material) : options.material;
  const species = (options.species ?? PID_SPECIES).map((s) => (typeof s === 'string' ? lookupParticle(s) : s));
  if (species.length === 0) throw msg.badArgument('species', '[]', 'at least one species, e.g. ["mu-", "pi-", "proton"]');
  const seg = segmentCurvatures(hits, { hitsPerSegment: options.hitsPerSegment });
  const n = hits.x.length;
  const end: [number, number, number] = [hits.x[n - 1], hits.y[n - 1], hits.z ? hits.z[n - 1] : 0];
  const forced = options.stops !== undefined;
  const geometric = forced
    ? Object.freeze({ stops: options.stops!, endInside: options.stops!, riseSignificance: NaN })
    : stopsInside(seg, end, { volume: options.volume, marginM: options.marginM });
  const base = {
    fieldT: options.fieldT,
    chargeMagnitude: options.chargeMagnitude ?? IDENTIFY_DEFAULTS.chargeMagnitude,
    radiationLengthM: mat.radiationLengthGcm2 / mat.densityGcm3 / 100,
    densityGcm3: mat.densityGcm3,
    zOverA: mat.zOverA,
    spacingM: meanHitSpacingM(seg.pathM),
  };
  const chords = filterTrack(hits.x, hits.y, seg.pathM, hits.sigmaX ?? options.hitErrorM ?? 200e-6);
  const ft = options.turn ? { ...chords, turn: options.turn } : chords;
  // Seen from +z a positive particle turns clockwise when B points along +z (F = q v × B).
  const charge = -ft.turn * Math.sign(options.fieldT);
  const scratch = { ...newFilterScratch(n), p: new Float64Array(n) };
  const enough = n >= MIN_HITS;
  const ranges = species.map((s) => speciesRange(s, mat));
  const fitAll = (stops: boolean): TrackHypothesis[] => species.map((s, i) => ({
    species: chargedSpecies(s, charge).name,
    ...(enough ? fitHypothesis(ft, ranges[i], { ...base, stops, massGeV: s.massMeV / 1000 }, scratch) : noFit()),
  }));
  let stop: StopDecision = geometric;
  let hypotheses: TrackHypothesis[];
  if (geometric.stops && !forced && !options.volume && enough) {
    // No walls to test against: a rising curvature alone (an electron that radiates, a track
    // that leaves through an unseen face) does not prove a stop. The track counts as stopping
    // only when running out of range just past the last hit explains it nearly as well as the
    // best fit that leaves (ours, documented).
    const leaving = fitAll(false), stopping = fitAll(true);
    const excess = leastM2lnL(stopping) - leastM2lnL(leaving);
    const stops = excess <= (options.maxStopExcess ?? IDENTIFY_DEFAULTS.maxStopExcess);
    stop = Object.freeze({ ...geometric, stops });
    hypotheses = stops ? stopping : leaving;
  } else {
    hypotheses = fitAll(geometric.stops);
  }
  if (stop.stops && enough) hypotheses = withMatterFits(hypotheses, hits, species, ranges, base.spacingM, { fieldT: options.fieldT, medium: mat, hitErrorM: options.hitErrorM ?? 200e-6 });
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

/**
 * A stopping track's hypotheses re-scored with the fit with material (3-D, mean loss, scattering
 * and straggling: lib/fit/matter): a mass whose fit cannot reach the last hit or does not settle
 * is rejected (m2lnL = Infinity); the others score that fit's χ² plus `endTerm`, the consistency
 * of its residual range at the last hit with a stop within one spacing. The determinant term of
 * the filter's −2 ln L is left out (ours, measured): with it the lighter of two close masses lost
 * whenever the χ² did not separate them. On the simulated Hollowmere stopping tracks (liquid
 * propane, 2 T, seeds 7–9) the filter alone named μ 62–75 % and π 86–88 % right, this score
 * μ 91–96 % and π 91–93 %, with p, K ≥ 97.5 % and electrons 100 %. When no mass reaches, the
 * filter decides.
 */
/**
 * A mass whose filter −2 ln L is worse than the best by more than this is not refitted (a gross
 * mismatch: an electron profile on a muon, a proton on an electron spiral). The fit with
 * material frees the first-hit momentum, so under a light mass it matched some muon tracks about
 * as well as the muon's own fit (5–9 μ a sample were named e± without this), where the filter's
 * profile, anchored at the stop, rules the electron out by hundreds. 25 = a 5σ difference for
 * one parameter (ours).
 */
const FILTER_VETO = 25;

function withMatterFits(hs: TrackHypothesis[], hits: HitCoordinates, species: readonly Particle[], ranges: readonly SpeciesRange[], spacingM: number, o: { fieldT: number; medium: Material; hitErrorM: number }): TrackHypothesis[] {
  const least = leastM2lnL(hs);
  const fits = species.map((s, i) => (hs[i].m2lnL <= least + FILTER_VETO ? fitTrackInMatter(hits, { ...o, particle: s }) : undefined));
  const reaches = fits.map((f) => f !== undefined && (f.status === 'ok' || f.status === 'poor-fit'));
  const any = reaches.some(Boolean);
  return hs.map((h, i) => ({
    ...h,
    filterM2lnL: h.m2lnL,
    fitStatus: fits[i]?.status,
    fitChi2: fits[i]?.chi2,
    m2lnL: !any ? h.m2lnL : reaches[i] ? fits[i]!.chi2 + endTerm(fits[i]!, ranges[i], spacingM) : Infinity,
  }));
}

/** Pull² of a fit's residual range at the last hit against the stop prior U(0, spacing). */
function endTerm(f: MatterTrackFit, range: SpeciesRange, spacingM: number): number {
  const p = f.last.pGeV, sp = f.last.sigmaPGeV;
  const sigmaR = 0.5 * Math.abs(range.rangeM(p + sp) - range.rangeM(Math.max(p - sp, 0)));
  const v = (spacingM * spacingM) / 12 + (Number.isFinite(sigmaR) ? sigmaR * sigmaR : 0);
  return (f.residualRangeM - 0.5 * spacingM) ** 2 / v;
}

/** The smallest −2 ln L of a set of hypotheses (Infinity for none). */
function leastM2lnL(hs: readonly TrackHypothesis[]): number {
  return hs.reduce((m, h) => (h.m2lnL < m ? h.m2lnL : m), Infinity);
}

function noFit(): HypothesisFit {
  return { m2lnL: NaN, chi2: NaN, rangeChi2: NaN, ndf: 0, pGeV: NaN, sigmaPGeV: NaN, pMinGeV: NaN, rangeEndM: NaN };
}

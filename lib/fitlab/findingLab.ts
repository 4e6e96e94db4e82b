import { performance } from 'node:perf_hooks';
import { msg } from '../errors.js';
import { findTracks, type FindTracksOptions, type FoundTracks } from '../find/findTracks.js';
import { matchFoundTracks, type MatchOptions, type TrackMatch } from '../find/matchFoundTracks.js';
import type { HitTable } from '../io/hitTable.js';
import { seededRandom } from '../simulate/rng.js';
import { simulateChamber, type SimulationConfig, type SimulationResult } from '../simulate/simulate.js';
import { withNoiseHits } from './withNoiseHits.js';

export interface FindingLabOptions {
  /** The chamber, its measurement and sources (e.g. a burst of helices); the truth comes from it. */
  readonly scenario: SimulationConfig;
  readonly seed: number;
  /** Noise hits as fractions of all hits; default [0, 0.1, 0.2, 0.3]. */
  readonly noiseFractions?: readonly number[];
  readonly find?: FindTracksOptions;
  readonly match?: MatchOptions;
  /** Bin edges: transverse momentum [GeV/c], tan λ, true tracks per event. */
  readonly ptEdgesGeV?: readonly number[];
  readonly tanLambdaEdges?: readonly number[];
  readonly multiplicityEdges?: readonly number[];
}

/** Efficiency of one bin (binomial error √(ε(1 − ε)/n)); fakes where they can be placed. */
export interface FindingBin {
  readonly noiseFraction: number;
  readonly low: number;
  readonly high: number;
  readonly centre: number;
  readonly trueTracks: number;
  readonly found: number;
  readonly efficiency: number;
  readonly efficiencyError: number;
}

export interface FindingSummary extends FindingBin {
  readonly events: number;
  readonly foundTracks: number;
  readonly fakeTracks: number;
  readonly fakeRate: number;
  readonly splitTracks: number;
  readonly sharedHits: number;
  readonly unassignedHits: number;
  /** Wall clock on this machine, for comparing settings side by side (not a benchmark). */
  readonly eventsPerSecond: number;
}

export interface FindingLabReport {
  readonly summary: readonly FindingSummary[];
  readonly byPt: readonly FindingBin[];
  readonly byTanLambda: readonly FindingBin[];
  /** Per bin of true tracks per event, with the fake rate among the tracks found in those events. */
  readonly byMultiplicity: readonly (FindingBin & { readonly foundTracks: number; readonly fakeTracks: number; readonly fakeRate: number })[];
  readonly run: SimulationResult;
  /** Per noise level: the hits given to the finder, what it found, and the match. */
  readonly levels: readonly { readonly noiseFraction: number; readonly hits: HitTable; readonly found: FoundTracks; readonly match: TrackMatch }[];
}

const DEFAULTS = Object.freeze({
  noiseFractions: [0, 0.1, 0.2, 0.3],
  ptEdgesGeV: [0.1, 0.2, 0.4, 0.7, 1.2, 2],
  tanLambdaEdges: [-1, -0.6, -0.2, 0.2, 0.6, 1],
  multiplicityEdges: [1, 6, 11, 16, 21, 31],
});

/**
 * Track finding measured on simulated truth, in the fit lab's manner: one run of the scenario,
 * the same tracks with noise added at each level (`withNoiseHits`), `findTracks` on the hits,
 * `matchFoundTracks` against the true labels; efficiency by transverse momentum, dip and tracks
 * per event, fakes, split tracks and shared hits per noise level. p_T and tan λ are the true
 * values at production (truth table); true tracks with fewer hits than `match.minTrueHits` are
 * not counted.
 * @example findingLab({ scenario: readScenario('tracker.scenario.json'), seed: 1 }).summary
 */
export function findingLab(options: FindingLabOptions): FindingLabReport {
  const o = { ...DEFAULTS, ...options };
  for (const f of o.noiseFractions) if (!(f >= 0 && f < 1)) throw msg.badArgument('noiseFractions', o.noiseFractions, 'fractions from 0 up to (not including) 1');
  const run = simulateChamber(o.scenario, o.seed);
  const t = run.truth;
  const truthRow = new Map<string, number>();
  for (let i = 0; i < t.length; i++) truthRow.set(`${t.event[i]}\u0000${t.track[i]}`, i);
  const summary: FindingSummary[] = [], byPt: FindingBin[] = [], byTanLambda: FindingBin[] = [];
  const byMultiplicity: FindingLabReport['byMultiplicity'][number][] = [];
  const levels: FindingLabReport['levels'][number][] = [];
  o.noiseFractions.forEach((fraction, level) => {
    const hits = withNoiseHits(run.hits, fraction, o.scenario.chamber, seededRandom(o.seed, `findingLab noise ${level}`));
    const t0 = performance.now();
    const found = findTracks(hits, o.find);
    const seconds = (performance.now() - t0) / 1000;
    const match = matchFoundTracks(hits.event, hits.track, found, o.match);
    levels.push({ noiseFraction: fraction, hits, found, match });
    const T = match.trueHits.length;
    const pt = new Float64Array(T), tanL = new Float64Array(T), mult = new Float64Array(T);
    const perEvent = new Map<number, number>();
    for (let k = 0; k < T; k++) if (match.counted[k]) perEvent.set(match.trueEvent[k], (perEvent.get(match.trueEvent[k]) ?? 0) + 1);
    for (let k = 0; k < T; k++) {
      const r = truthRow.get(`${match.trueEvent[k]}\u0000${match.trueId[k]}`)!;
      pt[k] = Math.hypot(t.px[r], t.py[r]);
      tanL[k] = t.pz[r] / pt[k];
      mult[k] = perEvent.get(match.trueEvent[k]) ?? 0;
    }
    const all = bin(fraction, match, () => true, -Infinity, Infinity);
    summary.push({
      ...all, low: NaN, high: NaN, centre: NaN,
      events: found.events, foundTracks: found.count, fakeTracks: match.fakeTracks, fakeRate: match.fakeRate,
      splitTracks: match.splitTracks, sharedHits: found.sharedHitsTotal, unassignedHits: found.unassignedHits,
      eventsPerSecond: seconds > 0 ? found.events / seconds : Infinity,
    });
    const edges = (e: readonly number[], value: Float64Array, out: FindingBin[], centre: (lo: number, hi: number) => number) => {
      for (let b = 0; b + 1 < e.length; b++) {
        const lo = e[b], hi = e[b + 1], last = b + 2 === e.length;
        out.push({ ...bin(fraction, match, (k) => value[k] >= lo && (value[k] < hi || (last && value[k] <= hi)), lo, hi), centre: centre(lo, hi) });
      }
    };
    edges(o.ptEdgesGeV, pt, byPt, (lo, hi) => Math.sqrt(lo * hi));
    edges(o.tanLambdaEdges, tanL, byTanLambda, (lo, hi) => 0.5 * (lo + hi));
    const multBins: FindingBin[] = [];
    edges(o.multiplicityEdges, mult, multBins, (lo, hi) => 0.5 * (lo + hi - 1));
    for (const mb of multBins) {
      let foundTracks = 0, fakeTracks = 0;
      for (let f = 0; f < found.count; f++) {
        const m = perEvent.get(found.event[f]) ?? 0;
        if (m >= mb.low && m < mb.high) { foundTracks++; fakeTracks += match.fake[f]; }
      }
      byMultiplicity.push({ ...mb, foundTracks, fakeTracks, fakeRate: foundTracks > 0 ? fakeTracks / foundTracks : NaN });
    }
  });
  return { summary, byPt, byTanLambda, byMultiplicity, run, levels };
}

function bin(noiseFraction: number, match: TrackMatch, keep: (k: number) => boolean, low: number, high: number): FindingBin {
  let trueTracks = 0, found = 0;
  for (let k = 0; k < match.trueHits.length; k++) {
    if (!match.counted[k] || !keep(k)) continue;
    trueTracks++;
    found += match.found[k];
  }
  const eff = trueTracks > 0 ? found / trueTracks : NaN;
  return { noiseFraction, low, high, centre: NaN, trueTracks, found, efficiency: eff, efficiencyError: trueTracks > 0 ? Math.sqrt((eff * (1 - eff)) / trueTracks) : NaN };
}

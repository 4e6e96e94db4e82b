import { material as lookupMaterial } from '../matter/materials.js';
import { particle as lookupParticle } from '../particles.js';
import { PID_SPECIES } from './chargedSpecies.js';
import { identifyTrack, type IdentifyTrackOptions, type TrackIdentity } from './identifyTrack.js';
import type { TrackTable } from './measureTracks.js';
import { trackHits } from './trackHits.js';

/** One row per track of a track table: the identification columns. */
export interface IdentifiedTracks {
  readonly count: number;
  /** Chosen species per track ('sagitta range --particle' names), or 'undecided'. */
  readonly pid: readonly string[];
  /** −2 ln L of the runner-up minus the best. */
  readonly deltaM2lnL: Float64Array;
  /**
   * First-hit momentum [GeV/c] and its error under the best hypothesis, from the identification's
   * own one-parameter fit. For a spiralling electron −2 ln L in p₀ has several minima: this value
   * moved by up to 30 % (tens of σ) when the scan's grid went from 20 to 12 points on the
   * Brindlemoor electrons, σ being the curvature of the minimum found. Momenta for physics come
   * from `measureTracks` (the fit with material under the chosen species), not from here.
   */
  readonly pGeV: Float64Array;
  readonly sigmaPGeV: Float64Array;
  /** Least first-hit momentum [GeV/c] that reaches the last hit under the best hypothesis. */
  readonly pMinGeV: Float64Array;
  /** 1 when the track stops inside the volume. */
  readonly stops: Uint8Array;
  /** −2 ln L per hypothesis (mass names as given, e.g. 'mu-' stands for μ±), one column each. */
  readonly m2lnL: Readonly<Record<string, Float64Array>>;
  /** Hypotheses in column order. */
  readonly species: readonly string[];
  /**
   * The species whose fit gave the table's `p_GeV_c` row by row (set by `measureTracks` with
   * `particle: 'auto'` or a list): the chosen one, or the charged pion for an 'undecided' track.
   */
  readonly pSpecies?: readonly string[];
  /** The full result of each track (segments, every hypothesis), for figures. */
  readonly identities: readonly TrackIdentity[];
}

/**
 * `identifyTrack` for every track of a `measureTracks` table, in its row order (the table keeps
 * each track's hits, so nothing is regrouped). Options as `identifyTrack`; the species list is
 * parsed once.
 * @example identifyTracks(measureTracks(hits, { fieldT: 2 }), { fieldT: 2, material: 'liquid-propane', volume })
 */
export function identifyTracks(tracks: TrackTable, options: IdentifyTrackOptions): IdentifiedTracks {
  const mat = typeof options.material === 'string' ? lookupMaterial(options.material) : options.material;
  const species = (options.species ?? PID_SPECIES).map((s) => (typeof s === 'string' ? lookupParticle(s) : s));
  const opts = { ...options, material: mat, species };
  const n = tracks.count;
  const out = {
    deltaM2lnL: new Float64Array(n), pGeV: new Float64Array(n), sigmaPGeV: new Float64Array(n),
    pMinGeV: new Float64Array(n), stops: new Uint8Array(n),
  };
  const m2lnL: Record<string, Float64Array> = {};
  for (const s of species) m2lnL[s.name] = new Float64Array(n);
  const pid: string[] = [];
  const identities: TrackIdentity[] = [];
  for (let k = 0; k < n; k++) {
    // The circle fit's κ sign is the turning sense (its error is far smaller than that of the
    // hit-to-hit chords on a nearly straight track).
    const kappa = tracks.kappa[k];
    const fitted = tracks.status[k] === 'ok' || tracks.status[k] === 'poor-fit';
    const turn = options.turn ?? (fitted && Number.isFinite(kappa) && kappa !== 0 ? (kappa > 0 ? 1 : -1) : undefined);
    const id = identifyTrack(trackHits(tracks, k), { ...opts, turn });
    identities.push(id);
    pid.push(id.pid);
    out.deltaM2lnL[k] = id.deltaM2lnL;
    out.pGeV[k] = id.pGeV;
    out.sigmaPGeV[k] = id.sigmaPGeV;
    out.pMinGeV[k] = id.pMinGeV;
    out.stops[k] = id.stop.stops ? 1 : 0;
    species.forEach((s, i) => { m2lnL[s.name][k] = id.hypotheses[i].m2lnL; });
  }
  return Object.freeze({ count: n, pid, ...out, m2lnL, species: species.map((s) => s.name), identities });
}

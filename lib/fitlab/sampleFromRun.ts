import { GEV_PER_TESLA_METRE } from '../constants.js';
import { msg } from '../errors.js';
import { particle } from '../particles.js';
import type { SimulationResult } from '../simulate/simulate.js';
import type { FitLabSample } from './sample.js';

export interface SampleFromRunOptions {
  /** Field along +z of the run [T] (the chamber's uniform field). */
  readonly fieldT: number;
  /** Tracks with fewer recorded hits are left out; default 10. */
  readonly minHits?: number;
  /** Keep only these species (names as in the truth table, e.g. ["pi-", "mu+"]); default all charged. */
  readonly species?: readonly string[];
}

/**
 * Turns the charged tracks of a chamber simulation into a fit-lab sample, so that fit methods can
 * be compared on a full scenario (energy loss, scattering, efficiency). The truth is taken at the
 * first recorded hit — where lib/fit reports its parameters: κ = −0.299792458·q·B/p_T with p_T the
 * true momentum there times cos λ of the production direction (λ is constant in a uniform field
 * along z). A track that loses energy curls up along its length, so a fit that assumes a circle
 * shows a bias against this truth: that is one of the things the lab is for.
 * Noise hits and neutral particles are skipped. Track length is the true projected path between
 * the first and last hits.
 */
export function fitLabSampleFromRun(run: SimulationResult, options: SampleFromRunOptions): FitLabSample {
  const { fieldT } = options;
  const minHits = options.minHits ?? 10;
  if (!(Number.isFinite(fieldT) && fieldT !== 0)) throw msg.badArgument('fieldT', fieldT, 'the non-zero field of the run in tesla');
  const h = run.hits, t = run.truth, ht = run.hitTruth;
  const truthRow = new Map<string, number>();
  for (let i = 0; i < t.length; i++) truthRow.set(`${t.event[i]}/${t.track[i]}`, i);
  const starts: number[] = [];
  const ends: number[] = [];
  const rows: number[] = [];
  for (let i = 0; i < h.length;) {
    let j = i + 1;
    while (j < h.length && h.event[j] === h.event[i] && h.track[j] === h.track[i]) j++;
    const row = truthRow.get(`${h.event[i]}/${h.track[i]}`);
    if (h.track[i] > 0 && row !== undefined && t.charge[row] !== 0 && j - i >= minHits
      && (options.species === undefined || options.species.includes(t.species[row]))) {
      starts.push(i); ends.push(j); rows.push(row);
    }
    i = j;
  }
  const count = starts.length;
  const n = starts.reduce((s, a, k) => s + ends[k] - a, 0);
  const x = new Float64Array(n), y = new Float64Array(n), z = new Float64Array(n);
  const sigma = new Float64Array(n), sigmaZ = new Float64Array(n);
  const offsets = new Int32Array(count + 1);
  const kappaTrue = new Float64Array(count), momentumGeV = new Float64Array(count), lengthM = new Float64Array(count);
  const charge = new Float64Array(count), tanLambdaTrue = new Float64Array(count);
  let at = 0;
  for (let k = 0; k < count; k++) {
    const a = starts[k], b = ends[k], r = rows[k];
    offsets[k] = at;
    let len = 0;
    for (let i = a; i < b; i++, at++) {
      x[at] = h.x[i]; y[at] = h.y[i]; z[at] = h.z ? h.z[i] : 0;
      sigma[at] = h.sigmaX ? h.sigmaX[i] : NaN;
      sigmaZ[at] = h.sigmaZ ? h.sigmaZ[i] : NaN;
      if (i > a) len += Math.hypot(ht.x[i] - ht.x[i - 1], ht.y[i] - ht.y[i - 1]);
    }
    const pt0 = Math.hypot(t.px[r], t.py[r]);
    const tl = pt0 > 0 ? t.pz[r] / pt0 : 0;
    const p1 = ht.momentumGeV[a];
    const q = t.charge[r] !== 0 ? t.charge[r] : particle(t.species[r]).charge;
    kappaTrue[k] = (-GEV_PER_TESLA_METRE * q * fieldT * Math.sqrt(1 + tl * tl)) / p1;
    momentumGeV[k] = p1;
    tanLambdaTrue[k] = tl;
    lengthM[k] = len;
    charge[k] = q;
  }
  offsets[count] = at;
  return { count, offsets, x, y, z, sigma, sigmaZ, tanLambdaTrue, kappaTrue, momentumGeV, lengthM, charge, fieldT, seed: run.seed, scattering: true };
}

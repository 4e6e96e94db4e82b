import { msg } from '../errors.js';
import { FIT_STATUS } from '../fit/circleFit.js';
import { fitHelices } from '../fit/fitHelices.js';
import { fitTracksInMatter } from '../fit/matter/fitTracksInMatter.js';
import { momenta } from '../track/momentum.js';
import type { MatterSample } from './matterSample.js';
import type { Material } from '../matter/materials.js';

/** Figures of merit of one fit over a set of tracks, for p at the first hit (relative to the truth there). */
export interface MatterFitMerit {
  /** 'matter-stop': the fit with material with the stop constraint on the tracks the simulator ranged out. */
  readonly fit: 'matter' | 'matter-stop' | 'plain-helix';
  readonly tracks: number;
  readonly fitted: number;
  /** Median of (p − p_true)/p_true. */
  readonly medianBias: number;
  /** Resolution: 1.4826 × the median absolute deviation of (p − p_true)/p_true (robust σ). */
  readonly resolution: number;
  /** Mean and rms of (p − p_true)/σ(p). */
  readonly pullMean: number;
  readonly pullRms: number;
  /** Mean χ²/ndf. */
  readonly chi2PerNdf: number;
}

export interface MatterFitLabBin {
  readonly low: number;
  readonly high: number;
  readonly matter: MatterFitMerit;
  readonly plain: MatterFitMerit;
  /** With `stopsKnown`: the fit with material, tracks that stop fitted with the stop constraint. */
  readonly stop?: MatterFitMerit;
}

export interface MatterFitLabReport {
  readonly species: string;
  readonly material: string;
  readonly overall: { readonly matter: MatterFitMerit; readonly plain: MatterFitMerit; readonly stop?: MatterFitMerit };
  /** By true momentum at the first hit [GeV/c] (log bins) and by 3-D path length first → last hit [m]. */
  readonly byMomentum: readonly MatterFitLabBin[];
  readonly byPathLength: readonly MatterFitLabBin[];
}

export interface MatterFitLabOptions {
  readonly material: Material;
  readonly fieldT: number;
  /** Bins per variable; default 4. */
  readonly bins?: number;
  /**
   * Also fit with the stop constraint the tracks the simulator ranged out (as a fiducial volume
   * would flag them: `MatterFitOptions.stops`), reported as `stop`. Default false.
   */
  readonly stopsKnown?: boolean;
}

/**
 * Compares the fit with material (lib/fit/matter, under the sample's true species) with the
 * plain helix fit (geometric circle + line, no material) on simulated truth: bias, resolution
 * and pulls of p at the first hit, overall and by momentum and path length. The plain fit
 * measures a mean curvature, so on slowing tracks it is biased low and its σ(p), which holds
 * only the hit errors, is too small: that is what this lab shows next to the new fit. With
 * `stopsKnown` a third column fits the stopping tracks with the stop constraint (momentum from
 * range), as a chamber whose fiducial volume tells which tracks stop would.
 * @example matterFitLab(matterSample({ ... }), { material: material('liquid-propane'), fieldT: 2 }).overall
 */
export function matterFitLab(s: MatterSample, o: MatterFitLabOptions): MatterFitLabReport {
  if (s.count < 1) throw msg.badArgument('sample.count', s.count, 'at least one track');
  const hits = { x: s.x, y: s.y, z: s.z, sigmaX: s.sigma, sigmaY: s.sigma, sigmaZ: s.sigma };
  const matter = fitTracksInMatter(hits, s.offsets, { fieldT: o.fieldT, medium: o.material, particle: s.species });
  const helix = fitHelices(hits, s.offsets, { method: 'geometric', fieldT: o.fieldT });
  const plainP = momenta(helix, o.fieldT, { chargeMagnitude: Math.abs(s.species.charge) });
  const held = o.stopsKnown ? fitTracksInMatter(hits, s.offsets, { fieldT: o.fieldT, medium: o.material, particle: s.species, stoppingTracks: s.stopped }) : undefined;
  const rows = (keep: (k: number) => boolean) => ({
    matter: merit('matter', s, keep, (k) => (matter.status[k] <= 1 ? [matter.pGeV[k], matter.sigmaPGeV[k], matter.chi2[k] / matter.ndf[k]] : undefined)),
    plain: merit('plain-helix', s, keep, (k) => (FIT_STATUS[helix.circle.status[k]] === 'ok' ? [plainP.pGeV[k], plainP.sigmaPGeV[k], helix.circle.chi2[k] / helix.circle.ndf[k]] : undefined)),
    ...(held ? { stop: merit('matter-stop', s, keep, (k) => (held.status[k] <= 1 ? [held.pGeV[k], held.sigmaPGeV[k], held.chi2[k] / held.ndf[k]] : undefined)) } : {}),
  });
  const nb = o.bins ?? 4;
  const binned = (v: Float64Array, log: boolean): MatterFitLabBin[] => {
    let lo = Infinity, hi = -Infinity;
    for (const x of v) { lo = Math.min(lo, x); hi = Math.max(hi, x); }
    const f = (x: number) => (log ? Math.log(x) : x), g = (x: number) => (log ? Math.exp(x) : x);
    const out: MatterFitLabBin[] = [];
    for (let b = 0; b < nb; b++) {
      const a = g(f(lo) + ((f(hi) - f(lo)) * b) / nb), c = g(f(lo) + ((f(hi) - f(lo)) * (b + 1)) / nb);
      out.push({ low: a, high: c, ...rows((k) => v[k] >= a && (b === nb - 1 ? v[k] <= c : v[k] < c)) });
    }
    return out;
  };
  return {
    species: s.species.name, material: o.material.name,
    overall: rows(() => true),
    byMomentum: binned(s.pFirstGeV, true),
    byPathLength: binned(s.pathM, false),
  };
}

function merit(fit: MatterFitMerit['fit'], s: MatterSample, keep: (k: number) => boolean, at: (k: number) => number[] | undefined): MatterFitMerit {
  const rel: number[] = [], pull: number[] = [];
  let tracks = 0, chi = 0;
  for (let k = 0; k < s.count; k++) {
    if (!keep(k)) continue;
    tracks++;
    const v = at(k);
    if (v === undefined || !Number.isFinite(v[0])) continue;
    rel.push(v[0] / s.pFirstGeV[k] - 1);
    pull.push((v[0] - s.pFirstGeV[k]) / v[1]);
    chi += v[2];
  }
  const med = median(rel);
  return Object.freeze({
    fit, tracks, fitted: rel.length, medianBias: med,
    resolution: 1.4826 * median(rel.map((r) => Math.abs(r - med))),
    pullMean: pull.reduce((a, x) => a + x, 0) / pull.length,
    pullRms: Math.sqrt(pull.reduce((a, x) => a + x * x, 0) / pull.length),
    chi2PerNdf: chi / rel.length,
  });
}

function median(v: number[]): number {
  if (v.length === 0) return NaN;
  const s = [...v].sort((a, b) => a - b);
  return s.length % 2 ? s[s.length >> 1] : 0.5 * (s[s.length / 2 - 1] + s[s.length / 2]);
}

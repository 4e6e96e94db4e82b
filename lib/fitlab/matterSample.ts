import { msg } from '../errors.js';
import { chamberMedium } from '../matter/chamberMedium.js';
import type { Material } from '../matter/materials.js';
import type { Particle } from '../particles.js';
import { chamber } from '../simulate/chamber.js';
import { seededRandom } from '../simulate/rng.js';
import { transportTrack } from '../simulate/transport.js';
import { TRANSPORT_DEFAULTS, type EnergyLossMode } from '../simulate/transportOptions.js';

export interface MatterSampleOptions {
  readonly tracks: number;
  /** One species for the whole sample (fit labs compare per species). */
  readonly species: Particle;
  /** Momentum at the start [GeV/c], drawn log-uniformly. */
  readonly momentumGeV: readonly [number, number];
  readonly material: Material;
  /** B_z [T]. */
  readonly fieldT: number;
  /** Hit every this much 3-D path [m]. */
  readonly spacingM: number;
  /** Gaussian error of x, y and z [m]. */
  readonly sigmaM: number;
  /** Hits kept per track at most (a track that stops earlier has fewer). */
  readonly maxHits: number;
  /** Dip tan λ drawn uniformly in this range; default [0, 0]. */
  readonly tanLambda?: readonly [number, number];
  /** 'mean' (default) or 'straggling'; 'off' makes curvature constant. */
  readonly energyLoss?: EnergyLossMode;
  /** Multiple scattering in the simulation; default true. */
  readonly scattering?: boolean;
  readonly seed: number;
}

/** Simulated tracks through a medium with their truth at the first hit. */
export interface MatterSample {
  readonly count: number;
  /** Track k is rows [offsets[k], offsets[k+1]) of the hit columns, in travel order. */
  readonly offsets: Int32Array;
  readonly x: Float64Array; readonly y: Float64Array; readonly z: Float64Array;
  readonly sigma: Float64Array;
  /** True momentum at the first and the last hit [GeV/c]. */
  readonly pFirstGeV: Float64Array;
  readonly pLastGeV: Float64Array;
  /** 3-D path length from the first to the last hit [m] (spacing × (hits − 1)). */
  readonly pathM: Float64Array;
  /** 1 where the particle ranged out inside the chamber after its last hit. */
  readonly stopped: Uint8Array;
  readonly species: Particle;
}

/**
 * Tracks for the fit lab of the fit with material: the chamber simulator (lib/simulate) with
 * mean CSDA loss (or Bohr straggling) and Highland scattering from `chamberMedium(material)`,
 * starting at the origin of a 4 m box in random bending-plane directions, a hit every
 * `spacingM` of path (the first one spacing after the start), Gaussian smearing. Tracks that
 * range out earlier keep the hits they made (stopping tracks); tracks with fewer than 4 hits
 * are dropped and not counted (the count says how many are kept).
 * @example matterSample({ tracks: 200, species: PROTON, momentumGeV: [0.3, 1], material: material('liquid-propane'), fieldT: 2, spacingM: 5e-3, sigmaM: 2e-4, maxHits: 60, seed: 1 })
 */
export function matterSample(o: MatterSampleOptions): MatterSample {
  if (!(Number.isInteger(o.tracks) && o.tracks > 0)) throw msg.badArgument('tracks', o.tracks, 'a positive whole number');
  if (!(o.momentumGeV[0] > 0 && o.momentumGeV[1] >= o.momentumGeV[0])) throw msg.badArgument('momentumGeV', o.momentumGeV, '[low, high] with 0 < low ≤ high');
  if (!(o.spacingM > 0 && o.sigmaM > 0 && o.maxHits >= 4)) throw msg.badArgument('spacingM/sigmaM/maxHits', [o.spacingM, o.sigmaM, o.maxHits], 'positive spacing and error, at least 4 hits');
  const box = chamber({ sizeM: [4, 4, 4], medium: chamberMedium(o.material), fieldT: [0, 0, o.fieldT] });
  const rng = seededRandom(o.seed, 'matterSample');
  const cap = o.tracks * o.maxHits;
  const x = new Float64Array(cap), y = new Float64Array(cap), z = new Float64Array(cap), ptrue = new Float64Array(cap);
  const offsets: number[] = [0];
  const pFirst: number[] = [], pLast: number[] = [], path: number[] = [], stopped: number[] = [];
  const [tlLo, tlHi] = o.tanLambda ?? [0, 0];
  const logRatio = Math.log(o.momentumGeV[1] / o.momentumGeV[0]);
  let row = 0;
  for (let k = 0; k < o.tracks; k++) {
    const p = o.momentumGeV[0] * Math.exp(logRatio * rng.uniform());
    const tl = tlLo + (tlHi - tlLo) * rng.uniform();
    const cosL = 1 / Math.sqrt(1 + tl * tl);
    const phi = 2 * Math.PI * rng.uniform();
    const first = row;
    const end = transportTrack(
      { species: o.species, xM: 0, yM: 0, zM: 0, ux: cosL * Math.cos(phi), uy: cosL * Math.sin(phi), uz: tl * cosL, momentumGeV: p }, box,
      { ...TRANSPORT_DEFAULTS, energyLoss: o.energyLoss ?? 'mean', scattering: o.scattering ?? true, maxStepM: Math.min(o.spacingM, 1e-3), rangeFraction: 0.02, maxPathM: (o.maxHits + 0.5) * o.spacingM, sampling: { kind: 'spacing', spacingM: o.spacingM } },
      rng, (hx, hy, hz, pm) => {
        if (row - first >= o.maxHits) return;
        x[row] = hx + o.sigmaM * rng.gaussian(); y[row] = hy + o.sigmaM * rng.gaussian(); z[row] = hz + o.sigmaM * rng.gaussian();
        ptrue[row] = pm;
        row++;
      });
    const nh = row - first;
    if (nh < 4) { row = first; continue; }
    pFirst.push(ptrue[first]); pLast.push(ptrue[row - 1]); path.push((nh - 1) * o.spacingM);
    stopped.push(end.reason === 'stopped' ? 1 : 0);
    offsets.push(row);
  }
  return {
    count: pFirst.length, offsets: Int32Array.from(offsets),
    x: x.slice(0, row), y: y.slice(0, row), z: z.slice(0, row), sigma: new Float64Array(row).fill(o.sigmaM),
    pFirstGeV: Float64Array.from(pFirst), pLastGeV: Float64Array.from(pLast), pathM: Float64Array.from(path), stopped: Uint8Array.from(stopped),
    species: o.species,
  };
}

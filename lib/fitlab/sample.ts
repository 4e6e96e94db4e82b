import { GEV_PER_TESLA_METRE } from '../constants.js';
import { msg } from '../errors.js';
import { MUON_MINUS, MUON_PLUS, type Particle } from '../particles.js';
import { chamber } from '../simulate/chamber.js';
import { VACUUM, type Medium } from '../matter/medium.js';
import { seededRandom } from '../simulate/rng.js';
import { transportTrack } from '../simulate/transport.js';
import { TRANSPORT_DEFAULTS } from '../simulate/transportOptions.js';

export interface FitLabSampleOptions {
  /** Number of tracks. */
  readonly tracks: number;
  /** Momentum range [GeV/c]; momenta are drawn log-uniformly in it. */
  readonly momentumGeV: readonly [number, number];
  /** Projected track lengths [m]; track k gets lengthsM[k mod n]. */
  readonly lengthsM: readonly number[];
  /** Equally spaced hits per track (the first one spacing after the start). */
  readonly hitsPerTrack: number;
  /** Gaussian error of each bending-plane coordinate [m]. */
  readonly sigmaM: number;
  /** Gaussian error of z [m]; default `sigmaM`. */
  readonly sigmaZM?: number;
  /** Dip tan λ drawn uniformly in this range; default [0, 0] (tracks in the bending plane). */
  readonly tanLambda?: readonly [number, number];
  /** Field along +z [T]. */
  readonly fieldT: number;
  /** Species drawn with equal probability; default μ⁻ and μ⁺. */
  readonly species?: readonly Particle[];
  /** Medium for multiple scattering; default vacuum. Energy loss is always off (κ stays the truth). */
  readonly medium?: Medium;
  readonly seed: number;
}

/** Tracks for the fit lab: hits (contiguous per track) and the true curvature of each. */
export interface FitLabSample {
  readonly count: number;
  /** Track k is rows [offsets[k], offsets[k+1]). */
  readonly offsets: Int32Array;
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly z: Float64Array;
  readonly sigma: Float64Array;
  readonly sigmaZ: Float64Array;
  /** True dip tan λ of each track. */
  readonly tanLambdaTrue: Float64Array;
  /** True signed curvature [1/m] in the lib/fit convention (κ > 0 counter-clockwise from +z). */
  readonly kappaTrue: Float64Array;
  /** True total momentum [GeV/c]; the transverse momentum is p/√(1 + tan²λ). */
  readonly momentumGeV: Float64Array;
  /** Projected (bending-plane) track length [m]. */
  readonly lengthM: Float64Array;
  readonly charge: Float64Array;
  readonly fieldT: number;
  readonly seed: number;
  /** Whether the hits include multiple scattering. */
  readonly scattering: boolean;
}

/**
 * Simulates a fit-lab sample with the chamber simulator: tracks from the origin in random
 * bending-plane directions with dip tan λ from `tanLambda` (default 0), |p| log-uniform, no energy
 * loss (so the curvature is the truth all along), optional multiple scattering from `medium`,
 * Gaussian smearing of x, y and z. Hits are equally spaced in projected length.
 * True curvature κ = −0.299792458·q·B/p_T (F = q v × B with exact c; common practice; the minus
 * sign because lib/fit counts counter-clockwise turning as positive and q > 0 turns clockwise
 * in B along +z).
 * @example fitLabSample({ tracks: 1000, momentumGeV: [0.2, 5], lengthsM: [0.5, 1], hitsPerTrack: 50, sigmaM: 3e-4, fieldT: 1.5, seed: 1 })
 */
export function fitLabSample(options: FitLabSampleOptions): FitLabSample {
  const { tracks, hitsPerTrack: nh, sigmaM, fieldT } = options;
  const [pLo, pHi] = options.momentumGeV;
  if (!(Number.isInteger(tracks) && tracks > 0)) throw msg.badArgument('tracks', tracks, 'a positive whole number');
  if (!(Number.isInteger(nh) && nh >= 3)) throw msg.badArgument('hitsPerTrack', nh, 'a whole number ≥ 3');
  if (!(pLo > 0 && pHi >= pLo)) throw msg.badArgument('momentumGeV', options.momentumGeV, '[low, high] with 0 < low ≤ high');
  if (options.lengthsM.length === 0 || !options.lengthsM.every((l) => l > 0)) throw msg.badArgument('lengthsM', options.lengthsM, 'one or more positive lengths in metres');
  if (!(sigmaM > 0)) throw msg.badArgument('sigmaM', sigmaM, 'a positive hit error in metres');
  if (!(Number.isFinite(fieldT) && fieldT !== 0)) throw msg.badArgument('fieldT', fieldT, 'a non-zero field in tesla');
  const species = options.species ?? [MUON_MINUS, MUON_PLUS];
  const medium = options.medium ?? VACUUM;
  const scattering = medium !== VACUUM;
  const maxLength = Math.max(...options.lengthsM);
  const box = chamber({ sizeM: [4 * maxLength, 4 * maxLength, 4 * maxLength], medium, fieldT: [0, 0, fieldT] });
  const rng = seededRandom(options.seed, 'fitLabSample');
  const sigmaZM = options.sigmaZM ?? sigmaM;
  if (!(sigmaZM > 0)) throw msg.badArgument('sigmaZM', sigmaZM, 'a positive hit error in metres');
  const [tlLo, tlHi] = options.tanLambda ?? [0, 0];
  const n = tracks * nh;
  const x = new Float64Array(n), y = new Float64Array(n), z = new Float64Array(n);
  const sigma = new Float64Array(n).fill(sigmaM), sigmaZ = new Float64Array(n).fill(sigmaZM);
  const tanLambdaTrue = new Float64Array(tracks);
  const offsets = new Int32Array(tracks + 1);
  const kappaTrue = new Float64Array(tracks), momentumGeV = new Float64Array(tracks);
  const lengthM = new Float64Array(tracks), charge = new Float64Array(tracks);
  const logRatio = Math.log(pHi / pLo);
  let row = 0;
  for (let k = 0; k < tracks; k++) {
    const sp = species[Math.min(species.length - 1, Math.floor(rng.uniform() * species.length))];
    const p = pLo * Math.exp(logRatio * rng.uniform());
    const length = options.lengthsM[k % options.lengthsM.length];
    const tl = tlLo + (tlHi - tlLo) * rng.uniform();
    const cosL = 1 / Math.sqrt(1 + tl * tl), sinL = tl * cosL;
    // Spacing along the path, so that the projected spacing is length/nh.
    const spacing = length / nh / cosL;
    const phi = 2 * Math.PI * rng.uniform();
    offsets[k] = row;
    const first = row;
    transportTrack({ species: sp, xM: 0, yM: 0, zM: 0, ux: cosL * Math.cos(phi), uy: cosL * Math.sin(phi), uz: sinL, momentumGeV: p }, box,
      { ...TRANSPORT_DEFAULTS, energyLoss: 'off', scattering, maxStepM: spacing, maxPathM: (nh + 0.5) * spacing, sampling: { kind: 'spacing', spacingM: spacing } },
      rng, (hx, hy, hz) => {
        if (row - first >= nh) return;
        x[row] = hx + sigmaM * rng.gaussian();
        y[row] = hy + sigmaM * rng.gaussian();
        z[row] = hz + sigmaZM * rng.gaussian();
        row++;
      });
    kappaTrue[k] = (-GEV_PER_TESLA_METRE * sp.charge * fieldT) / (p * cosL);
    tanLambdaTrue[k] = tl;
    momentumGeV[k] = p;
    lengthM[k] = length;
    charge[k] = sp.charge;
  }
  offsets[tracks] = row;
  return {
    count: tracks, offsets,
    x: row === n ? x : x.slice(0, row), y: row === n ? y : y.slice(0, row), z: row === n ? z : z.slice(0, row),
    sigma: row === n ? sigma : sigma.slice(0, row), sigmaZ: row === n ? sigmaZ : sigmaZ.slice(0, row),
    tanLambdaTrue, kappaTrue, momentumGeV, lengthM, charge, fieldT, seed: options.seed, scattering,
  };
}

import type { Particle } from '../particles.js';
import { insideChamber, type Chamber } from './chamber.js';
import { DECAY_AT_REST, NEUTRAL_DECAYS } from './decays.js';
import { michelMaxEnergyMeV, sampleMichelFraction } from './michel.js';
import type { SeededRandom } from './rng.js';
import { rotateAbout } from './scatteringKick.js';
import type { Primary } from './sources/primary.js';
import { twoBodyDecay } from './twoBodyDecay.js';
import { twoBodyMomentumMeV } from '../vertex/twoBodyMomentum.js';

/** A particle waiting to be transported, with the track id of the particle that made it (0: a primary). */
export interface Pending extends Primary {
  readonly parent: number;
}

/** Where a neutral particle's flight ended. */
export interface NeutralFlight {
  readonly end: 'exited' | 'decayed';
  readonly ex: number;
  readonly ey: number;
  readonly ez: number;
  readonly path: number;
}

/**
 * A neutral particle flies straight; it decays after an exponential flight length of mean
 * βγcτ when a charged decay mode is known and the decay point is inside the chamber.
 */
export function flyNeutral(item: Pending, id: number, c: Chamber, rng: SeededRandom, stack: Pending[]): NeutralFlight {
  const sp = item.species;
  const pMeV = item.momentumGeV * 1e3;
  const daughters = NEUTRAL_DECAYS[sp.name];
  const mean = (pMeV / sp.massMeV) * sp.ctauM;
  const length = Number.isFinite(mean) ? rng.exponential(mean) : Infinity;
  const exit = exitDistance(c, item);
  if (daughters === undefined || !(length < exit)) {
    const l = Math.min(length, exit);
    return { end: 'exited', ex: item.xM + l * item.ux, ey: item.yM + l * item.uy, ez: item.zM + l * item.uz, path: l };
  }
  const ex = item.xM + length * item.ux, ey = item.yM + length * item.uy, ez = item.zM + length * item.uz;
  const d = twoBodyDecay(sp.massMeV, pMeV * item.ux, pMeV * item.uy, pMeV * item.uz, daughters[0].massMeV, daughters[1].massMeV, rng);
  for (const [daughter, four] of [[daughters[0], d.first], [daughters[1], d.second]] as const) {
    const p = Math.hypot(four[1], four[2], four[3]);
    stack.push({ species: daughter, xM: ex, yM: ey, zM: ez, ux: four[1] / p, uy: four[2] / p, uz: four[3] / p, momentumGeV: p * 1e-3, process: 'decay', parent: id });
  }
  return { end: 'decayed', ex, ey, ez, path: length };
}

/** Distance along a straight line from the item's start to the chamber wall. */
function exitDistance(c: Chamber, item: Primary): number {
  if (!insideChamber(c, item.xM, item.yM, item.zM)) return 0;
  let t = Infinity;
  const axes: [number, number, number, number][] = [
    [item.xM, item.ux, c.xMinM, c.xMaxM], [item.yM, item.uy, c.yMinM, c.yMaxM], [item.zM, item.uz, c.zMinM, c.zMaxM],
  ];
  for (const [x, u, lo, hi] of axes) {
    if (u > 0) t = Math.min(t, (hi - x) / u);
    else if (u < 0) t = Math.min(t, (lo - x) / u);
  }
  return t;
}

/** The decay products of a particle that stopped (μ → e Michel spectrum, π → μ two-body), isotropic, pushed on the stack. */
export function decayAtRest(sp: Particle, x: number, y: number, z: number, id: number, rng: SeededRandom, stack: Pending[]): void {
  const mode = DECAY_AT_REST[sp.name];
  if (mode === undefined) return;
  let pMeV: number;
  if (mode.kind === 'two-body') {
    pMeV = twoBodyMomentumMeV(sp.massMeV, mode.daughter.massMeV, 0);
  } else {
    const e = Math.max(mode.daughter.massMeV, sampleMichelFraction(rng) * michelMaxEnergyMeV(sp.massMeV));
    pMeV = Math.sqrt(Math.max(0, e * e - mode.daughter.massMeV ** 2));
  }
  if (!(pMeV > 0)) return;
  const [ux, uy, uz] = rotateAbout(0, 0, 1, 2 * rng.uniform() - 1, 2 * Math.PI * rng.uniform());
  stack.push({ species: mode.daughter, xM: x, yM: y, zM: z, ux, uy, uz, momentumGeV: pMeV * 1e-3, process: 'decay-at-rest', parent: id });
}

import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64';
import type { RandomGenerator } from 'pure-rand/types/RandomGenerator';
import { msg } from '../errors.js';
import { recordSeed } from '../provenance.js';

/**
 * The one seeded random stream of a simulation run (ARCHITECTURE.md: no global RNG in lib/).
 * Uniforms come from pure-rand's xoroshiro128+ (53-bit floats); the non-uniform samplers on top
 * are textbook methods named at each method. One seed per run; the seed is recorded in the
 * provenance registry and in every output the simulator writes.
 */
export interface SeededRandom {
  /** The seed the stream was started with. */
  readonly seed: number;
  /** Uniform on [0, 1). */
  uniform(): number;
  /** Uniform on (0, 1]: safe under a logarithm. */
  uniformPositive(): number;
  /** Standard normal N(0, 1). */
  gaussian(): number;
  /** Exponential with the given mean. */
  exponential(mean: number): number;
  /** Poisson-distributed count with the given mean (mean ≤ ~30 intended). */
  poisson(mean: number): number;
  /** An independent stream derived from this one (jump of 2⁶⁴ draws). */
  fork(): SeededRandom;
}

const TWO_TO_MINUS_31 = 2 ** -31;

class Xoroshiro implements SeededRandom {
  readonly seed: number;
  private readonly rng: RandomGenerator & { jump?: () => void };
  // A typed array, not a number field: V8 boxes doubles stored in object fields, and one
  // allocation per Gaussian would keep the garbage collector busy in the transport loop.
  private readonly spare = new Float64Array(1);
  private hasSpare = false;

  constructor(seed: number, rng: RandomGenerator & { jump?: () => void }) {
    this.seed = seed;
    this.rng = rng;
  }

  uniform(): number {
    return uniformFloat64(this.rng);
  }

  uniformPositive(): number {
    return 1 - uniformFloat64(this.rng);
  }

  /**
   * Marsaglia polar method (Marsaglia & Bray, SIAM Review 6 (1964) 260); pairs are cached.
   * The two coordinates use 32 random bits each (half the generator calls of 53-bit uniforms):
   * s ≥ 2⁻⁶² then, so the largest reachable |value| is ≈ 9.3σ — far beyond any count a
   * simulation could resolve (P(|g| > 9σ) ≈ 2e-19).
   */
  gaussian(): number {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spare[0];
    }
    let u = 0, v = 0, s = 0;
    const rng = this.rng;
    do {
      // next() is uniform on [−2³¹, 2³¹): scaled to [−1, 1).
      u = rng.next() * TWO_TO_MINUS_31;
      v = rng.next() * TWO_TO_MINUS_31;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const f = Math.sqrt((-2 * Math.log(s)) / s);
    this.spare[0] = v * f;
    this.hasSpare = true;
    return u * f;
  }

  exponential(mean: number): number {
    return -mean * Math.log(this.uniformPositive());
  }

  /** Knuth's multiplication method (TAOCP vol. 2, §3.4.1); exact for small means. */
  poisson(mean: number): number {
    if (!(mean > 0)) return 0;
    const limit = Math.exp(-mean);
    let k = 0;
    let p = this.uniformPositive();
    while (p > limit) {
      k++;
      p *= this.uniformPositive();
    }
    return k;
  }

  fork(): SeededRandom {
    // The child takes the next 2⁶⁴-draw region; this stream moves on to the region after it, so
    // successive forks and the parent never overlap.
    this.rng.jump?.();
    const child = this.rng.clone() as RandomGenerator & { jump?: () => void };
    this.rng.jump?.();
    return new Xoroshiro(this.seed, child);
  }
}

/**
 * Starts the seeded stream of a run. The seed is a whole number 0…2³²−1 (xoroshiro128+ is seeded from 32 bits; it is written to outputs
 * as text and read back). Records the seed in the provenance registry under `label`.
 * @example const rng = seededRandom(7); rng.gaussian()
 */
export function seededRandom(seed: number, label = 'simulate'): SeededRandom {
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) throw msg.badArgument('seed', seed, 'a whole number from 0 to 4294967295, e.g. 7');
  recordSeed(seed, label);
  return new Xoroshiro(seed, xoroshiro128plus(seed) as RandomGenerator & { jump?: () => void });
}

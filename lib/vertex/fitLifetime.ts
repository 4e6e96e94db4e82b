import { minimiseOnInterval } from '../analysis/minimiseOnInterval.js';
import { msg } from '../errors.js';

/** Result of a lifetime fit. Proper decay lengths cτ [m]. */
export interface LifetimeFit {
  /** Maximum-likelihood cτ [m]. */
  readonly ctauM: number;
  /** Where −ln L has risen by ½ below and above the maximum (68.3 % interval) [m]. */
  readonly lowerM: number;
  readonly upperM: number;
  /** Symmetrised error (upper − lower)/2 [m]. */
  readonly sigmaM: number;
  /** Candidates used (those with a finite proper length inside their window). */
  readonly used: number;
  /** Candidates left out, counted. */
  readonly skipped: number;
  readonly negLogLikelihood: number;
  readonly status: 'ok' | 'too-few' | 'at-limit';
}

/**
 * Mean proper decay length cτ from proper decay lengths tᵢ = Lᵢ·m/pᵢ by an unbinned likelihood
 * with each candidate's acceptance window [aᵢ, bᵢ] (in proper length: the flight window of the
 * chamber and cuts, times m/pᵢ):
 *   ln L = Σ [ −ln λ − tᵢ/λ − ln(e^{−aᵢ/λ} − e^{−bᵢ/λ}) ]
 * (exponential decay truncated to what could be seen; common practice for lifetimes from
 * bubble-chamber V⁰s). The acceptance is taken as 1 inside the window and 0 outside; a
 * detection efficiency that varies inside it must be folded in separately. λ is found by
 * Brent's method in ln λ (`minimiseOnInterval`), the interval by bisection on Δ(−ln L) = ½.
 * @example fitLifetime(t, a, b).ctauM // ≈ 0.0268 for K⁰_S
 */
export function fitLifetime(properLengthM: ArrayLike<number>, windowMinM: ArrayLike<number>, windowMaxM: ArrayLike<number>): LifetimeFit {
  const n = properLengthM.length;
  if (windowMinM.length !== n || windowMaxM.length !== n) throw msg.badArgument('window lengths', [windowMinM.length, windowMaxM.length], `${n} (one window per candidate)`);
  const t: number[] = [], a: number[] = [], b: number[] = [];
  for (let i = 0; i < n; i++) {
    const ti = properLengthM[i], ai = windowMinM[i], bi = windowMaxM[i];
    if (Number.isFinite(ti) && ai >= 0 && bi > ai && ti >= ai && ti <= bi) { t.push(ti); a.push(ai); b.push(bi); }
  }
  const used = t.length, skipped = n - used;
  if (used < 2) return { ctauM: NaN, lowerM: NaN, upperM: NaN, sigmaM: NaN, used, skipped, negLogLikelihood: NaN, status: 'too-few' };
  const nll = (lambda: number): number => {
    let s = 0;
    for (let i = 0; i < used; i++) {
      // ln(e^{−a/λ} − e^{−b/λ}) = −a/λ + ln(1 − e^{−(b−a)/λ}), stable for long windows.
      s += Math.log(lambda) + (t[i] - a[i]) / lambda + Math.log(-Math.expm1(-(b[i] - a[i]) / lambda));
    }
    return s;
  };
  let tMean = 0;
  for (const v of t) tMean += v;
  tMean /= used;
  // Brent's method in ln λ over six decades around the mean.
  const best = Math.exp(minimiseOnInterval((u) => nll(Math.exp(u)), Math.log(tMean / 1e3), Math.log(tMean * 1e3), { toleranceX: 1e-9 }).x);
  const fBest = nll(best);
  const atLimit = Math.abs(Math.log(best / tMean)) > Math.log(1e3) - 1e-3;
  const cross = (from: number, to: number): number => {
    // Bisection in ln λ for nll(λ) = fBest + ½ between the optimum and `to`.
    let x0 = Math.log(from), x1 = Math.log(to);
    if (nll(to) - fBest < 0.5) return NaN;
    for (let it = 0; it < 50; it++) {
      const m = 0.5 * (x0 + x1);
      if (nll(Math.exp(m)) - fBest < 0.5) x0 = m; else x1 = m;
    }
    return Math.exp(0.5 * (x0 + x1));
  };
  const lowerM = cross(best, best / 1e3), upperM = cross(best, best * 1e3);
  return { ctauM: best, lowerM, upperM, sigmaM: 0.5 * (upperM - lowerM), used, skipped, negLogLikelihood: fBest, status: atLimit ? 'at-limit' : 'ok' };
}

/**
 * Flight window [m] of a neutral particle leaving `primaryM` along the unit `direction` in a box
 * chamber [xMin, xMax] × [yMin, yMax] × [zMin, zMax]: from `minFlightM` (the finder's flight cut)
 * to the wall less `wallMarginM` (its daughters need room for enough hits). Returns
 * [min, max]; max < min when nothing can be seen along that direction.
 * @example decayWindowInBox([-0.55, 0, 0], [1, 0, 0], [[-0.6, 0.6], [-0.4, 0.4], [-0.25, 0.25]], 0.02, 0.2) // [0.02, 0.95]
 */
export function decayWindowInBox(
  primaryM: ArrayLike<number>, direction: ArrayLike<number>, box: readonly (readonly [number, number])[], minFlightM: number, wallMarginM: number,
): [number, number] {
  const norm = Math.hypot(direction[0], direction[1], direction[2]);
  let exit = Infinity;
  for (let k = 0; k < 3; k++) {
    const u = direction[k] / norm;
    if (u > 0) exit = Math.min(exit, (box[k][1] - primaryM[k]) / u);
    else if (u < 0) exit = Math.min(exit, (box[k][0] - primaryM[k]) / u);
  }
  return [minFlightM, exit - wallMarginM];
}

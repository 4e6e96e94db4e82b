/** The minimum of a function of one variable found on an interval. */
export interface IntervalMinimum {
  /** Where the minimum lies, within the tolerance asked for. */
  readonly x: number;
  /** The function's value there. */
  readonly value: number;
  /** How many times the function was called. */
  readonly evaluations: number;
}

/** Settings of `minimiseOnInterval`. */
export interface MinimiseOnIntervalOptions {
  /** Absolute tolerance on x; the relative part √ε·|x| is always added. */
  readonly toleranceX?: number;
  /** Stop after this many evaluations even if the tolerance is not reached. */
  readonly maxEvaluations?: number;
}

/** Defaults of `minimiseOnInterval`. */
export const MINIMISE_ON_INTERVAL_DEFAULTS: Required<MinimiseOnIntervalOptions> = Object.freeze({ toleranceX: 1e-10, maxEvaluations: 200 });

const SQRT_EPS = Math.sqrt(Number.EPSILON);
const GOLDEN = 0.5 * (3 - Math.sqrt(5));

/**
 * Minimum of `f` on [a, b] by Brent's method: parabolic interpolation through the three best
 * points, with a golden-section step whenever the parabola is unsafe (R. P. Brent, "Algorithms
 * for Minimization without Derivatives", Prentice-Hall 1973, ch. 5, procedure `localmin`; the
 * same algorithm as Forsythe, Malcolm & Moler's `fmin`). For a smooth function it needs a
 * handful of evaluations where golden section alone needs one per factor 0.618 of the interval;
 * it never needs many more. A local minimum only: for a function with several, bracket first
 * (e.g. by a coarse scan). The answer is within `toleranceX + √ε·|x|` of a local minimum (or on
 * an end of the interval if the function falls towards it); units are those of `a`, `b` and f.
 * @example minimiseOnInterval((x) => (x - 2) ** 2, 0, 5).x // ≈ 2
 */
export function minimiseOnInterval(f: (x: number) => number, a: number, b: number, options: MinimiseOnIntervalOptions = {}): IntervalMinimum {
  const { toleranceX, maxEvaluations } = { ...MINIMISE_ON_INTERVAL_DEFAULTS, ...options };
  if (a > b) [a, b] = [b, a];
  let x = a + GOLDEN * (b - a), w = x, v = x;
  let fx = f(x), fw = fx, fv = fx;
  let d = 0, e = 0, evaluations = 1;
  while (evaluations < maxEvaluations) {
    const m = 0.5 * (a + b);
    const tol = SQRT_EPS * Math.abs(x) + toleranceX / 3;
    const tol2 = 2 * tol;
    if (Math.abs(x - m) <= tol2 - 0.5 * (b - a)) break;
    let golden = true;
    if (Math.abs(e) > tol) {
      // The parabola through (v, fv), (w, fw), (x, fx); its vertex is x + p/q.
      const r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p; else q = -q;
      const eOld = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * eOld) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        // Never evaluate closer than tol to an end of the interval.
        if (u - a < tol2 || b - u < tol2) d = x < m ? tol : -tol;
        golden = false;
      }
    }
    if (golden) {
      e = (x < m ? b : a) - x;
      d = GOLDEN * e;
    }
    // Never step by less than tol: two evaluations that close cannot tell the function apart.
    const u = Math.abs(d) >= tol ? x + d : x + (d > 0 ? tol : -tol);
    const fu = f(u);
    evaluations++;
    if (fu <= fx) {
      if (u < x) b = x; else a = x;
      v = w; fv = fw; w = x; fw = fx; x = u; fx = fu;
    } else {
      if (u < x) a = u; else b = u;
      if (fu <= fw || w === x) { v = w; fv = fw; w = u; fw = fu; }
      else if (fu <= fv || v === x || v === w) { v = u; fv = fu; }
    }
  }
  return Object.freeze({ x, value: fx, evaluations });
}

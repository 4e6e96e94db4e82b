/** Cube root of the double-precision machine epsilon: the relative step that balances truncation and rounding in a central difference. */
export const CENTRAL_STEP = Math.cbrt(2.220446049250313e-16);

/** Settings for `numericalJacobian`. */
export interface JacobianSettings {
  /** Smallest magnitude each parameter's step is taken relative to (matters only near θ_j = 0); default 1e-6. */
  readonly scale?: ArrayLike<number>;
  readonly lower?: ArrayLike<number>;
  readonly upper?: ArrayLike<number>;
  /**
   * Richardson extrapolation of two central differences (steps h and h/2: truncation O(h⁴)
   * instead of O(h²), 4p evaluations) — for a final covariance, whose accuracy is the derivative's.
   */
  readonly richardson?: boolean;
  /**
   * Forward differences from f(θ) = `base` (p evaluations instead of 2p, relative accuracy
   * ~1e-8 with a step of √ε·|θ_j|): enough to steer a minimiser, not for final errors.
   */
  readonly base?: Float64Array;
}

/** Scratch for `numericalJacobian`: four vectors of the function's output length. */
export interface JacobianScratch {
  readonly plus: Float64Array;
  readonly minus: Float64Array;
  readonly coarse: Float64Array;
  readonly fine: Float64Array;
}

/** Allocates scratch for a function with `outputs` values. */
export function jacobianScratch(outputs: number): JacobianScratch {
  return { plus: new Float64Array(outputs), minus: new Float64Array(outputs), coarse: new Float64Array(outputs), fine: new Float64Array(outputs) };
}

/**
 * Central-difference Jacobian J[i][j] = ∂f_i/∂θ_j of a vector function `f(θ, out)` with
 * `outputs` values, written row-major into `out` (outputs × θ.length). The step for θ_j is
 * h = ε^⅓ · max(|θ_j|, scale_j), which balances truncation and rounding (J. Nocedal &
 * S. J. Wright, Numerical Optimization, 2nd ed., §8.1): relative accuracy ~(h/ℓ)² with ℓ the
 * length over which f curves; with `richardson`, the differences at h and h/2 are extrapolated
 * (L. F. Richardson, Phil. Trans. R. Soc. A 226 (1927) 299), leaving rounding, ~1e-10. Next to a bound the difference is
 * one-sided, inside the allowed region. θ is restored before returning. Costs 2·θ.length
 * evaluations of f (4· with Richardson). Returns false if f gave a non-finite value.
 * @example numericalJacobian((t, o) => { o[0] = t[0] * t[1]; }, Float64Array.of(2, 3), 1, out, jacobianScratch(1)) // out ≈ [3, 2]
 */
export function numericalJacobian(
  f: (theta: Float64Array, out: Float64Array) => void,
  theta: Float64Array,
  outputs: number,
  out: Float64Array,
  scratch: JacobianScratch,
  settings: JacobianSettings = {},
): boolean {
  const p = theta.length;
  const { plus, minus, coarse, fine } = scratch;
  let finite = true;
  if (settings.base) return forwardJacobian(f, theta, outputs, out, scratch, settings, settings.base);
  for (let j = 0; j < p; j++) {
    const t = theta[j];
    const h = CENTRAL_STEP * Math.max(Math.abs(t), settings.scale ? Math.abs(settings.scale[j]) : 1e-6, 1e-300);
    const lo = settings.lower ? settings.lower[j] : -Infinity;
    const hi = settings.upper ? settings.upper[j] : Infinity;
    // Offsets from t; one-sided inside the bounds when a side would leave them.
    let up = h, down = -h;
    if (t + h > hi) up = 0; else if (t - h < lo) down = 0;
    const difference = (u: number, dn: number, into: Float64Array): void => {
      theta[j] = t + u; f(theta, plus);
      theta[j] = t + dn; f(theta, minus);
      theta[j] = t;
      const width = (t + u) - (t + dn);
      for (let i = 0; i < outputs; i++) into[i] = (plus[i] - minus[i]) / width;
    };
    difference(up, down, coarse);
    const extrapolate = settings.richardson === true && up !== 0 && down !== 0;
    if (extrapolate) difference(up / 2, down / 2, fine);
    for (let i = 0; i < outputs; i++) {
      const dv = extrapolate ? (4 * fine[i] - coarse[i]) / 3 : coarse[i];
      if (!Number.isFinite(dv)) finite = false;
      out[i * p + j] = dv;
    }
  }
  return finite;
}

const FORWARD_STEP = Math.sqrt(2.220446049250313e-16);

function forwardJacobian(
  f: (theta: Float64Array, out: Float64Array) => void,
  theta: Float64Array,
  outputs: number,
  out: Float64Array,
  scratch: JacobianScratch,
  settings: JacobianSettings,
  base: Float64Array,
): boolean {
  const p = theta.length;
  let finite = true;
  for (let j = 0; j < p; j++) {
    const t = theta[j];
    let h = FORWARD_STEP * Math.max(Math.abs(t), settings.scale ? Math.abs(settings.scale[j]) : 1e-6, 1e-300);
    if (settings.upper && t + h > settings.upper[j]) h = -h; // step inwards at an upper bound
    theta[j] = t + h;
    f(theta, scratch.plus);
    theta[j] = t;
    const width = (t + h) - t;
    for (let i = 0; i < outputs; i++) {
      const dv = (scratch.plus[i] - base[i]) / width;
      if (!Number.isFinite(dv)) finite = false;
      out[i * p + j] = dv;
    }
  }
  return finite;
}

import { msg } from '../errors.js';
import { jacobianScratch, numericalJacobian } from './numericalJacobian.js';

/** Values of a derived quantity (or several) with their propagated covariance. */
export interface PropagatedErrors {
  readonly values: readonly number[];
  readonly errors: readonly number[];
  readonly covariance: readonly (readonly number[])[];
  /** The Jacobian ∂fᵢ/∂θⱼ used (rows: outputs). */
  readonly jacobian: readonly (readonly number[])[];
}

/**
 * First-order (linear) error propagation through a user function: C_f = J C Jᵀ, with
 * J = ∂f/∂θ by central differences at the given values (`numericalJacobian`; relative accuracy
 * ~1e-10 for a smooth f). `f` returns one number or an array of them; `covariance` is the
 * input covariance as rows (or pass `errors` for uncorrelated inputs). Valid while f is close
 * to linear over ±1σ; for strongly non-linear f, propagate samples instead.
 * (BIPM et al., Guide to the Expression of Uncertainty in Measurement, JCGM 100:2008, §5.2.)
 * @example propagateErrors((p) => p[0] / p[1], [10, 2], { errors: [0.1, 0.05] }).errors[0] // ≈ 0.1346
 */
export function propagateErrors(
  f: (p: Float64Array) => number | ArrayLike<number>,
  values: ArrayLike<number>,
  input: { readonly covariance: readonly (readonly number[])[] } | { readonly errors: ArrayLike<number> },
): PropagatedErrors {
  const p = values.length;
  const cov = new Float64Array(p * p);
  if ('errors' in input) {
    if (input.errors.length !== p) throw msg.badArgument('errors', `${input.errors.length} errors`, `one error per value (${p})`);
    for (let j = 0; j < p; j++) cov[j * p + j] = input.errors[j] * input.errors[j];
  } else {
    if (input.covariance.length !== p || input.covariance.some((row) => row.length !== p)) throw msg.badArgument('covariance', `${input.covariance.length} rows`, `a ${p}×${p} matrix`);
    input.covariance.forEach((row, j) => row.forEach((v, k) => { cov[j * p + k] = v; }));
  }
  const theta = Float64Array.from(values);
  const first = f(theta);
  const q = typeof first === 'number' ? 1 : first.length;
  const y = typeof first === 'number' ? [first] : Array.from(first);
  const jac = new Float64Array(q * p);
  numericalJacobian((t, out) => { const v = f(t); if (typeof v === 'number') out[0] = v; else for (let i = 0; i < q; i++) out[i] = v[i]; }, theta, q, jac, jacobianScratch(q), { richardson: true });
  const out = Array.from({ length: q }, () => new Array<number>(q).fill(0));
  for (let a = 0; a < q; a++) for (let b = 0; b < q; b++) {
    let s = 0;
    for (let j = 0; j < p; j++) for (let k = 0; k < p; k++) s += jac[a * p + j] * cov[j * p + k] * jac[b * p + k];
    out[a][b] = s;
  }
  return Object.freeze({
    values: Object.freeze(y),
    errors: Object.freeze(out.map((row, a) => Math.sqrt(row[a]))),
    covariance: Object.freeze(out.map((row) => Object.freeze(row))),
    jacobian: Object.freeze(Array.from({ length: q }, (_, a) => Object.freeze(Array.from(jac.subarray(a * p, (a + 1) * p))))),
  });
}

import { chi2Survival } from './chi2Survival.js';
import type { MinimiserStatus } from './levenbergMarquardt.js';

/** Which objective a fit minimised. */
export type ModelFitMethod = 'least-squares' | 'poisson' | 'neyman' | 'pearson' | 'unbinned' | 'unbinned-extended';

/**
 * How a fit ended: `ok` (converged, errors from a positive-definite curvature); `not-converged`
 * (iteration limit; values are the last point); `singular` (converged, but some parameter is
 * not determined by the data: errors NaN); `not-finite` (the model gave NaN or ±Infinity at the
 * start).
 */
export type ModelFitStatus = 'ok' | 'not-converged' | 'singular' | 'not-finite';

/** One fitted parameter. */
export interface FittedParameter {
  readonly value: number;
  /** 1σ error (0 for a fixed parameter, NaN when the fit is singular). */
  readonly error: number;
  /** Likelihood-ratio (Δχ² = 1) distances below and above the value, when asked for. */
  readonly lowerError?: number;
  readonly upperError?: number;
  readonly fixed: boolean;
  readonly atBound: boolean;
}

/** The result of `fitModel`, `fitHistogram` or `fitUnbinned`: plain, readonly data. */
export interface FitResult {
  readonly method: ModelFitMethod;
  readonly names: readonly string[];
  readonly values: readonly number[];
  readonly errors: readonly number[];
  /** Covariance matrix (rows and columns in `names` order; zero for fixed parameters). */
  readonly covariance: readonly (readonly number[])[];
  readonly correlation: readonly (readonly number[])[];
  /** Goodness of fit: Σ((y − f)/σ)² for least squares (the residual sum of squares without σ), the Baker–Cousins χ² for `poisson`, Neyman's or Pearson's χ²; NaN for unbinned fits. */
  readonly chi2: number;
  /** Degrees of freedom: points or bins used minus free parameters. */
  readonly ndf: number;
  /** P(χ²_ndf ≥ chi2); NaN when chi2 has no χ² distribution (no σ given, unbinned). */
  readonly pValue: number;
  readonly status: ModelFitStatus;
  readonly iterations: number;
  /** The minimised objective in χ² units (χ², or −2 ln L up to a constant for unbinned fits). */
  readonly minimum: number;
  /** Factor the errors were multiplied by (√(χ²/ndf) when scaled by the residual variance, else 1). */
  readonly errorScale: number;
  /** Values or bins left out (outside the fit range, non-finite), counted. */
  readonly excluded: number;
  readonly parameters: Readonly<Record<string, FittedParameter>>;
}

/** What the fitters hand to `buildFitResult`. */
export interface FitResultParts {
  readonly method: ModelFitMethod;
  readonly names: readonly string[];
  readonly full: Float64Array;
  readonly free: Int32Array;
  /** Covariance of the free parameters (free × free), before error scaling; undefined if singular. */
  readonly covariance: Float64Array | undefined;
  readonly chi2: number;
  readonly ndf: number;
  readonly chi2HasDistribution: boolean;
  readonly minimiser: MinimiserStatus;
  readonly iterations: number;
  readonly minimum: number;
  readonly atBound: Uint8Array;
  readonly errorScale?: number;
  readonly excluded?: number;
  /** Asymmetric errors of the free parameters (distances, ≥ 0). */
  readonly asymmetric?: { readonly lower: Float64Array; readonly upper: Float64Array };
}

/** Assembles the readonly FitResult. */
export function buildFitResult(parts: FitResultParts): FitResult {
  const n = parts.names.length, p = parts.free.length;
  const scale = parts.errorScale ?? 1;
  const position = new Int32Array(n).fill(-1);
  parts.free.forEach((i, j) => { position[i] = j; });
  const cov = (a: number, b: number): number => {
    const ja = position[a], jb = position[b];
    if (ja < 0 || jb < 0) return 0;
    return parts.covariance ? parts.covariance[ja * p + jb] * scale * scale : NaN;
  };
  const covariance = Array.from({ length: n }, (_, a) => Object.freeze(Array.from({ length: n }, (_, b) => cov(a, b))));
  const errors = Array.from({ length: n }, (_, a) => Math.sqrt(covariance[a][a]));
  const correlation = Array.from({ length: n }, (_, a) => Object.freeze(Array.from({ length: n }, (_, b) => {
    if (a === b) return position[a] < 0 ? 0 : 1;
    const d = errors[a] * errors[b];
    return d > 0 ? covariance[a][b] / d : 0;
  })));
  let status: ModelFitStatus = parts.minimiser === 'not-finite' ? 'not-finite' : parts.minimiser === 'max-iterations' ? 'not-converged' : 'ok';
  if (status === 'ok' && parts.covariance === undefined) status = 'singular';
  const values = Array.from(parts.full);
  const parameters: Record<string, FittedParameter> = {};
  parts.names.forEach((name, a) => {
    const j = position[a];
    parameters[name] = Object.freeze({
      value: values[a],
      error: errors[a],
      ...(parts.asymmetric && j >= 0 ? { lowerError: parts.asymmetric.lower[j] * scale, upperError: parts.asymmetric.upper[j] * scale } : {}),
      fixed: j < 0,
      atBound: j >= 0 && parts.atBound[j] === 1,
    });
  });
  return Object.freeze({
    method: parts.method,
    names: Object.freeze([...parts.names]),
    values: Object.freeze(values),
    errors: Object.freeze(errors),
    covariance: Object.freeze(covariance),
    correlation: Object.freeze(correlation),
    chi2: parts.chi2,
    ndf: parts.ndf,
    pValue: parts.chi2HasDistribution && parts.ndf > 0 ? chi2Survival(parts.chi2, parts.ndf) : NaN,
    status,
    iterations: parts.iterations,
    minimum: parts.minimum,
    errorScale: scale,
    excluded: parts.excluded ?? 0,
    parameters: Object.freeze(parameters),
  });
}

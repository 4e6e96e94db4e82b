import { msg } from '../errors.js';
import { buildFitResult, type FitResult } from './fitResult.js';
import { householderLeastSquares } from './householderLeastSquares.js';

/** A linear model y = β₀ + Σ βⱼ xⱼ: the predictor columns, the response, optional 1σ errors on y. */
export interface LinearFitData {
  readonly columns: readonly ArrayLike<number>[];
  readonly y: ArrayLike<number>;
  readonly sigma?: ArrayLike<number> | number;
}

export interface FitLinearOptions {
  /** Include the constant β₀ (default true); false fits through the origin. */
  readonly intercept?: boolean;
  /** Names of the coefficients (default 'intercept', 'b1', 'b2', …). */
  readonly names?: readonly string[];
  /** Scale the errors by √(χ²/ndf): default true without sigma (as NIST certifies), false with it. */
  readonly scaleErrors?: boolean;
}

/**
 * Linear least squares y = β₀ + β₁x₁ + … + βₖxₖ (weighted by 1/σ² when `sigma` is given), solved
 * exactly — no iteration — by Householder QR (`householderLeastSquares`): the NIST StRD linear
 * problems Norris and Longley are reproduced to ≥ 9 significant digits (test/analysis/
 * nistLinear.test.ts). Polynomials are linear models too: columns [x, x²]. Rows with a
 * non-finite value are left out and counted (`excluded`).
 * @example fitLinear({ columns: [x], y }) // straight line; values [intercept, slope]
 */
export function fitLinear(data: LinearFitData, options: FitLinearOptions = {}): FitResult {
  const intercept = options.intercept ?? true;
  const n = data.y.length;
  data.columns.forEach((c, j) => { if (c.length !== n) throw msg.badArgument(`columns[${j}]`, `${c.length} values`, `one value per y (${n})`); });
  const p = data.columns.length + (intercept ? 1 : 0);
  if (p === 0) throw msg.badArgument('columns', [], 'at least one predictor column, or intercept: true');
  const names = options.names ?? [...(intercept ? ['intercept'] : []), ...data.columns.map((_, j) => `b${j + 1}`)];
  if (names.length !== p) throw msg.badArgument('names', names, `${p} names`);
  const sigma = typeof data.sigma === 'number' ? new Float64Array(n).fill(data.sigma) : data.sigma;
  if (sigma && sigma.length !== n) throw msg.badArgument('sigma', `${sigma.length} values`, `one error per y (${n})`);
  const rows: number[] = [];
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(data.y[i]) || data.columns.some((c) => !Number.isFinite(c[i]))) continue;
    if (sigma && !(sigma[i] > 0 && Number.isFinite(sigma[i]))) throw msg.badArgument(`sigma[${i}]`, sigma[i], 'a finite error > 0 for every point');
    rows.push(i);
  }
  const m = rows.length;
  const a = new Float64Array(m * p), b = new Float64Array(m);
  rows.forEach((i, r) => {
    const w = sigma ? 1 / sigma[i] : 1;
    let j = 0;
    if (intercept) a[r * p + j++] = w;
    for (const c of data.columns) a[r * p + j++] = c[i] * w;
    b[r] = data.y[i] * w;
  });
  const solution = householderLeastSquares(a, m, p, b);
  const ndf = m - p;
  const scaled = options.scaleErrors ?? !sigma;
  const errorScale = scaled ? (ndf > 0 ? Math.sqrt(solution.residualSumOfSquares / ndf) : NaN) : 1;
  return buildFitResult({
    method: 'least-squares', names, full: solution.coefficients, free: Int32Array.from({ length: p }, (_, j) => j),
    covariance: solution.inverseNormal, chi2: solution.residualSumOfSquares, ndf, chi2HasDistribution: sigma !== undefined,
    minimiser: 'converged', iterations: 0, minimum: solution.residualSumOfSquares, atBound: new Uint8Array(p),
    errorScale, excluded: n - m,
  });
}

import { msg } from '../errors.js';
import { warn } from '../warnings.js';
import { binIntegrator } from './binIntegral.js';
import { hessianCovariance, minimiseObjective, type FitObjective } from './fitObjective.js';
import { resolveParameters, type ParameterOptions, type ParameterStart } from './fitParameters.js';
import { buildFitResult, type FitResult } from './fitResult.js';
import type { Histogram } from './histogram.js';
import { profileErrors } from './profileErrors.js';
import type { Model } from './shapes/shape.js';

/** The binned objectives: Poisson likelihood, or Neyman's or Pearson's χ². */
export type BinnedMethod = 'poisson' | 'neyman' | 'pearson';

export interface FitHistogramOptions extends ParameterOptions {
  /** Default 'poisson'. */
  readonly method?: BinnedMethod;
  /** Fit only the bins lying wholly inside [low, high] (x's unit); default all bins. */
  readonly range?: readonly [number, number];
  /** Also scan for ΔF = 1 on each side of every free parameter (asymmetric errors). */
  readonly asymmetricErrors?: boolean;
  readonly maxIterations?: number;
}

/** Fewer entries than this in a bin make a χ² fit biased (common practice). */
const SPARSE_COUNT = 5;

/**
 * Fits `model` — a density in entries per unit x (a Shape such as `gaussian()`, whose `area`
 * is then the number of entries, or a function) — to the bins of `h`. The expected content of
 * a bin is the model's integral over it (exact for shapes that have one, else 3-point
 * Gauss–Legendre), so wide and variable bins are treated correctly.
 *
 * `method`:
 * - `poisson` (default): binned maximum likelihood; the minimised quantity is the Baker–Cousins
 *   saturated-model χ²_λ = 2 Σ [μ − n + n ln(n/μ)] (S. Baker & R. D. Cousins, NIM 221 (1984) 437),
 *   which is also the goodness of fit and makes empty bins count correctly. It is χ²(ndf)
 *   asymptotically; bins of few expected entries raise its mean (by ~0.13 per bin at μ = 2), so
 *   the p-value of a spectrum with many sparse bins is approximate (test/analysis/toyPulls.test.ts).
 *   Errors from the curvature of χ²_λ (observed information), unbiased on toy spectra.
 * - `neyman`: Σ (n − μ)²/n, with σ² = max(n, 1) for counts (σ² = Σw² for weighted bins).
 * - `pearson`: Σ (n − μ)²/μ.
 * Both χ² methods are biased when bins hold few entries: a SPARSE_BINS warning names how many
 * bins have fewer than 5; their errors are the linearised covariance.
 *
 * Count histograms (every entry of the same weight) are fitted as counts. Weighted bins use
 * scaled Poisson counts n·(Σw/Σw²) (G. Bohm & G. Zech, NIM A 748 (2014) 1) with an
 * APPROXIMATION warning. ndf = bins fitted − free parameters; `excluded` counts the bins left
 * outside `range`.
 * @example fitHistogram(h, sumShapes({ peak: gaussian(), background: exponential() }), { 'peak.area': 500, 'peak.mean': 480, 'peak.sigma': 10, 'background.norm': 5, 'background.slope': -0.01 })
 */
export function fitHistogram(h: Histogram, model: Model, start: ParameterStart, options: FitHistogramOptions = {}): FitResult {
  const method = options.method ?? 'poisson';
  if (method !== 'poisson' && method !== 'neyman' && method !== 'pearson') throw msg.badArgument('method', method, "'poisson', 'neyman' or 'pearson'");
  const pars = resolveParameters(model, start, options);
  const [lo, hi] = options.range ?? [h.edges[0], h.edges[h.bins]];
  if (!(lo < hi)) throw msg.badArgument('range', options.range, '[low, high] with low < high');
  const bins: number[] = [];
  for (let k = 0; k < h.bins; k++) if (h.edges[k] >= lo && h.edges[k + 1] <= hi) bins.push(k);
  if (bins.length === 0) throw msg.badArgument('range', options.range, `a range containing at least one whole bin of the histogram ([${h.edges[0]}, ${h.edges[h.bins]}])`);
  const m = bins.length;
  // Per fitted bin: the count-scale s (entries = content / s) and the observed count n.
  const scale = new Float64Array(m), n = new Float64Array(m), a = new Float64Array(m), b = new Float64Array(m);
  const sumW2 = h.sumW2;
  let totalW = 0, totalW2 = 0;
  for (const k of bins) { totalW += h.sumW[k]; totalW2 += sumW2[k]; }
  const meanScale = h.isCounts ? Math.abs(h.unitWeight) : totalW > 0 ? totalW2 / totalW : 1;
  bins.forEach((k, q) => {
    scale[q] = h.isCounts ? meanScale : h.sumW[k] > 0 && sumW2[k] > 0 ? sumW2[k] / h.sumW[k] : meanScale;
    n[q] = h.sumW[k] / scale[q];
    a[q] = h.edges[k]; b[q] = h.edges[k + 1];
  });
  if (!h.isCounts) warn('APPROXIMATION', `fitHistogram: weighted bins are fitted as scaled Poisson counts (content × Σw/Σw²); errors are approximate for bins with few entries`, 'fitHistogram');
  const integral = binIntegrator(model);
  const mu = new Float64Array(m);
  const expected = (p: Float64Array) => { for (let q = 0; q < m; q++) mu[q] = integral(a[q], b[q], p) / scale[q]; };
  const objective: FitObjective = {
    kind: 'residuals',
    count: m,
    residuals(p: Float64Array, out: Float64Array) {
      expected(p);
      for (let q = 0; q < m; q++) out[q] = binResidual(method, n[q], mu[q]);
    },
  };
  // χ² units: stopping once a step gains < 1e-9 places the minimum within ~3e-5 σ; the
  // Poisson errors come from the Hessian, so the least-squares polish is not needed.
  const minimum = minimiseObjective(objective, pars.start, pars.free, pars.lower, pars.upper, { maxIterations: options.maxIterations, absoluteTolerance: 1e-9, precise: method !== 'poisson' });
  if (method !== 'poisson') {
    expected(minimum.full);
    let sparse = 0;
    for (let q = 0; q < m; q++) if ((method === 'neyman' ? n[q] : mu[q]) < SPARSE_COUNT) sparse++;
    if (sparse > 0) warn('SPARSE_BINS', `fitHistogram (${method} χ²): ${sparse} of ${m} bins have fewer than ${SPARSE_COUNT} ${method === 'neyman' ? 'entries' : 'expected entries'}, where a χ² fit is biased; method 'poisson' is not`, 'fitHistogram');
  }
  const covariance = method === 'poisson' ? hessianCovariance(objective, minimum, pars.free) : minimum.roughCovariance;
  const asymmetric = options.asymmetricErrors && covariance && minimum.status === 'converged'
    ? profileErrors(objective, minimum, pars.free, pars.lower, pars.upper, covariance)
    : undefined;
  return buildFitResult({
    method, names: pars.names, full: minimum.full, free: pars.free, covariance,
    chi2: minimum.value, ndf: m - pars.free.length, chi2HasDistribution: true, minimiser: minimum.status,
    iterations: minimum.iterations, minimum: minimum.value, atBound: minimum.atBound,
    excluded: h.bins - m, asymmetric,
  });
}

/** Smallest expected count used in a logarithm (a model at or below zero where entries were seen). */
const TINY = 1e-300;

/**
 * The signed residual of one bin whose square is its contribution to the objective: for
 * `poisson` the deviance residual sign(μ − n)·√(2[μ − n + n ln(n/μ)]), evaluated without
 * cancellation near μ = n.
 */
export function binResidual(method: BinnedMethod, n: number, mu: number): number {
  if (method === 'neyman') return (n - mu) / Math.sqrt(Math.max(n, 1));
  if (method === 'pearson') return mu > 0 ? (n - mu) / Math.sqrt(mu) : n > 0 ? 1e150 : 0;
  if (n <= 0) return mu > 0 ? Math.sqrt(2 * mu) : 0;
  const m = Math.max(mu, TINY);
  const t = (m - n) / n; // μ = n(1 + t); μ − n + n ln(n/μ) = n [t − ln(1 + t)]
  const part = Math.abs(t) < 0.1 ? n * tMinusLog1p(t) : n * (t - Math.log1p(t));
  return (m >= n ? 1 : -1) * Math.sqrt(2 * Math.max(part, 0));
}

/** t − ln(1 + t) by its series t²/2 − t³/3 + t⁴/4 − … for |t| < 0.1 (relative accuracy ~1e-16 with 20 terms). */
function tMinusLog1p(t: number): number {
  let term = t * t, s = 0;
  for (let k = 2; k <= 22; k++) { s += (k % 2 === 0 ? 1 : -1) * term / k; term *= t; }
  return s;
}

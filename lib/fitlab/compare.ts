import { GEV_PER_TESLA_METRE } from '../constants.js';
import { msg } from '../errors.js';
import { chi2Survival } from '../analysis/chi2Survival.js';
import { FIT_STATUS } from '../fit/circleFit.js';
import { fitHelices } from '../fit/fitHelices.js';
import type { FitMethod } from '../fit/fitMethod.js';
import { fitMethod } from '../fit/fitMethods.js';
import { preparePlaneHits, type PreparedPlaneHits } from '../fit/preparePlaneHits.js';
import type { FitLabSample } from './sample.js';

/** One fitter's answer for every track of the sample (NaN where it failed or gave nothing). */
export interface FitterTrackColumns {
  readonly kappa: Float64Array;
  readonly sigmaKappa: Float64Array;
  readonly chi2: Float64Array;
  readonly ndf: Float64Array;
  /** P(χ²_ndf ≥ χ²): uniform on [0, 1] when the model and the errors are right. */
  readonly pValue: Float64Array;
  /** (κ − κ_true)/σ(κ): mean 0 and width 1 when the covariance is honest. */
  readonly pull: Float64Array;
  /** tan λ and its pull (tan λ − tan λ_true)/σ, for methods that report them. */
  readonly tanLambda: Float64Array;
  readonly tanLambdaPull: Float64Array;
  /** 1 where the fit succeeded. */
  readonly ok: Uint8Array;
}

/** Figures of merit of one fitter over a set of tracks. Curvatures in 1/m, momenta relative. */
export interface FitMerit {
  readonly fitter: string;
  readonly tracks: number;
  readonly failures: number;
  readonly failureRate: number;
  /** Mean of κ_fit − κ_true [1/m]. */
  readonly kappaBias: number;
  /** Standard deviation of κ_fit − κ_true [1/m]. */
  readonly kappaResolution: number;
  /**
   * Mean and standard deviation of (p_fit − p_true)/p_true for the transverse momentum,
   * p_T,fit = 0.299792458·|z B|/|κ_fit| (what every circle fit measures).
   */
  readonly momentumBias: number;
  readonly momentumResolution: number;
  readonly pullMean: number;
  readonly pullWidth: number;
  /** Mean of χ²/ndf. */
  readonly chi2PerNdf: number;
  /** Fraction of tracks with p-value below 0.05 (0.05 expected). */
  readonly pValueBelow5Percent: number;
  /** Standard deviation of tan λ − tan λ_true and the width of its pull; NaN for circle-only methods. */
  readonly tanLambdaResolution: number;
  readonly tanLambdaPullWidth: number;
}

export interface BinnedMerit extends FitMerit {
  /** Bin edges and centre (geometric for momentum) in the binning variable's unit. */
  readonly low: number;
  readonly high: number;
  readonly centre: number;
}

export interface FitLabReport {
  readonly fitters: readonly string[];
  /** One row per fitter, plus its speed. */
  readonly summary: readonly (FitMerit & { readonly tracksPerSecond: number })[];
  /** Rows per fitter and momentum bin [GeV/c]. */
  readonly byMomentum: readonly BinnedMerit[];
  /** Rows per fitter and track length [m]. */
  readonly byLength: readonly BinnedMerit[];
  readonly perTrack: Readonly<Record<string, FitterTrackColumns>>;
  readonly sample: FitLabSample;
}

export interface CompareOptions {
  /** Momentum bin edges [GeV/c]; default 6 log-spaced bins over the sample's range. */
  readonly momentumEdgesGeV?: readonly number[];
  /** Track-length bin edges [m]; default one bin per distinct length when there are at most 12, else 6 equal bins. */
  readonly lengthEdgesM?: readonly number[];
}

/**
 * Runs every fit method (registry names or `FitMethod`s, e.g. one made with `defineFitMethod` in
 * a notebook) on every track of a simulated sample — as a helix fit, so that tan λ is measured
 * too — and reports, per method, the bias and
 * resolution of curvature and momentum (overall, per momentum bin and per track length), the
 * pull mean and width, χ²/ndf and the p-value distribution, the failure rate and the speed
 * (tracks per second, wall clock on this machine — for comparing methods side by side, not a
 * benchmark). A method that fails on a track (for a user method: throws) counts as a failure on
 * that track. χ²/ndf and p-values are those of the bending-plane fit.
 * @example compareFitters(['geometric', 'taubin', 'kasa'], fitLabSample({...})).summary
 */
export function compareFitters(methods: readonly (FitMethod | string)[], sample: FitLabSample, options: CompareOptions = {}): FitLabReport {
  if (methods.length === 0) throw msg.badArgument('methods', [], 'at least one fit method (a registered name or a FitMethod)');
  const fitters = methods.map((m) => (typeof m === 'string' ? fitMethod(m) : m));
  const names = fitters.map((f) => f.name);
  if (new Set(names).size !== names.length) throw msg.badArgument('fitter names', names, 'distinct names');
  const perTrack: Record<string, FitterTrackColumns> = {};
  const summary: (FitMerit & { tracksPerSecond: number })[] = [];
  const all = Int32Array.from({ length: sample.count }, (_, k) => k);
  const prepared = preparePlaneHits({ x: sample.x, y: sample.y, sigmaX: sample.sigma, sigmaY: sample.sigma });
  for (const fitter of fitters) {
    // Untimed warm-up on a few tracks so that the first fitter does not pay the JIT for all.
    runFitter(fitter, sample, prepared, Math.min(50, sample.count));
    const t0 = performance.now();
    const cols = runFitter(fitter, sample, prepared, sample.count);
    const seconds = (performance.now() - t0) / 1000;
    perTrack[fitter.name] = cols;
    summary.push({ ...merit(fitter.name, cols, sample, all), tracksPerSecond: seconds > 0 ? sample.count / seconds : Infinity });
  }
  const edges = options.momentumEdgesGeV ?? defaultEdges(sample.momentumGeV);
  const byMomentum: BinnedMerit[] = [];
  const byLength: BinnedMerit[] = [];
  const distinct = [...new Set(sample.lengthM)].sort((a, b) => a - b);
  const lengthEdges = options.lengthEdgesM ?? (distinct.length <= 12 ? undefined : linearEdges(distinct[0], distinct[distinct.length - 1], 6));
  for (const fitter of fitters) {
    const cols = perTrack[fitter.name];
    for (let b = 0; b + 1 < edges.length; b++) {
      const lo = edges[b], hi = edges[b + 1];
      const rows = select(sample.count, (k) => sample.momentumGeV[k] >= lo && (sample.momentumGeV[k] < hi || (b + 2 === edges.length && sample.momentumGeV[k] <= hi)));
      byMomentum.push({ ...merit(fitter.name, cols, sample, rows), low: lo, high: hi, centre: Math.sqrt(lo * hi) });
    }
    if (lengthEdges === undefined) {
      for (const l of distinct) {
        const rows = select(sample.count, (k) => sample.lengthM[k] === l);
        byLength.push({ ...merit(fitter.name, cols, sample, rows), low: l, high: l, centre: l });
      }
    } else {
      for (let b = 0; b + 1 < lengthEdges.length; b++) {
        const lo = lengthEdges[b], hi = lengthEdges[b + 1], last = b + 2 === lengthEdges.length;
        const rows = select(sample.count, (k) => sample.lengthM[k] >= lo && (sample.lengthM[k] < hi || (last && sample.lengthM[k] <= hi)));
        byLength.push({ ...merit(fitter.name, cols, sample, rows), low: lo, high: hi, centre: 0.5 * (lo + hi) });
      }
    }
  }
  return { fitters: names, summary, byMomentum, byLength, perTrack, sample };
}

function runFitter(method: FitMethod, s: FitLabSample, prepared: PreparedPlaneHits, tracks: number): FitterTrackColumns {
  const n = tracks;
  const kappa = new Float64Array(n).fill(NaN), sigmaKappa = new Float64Array(n).fill(NaN);
  const chi2 = new Float64Array(n).fill(NaN), ndf = new Float64Array(n).fill(NaN);
  const pValue = new Float64Array(n).fill(NaN), pull = new Float64Array(n).fill(NaN);
  const tanLambda = new Float64Array(n).fill(NaN), tanLambdaPull = new Float64Array(n).fill(NaN);
  const ok = new Uint8Array(n);
  const fits = fitHelices({ ...prepared, z: s.z, sigmaZ: s.sigmaZ }, s.offsets.subarray(0, n + 1), { method });
  const c = fits.circle;
  for (let k = 0; k < n; k++) {
    if (FIT_STATUS[c.status[k]] !== 'ok' || !Number.isFinite(c.kappa[k])) continue;
    ok[k] = 1;
    kappa[k] = c.kappa[k];
    const sk = Math.sqrt(c.cov[6 * k]);
    if (sk > 0) {
      sigmaKappa[k] = sk;
      pull[k] = (c.kappa[k] - s.kappaTrue[k]) / sk;
    }
    const t = fits.tanLambda[k];
    if (Number.isFinite(t)) {
      tanLambda[k] = t;
      const st = Math.sqrt(fits.cov[15 * k + 14]);
      if (st > 0) tanLambdaPull[k] = (t - s.tanLambdaTrue[k]) / st;
    }
    if (Number.isFinite(c.chi2[k]) && c.ndf[k] > 0) {
      chi2[k] = c.chi2[k];
      ndf[k] = c.ndf[k];
      pValue[k] = chi2Survival(c.chi2[k], c.ndf[k]);
    }
  }
  return { kappa, sigmaKappa, chi2, ndf, pValue, pull, tanLambda, tanLambdaPull, ok };
}

function select(n: number, keep: (k: number) => boolean): Int32Array {
  const out: number[] = [];
  for (let k = 0; k < n; k++) if (keep(k)) out.push(k);
  return Int32Array.from(out);
}

function linearEdges(lo: number, hi: number, n: number): number[] {
  return Array.from({ length: n + 1 }, (_, i) => lo + ((hi - lo) * i) / n);
}

function defaultEdges(p: Float64Array): number[] {
  let lo = Infinity, hi = -Infinity;
  for (const v of p) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  if (!(hi > lo)) return [lo * 0.999, hi * 1.001];
  const n = 6;
  return Array.from({ length: n + 1 }, (_, i) => lo * Math.pow(hi / lo, i / n));
}

/** Mean and standard deviation of the finite values (NaN when fewer than 2). */
function meanSd(values: ArrayLike<number>): [number, number] {
  let n = 0, s = 0, s2 = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    n++; s += v; s2 += v * v;
  }
  if (n < 2) return [n === 1 ? s : NaN, NaN];
  const m = s / n;
  return [m, Math.sqrt(Math.max(0, (s2 - n * m * m) / (n - 1)))];
}

function merit(name: string, c: FitterTrackColumns, s: FitLabSample, rows: Int32Array): FitMerit {
  const m = rows.length;
  const dk = new Float64Array(m), dp = new Float64Array(m), pulls = new Float64Array(m), red = new Float64Array(m);
  const dt = new Float64Array(m), tPulls = new Float64Array(m);
  let failures = 0, withP = 0, lowP = 0;
  for (let i = 0; i < m; i++) {
    const k = rows[i];
    if (!c.ok[k]) { failures++; dk[i] = dp[i] = pulls[i] = red[i] = dt[i] = tPulls[i] = NaN; continue; }
    dt[i] = c.tanLambda[k] - s.tanLambdaTrue[k];
    tPulls[i] = c.tanLambdaPull[k];
    dk[i] = c.kappa[k] - s.kappaTrue[k];
    const pFit = (GEV_PER_TESLA_METRE * Math.abs(s.fieldT * s.charge[k])) / Math.abs(c.kappa[k]);
    const ptTrue = s.momentumGeV[k] / Math.sqrt(1 + s.tanLambdaTrue[k] ** 2);
    dp[i] = pFit / ptTrue - 1;
    pulls[i] = c.pull[k];
    red[i] = c.chi2[k] / c.ndf[k];
    if (Number.isFinite(c.pValue[k])) { withP++; if (c.pValue[k] < 0.05) lowP++; }
  }
  const [kb, kr] = meanSd(dk), [pb, pr] = meanSd(dp), [pm, pw] = meanSd(pulls), [rc] = meanSd(red);
  const [, tr] = meanSd(dt), [, tw] = meanSd(tPulls);
  return {
    fitter: name, tracks: m, failures, failureRate: m > 0 ? failures / m : NaN,
    kappaBias: kb, kappaResolution: kr, momentumBias: pb, momentumResolution: pr,
    pullMean: pm, pullWidth: pw, chi2PerNdf: rc, pValueBelow5Percent: withP > 0 ? lowP / withP : NaN,
    tanLambdaResolution: tr, tanLambdaPullWidth: tw,
  };
}

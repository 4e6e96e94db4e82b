import { minimiseOnInterval } from '../analysis/minimiseOnInterval.js';
import { bendingPlaneFilter, type FilterContext, type FilterScratch, type FilterTrack } from './bendingPlaneFilter.js';
import type { SpeciesRange } from './speciesRange.js';

/** What one hypothesis fit needs besides the hits. */
export interface HypothesisContext {
  readonly fieldT: number;
  readonly chargeMagnitude: number;
  /** Whether the track stops inside the volume. */
  readonly stops: boolean;
  /** Mean hit spacing [m]: a stop lies U(0, spacing) beyond the last hit. */
  readonly spacingM: number;
}

/** Result of fitting one mass hypothesis to one track. */
export interface HypothesisFit {
  /** −2 ln L at the best parameter (filter term with its ln S, plus the end-point term of a stopping track). */
  readonly m2lnL: number;
  /** χ² of the hits (Kalman innovations, no ln S). */
  readonly chi2: number;
  /** Pull² of the fitted end point beyond the last hit (stopping track; 0 otherwise). */
  readonly rangeChi2: number;
  /** Degrees of freedom of `chi2`: hits − 3 (offset, angle, momentum or end point). */
  readonly ndf: number;
  /** Momentum at the first hit [GeV/c] and its error. */
  readonly pGeV: number;
  readonly sigmaPGeV: number;
  /** Least first-hit momentum [GeV/c] that reaches the last hit (CSDA): the bound for a track that leaves. */
  readonly pMinGeV: number;
  /** Path [m] from the first hit at which the fitted CSDA profile comes to rest: p(s) = p_h(rangeEndM − s). */
  readonly rangeEndM: number;
}

/** Per-hit momentum buffer of a track (allocate once per track). */
export interface HypothesisScratch extends FilterScratch {
  readonly p: Float64Array;
}

/**
 * −2 ln L of one track under one species, with its free parameter:
 * - a track that stops: the end point δ [m] beyond the last hit. The momentum profile runs back
 *   from the stop, p(s) = p_h(s_last + δ − s) (CSDA range of lib/matter), and the filter runs
 *   backward from the last hit (straggling grows away from the stop); δ has the prior
 *   U(0, spacing), taken as Gaussian N(spacing/2, spacing²/12) (ours, documented), which is where
 *   the consistency of the length with the range–energy relation enters;
 * - a track that leaves: the first-hit momentum p₀ [GeV/c], p(s) = p_h(R(p₀) − s), filter forward.
 */
export function hypothesisM2lnL(t: FilterTrack, range: SpeciesRange, parameter: number, ctx: HypothesisContext & FilterContext, scratch: HypothesisScratch): { total: number; chi2: number; rangeChi2: number; pGeV: number; sigmaPGeV: number } {
  const n = t.n, p = scratch.p, sLast = t.path3[n - 1];
  const rEnd = ctx.stops ? sLast + parameter : range.rangeM(parameter);
  if (!(rEnd > sLast)) return { total: Infinity, chi2: Infinity, rangeChi2: Infinity, pGeV: NaN, sigmaPGeV: NaN };
  range.momentaAlong(rEnd, t.path3, p);
  const f = bendingPlaneFilter(t, p, ctx, ctx.stops, scratch);
  if (!ctx.stops) return { total: f.m2lnL, chi2: f.chi2, rangeChi2: 0, pGeV: parameter, sigmaPGeV: NaN };
  const sp = ctx.spacingM;
  const rangeChi2 = (parameter - 0.5 * sp) ** 2 / ((sp * sp) / 12);
  return { total: f.m2lnL + rangeChi2, chi2: f.chi2, rangeChi2, pGeV: f.pEndGeV, sigmaPGeV: f.sigmaPEndGeV };
}

/**
 * Fits one hypothesis by minimising `hypothesisM2lnL` over its parameter: a 20-point scan, then
 * Brent's method between the neighbours of the scan's best point, to 3e-6 of the scanned span
 * (median 10 evaluations, mean 13 on the Brindlemoor tracks, where golden section took 22).
 * The parameter: δ in [0.1, 2]·spacing for a stopping track; ln p₀ in [ln p_min, ln(βγ 900 · m)]
 * for one that leaves (the range tables end at βγ 1000), p_min = the momentum whose CSDA range
 * is the observed path. Errors: a stopping track's from the filter (curvature offset at the
 * first hit); a leaving track's from the second difference of −2 ln L (Δ = 1), NaN on a bound.
 */
export function fitHypothesis(t: FilterTrack, range: SpeciesRange, ctx: HypothesisContext & FilterContext, scratch: HypothesisScratch): HypothesisFit {
  const sLast = t.path3[t.n - 1];
  const pMin = range.momentumGeV(sLast) * (1 + 1e-6) + 1e-9;
  const lo = ctx.stops ? 0.1 * ctx.spacingM : Math.log(pMin);
  const hi = ctx.stops ? 2 * ctx.spacingM : Math.log(Math.max(900 * ctx.massGeV, pMin * 1.01));
  const toParam = (v: number) => (ctx.stops ? v : Math.exp(v));
  const f = (v: number) => hypothesisM2lnL(t, range, toParam(v), ctx, scratch).total;
  const n = 20;
  let best = 0, fBest = Infinity;
  for (let i = 0; i < n; i++) {
    const v = f(lo + ((hi - lo) * i) / (n - 1));
    if (v < fBest) { fBest = v; best = i; }
  }
  const a = lo + ((hi - lo) * Math.max(best - 1, 0)) / (n - 1);
  const b = lo + ((hi - lo) * Math.min(best + 1, n - 1)) / (n - 1);
  const v = minimiseOnInterval(f, a, b, { toleranceX: 3e-6 * (hi - lo) }).x;
  const r = hypothesisM2lnL(t, range, toParam(v), ctx, scratch);
  let sigma = r.sigmaPGeV;
  if (!ctx.stops) {
    const p = toParam(v);
    const h = Math.min(0.005 * p, 0.5 * (p - pMin), 0.5 * (Math.exp(hi) - p));
    sigma = NaN;
    if (h > 1e-7 * p) {
      const fpp = (hypothesisM2lnL(t, range, p + h, ctx, scratch).total - 2 * r.total + hypothesisM2lnL(t, range, p - h, ctx, scratch).total) / (h * h);
      if (fpp > 0) sigma = Math.sqrt(2 / fpp);
    }
  }
  const rangeEndM = ctx.stops ? sLast + toParam(v) : range.rangeM(toParam(v));
  return Object.freeze({ m2lnL: r.total, chi2: r.chi2, rangeChi2: r.rangeChi2, ndf: t.n - 3, pGeV: r.pGeV, sigmaPGeV: sigma, pMinGeV: pMin, rangeEndM });
}

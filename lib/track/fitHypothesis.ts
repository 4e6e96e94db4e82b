import { GEV_PER_TESLA_METRE } from '../constants.js';
import type { SegmentCurvatures } from './segmentCurvatures.js';
import type { SpeciesRange } from './speciesRange.js';

/** Multiple-scattering constant of the curvature error, σκ = 0.016 GeV/(βp)/√(L·X₀) (PDG detector review, (memory) for the constant). */
export const MS_CURVATURE_GEV = 0.016;

/** What one hypothesis fit needs besides the segments. */
export interface HypothesisContext {
  readonly fieldT: number;
  readonly chargeMagnitude: number;
  /** Radiation length of the medium [m]. */
  readonly radiationLengthM: number;
  /** Whether the track stops (adds the range-consistency term). */
  readonly stops: boolean;
  /** Mean hit spacing [m]: the stop lies U(0, spacing) beyond the last hit. */
  readonly spacingM: number;
}

/** Result of fitting one mass hypothesis to one track. */
export interface HypothesisFit {
  /** −2 ln L at the best first-hit momentum (curvature terms + range term, with their ln σ²). */
  readonly m2lnL: number;
  /** Σ pulls² of the segment curvatures (no ln σ²). */
  readonly chi2: number;
  /** Pull² of the range term (0 for a track that leaves). */
  readonly rangeChi2: number;
  readonly ndf: number;
  /** Momentum at the first hit [GeV/c] and its error from Δ(−2 ln L) = 1. */
  readonly pGeV: number;
  readonly sigmaPGeV: number;
  /** Least first-hit momentum [GeV/c] that reaches the last hit (CSDA): the bound for a track that leaves. */
  readonly pMinGeV: number;
}

/**
 * −2 ln L of one track under one species with first-hit momentum p₀ [GeV/c]. The momentum along
 * the track follows the CSDA range relation, p(s) = p_h(R(p₀) − s); segment j's predicted
 * curvature is the mean of 0.2998·B·|z|/(p(s) cos λ_j) over its hit intervals, with
 * σ_j² = σ_meas² + σ_MS² and σ_MS = 0.016 GeV/(βp)/√(L_j X₀) (PDG detector review; constant (memory)).
 * A stopping track adds ((s_last + spacing/2 − R(p₀))² / σ_R² + ln σ_R²), σ_R² = straggling² +
 * spacing²/12. Gaussian likelihood, so the ln σ² terms stay (σ depends on the hypothesis).
 */
export function hypothesisM2lnL(range: SpeciesRange, p0GeV: number, seg: SegmentCurvatures, ctx: HypothesisContext): { total: number; chi2: number; rangeChi2: number } {
  const c = GEV_PER_TESLA_METRE * Math.abs(ctx.fieldT) * ctx.chargeMagnitude;
  const r0 = range.rangeM(p0GeV);
  const path = seg.pathM;
  const m = range.particle.massMeV / 1000;
  let total = 0, chi2 = 0;
  const sign = curvatureSign(seg);
  for (let j = 0; j < seg.count; j++) {
    const k = seg.kappa[j] * sign;
    if (!Number.isFinite(k)) continue;
    const a = seg.from[j], b = seg.to[j];
    let inv = 0;
    for (let i = a; i < b - 1; i++) inv += 1 / range.momentumGeV(r0 - 0.5 * (path[i] + path[i + 1]));
    const kPred = (c * inv) / ((b - 1 - a) * seg.cosLambda[j]);
    const pMid = range.momentumGeV(r0 - seg.pathMidM[j]);
    const beta = pMid / Math.hypot(pMid, m);
    const len = Math.max(path[b - 1] - path[a], 1e-6);
    const sMs = MS_CURVATURE_GEV / (beta * pMid * Math.sqrt(len * ctx.radiationLengthM));
    const v = seg.sigmaKappa[j] ** 2 + sMs * sMs;
    const d = k - kPred;
    if (!Number.isFinite(d) || !(v > 0)) return { total: Infinity, chi2: Infinity, rangeChi2: Infinity };
    chi2 += (d * d) / v;
    total += (d * d) / v + Math.log(v);
  }
  let rangeChi2 = 0;
  if (ctx.stops) {
    const sEnd = path[path.length - 1] + 0.5 * ctx.spacingM;
    const v = range.rangeSigmaM(r0) ** 2 + (ctx.spacingM * ctx.spacingM) / 12;
    rangeChi2 = (sEnd - r0) ** 2 / v;
    total += rangeChi2 + Math.log(v);
  }
  return { total, chi2, rangeChi2 };
}

/** Sign that makes the track's curvatures positive (weighted mean). */
export function curvatureSign(seg: SegmentCurvatures): number {
  let s = 0;
  for (let j = 0; j < seg.count; j++) if (Number.isFinite(seg.kappa[j])) s += seg.kappa[j] / seg.sigmaKappa[j] ** 2;
  return s < 0 ? -1 : 1;
}

/**
 * Fits the first-hit momentum of one hypothesis by minimising `hypothesisM2lnL` over ln p₀ in
 * [p_min, p_max] (a 32-point scan, then golden-section search; p_min = the momentum whose CSDA
 * range is the observed path, p_max = βγ 500 or 3× the range-momentum of the track). The error
 * comes from the second difference of −2 ln L (Δ = 1); NaN when the minimum sits on a bound.
 */
export function fitHypothesis(range: SpeciesRange, seg: SegmentCurvatures, ctx: HypothesisContext): HypothesisFit {
  const path = seg.pathM;
  const sLast = path[path.length - 1];
  const pMin = range.momentumGeV(sLast) * (1 + 1e-7) + 1e-9;
  const mGeV = range.particle.massMeV / 1000;
  const pMax = ctx.stops ? Math.min(500 * mGeV, range.momentumGeV(3 * (sLast + ctx.spacingM))) : 500 * mGeV;
  const f = (u: number) => hypothesisM2lnL(range, Math.exp(u), seg, ctx).total;
  const lo = Math.log(pMin), hi = Math.log(Math.max(pMax, pMin * 1.01));
  const n = 32;
  let best = 0, fBest = Infinity;
  const grid = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    grid[i] = f(lo + ((hi - lo) * i) / (n - 1));
    if (grid[i] < fBest) { fBest = grid[i]; best = i; }
  }
  let a = lo + ((hi - lo) * Math.max(best - 1, 0)) / (n - 1);
  let b = lo + ((hi - lo) * Math.min(best + 1, n - 1)) / (n - 1);
  const g = 0.5 * (Math.sqrt(5) - 1);
  let x1 = b - g * (b - a), x2 = a + g * (b - a), f1 = f(x1), f2 = f(x2);
  for (let it = 0; it < 30; it++) {
    if (f1 < f2) { b = x2; x2 = x1; f2 = f1; x1 = b - g * (b - a); f1 = f(x1); }
    else { a = x1; x1 = x2; f1 = f2; x2 = a + g * (b - a); f2 = f(x2); }
  }
  const u = f1 < f2 ? x1 : x2;
  const p = Math.exp(u);
  const at = hypothesisM2lnL(range, p, seg, ctx);
  const h = 0.01 * p;
  let sigma = NaN;
  if (p - h > pMin && p + h < Math.exp(hi)) {
    const fpp = (hypothesisM2lnL(range, p + h, seg, ctx).total - 2 * at.total + hypothesisM2lnL(range, p - h, seg, ctx).total) / (h * h);
    if (fpp > 0) sigma = Math.sqrt(2 / fpp);
  }
  let nseg = 0;
  for (let j = 0; j < seg.count; j++) if (Number.isFinite(seg.kappa[j])) nseg++;
  return Object.freeze({ m2lnL: at.total, chi2: at.chi2, rangeChi2: at.rangeChi2, ndf: nseg + (ctx.stops ? 1 : 0) - 1, pGeV: p, sigmaPGeV: sigma, pMinGeV: pMin });
}

/**
 * Straight line y = a + b·x (or y = b·x through the origin) fitted to points with errors on both
 * axes, by minimising χ²(a, b) = Σ (yᵢ − a − b xᵢ)² / (σ_yᵢ² + b² σ_xᵢ²) — the effective-variance
 * χ² (Orear, Am. J. Phys. 50 (1982) 912), which for a straight line is the exact likelihood of
 * Gaussian errors up to the normalisation. For fixed b the best a is the weighted mean of
 * y − b x, so the fit is a one-dimensional minimisation over b (golden section, then parabolic
 * steps); σ_b from the profile χ² rising by 1 (the curvature at the minimum).
 * The project's general fitting layer will take this over when it exists; it is small and
 * exact for this one model, so the beam measurements do not wait for it.
 */
export interface LineFitXY {
  readonly slope: number;
  readonly sigmaSlope: number;
  /** 0 when fitted through the origin. */
  readonly intercept: number;
  readonly sigmaIntercept: number;
  readonly chi2: number;
  readonly ndf: number;
  readonly throughOrigin: boolean;
}

function profile(x: ArrayLike<number>, y: ArrayLike<number>, sx: ArrayLike<number>, sy: ArrayLike<number>, b: number, origin: boolean): { chi2: number; a: number; sumW: number } {
  let sw = 0, swr = 0;
  const n = x.length;
  if (!origin) for (let i = 0; i < n; i++) { const w = 1 / (sy[i] ** 2 + b * b * sx[i] ** 2); sw += w; swr += w * (y[i] - b * x[i]); }
  const a = origin ? 0 : swr / sw;
  let chi2 = 0;
  for (let i = 0; i < n; i++) { const r = y[i] - a - b * x[i]; chi2 += (r * r) / (sy[i] ** 2 + b * b * sx[i] ** 2); }
  if (origin) for (let i = 0; i < n; i++) sw += 1 / (sy[i] ** 2 + b * b * sx[i] ** 2);
  return { chi2, a, sumW: sw };
}

export function fitStraightLineXY(
  x: ArrayLike<number>, y: ArrayLike<number>, sigmaX: ArrayLike<number>, sigmaY: ArrayLike<number>, throughOrigin: boolean,
): LineFitXY {
  const n = x.length;
  // Start: ordinary weighted fit ignoring σ_x.
  let sw = 0, sx = 0, sy = 0, sxx = 0, sxy = 0;
  for (let i = 0; i < n; i++) { const w = 1 / sigmaY[i] ** 2; sw += w; sx += w * x[i]; sy += w * y[i]; sxx += w * x[i] * x[i]; sxy += w * x[i] * y[i]; }
  const b0 = throughOrigin ? sxy / sxx : (sw * sxy - sx * sy) / (sw * sxx - sx * sx);
  const f = (b: number) => profile(x, y, sigmaX, sigmaY, b, throughOrigin).chi2;
  // Bracket the minimum around b0 and shrink it by golden sections.
  let lo = b0 * 0.5, hi = b0 * 1.5;
  if (lo > hi) [lo, hi] = [hi, lo];
  if (lo === hi) { lo -= 1; hi += 1; }
  const g = (Math.sqrt(5) - 1) / 2;
  let c = hi - g * (hi - lo), d = lo + g * (hi - lo);
  let fc = f(c), fd = f(d);
  for (let it = 0; it < 200 && Math.abs(hi - lo) > 1e-13 * Math.abs(b0); it++) {
    if (fc < fd) { hi = d; d = c; fd = fc; c = hi - g * (hi - lo); fc = f(c); }
    else { lo = c; c = d; fc = fd; d = lo + g * (hi - lo); fd = f(d); }
  }
  const b = 0.5 * (lo + hi);
  const best = profile(x, y, sigmaX, sigmaY, b, throughOrigin);
  // σ_b: Δχ² = 1 on the profile, from its curvature (second difference at a step of ~σ).
  const h0 = Math.abs(b) * 1e-4 || 1e-6;
  const curv = (f(b + h0) - 2 * best.chi2 + f(b - h0)) / (h0 * h0);
  const sigmaSlope = Math.sqrt(2 / curv);
  // σ_a at fixed b (weighted mean) plus the slope's contribution through a(b).
  let sigmaIntercept = 0;
  if (!throughOrigin) {
    const da = (profile(x, y, sigmaX, sigmaY, b + h0, false).a - profile(x, y, sigmaX, sigmaY, b - h0, false).a) / (2 * h0);
    sigmaIntercept = Math.sqrt(1 / best.sumW + da * da * sigmaSlope * sigmaSlope);
  }
  return { slope: b, sigmaSlope, intercept: best.a, sigmaIntercept, chi2: best.chi2, ndf: n - (throughOrigin ? 1 : 2), throughOrigin };
}

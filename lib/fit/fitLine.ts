/** Result of a weighted straight-line fit v = intercept + slope·u. */
export interface LineFit {
  readonly intercept: number;
  readonly slope: number;
  /** Covariance [var(intercept), cov, var(slope)]. */
  readonly cov: readonly [number, number, number];
  readonly chi2: number;
  readonly ndf: number;
  /** True when no errors were given and the covariance was scaled by χ²/ndf. */
  readonly errorsEstimated: boolean;
}

/**
 * Weighted least-squares straight line through (u_i, v_i) with errors σ_i on v
 * (closed form of the normal equations; e.g. PDG RPP "Statistics", linear least squares).
 * Without errors, unit weights and the covariance scaled by χ²/ndf.
 * Returns NaNs (never throws) when fewer than 2 distinct u values are given.
 * @example fitLine(Float64Array.of(0,1,2), Float64Array.of(1,3,5)) // slope 2, intercept 1
 */
export function fitLine(u: Float64Array, v: Float64Array, sigma?: Float64Array, from = 0, to = u.length): LineFit {
  let sw = 0, su = 0, sv = 0;
  for (let i = from; i < to; i++) {
    const w = sigma ? 1 / (sigma[i] * sigma[i]) : 1;
    sw += w; su += w * u[i]; sv += w * v[i];
  }
  const mu = su / sw, mv = sv / sw;
  let suu = 0, suv = 0;
  for (let i = from; i < to; i++) {
    const w = sigma ? 1 / (sigma[i] * sigma[i]) : 1;
    const du = u[i] - mu;
    suu += w * du * du;
    suv += w * du * (v[i] - mv);
  }
  const slope = suv / suu;
  const intercept = mv - slope * mu;
  let chi2 = 0;
  for (let i = from; i < to; i++) {
    const w = sigma ? 1 / (sigma[i] * sigma[i]) : 1;
    const r = v[i] - intercept - slope * u[i];
    chi2 += w * r * r;
  }
  const ndf = to - from - 2;
  const s2 = sigma ? 1 : ndf > 0 ? chi2 / ndf : NaN;
  // Centred form: var(slope) = 1/Suu, var(mean) = 1/Sw, intercept = mean − slope·mu.
  const varSlope = s2 / suu;
  const varIntercept = s2 * (1 / sw + (mu * mu) / suu);
  const covIS = -s2 * mu / suu;
  const ok = suu > 0 && Number.isFinite(slope);
  return Object.freeze({
    intercept: ok ? intercept : NaN,
    slope: ok ? slope : NaN,
    cov: ok ? ([varIntercept, covIS, varSlope] as const) : ([NaN, NaN, NaN] as const),
    chi2: ok ? chi2 : NaN,
    ndf,
    errorsEstimated: sigma === undefined,
  });
}

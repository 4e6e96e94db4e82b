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

/** Scratch result of `lineFitInto` (internal, reused across calls in hot loops). */
export interface LineScratch {
  intercept: number;
  slope: number;
  varIntercept: number;
  covIS: number;
  varSlope: number;
  chi2: number;
  /** Weighted means of u and the sums the derivatives need. */
  meanU: number;
  sumW: number;
  suu: number;
}

/**
 * Weighted least-squares line through (u_i, v_i), i < n, with weights w_i = 1/σ_i² (or unit
 * weights and the covariance scaled by χ²/ndf when `w` is undefined). Closed-form centred
 * normal equations (e.g. PDG RPP "Statistics", linear least squares). NaNs when the u values
 * do not spread.
 */
export function lineFitInto(u: Float64Array, v: Float64Array, w: Float64Array | undefined, n: number, out: LineScratch): LineScratch {
  let sw = 0, su = 0, sv = 0;
  for (let i = 0; i < n; i++) {
    const wi = w ? w[i] : 1;
    sw += wi; su += wi * u[i]; sv += wi * v[i];
  }
  const mu = su / sw, mv = sv / sw;
  let suu = 0, suv = 0;
  for (let i = 0; i < n; i++) {
    const wi = w ? w[i] : 1;
    const du = u[i] - mu;
    suu += wi * du * du;
    suv += wi * du * (v[i] - mv);
  }
  const slope = suv / suu;
  const intercept = mv - slope * mu;
  let chi2 = 0;
  for (let i = 0; i < n; i++) {
    const r = v[i] - intercept - slope * u[i];
    chi2 += (w ? w[i] : 1) * r * r;
  }
  const ndf = n - 2;
  const s2 = w ? 1 : ndf > 0 ? chi2 / ndf : NaN;
  const ok = suu > 0 && Number.isFinite(slope);
  out.intercept = ok ? intercept : NaN;
  out.slope = ok ? slope : NaN;
  // Centred form: var(slope) = 1/Suu, var(mean) = 1/Sw, intercept = mean − slope·mu.
  out.varSlope = ok ? s2 / suu : NaN;
  out.varIntercept = ok ? s2 * (1 / sw + (mu * mu) / suu) : NaN;
  out.covIS = ok ? (-s2 * mu) / suu : NaN;
  out.chi2 = ok ? chi2 : NaN;
  out.meanU = mu;
  out.sumW = sw;
  out.suu = suu;
  return out;
}

/**
 * Weighted least-squares straight line through (u_i, v_i) with errors σ_i on v.
 * Without errors, unit weights and the covariance scaled by χ²/ndf.
 * Returns NaNs (never throws) when fewer than 2 distinct u values are given.
 * @example fitLine(Float64Array.of(0,1,2), Float64Array.of(1,3,5)) // slope 2, intercept 1
 */
export function fitLine(u: Float64Array, v: Float64Array, sigma?: Float64Array, from = 0, to = u.length): LineFit {
  const n = to - from;
  let w: Float64Array | undefined;
  if (sigma) {
    w = new Float64Array(n);
    for (let i = 0; i < n; i++) w[i] = 1 / (sigma[from + i] * sigma[from + i]);
  }
  const r = lineFitInto(u.subarray(from, to), v.subarray(from, to), w, n, newLineScratch());
  return Object.freeze({
    intercept: r.intercept,
    slope: r.slope,
    cov: [r.varIntercept, r.covIS, r.varSlope] as const,
    chi2: r.chi2,
    ndf: n - 2,
    errorsEstimated: sigma === undefined,
  });
}

export function newLineScratch(): LineScratch {
  return { intercept: NaN, slope: NaN, varIntercept: NaN, covIS: NaN, varSlope: NaN, chi2: NaN, meanU: NaN, sumW: NaN, suu: NaN };
}

/**
 * One track's helix, as the vertex code reads it: the fit parameters (κ, φ0, d0, z0, tan λ) at
 * the reference point (x_ref, y_ref) — the track's first hit — in the convention of
 * lib/fit/circleFit.ts, and their 5×5 covariance. Lengths [m], κ [1/m], angles [rad].
 *
 * Position at transverse arc length s from the point of closest approach P0 = ref − d0·n,
 * n = (−sin φ0, cos φ0), with h = κs/2 and sinc(h) = sin h / h:
 *   x(s) = x_ref + d0 sin φ0 + s cos(φ0 + h) sinc h
 *   y(s) = y_ref − d0 cos φ0 + s sin(φ0 + h) sinc h
 *   z(s) = z0 + s tan λ
 * (the chord form of the circle, exact, and free of the 1/κ cancellation of a straight track).
 * The direction of travel at s is φ0 + κs; s > 0 is downstream of the first hit.
 */
export interface HelixParameters {
  xRef: number;
  yRef: number;
  kappa: number;
  phi0: number;
  d0: number;
  z0: number;
  tanLambda: number;
  /** Row-major 5×5 covariance of (κ, φ0, d0, z0, tan λ). */
  readonly cov: Float64Array;
}

/** A fresh, zeroed helix (scratch for the hot loops: fill it, do not allocate per pair). */
export function newHelixParameters(): HelixParameters {
  return { xRef: 0, yRef: 0, kappa: 0, phi0: 0, d0: 0, z0: 0, tanLambda: 0, cov: new Float64Array(25) };
}

/** sinc(h) = sin h / h, and its derivative, with the series near 0. */
export function sinc(h: number): number {
  return Math.abs(h) < 1e-4 ? 1 - (h * h) / 6 : Math.sin(h) / h;
}
function sincSlope(h: number): number {
  return Math.abs(h) < 1e-3 ? -h / 3 + (h * h * h) / 30 : (h * Math.cos(h) - Math.sin(h)) / (h * h);
}

/** Position [m] at arc length `sM` into out[0..2]. */
export function helixPoint(h: HelixParameters, sM: number, out: Float64Array | number[]): void {
  const half = 0.5 * h.kappa * sM;
  const chord = sM * sinc(half);
  const a = h.phi0 + half;
  out[0] = h.xRef + h.d0 * Math.sin(h.phi0) + chord * Math.cos(a);
  out[1] = h.yRef - h.d0 * Math.cos(h.phi0) + chord * Math.sin(a);
  out[2] = h.z0 + sM * h.tanLambda;
}

/**
 * ∂(x, y, z)/∂(κ, φ0, d0, z0, tan λ) at fixed arc length `sM`, row-major 3×5 into `out`.
 */
export function helixPointJacobian(h: HelixParameters, sM: number, out: Float64Array): void {
  const half = 0.5 * h.kappa * sM;
  const S = sinc(half), dS = sincSlope(half);
  const a = h.phi0 + half;
  const ca = Math.cos(a), sa = Math.sin(a), c0 = Math.cos(h.phi0), s0 = Math.sin(h.phi0);
  const q = 0.5 * sM * sM;
  out.fill(0);
  out[0] = q * (-sa * S + ca * dS);
  out[1] = h.d0 * c0 - sM * sa * S;
  out[2] = s0;
  out[5] = q * (ca * S + sa * dS);
  out[6] = h.d0 * s0 + sM * ca * S;
  out[7] = -c0;
  out[13] = 1;
  out[14] = sM;
}

/** Centre [m] of the circle in the bending plane (Infinity-free only when κ ≠ 0). */
export function helixCentre(h: HelixParameters): [number, number] {
  const arm = 1 / h.kappa - h.d0;
  return [h.xRef - arm * Math.sin(h.phi0), h.yRef + arm * Math.cos(h.phi0)];
}

/**
 * Transverse arc length [m] of the point of the circle nearest to (x, y), on the branch with
 * |κ s| ≤ π (the turn through the reference point); for a straight track, the projection.
 */
export function arcLengthNear(h: HelixParameters, xM: number, yM: number): number {
  const c0 = Math.cos(h.phi0), s0 = Math.sin(h.phi0);
  const px = h.xRef + h.d0 * s0, py = h.yRef - h.d0 * c0;
  if (Math.abs(h.kappa) < 1e-12) return (xM - px) * c0 + (yM - py) * s0;
  const [cx, cy] = helixCentre(h);
  // P − C = (sin φ, −cos φ)/κ at direction φ.
  const phi = Math.atan2(h.kappa * (xM - cx), -h.kappa * (yM - cy));
  let d = phi - h.phi0;
  d -= 2 * Math.PI * Math.round(d / (2 * Math.PI));
  return d / h.kappa;
}

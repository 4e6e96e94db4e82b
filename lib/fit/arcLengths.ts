/** Rows [from, to) of x, y columns [m]. */
export interface PointRows {
  readonly x: Float64Array;
  readonly y: Float64Array;
  from: number;
  to: number;
}

/** A circle in the (κ, φ, d) parametrisation at the reference point (xRef, yRef) (see circleFit.ts). */
export interface CircleAt {
  kappa: number;
  phi: number;
  d: number;
  xRef: number;
  yRef: number;
}

/** Arc length s [m] of each point and ∂s/∂κ, ∂s/∂φ, ∂s/∂d; arrays of at least to − from entries. */
export interface ArcLengthSlopes {
  readonly s: Float64Array;
  readonly dsK: Float64Array;
  readonly dsP: Float64Array;
  readonly dsD: Float64Array;
}

/** Scratch for `arcLengthsAndSlopes` on tracks of up to `n` hits. */
export function newArcLengthSlopes(n: number): ArcLengthSlopes {
  return { s: new Float64Array(n), dsK: new Float64Array(n), dsP: new Float64Array(n), dsD: new Float64Array(n) };
}

/**
 * Arc length [m] of each hit along the fitted circle from the point of closest approach to the
 * reference point, unwrapped in hit order so spirals of several turns are measured in full
 * (consecutive hits less than half a turn apart; turning angle ψ = atan2(κa, 1 − κB), a, B as in
 * curvatureResidual.ts, s = ψ/κ, s = a at κ = 0), plus the derivatives of s with respect to the
 * circle parameters, in the same single pass (one atan2 per hit). With N = κa, D = 1 − κB, Q = N² + D², ψ = atan2(N, D):
 *     ∂s/∂φ = (D·b − N·a)/Q,   ∂s/∂d = N/Q,   ∂s/∂κ = ((D·a + N·B)/Q − s)/κ
 * (b = B − d). For a nearly straight piece (|κa|, |κB| < 1e-4) ∂s/∂κ uses the series
 * s ≈ a + κaB + κ²(aB² − a³/3), whose derivative avoids the cancellation.
 */
export function arcLengthsAndSlopes(rows: PointRows, circle: CircleAt, out: ArcLengthSlopes): void {
  const { x, y, from, to } = rows;
  const { kappa, phi, d, xRef: xr, yRef: yr } = circle;
  const { s, dsK, dsP, dsD } = out;
  const c = Math.cos(phi), sn = Math.sin(phi);
  let prev = 0;
  let turns = 0;
  for (let i = from; i < to; i++) {
    const j = i - from;
    const dx = x[i] - xr, dy = y[i] - yr;
    const a = dx * c + dy * sn;
    const b = -dx * sn + dy * c;
    const B = b + d;
    const N = kappa * a, D = 1 - kappa * B;
    const Q = N * N + D * D;
    dsP[j] = (D * b - N * a) / Q;
    dsD[j] = N / Q;
    if (kappa === 0) {
      s[j] = a;
      dsK[j] = a * B;
      continue;
    }
    let psi = Math.atan2(N, D) + turns;
    while (psi - prev > Math.PI) { psi -= 2 * Math.PI; turns -= 2 * Math.PI; }
    while (psi - prev < -Math.PI) { psi += 2 * Math.PI; turns += 2 * Math.PI; }
    prev = psi;
    const sj = psi / kappa;
    s[j] = sj;
    dsK[j] = turns === 0 && Math.abs(N) + Math.abs(kappa * B) < 1e-4
      ? a * B + 2 * kappa * (a * B * B - (a * a * a) / 3)
      : ((D * a + N * B) / Q - sj) / kappa;
  }
}

/**
 * Central-difference Hessian H[j][k] = ∂²F/∂θ_j∂θ_k of a scalar function at θ, row-major into
 * `out` (p×p, symmetric): diagonal from F(θ ± h_j e_j), off-diagonal from the four corners
 * F(θ ± h_j e_j ± h_k e_k) (Abramowitz & Stegun 25.3.23–26). With F in χ² units, choose h_j a
 * small fraction of θ_j's error: F then rises by (h/σ)² over a step, which must stay far above
 * its rounding, while the truncation error is ~(h/σ)² of the non-quadratic part. Costs 2p² + 1 evaluations; θ is
 * restored. Returns false if F was not finite somewhere.
 * @example numericalHessian((t) => t[0] * t[0] + 3 * t[0] * t[1], Float64Array.of(1, 1), [0.1, 0.1], out) // out ≈ [2, 3, 3, 0]
 */
export function numericalHessian(f: (theta: Float64Array) => number, theta: Float64Array, steps: ArrayLike<number>, out: Float64Array): boolean {
  const p = theta.length;
  const f0 = f(theta);
  let finite = Number.isFinite(f0);
  for (let j = 0; j < p; j++) {
    const tj = theta[j], hj = steps[j];
    theta[j] = tj + hj; const fp = f(theta);
    theta[j] = tj - hj; const fm = f(theta);
    theta[j] = tj;
    out[j * p + j] = (fp - 2 * f0 + fm) / (hj * hj);
    for (let k = 0; k < j; k++) {
      const tk = theta[k], hk = steps[k];
      theta[j] = tj + hj; theta[k] = tk + hk; const fpp = f(theta);
      theta[k] = tk - hk; const fpm = f(theta);
      theta[j] = tj - hj; const fmm = f(theta);
      theta[k] = tk + hk; const fmp = f(theta);
      theta[j] = tj; theta[k] = tk;
      out[j * p + k] = out[k * p + j] = (fpp - fpm - fmp + fmm) / (4 * hj * hk);
    }
  }
  for (let i = 0; i < p * p; i++) if (!Number.isFinite(out[i])) finite = false;
  return finite;
}

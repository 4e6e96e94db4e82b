/**
 * Cholesky factorisation of a small dense symmetric positive-definite matrix, in place
 * (row-major n×n; the lower triangle is read and overwritten with L, A = L Lᵀ). Returns false
 * when a pivot is not positive (the matrix is not positive definite to working precision).
 * Small dense systems only (n ≲ 50): the fitting layer's normal equations. Written here rather
 * than taken from ml-matrix because the Levenberg–Marquardt loop solves one such system per
 * step on preallocated Float64Arrays, and ml-matrix takes ~0.3 s to import and allocates per call.
 * (G. H. Golub & C. F. Van Loan, Matrix Computations, 4th ed., §4.2.)
 * @example const a = Float64Array.of(4, 2, 2, 3); choleskyDecompose(a, 2) // true; a = [2, 2, 1, √2]
 */
export function choleskyDecompose(a: Float64Array, n: number): boolean {
  for (let j = 0; j < n; j++) {
    let d = a[j * n + j];
    for (let k = 0; k < j; k++) d -= a[j * n + k] * a[j * n + k];
    if (!(d > 0)) return false;
    const ljj = Math.sqrt(d);
    a[j * n + j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let s = a[i * n + j];
      for (let k = 0; k < j; k++) s -= a[i * n + k] * a[j * n + k];
      a[i * n + j] = s / ljj;
    }
  }
  return true;
}

/** Solves L Lᵀ x = b in place (b becomes x), with L from `choleskyDecompose`. */
export function choleskySolve(l: Float64Array, n: number, b: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= l[i * n + k] * b[k];
    b[i] = s / l[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i];
    for (let k = i + 1; k < n; k++) s -= l[k * n + i] * b[k];
    b[i] = s / l[i * n + i];
  }
}

/** Writes (L Lᵀ)⁻¹ into `out` (row-major n×n, symmetric), with L from `choleskyDecompose`. */
export function choleskyInverse(l: Float64Array, n: number, out: Float64Array): void {
  const col = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    col.fill(0);
    col[j] = 1;
    choleskySolve(l, n, col);
    for (let i = 0; i < n; i++) out[i * n + j] = col[i];
  }
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) out[i * n + j] = out[j * n + i] = 0.5 * (out[i * n + j] + out[j * n + i]);
}

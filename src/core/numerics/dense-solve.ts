/**
 * Small dense linear solves for the Newton steps of the sublattice equations (n <= 33):
 * Gaussian elimination with partial pivoting for the general Newton matrix, and Cholesky
 * for the Hessian of the T = 0 energy (which also tells whether it is positive definite).
 * Matrices are row-major Float64Arrays, overwritten; the right side becomes the solution.
 */

/** Solve A y = b in place by Gaussian elimination with partial pivoting; false if singular. */
export function gaussSolve(A: Float64Array, b: Float64Array, n: number): boolean {
  for (let k = 0; k < n; k++) {
    let piv = k, best = Math.abs(A[k * n + k]);
    for (let i = k + 1; i < n; i++) { const v = Math.abs(A[i * n + k]); if (v > best) { best = v; piv = i; } }
    if (!(best > 1e-300)) return false;
    if (piv !== k) {
      for (let j = 0; j < n; j++) { const t = A[k * n + j]; A[k * n + j] = A[piv * n + j]; A[piv * n + j] = t; }
      const t = b[k]; b[k] = b[piv]; b[piv] = t;
    }
    const inv = 1 / A[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const f = A[i * n + k] * inv;
      if (f === 0) continue;
      for (let j = k + 1; j < n; j++) A[i * n + j] -= f * A[k * n + j];
      b[i] -= f * b[k];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i];
    for (let j = i + 1; j < n; j++) s -= A[i * n + j] * b[j];
    b[i] = s / A[i * n + i];
  }
  for (let i = 0; i < n; i++) if (!Number.isFinite(b[i])) return false;
  return true;
}

/**
 * Cholesky factor of the symmetric A + shift I into L (lower, row-major); false when it is
 * not positive definite (a pivot <= 0).
 */
export function cholesky(A: Float64Array, n: number, shift: number, L: Float64Array): boolean {
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = A[i * n + j] + (i === j ? shift : 0);
      for (let k = 0; k < j; k++) s -= L[i * n + k] * L[j * n + k];
      if (i === j) {
        if (!(s > 0)) return false;
        L[i * n + i] = Math.sqrt(s);
      } else {
        L[i * n + j] = s / L[j * n + j];
      }
    }
  }
  return true;
}

/** Solve L L^T y = b in place with the Cholesky factor L. */
export function choleskySolve(L: Float64Array, n: number, b: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= L[i * n + k] * b[k];
    b[i] = s / L[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = b[i];
    for (let k = i + 1; k < n; k++) s -= L[k * n + i] * b[k];
    b[i] = s / L[i * n + i];
  }
}

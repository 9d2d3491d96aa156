/**
 * Eigenvalues and eigenvectors of a real n x n matrix A (row-major): orthogonal reduction
 * to Hessenberg form (hessenberg.ts), the Francis double-shift QR iteration to the real
 * Schur form (real-schur.ts, with an iteration cap: a ConvergenceError, never a hang), and
 * back-substitution for the eigenvectors (schur-eigenvectors.ts). Wilkinson and Reinsch,
 * Handbook for Automatic Computation II (1971), II/13 and II/15.
 */
import { Matrix } from 'ml-matrix';
import { orthes } from './hessenberg.ts';
import { schurQR } from './real-schur.ts';
import { schurEigenvectors } from './schur-eigenvectors.ts';

export interface RealEigen {
  /** Eigenvalues d + i e; a complex pair sits at (j, j+1) with e[j] > 0. */
  re: Float64Array;
  im: Float64Array;
  /** Column j: the eigenvector of a real value j; a pair j, j+1 has V_j +- i V_{j+1}. */
  V: Matrix;
}

/** A V = V diag(lambda) for real A (row-major, n x n). */
export function realEigenDecomposition(n: number, A: ArrayLike<number>): RealEigen {
  const H = new Matrix(n, n), V = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) H.set(i, j, A[i * n + j]);
  const d = new Float64Array(n), e = new Float64Array(n), ort = new Float64Array(n);
  orthes(n, H, ort, V);
  const norm = schurQR(n, e, d, V, H);
  schurEigenvectors(n, e, d, V, H, norm);
  return { re: d, im: e, V };
}

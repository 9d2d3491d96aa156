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

/** Householder reflections tried, in turn, when the QR iteration does not deflate. */
const REFLECTIONS = 3;

/**
 * A V = V diag(lambda) for real A (row-major, n x n). The realified matrices of the
 * fluctuation spectra (a complex structure, spectra +-i omega) can hold the QR sweep at a
 * fixed point even with exceptional shifts; then the same problem is solved for Q A Q with a
 * Householder reflection Q = I - 2 u u^T/(u.u) (u fixed, without symmetry), which breaks the
 * structure and not the spectrum, and V = Q V'. A ConvergenceError only if all of them fail.
 */
export function realEigenDecomposition(n: number, A: ArrayLike<number>): RealEigen {
  let failure: unknown;
  for (let t = 0; t <= REFLECTIONS; t++) {
    try {
      if (t === 0) return decompose(n, A);
      const u = Array.from({ length: n }, (_, i) => Math.sin(1.7 * (i + 1) * t + 0.3) + 1.1);
      const uu = u.reduce((x, y) => x + y * y, 0);
      const Q = (i: number, j: number) => (i === j ? 1 : 0) - (2 * u[i] * u[j]) / uu;
      const B = new Float64Array(n * n), QA = new Float64Array(n * n);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) { let x = 0; for (let k = 0; k < n; k++) x += Q(i, k) * A[k * n + j]; QA[i * n + j] = x; }
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) { let x = 0; for (let k = 0; k < n; k++) x += QA[i * n + k] * Q(k, j); B[i * n + j] = x; }
      const r = decompose(n, B);
      const V = new Matrix(n, n);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) { let x = 0; for (let k = 0; k < n; k++) x += Q(i, k) * r.V.get(k, j); V.set(i, j, x); }
      return { re: r.re, im: r.im, V };
    } catch (e) {
      if ((e as Error).name !== 'ConvergenceError') throw e;
      failure = e;
    }
  }
  throw failure;
}

/** Hessenberg reduction, capped QR and back-substitution of one matrix. */
function decompose(n: number, A: ArrayLike<number>): RealEigen {
  const H = new Matrix(n, n), V = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) H.set(i, j, A[i * n + j]);
  const d = new Float64Array(n), e = new Float64Array(n), ort = new Float64Array(n);
  orthes(n, H, ort, V);
  const norm = schurQR(n, e, d, V, H);
  schurEigenvectors(n, e, d, V, H, norm);
  return { re: d, im: e, V };
}

/** Shared helpers of the numerics tests: random matrices and dense products (no code under test). */
import seedrandom from 'seedrandom';
import { Matrix } from 'ml-matrix';

export function randomMatrix(n: number, seed: string, symmetric = false): Matrix {
  const rng = seedrandom(seed), A = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) A.set(i, j, 2 * rng() - 1);
  if (symmetric) for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) A.set(i, j, A.get(j, i));
  return A;
}

/** max |X_ij - Y_ij|. */
export function maxDiff(X: Matrix, Y: Matrix): number {
  let m = 0;
  for (let i = 0; i < X.rows; i++) for (let j = 0; j < X.columns; j++) m = Math.max(m, Math.abs(X.get(i, j) - Y.get(i, j)));
  return m;
}

/** Copy of H with the entries below the first subdiagonal set to zero (the Hessenberg part). */
export function hessenbergPart(H: Matrix): Matrix {
  const T = H.clone();
  for (let i = 0; i < T.rows; i++) for (let j = 0; j < i - 1; j++) T.set(i, j, 0);
  return T;
}

/** Sorted (re, im) pairs, for comparing spectra. */
export function sortedSpectrum(re: ArrayLike<number>, im: ArrayLike<number>): [number, number][] {
  return Array.from({ length: re.length }, (_, i) => [re[i], im[i]] as [number, number])
    .sort((a, b) => a[0] - b[0] || a[1] - b[1]);
}

/**
 * Small dense solves (src/core/numerics/dense-solve.ts): the residual A x = b of the
 * Gaussian elimination, L L^T = A + shift I of the Cholesky factor and its refusal of an
 * indefinite matrix, the Cholesky solve's residual (definitions; common practice, no source).
 */
import { describe, it, expect } from 'vitest';
import seedrandom from 'seedrandom';
import { cholesky, choleskySolve, gaussSolve } from '../../../src/core/numerics/dense-solve.ts';
import { expectAbs } from '../../references.ts';

function random(n: number, seed: string): Float64Array {
  const rng = seedrandom(seed);
  return Float64Array.from({ length: n * n }, () => 2 * rng() - 1);
}

/** B B^T + n I: symmetric positive definite by construction. */
function spd(n: number, seed: string): Float64Array {
  const B = random(n, seed), A = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    let s = i === j ? n : 0;
    for (let k = 0; k < n; k++) s += B[i * n + k] * B[j * n + k];
    A[i * n + j] = s;
  }
  return A;
}

function residual(A: Float64Array, x: Float64Array, b: Float64Array, n: number): number {
  let worst = 0;
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += A[i * n + j] * x[j];
    worst = Math.max(worst, Math.abs(s - b[i]));
  }
  return worst;
}

describe('dense solves', () => {
  it('gaussSolve: A x = b for random A (n = 3, 12, 33)', () => {
    for (const n of [3, 12, 33]) {
      const A = random(n, `A${n}`), b = random(n, `b${n}`).subarray(0, n).slice();
      const x = b.slice();
      expect(gaussSolve(A.slice(), x, n)).toBe(true);
      // Partial pivoting is backward stable: residual ~ n eps |A||x|; |x| of a random system can
      // reach ~1e2, so 1e-10.
      expect(residual(A, x, b, n)).toBeLessThan(1e-10);
    }
  });

  it('gaussSolve: a zero pivot needs the row swap; a singular matrix is refused', () => {
    // [[0, 1], [1, 0]] x = [2, 3] has x = [3, 2] (by inspection).
    const x = Float64Array.from([2, 3]);
    expect(gaussSolve(Float64Array.from([0, 1, 1, 0]), x, 2)).toBe(true);
    expect(Array.from(x)).toEqual([3, 2]);
    expect(gaussSolve(Float64Array.from([1, 2, 2, 4]), Float64Array.from([1, 1]), 2)).toBe(false);
  });

  it('cholesky: L L^T = A + shift I, L lower triangular; choleskySolve solves it', () => {
    const n = 10, A = spd(n, 'chol'), shift = 0.25, L = new Float64Array(n * n);
    expect(cholesky(A, n, shift, L)).toBe(true);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      if (j > i) continue;
      let s = 0;
      for (let k = 0; k <= j; k++) s += L[i * n + k] * L[j * n + k];
      // entries of A ~ n = 10: rounding ~1e-14; 1e-12.
      expectAbs(s, A[i * n + j] + (i === j ? shift : 0), 1e-12);
    }
    const b = Float64Array.from({ length: n }, (_, i) => Math.sin(i + 1)), x = b.slice();
    choleskySolve(L, n, x);
    const As = A.slice();
    for (let i = 0; i < n; i++) As[i * n + i] += shift;
    expect(residual(As, x, b, n)).toBeLessThan(1e-12);
  });

  it('cholesky refuses an indefinite matrix and accepts it once shifted past its lowest eigenvalue', () => {
    // [[1, 2], [2, 1]] has eigenvalues 3 and -1 (by hand).
    const A = Float64Array.from([1, 2, 2, 1]), L = new Float64Array(4);
    expect(cholesky(A, 2, 0, L)).toBe(false);
    expect(cholesky(A, 2, 0.999, L)).toBe(false);
    expect(cholesky(A, 2, 1.001, L)).toBe(true);
  });
});

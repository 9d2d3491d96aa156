/**
 * Lanczos ground state (src/core/ed/lanczos.ts) against an independent dense reference:
 * ml-matrix's EigenvalueDecomposition (tred2/tql2, a general-purpose library, not the code
 * under test), plus the residual identity |A v - lambda v| (common practice, no source).
 */
import { describe, it, expect } from 'vitest';
import seedrandom from 'seedrandom';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { lanczosGround, lowestEigenvalue } from '../../../src/core/ed/lanczos.ts';
import { SOURCES, expectAbs } from '../../references.ts';

function randomSymmetric(n: number, seed: string): Float64Array {
  const rng = seedrandom(seed), A = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) { const x = 2 * rng() - 1; A[i * n + j] = x; A[j * n + i] = x; }
  return A;
}

const product = (A: Float64Array, n: number) => (x: Float64Array, y: Float64Array) => {
  for (let i = 0; i < n; i++) { let s = 0; for (let j = 0; j < n; j++) s += A[i * n + j] * x[j]; y[i] = s; }
};

describe(`Lanczos ground state (reference: ${SOURCES.wilkinsonReinsch})`, () => {
  it('lowest eigenpair of random symmetric matrices matches ml-matrix, A v = lambda v to 1e-10', () => {
    for (const [n, seed] of [[12, 'a'], [40, 'b'], [80, 'c']] as const) {
      const A = randomSymmetric(n, seed);
      const rows = Array.from({ length: n }, (_, i) => Array.from(A.subarray(i * n, (i + 1) * n)));
      const ref = Math.min(...new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true }).realEigenvalues);
      const r = lanczosGround(product(A, n), n, { tolerance: 1e-12 });
      // 1e-10: both are backward stable to ~n eps |A| ~ 1e-13 here; the Lanczos stop is 1e-12 |E|
      // on the residual, and the eigenvalue error is at most residual^2 / gap, far smaller.
      expectAbs(r.energy, ref, 1e-10);
      const Av = new Float64Array(n);
      product(A, n)(r.vector, Av);
      let res = 0, norm = 0;
      for (let i = 0; i < n; i++) { res += (Av[i] - ref * r.vector[i]) ** 2; norm += r.vector[i] ** 2; }
      expectAbs(Math.sqrt(norm), 1, 1e-12);
      expect(Math.sqrt(res)).toBeLessThan(1e-10);
    }
  });

  it('a diagonal operator with a known minimum, started off the ground vector', () => {
    // diag(k - 3) for k = 0..29: lowest eigenvalue -3, vector e_0 (by inspection).
    const D = 30;
    const r = lanczosGround((x, y) => { for (let k = 0; k < D; k++) y[k] = (k - 3) * x[k]; }, D);
    expectAbs(r.energy, -3, 1e-10);
    expectAbs(Math.abs(r.vector[0]), 1, 1e-9);
  });

  it('lowestEigenvalue of the tridiagonal (2, -1) matrix is 2 - 2 cos(pi/(m+1))', () => {
    // Closed form of the discrete Laplacian's spectrum (e.g. Strang, Linear Algebra and its
    // Applications, 2nd ed. (1980); textbook). Bisection to 1e-15 relative, so 1e-13.
    for (const m of [1, 5, 17]) {
      const a = Array(m).fill(2), b = [0, ...Array(m - 1).fill(-1)];
      expectAbs(lowestEigenvalue(a, b), 2 - 2 * Math.cos(Math.PI / (m + 1)), 1e-13);
    }
  });
});

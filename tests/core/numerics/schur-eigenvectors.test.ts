/**
 * Eigenvectors from the real Schur form (src/core/numerics/schur-eigenvectors.ts): every
 * column (real) or column pair (complex, V_j + i V_{j+1}) satisfies A v = lambda v to 1e-10
 * relative (the eigen-equation, common practice, no source), with the eigenvalues checked
 * against ml-matrix's EigenvalueDecomposition (a general-purpose reference library).
 */
import { describe, it, expect } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { orthes } from '../../../src/core/numerics/hessenberg.ts';
import { schurQR } from '../../../src/core/numerics/real-schur.ts';
import { schurEigenvectors } from '../../../src/core/numerics/schur-eigenvectors.ts';
import { randomMatrix, sortedSpectrum } from './schur-helpers.ts';
import { expectAbs } from '../../references.ts';

function eigen(A: Matrix) {
  const n = A.rows, H = A.clone(), V = new Matrix(n, n), d = new Float64Array(n), e = new Float64Array(n);
  orthes(n, H, new Float64Array(n), V);
  const norm = schurQR(n, e, d, V, H);
  schurEigenvectors(n, e, d, V, H, norm);
  return { d, e, V };
}

/** Largest |A v - lambda v| / |v| over the eigenpairs. */
function worstResidual(A: Matrix, d: Float64Array, e: Float64Array, V: Matrix): number {
  const n = A.rows;
  let worst = 0;
  for (let j = 0; j < n; j++) {
    const pair = e[j] !== 0, first = pair && e[j] > 0 ? j : j - 1;
    const vr = Array.from({ length: n }, (_, i) => (pair ? V.get(i, first) : V.get(i, j)));
    const vi = Array.from({ length: n }, (_, i) => (pair ? Math.sign(e[j]) * V.get(i, first + 1) : 0));
    let num = 0, den = 0;
    for (let i = 0; i < n; i++) {
      let ar = 0, ai = 0;
      for (let k = 0; k < n; k++) { ar += A.get(i, k) * vr[k]; ai += A.get(i, k) * vi[k]; }
      num += (ar - (d[j] * vr[i] - e[j] * vi[i])) ** 2 + (ai - (d[j] * vi[i] + e[j] * vr[i])) ** 2;
      den += vr[i] ** 2 + vi[i] ** 2;
    }
    expect(den).toBeGreaterThan(0);
    worst = Math.max(worst, Math.sqrt(num / den));
  }
  return worst;
}

describe('eigenvectors by back-substitution on the Schur form', () => {
  for (const [n, seed] of [[4, 'v4'], [9, 'v9'], [16, 'v16']] as const) {
    it(`n = ${n} random nonsymmetric (complex pairs included)`, () => {
      const A = randomMatrix(n, seed), { d, e, V } = eigen(A);
      expect(e.some((x) => x !== 0)).toBe(true); // a random real matrix of this size has a complex pair
      // Backward-stable eigenpairs of a well-conditioned random matrix: residual ~ n eps |A|; 1e-10.
      expect(worstResidual(A, d, e, V)).toBeLessThan(1e-10);
      const ref = new EigenvalueDecomposition(A);
      const got = sortedSpectrum(d, e), want = sortedSpectrum(ref.realEigenvalues, ref.imaginaryEigenvalues);
      for (let i = 0; i < n; i++) { expectAbs(got[i][0], want[i][0], 1e-9); expectAbs(got[i][1], want[i][1], 1e-9); }
    });
  }

  it('upper triangular matrix: eigenvalues on the diagonal, eigenvectors satisfy A v = lambda v', () => {
    // Eigenvalues of a triangular matrix are its diagonal (elementary).
    const A = new Matrix([[1, 2, 3], [0, 4, 5], [0, 0, 6]]), { d, e, V } = eigen(A);
    expect(Array.from(d).sort((a, b) => a - b)).toEqual([1, 4, 6]);
    expect(Array.from(e)).toEqual([0, 0, 0]);
    expect(worstResidual(A, d, e, V)).toBeLessThan(1e-12);
  });
});

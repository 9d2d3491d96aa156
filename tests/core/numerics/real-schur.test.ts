/**
 * Real Schur form by Francis QR (src/core/numerics/real-schur.ts), after the Hessenberg
 * reduction: the Schur vectors V are orthogonal, V T V^T = A with T quasi-triangular (the
 * definition of the real Schur decomposition, Golub and Van Loan, Matrix Computations,
 * Thm 7.4.1), and the eigenvalues d + i e match ml-matrix's EigenvalueDecomposition.
 */
import { describe, it, expect } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { orthes } from '../../../src/core/numerics/hessenberg.ts';
import { schurQR } from '../../../src/core/numerics/real-schur.ts';
import { ConvergenceError } from '../../../src/core/convergence-error.ts';
import { hessenbergPart, maxDiff, randomMatrix, sortedSpectrum } from './schur-helpers.ts';
import { SOURCES, expectAbs } from '../../references.ts';

describe(`real Schur form (${SOURCES.wilkinsonReinsch})`, () => {
  for (const [n, seed] of [[3, 's3'], [7, 's7'], [20, 's20']] as const) {
    it(`n = ${n} random nonsymmetric: V^T V = I, V T V^T = A, eigenvalues as ml-matrix`, () => {
      const A = randomMatrix(n, seed), H = A.clone(), V = new Matrix(n, n);
      orthes(n, H, new Float64Array(n), V);
      const d = new Float64Array(n), e = new Float64Array(n);
      schurQR(n, e, d, V, H);
      const T = hessenbergPart(H);
      // Quasi-triangular: a subdiagonal entry survives only inside a 2x2 block of a complex pair.
      for (let j = 0; j + 1 < n; j++) if (e[j] === 0 || e[j + 1] === 0 || e[j] < 0) expectAbs(T.get(j + 1, j), 0, 1e-12);
      // Orthogonal transformations, backward stable: ~n eps |A| ~ 1e-14; 1e-10 is loose.
      expect(maxDiff(V.transpose().mmul(V), Matrix.eye(n))).toBeLessThan(1e-10);
      expect(maxDiff(V.mmul(T).mmul(V.transpose()), A)).toBeLessThan(1e-10);
      const ref = new EigenvalueDecomposition(A);
      const got = sortedSpectrum(d, e), want = sortedSpectrum(ref.realEigenvalues, ref.imaginaryEigenvalues);
      // well-separated eigenvalues of a random matrix: condition numbers O(10), so 1e-9
      for (let i = 0; i < n; i++) { expectAbs(got[i][0], want[i][0], 1e-9); expectAbs(got[i][1], want[i][1], 1e-9); }
    });
  }

  it('rotation by theta: the complex pair cos theta +- i sin theta', () => {
    // Eigenvalues of a plane rotation (elementary, no source).
    const th = 0.9, A = new Matrix([[Math.cos(th), -Math.sin(th)], [Math.sin(th), Math.cos(th)]]);
    const H = A.clone(), V = new Matrix(2, 2), d = new Float64Array(2), e = new Float64Array(2);
    orthes(2, H, new Float64Array(2), V);
    schurQR(2, e, d, V, H);
    expectAbs(d[0], Math.cos(th), 1e-15); expectAbs(d[1], Math.cos(th), 1e-15);
    expectAbs(e[0], Math.sin(th), 1e-15); expectAbs(e[1], -Math.sin(th), 1e-15);
  });

  it('a non-finite entry is a ConvergenceError, not a hang', () => {
    const H = new Matrix([[1, NaN], [1, 1]]);
    expect(() => schurQR(2, new Float64Array(2), new Float64Array(2), Matrix.eye(2), H)).toThrow(ConvergenceError);
  });
});

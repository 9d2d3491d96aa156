/**
 * Householder reduction to Hessenberg form (src/core/numerics/hessenberg.ts): for H = Q^T A Q
 * the invariants Q^T Q = I, Q H Q^T = A, H upper Hessenberg (definition of the reduction,
 * Golub and Van Loan, Matrix Computations, sec. 7.4; common practice), and the spectrum of H
 * equals ml-matrix's EigenvalueDecomposition of A (a general-purpose reference library).
 */
import { describe, it, expect } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { orthes } from '../../../src/core/numerics/hessenberg.ts';
import { hessenbergPart, maxDiff, randomMatrix, sortedSpectrum } from './schur-helpers.ts';
import { expectAbs } from '../../references.ts';

describe('Hessenberg reduction (orthes/ortran)', () => {
  for (const [n, seed] of [[2, 'h2'], [6, 'h6'], [15, 'h15']] as const) {
    it(`n = ${n}: Q^T Q = I, Q H Q^T = A, spectrum preserved`, () => {
      const A = randomMatrix(n, seed), H = A.clone(), Q = new Matrix(n, n);
      orthes(n, H, new Float64Array(n), Q);
      // orthes leaves the annihilated entries below the subdiagonal as workspace: the
      // reduced matrix is the Hessenberg part.
      const T = hessenbergPart(H);
      // Householder products are orthogonal to ~n eps (backward stability): 1e-10 is loose
      // for n <= 15 and entries of order 1.
      expect(maxDiff(Q.transpose().mmul(Q), Matrix.eye(n))).toBeLessThan(1e-10);
      expect(maxDiff(Q.mmul(T).mmul(Q.transpose()), A)).toBeLessThan(1e-10);
      const a = new EigenvalueDecomposition(A), t = new EigenvalueDecomposition(T);
      const sa = sortedSpectrum(a.realEigenvalues, a.imaginaryEigenvalues);
      const st = sortedSpectrum(t.realEigenvalues, t.imaginaryEigenvalues);
      for (let i = 0; i < n; i++) { expectAbs(st[i][0], sa[i][0], 1e-9); expectAbs(Math.abs(st[i][1]), Math.abs(sa[i][1]), 1e-9); }
    });
  }

  it('a symmetric matrix becomes tridiagonal (Q^T A Q is symmetric and Hessenberg)', () => {
    const n = 8, A = randomMatrix(n, 'sym', true), H = A.clone(), Q = new Matrix(n, n);
    orthes(n, H, new Float64Array(n), Q);
    const T = hessenbergPart(H);
    for (let i = 0; i < n; i++) for (let j = i + 2; j < n; j++) expectAbs(T.get(i, j), 0, 1e-12);
  });
});

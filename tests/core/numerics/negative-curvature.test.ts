/**
 * Levenberg shift and the direction of most negative curvature
 * (src/core/numerics/negative-curvature.ts), against the spectrum of H from ml-matrix's
 * EigenvalueDecomposition (a general-purpose reference library): the shift must exceed
 * -lambda_min (H + shift I positive definite), and the softest direction must be the
 * eigenvector of lambda_min (Nocedal and Wright, Numerical Optimization, 2nd ed., sec. 3.4, 4.3).
 */
import { describe, it, expect } from 'vitest';
import seedrandom from 'seedrandom';
import { EigenvalueDecomposition, Matrix, QrDecomposition } from 'ml-matrix';
import { levenbergFactor, softestDirection } from '../../../src/core/numerics/negative-curvature.ts';
import { ConvergenceError } from '../../../src/core/convergence-error.ts';
import { expectAbs } from '../../references.ts';

function randomSymmetric(n: number, seed: string): Float64Array {
  const rng = seedrandom(seed), H = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) { const x = 2 * rng() - 1; H[i * n + j] = x; H[j * n + i] = x; }
  return H;
}

function lowest(H: Float64Array, n: number): { value: number } {
  const rows = Array.from({ length: n }, (_, i) => Array.from(H.subarray(i * n, (i + 1) * n)));
  const ev = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true });
  return { value: Math.min(...ev.realEigenvalues) };
}

describe('Levenberg shift and softest direction', () => {
  it('a positive definite Hessian needs no shift', () => {
    const H = Float64Array.from([2, 1, 1, 2]), L = new Float64Array(4);
    expect(levenbergFactor(H, 2, L)).toBe(0);
  });

  it('indefinite random Hessian: the shift lies in (-lambda_min, 8 (-lambda_min) + margin]', () => {
    for (const seed of ['n1', 'n2', 'n3']) {
      const n = 8, H = randomSymmetric(n, seed), L = new Float64Array(n * n);
      const { value } = lowest(H, n);
      expect(value).toBeLessThan(0);
      const shift = levenbergFactor(H, n, L);
      // The least shift is found up to a factor 4 and then doubled (documented), so
      // -lambda_min < shift <= 8 (-lambda_min) plus the 1e-8 starting step.
      expect(shift).toBeGreaterThan(-value);
      expect(shift).toBeLessThanOrEqual(-8 * value + 1e-6);
    }
  });

  it('softest direction: the eigenvector of lambda_min of H = Q diag(-1, 3, 4, ...) Q^T, downhill', () => {
    // H built here with a known spectrum and eigenvectors (Q orthogonal from ml-matrix's QR of a
    // random matrix), so the reference vector is Q's first column.
    const n = 7, rng = seedrandom('soft');
    const R = new Matrix(Array.from({ length: n }, () => Array.from({ length: n }, () => 2 * rng() - 1)));
    const Q = new QrDecomposition(R).orthogonalMatrix;
    const lambda = [-1, 3, 4, 5, 6, 7, 8];
    const H = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += Q.get(i, k) * lambda[k] * Q.get(j, k);
      H[i * n + j] = s;
    }
    const L = new Float64Array(n * n), shift = levenbergFactor(H, n, L);
    expect(shift).toBeGreaterThan(1);
    expect(shift).toBeLessThanOrEqual(8 + 1e-6);
    const grad = Array.from({ length: n }, (_, i) => Math.cos(i));
    const v = softestDirection(L, n, grad, 60, new Float64Array(n));
    const norm = Math.hypot(...v);
    const overlap = Math.abs(v.reduce((s, x, i) => s + x * Q.get(i, 0), 0)) / norm;
    // Inverse iteration gains a factor (shift - 1)/(shift + 3) <= 7/11 per sweep: after 60 sweeps
    // the angle is below 1e-11, and 1 - overlap ~ angle^2 / 2; 1e-10 covers rounding.
    expectAbs(overlap, 1, 1e-10);
    expect(v.reduce((s, x, i) => s + x * grad[i], 0)).toBeLessThanOrEqual(0);
    expectAbs(Math.max(...v.map(Math.abs)), 1, 1e-15); // unit max-norm, as documented
  });

  it('a non-finite Hessian is a ConvergenceError', () => {
    expect(() => levenbergFactor(Float64Array.from([1, Infinity, Infinity, 1]), 2, new Float64Array(4))).toThrow(ConvergenceError);
  });
});

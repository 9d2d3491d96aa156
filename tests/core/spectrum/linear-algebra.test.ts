import { describe, it, expect } from 'vitest';
import seedrandom from 'seedrandom';
import { Matrix, inverse } from 'ml-matrix';
import { complexEigenvalues, realEigen } from '../../../src/core/spectrum/complex-eigen.ts';
import { background } from '../../../src/core/spectrum/background.ts';
import { dynamicalMatrix } from '../../../src/core/spectrum/linearised.ts';
import { stabilityMatrix } from '../../../src/core/softmode/stability-matrix.ts';
import { SOURCES, expectAbs } from '../../references.ts';

/** Real form [[X, -Y], [Y, X]] of a complex matrix given as real-form blocks. */
function realForm(X: number[][], Y: number[][]): Matrix {
  const n = X.length;
  const R = new Matrix(2 * n, 2 * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    R.set(i, j, X[i][j]); R.set(i, n + j, -Y[i][j]); R.set(n + i, j, Y[i][j]); R.set(n + i, n + j, X[i][j]);
  }
  return R;
}

describe(`complex eigenvalues through the real form (ml-matrix hqr2; ${SOURCES.wilkinsonReinsch})`, () => {
  it('recovers the spectrum of S D S^-1 for complex D, including conjugate pairs and repeats', () => {
    // Invariant test: the eigenvalues of a similarity transform of a diagonal matrix are its
    // diagonal. D holds lambda and conj(lambda) together (the case where eig(A) and
    // conj(eig(A)) overlap, every value double in the real form) and an exact repeat.
    const rng = seedrandom('complex-eigen');
    const D: [number, number][] = [[0.3, -1.2], [0.3, 1.2], [-0.5, 0.7], [2, 0], [1.1, -0.4], [1.1, -0.4]];
    const n = D.length;
    const S = Array.from({ length: n }, () => Array.from({ length: n }, () => rng() - 0.5));
    const T = Array.from({ length: n }, () => Array.from({ length: n }, () => rng() - 0.5));
    const RS = realForm(S, T);
    const RD = realForm(D.map((d, i) => D.map((_, j) => (i === j ? d[0] : 0))), D.map((d, i) => D.map((_, j) => (i === j ? d[1] : 0))));
    const RA = RS.mmul(RD).mmul(inverse(RS));
    const X = new Float64Array(n * n), Y = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) { X[i * n + j] = RA.get(i, j); Y[i * n + j] = RA.get(n + i, j); }
    const ev = complexEigenvalues(n, X, Y);
    const got = Array.from(ev.re, (r, i) => [r, ev.im[i]]).sort((a, b) => a[0] - b[0] || a[1] - b[1]);
    const want = [...D].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
    // 1e-7: the repeated value is a double root, its computed copies split by ~sqrt(eps) at worst.
    got.forEach((g, i) => { expectAbs(g[0], want[i][0], 1e-7); expectAbs(g[1], want[i][1], 1e-7); });
  });

  it('real eigenvectors satisfy A v = lambda v (the hqr2 pair convention)', () => {
    const A = Float64Array.from([0, 2, 0, -1, 0, 1, 0.5, 0.3, -0.2]);
    const ev = realEigen(3, A);
    for (let j = 0; j < 3; j++) {
      const v = ev.vec(j);
      for (let i = 0; i < 3; i++) {
        let re = 0, im = 0;
        for (let k = 0; k < 3; k++) { re += A[i * 3 + k] * v.re[k]; im += A[i * 3 + k] * v.im[k]; }
        // (lr + i li)(vr + i vi)
        expectAbs(re, ev.re[j] * v.re[i] - ev.im[j] * v.im[i], 1e-12);
        expectAbs(im, ev.re[j] * v.im[i] + ev.im[j] * v.re[i], 1e-12);
      }
    }
  });
});

describe('Hamiltonian structure: the linear map is the Poisson tensor times the Hessian', () => {
  /**
   * The mean-field equations are Hamiltonian in the free energy phi (stability-matrix.ts):
   * du/dt = 2 M r dphi/dv, dv/dt = -2 M r dphi/du for each sublattice's transverse amplitudes
   * (spin Poisson bracket {S_a, S_b} = 2 eps_abc S_c, weight 1/M per sublattice), and
   * d(da)/dt = (1/2) dphi/db, d(db)/dt = -(1/2) dphi/da for the photon. So A(k) built from
   * the equations of motion must equal Omega H_TT(k), with H = D^{1/2} Sigma D^{1/2} the raw
   * Hessian restricted to the transverse coordinates (common practice, no source;
   * tolerance 1e-12, exact arithmetic).
   */
  const cases = [
    { name: 'thermal density wave, k = 0.7', inp: { densities: [0.8, 0.3, 0.45], alpha: 0 }, k: 0.7 },
    { name: 'supersolid-like state, k = 1.9', inp: { densities: [0.8, 0.3, 0.45], alpha: 0.35 }, k: 1.9 },
    { name: 'normal state at the zone centre (photon)', inp: { densities: [0.2, 0.6, 0.35], alpha: 0 }, k: 0 },
  ];
  for (const c of cases) {
    it(c.name, () => {
      const bg = background({ lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.2 }, cell: { a: 3, b: 0, c: 1 }, mu: 0.4, delta: 2, T: 0.3, ...c.inp });
      const A = dynamicalMatrix(bg, [c.k, 0]);
      const S = stabilityMatrix(bg, [c.k, 0]);
      const coords = S.coords;
      // transverse coordinates of the stability matrix, in the order of the dynamical matrix
      const idx: number[] = [];
      coords.forEach((co, i) => { if (co.kind !== 'spin') idx.push(i); });
      for (let s = 0; s < bg.M; s++) {
        const own = coords.map((co, i) => [co, i] as const).filter(([co]) => co.kind === 'spin' && co.s === s).slice(0, 2);
        idx.push(...own.map(([, i]) => i));
      }
      expect(idx.length).toBe(A.n);
      const H = (i: number, j: number, part: 're' | 'im') => S[part][idx[i] * S.n + idx[j]] * Math.sqrt(coords[idx[i]].d * coords[idx[j]].d);
      const omegaRow = (i: number): [number, number] => {
        if (A.photon && i < 2) return i === 0 ? [1, 0.5] : [0, -0.5];
        const s = Math.floor((i - A.offset) / 2), w = 2 * bg.M * bg.r[s];
        return (i - A.offset) % 2 === 0 ? [i + 1, w] : [i - 1, -w];
      };
      for (let i = 0; i < A.n; i++) {
        const [p, w] = omegaRow(i);
        for (let j = 0; j < A.n; j++) {
          expectAbs(A.re[i * A.n + j], w * H(p, j, 're'), 1e-12);
          expectAbs(A.im[i * A.n + j], w * H(p, j, 'im'), 1e-12);
        }
      }
    });
  }
});

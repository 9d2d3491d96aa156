/**
 * The lowest eigenvalue of the stability matrix Sigma(k) (stability-matrix.ts) and what its
 * eigenvector is made of. Hermitian Sigma = X + iY is diagonalised through its real
 * symmetric form [[X, -Y], [Y, X]] (every eigenvalue twice; [x; y] gives the eigenvector
 * x + iy) with ml-matrix's symmetric EigenvalueDecomposition (Householder tridiagonalisation
 * and QL, tred2/tql2); a real Sigma directly.
 *
 * Kind of the soft mode: away from the zone centre the photon is absent and a soft mode
 * modulates the density with the wavevector ('density'). At the zone centre the
 * eigenvector's weights in raw coordinates decide: photon |da|^2 + |db|^2 plus coherence
 * (1/M) sum |dS^x|^2 + |dS^y|^2 against density (1/M) sum |dS^z|^2; the larger names it
 * ('photon': condensation or a change of the condensate; 'density').
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { Vec2 } from '../lattice/geometry.ts';
import type { Background } from '../spectrum/background.ts';
import { stabilityMatrix } from './stability-matrix.ts';

export type SoftKind = 'density' | 'photon';

export interface LowestMode {
  /** Lowest eigenvalue of Sigma(k) (Goldstone mode excluded): 1 free, 0 at an instability. */
  value: number;
  kind: SoftKind;
}

/** Lowest eigenvalue of Sigma(k) and the kind of its mode. */
export function lowestMode(bg: Background, k: Vec2): LowestMode {
  const S = stabilityMatrix(bg, k);
  const n = S.n;
  if (!S.photon && S.real) return { value: lowestReal(S.re, n), kind: 'density' };
  if (!S.photon) {
    const N = 2 * n;
    const R = new Matrix(N, N);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const x = S.re[i * n + j], y = S.im[i * n + j];
        R.set(i, j, x); R.set(i, n + j, -y); R.set(n + i, j, y); R.set(n + i, n + j, x);
      }
    }
    const ev = new EigenvalueDecomposition(R, { assumeSymmetric: true });
    return { value: Math.min(...ev.realEigenvalues), kind: 'density' };
  }
  const m = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) m.set(i, j, S.re[i * n + j]);
  const ev = new EigenvalueDecomposition(m, { assumeSymmetric: true });
  const d = ev.realEigenvalues;
  let j0 = 0;
  for (let j = 1; j < n; j++) if (d[j] < d[j0]) j0 = j;
  let wp = 0;
  for (let i = 0; i < n; i++) if (S.coords[i].kind !== 'spin') wp += ev.eigenvectorMatrix.get(i, j0) ** 2 / S.coords[i].d;
  const { wc, wd } = sublatticeWeights(bg, S.coords, (i) => ev.eigenvectorMatrix.get(i, j0));
  return { value: d[j0], kind: wp + wc >= wd ? 'photon' : 'density' };
}

/** Coherence and density weights of a mode: components along the frame vectors add per sublattice. */
function sublatticeWeights(bg: Background, coords: ReturnType<typeof stabilityMatrix>['coords'], x: (i: number) => number): { wc: number; wd: number } {
  const dS = new Float64Array(3 * bg.M);
  coords.forEach((c, i) => {
    if (c.kind !== 'spin') return;
    const v = x(i) / Math.sqrt(c.d);
    for (let a = 0; a < 3; a++) dS[3 * c.s + a] += v * c.e[a];
  });
  let wc = 0, wd = 0;
  for (let s = 0; s < bg.M; s++) {
    wc += (dS[3 * s] ** 2 + dS[3 * s + 1] ** 2) / bg.M;
    wd += dS[3 * s + 2] ** 2 / bg.M;
  }
  return { wc, wd };
}

/** Lowest eigenvalue of a real symmetric matrix (closed forms for n <= 2). */
function lowestReal(A: Float64Array, n: number): number {
  if (n === 1) return A[0];
  if (n === 2) {
    const m = (A[0] + A[3]) / 2, d = (A[0] - A[3]) / 2;
    return m - Math.hypot(d, A[1]);
  }
  const m = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) m.set(i, j, A[i * n + j]);
  return Math.min(...new EigenvalueDecomposition(m, { assumeSymmetric: true }).realEigenvalues);
}

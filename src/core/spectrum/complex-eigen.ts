/**
 * Eigenvalues of a complex n x n matrix A = X + iY with the real eigensolver of
 * numerics/real-eigen.ts (Hessenberg reduction and capped double-shift QR, hqr2; Wilkinson
 * and Reinsch, Handbook for Automatic Computation II (1971)), through the real form
 *
 *   R = [[X, -Y], [Y, X]]   (2n x 2n),   eig(R) = eig(A) u conj(eig(A)).
 *
 * An eigenvector w = [x; y] of R belongs to eig(A) when z = x + iy != 0 (then A z = lambda z)
 * and to conj(eig(A)) when x + iy = 0: the lambda-eigenspace of R is
 * {[z; -iz] : A z = lambda z} (+) {[u; iu] : conj(A) u = lambda u}, the two parts orthogonal.
 * Eigenvalues of R closer than a relative 1e-6 form a cluster; a cluster keeps as many
 * values as the rank of its vectors z (the geometric multiplicity in A). The ±sqrt(eps)
 * splitting of a defective pair stays inside one cluster.
 */
import { realEigenDecomposition } from '../numerics/real-eigen.ts';

export interface Eigenvalues {
  re: Float64Array;
  im: Float64Array;
}

/** Eigenvalues and eigenvectors of a real n x n matrix (row-major). vec(j) is the complex eigenvector of value j. */
export function realEigen(n: number, A: Float64Array): Eigenvalues & { vec(j: number): { re: Float64Array; im: Float64Array } } {
  const { re: d, im: e, V } = realEigenDecomposition(n, A);
  return {
    re: Float64Array.from(d), im: Float64Array.from(e),
    vec(j) {
      const vr = new Float64Array(n), vi = new Float64Array(n);
      if (e[j] === 0) {
        for (let i = 0; i < n; i++) vr[i] = V.get(i, j);
      } else {
        // hqr2 stores a pair as columns (p, p+1) with e[p] > 0: eigenvector of d + i e[p] is V_p + i V_{p+1}.
        const p = e[j] > 0 ? j : j - 1, sign = e[j] > 0 ? 1 : -1;
        for (let i = 0; i < n; i++) { vr[i] = V.get(i, p); vi[i] = sign * V.get(i, p + 1); }
      }
      return { re: vr, im: vi };
    },
  };
}

/** Relative distance under which eigenvalues of the real form are one cluster. */
const CLUSTER = 1e-6;
/** Norm of z/|w| (at most sqrt 2) above which a vector counts towards the rank. */
const RANK_TOL = 1e-3;

/** The n eigenvalues of A = X + iY (row-major re, im). */
export function complexEigenvalues(n: number, X: Float64Array, Y: Float64Array): Eigenvalues {
  const N = 2 * n;
  const R = new Float64Array(N * N);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const x = X[i * n + j], y = Y[i * n + j];
      R[i * N + j] = x; R[i * N + n + j] = -y;
      R[(n + i) * N + j] = y; R[(n + i) * N + n + j] = x;
    }
  }
  const ev = realEigen(N, R);
  let scale = 1;
  for (let j = 0; j < N; j++) scale = Math.max(scale, Math.hypot(ev.re[j], ev.im[j]));
  // z = x + iy per eigenvector, normalised by |w|.
  const zs: { re: Float64Array; im: Float64Array; norm: number }[] = [];
  for (let j = 0; j < N; j++) {
    const w = ev.vec(j);
    let wn = 0;
    for (let i = 0; i < N; i++) wn += w.re[i] * w.re[i] + w.im[i] * w.im[i];
    wn = Math.sqrt(wn) || 1;
    const zr = new Float64Array(n), zi = new Float64Array(n);
    let zn = 0;
    for (let i = 0; i < n; i++) {
      zr[i] = (w.re[i] - w.im[n + i]) / wn;
      zi[i] = (w.im[i] + w.re[n + i]) / wn;
      zn += zr[i] * zr[i] + zi[i] * zi[i];
    }
    zs.push({ re: zr, im: zi, norm: Math.sqrt(zn) });
  }
  // Clusters by union-find on close eigenvalues.
  const parent = Array.from({ length: N }, (_, i) => i);
  const find = (i: number): number => (parent[i] === i ? i : (parent[i] = find(parent[i])));
  for (let i = 0; i < N; i++) {
    for (let j = i + 1; j < N; j++) {
      if (Math.hypot(ev.re[i] - ev.re[j], ev.im[i] - ev.im[j]) <= CLUSTER * scale) parent[find(i)] = find(j);
    }
  }
  const clusters = new Map<number, number[]>();
  for (let i = 0; i < N; i++) { const c = find(i); if (!clusters.has(c)) clusters.set(c, []); clusters.get(c)!.push(i); }
  const keep: number[] = [];
  for (const members of clusters.values()) {
    members.sort((a, b) => zs[b].norm - zs[a].norm);
    const rank = clusterRank(members.map((j) => zs[j]));
    keep.push(...members.slice(0, rank));
  }
  if (keep.length !== n) {
    // Should not happen; fall back to the n vectors with the largest z.
    keep.length = 0;
    keep.push(...Array.from({ length: N }, (_, i) => i).sort((a, b) => zs[b].norm - zs[a].norm).slice(0, n));
  }
  return { re: Float64Array.from(keep, (j) => ev.re[j]), im: Float64Array.from(keep, (j) => ev.im[j]) };
}

/** Numerical rank of complex vectors by modified Gram-Schmidt. */
function clusterRank(vs: { re: Float64Array; im: Float64Array }[]): number {
  const basis: { re: Float64Array; im: Float64Array }[] = [];
  for (const v of vs) {
    const r = Float64Array.from(v.re), i = Float64Array.from(v.im);
    for (const b of basis) {
      // c = <b, v> = sum conj(b) v
      let cr = 0, ci = 0;
      for (let k = 0; k < r.length; k++) { cr += b.re[k] * r[k] + b.im[k] * i[k]; ci += b.re[k] * i[k] - b.im[k] * r[k]; }
      for (let k = 0; k < r.length; k++) { r[k] -= cr * b.re[k] - ci * b.im[k]; i[k] -= cr * b.im[k] + ci * b.re[k]; }
    }
    let nn = 0;
    for (let k = 0; k < r.length; k++) nn += r[k] * r[k] + i[k] * i[k];
    nn = Math.sqrt(nn);
    if (nn > RANK_TOL) {
      for (let k = 0; k < r.length; k++) { r[k] /= nn; i[k] /= nn; }
      basis.push({ re: r, im: i });
    }
  }
  return basis.length;
}

/**
 * Exact diagonalisation against ml-matrix's dense symmetric eigensolver
 * (EigenvalueDecomposition, the tred2/tql2 Householder-QL algorithm) for N <= 8. The dense
 * matrix is built here from the cluster's V_ij alone:
 *   H_ss = -mu sum_i n_i + sum_{i<j} V_ij n_i n_j,   H_{s, s^i} = -alpha.
 */
import { describe, it, expect } from 'vitest';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { exactDiagonalisation, type EdRequest } from '../../../src/core/ed/exact-diagonalisation.ts';
import { buildCluster } from '../../../src/core/cluster/spec.ts';
import { parseSiteCsv } from '../../../src/core/cluster/site-array.ts';
import { expectAbs } from '../../references.ts';

/** Dense H on the states `states` (all 2^N, or a blockade subset), its ground energy and <n_i n_j>. */
function denseGround(req: EdRequest, keep: (s: number) => boolean = () => true) {
  const c = buildCluster(req.cluster), N = c.N, alpha = req.alpha as number;
  const states = Array.from({ length: 2 ** N }, (_, s) => s).filter(keep);
  const index = new Map(states.map((s, k) => [s, k]));
  const D = states.length, H = Matrix.zeros(D, D);
  states.forEach((s, k) => {
    let e = 0;
    for (let i = 0; i < N; i++) {
      if (!((s >> i) & 1)) continue;
      e -= req.mu;
      for (let j = 0; j < i; j++) if ((s >> j) & 1) e += c.V[i * N + j];
    }
    H.set(k, k, e);
    for (let i = 0; i < N; i++) { const t = index.get(s ^ (1 << i)); if (t !== undefined) H.set(k, t, -alpha); }
  });
  expect(H.isSymmetric()).toBe(true);
  const evd = new EigenvalueDecomposition(H, { assumeSymmetric: true });
  const ev = evd.realEigenvalues;
  let g = 0;
  for (let q = 1; q < D; q++) if (ev[q] < ev[g]) g = q;
  const psi = evd.eigenvectorMatrix.getColumn(g);
  const pair = new Float64Array(N * N);
  states.forEach((s, k) => {
    for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) if ((s >> i) & 1 && (s >> j) & 1) pair[i * N + j] += psi[k] ** 2;
  });
  return { E0: ev[g], pair, N, cluster: c, gap: Math.min(...ev.filter((_, q) => q !== g)) - ev[g] };
}

/** S(k) from the dense ground vector by the definition (1/N) sum_ij cos(k.(ri - rj)) (<ninj> - <ni><nj>). */
function denseS(d: ReturnType<typeof denseGround>, kx: number, ky: number): number {
  const { N, pair, cluster: c } = d;
  let s = 0;
  for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) {
    const ph = kx * (c.positions[2 * i] - c.positions[2 * j]) + ky * (c.positions[2 * i + 1] - c.positions[2 * j + 1]);
    s += Math.cos(ph) * (pair[i * N + j] - pair[i * N + i] * pair[j * N + j]);
  }
  return s / N;
}

const csv = '# a hexagon with its centre, 4 um apart\nx,y\n0,0\n4,0\n2,3.4641016151377544\n-2,3.4641016151377544\n-4,0\n-2,-3.4641016151377544\n2,-3.4641016151377544\n';
const cases: [string, EdRequest][] = [
  ['vdw ring of 8', { cluster: { kind: 'periodic', lattice: 'chain', size: [8], interaction: { shape: 'vdw', Rb: 1.5 } }, mu: 1.5, alpha: 0.7 }],
  ['square 2x4 dipolar', { cluster: { kind: 'periodic', lattice: 'square', size: [2, 4], interaction: { shape: 'dipolar', Rb: 1.2 } }, mu: 0.8, alpha: 0.5 }],
  ['triangular 3x2 softcore', { cluster: { kind: 'periodic', lattice: 'triangular', size: [3, 2], interaction: { shape: 'softcore', V0: 3, Rc: 1.4 } }, mu: 2, alpha: 0.2 }],
  ['CSV hexagon, 4 um spacing', { cluster: { kind: 'array', lattice: 'triangular', positions: parseSiteCsv(csv, 4), interaction: { shape: 'vdw', Rb: 1.1 } }, mu: 1, alpha: 0.4 }],
];

describe('ED against the dense eigensolver of ml-matrix (N <= 8)', () => {
  for (const [name, req] of cases) {
    it(`${name}: ground energy to 1e-10, density and S(k) of the ground vector to 1e-8`, () => {
      const ed = exactDiagonalisation(req), d = denseGround(req);
      // tolerance 1e-10 on E0 (both exact to rounding, Lanczos residual 1e-10 relative);
      // ground-vector observables carry the vector error residual/gap, so 1e-8 (gaps here are > 0.05).
      expect(d.gap).toBeGreaterThan(0.05);
      expectAbs(ed.energyPerSite * d.N, d.E0, 1e-10);
      for (let i = 0; i < d.N; i++) expectAbs(ed.siteDensities[i], d.pair[i * d.N + i], 1e-8);
      for (const p of ed.structureFactor) expectAbs(p.value, denseS(d, p.k[0], p.k[1]), 1e-8);
      // m^2 = S(k)/N + |(1/N) sum_i e^{ik r_i} <n_i>|^2 at the reported k (identity of the definitions).
      const o = ed.orderParameter!, N = d.N;
      let re = 0, im = 0;
      for (let i = 0; i < N; i++) {
        const ph = o.k[0] * d.cluster.positions[2 * i] + o.k[1] * d.cluster.positions[2 * i + 1];
        re += Math.cos(ph) * d.pair[i * N + i] / N; im += Math.sin(ph) * d.pair[i * N + i] / N;
      }
      expectAbs(o.value, denseS(d, o.k[0], o.k[1]) / N + re * re + im * im, 1e-8);
    });
  }

  it('blockade-truncated basis equals the dense H restricted to the same states; E0 rises (interlacing)', () => {
    const req: EdRequest = { cluster: { kind: 'periodic', lattice: 'chain', size: [8], interaction: { shape: 'vdw', Rb: 1.3 } }, mu: 1, alpha: 0.4, blockade: 2 };
    const c = buildCluster(req.cluster);
    const allowed = (s: number) => {
      for (let i = 0; i < 8; i++) for (let j = 0; j < i; j++) if ((s >> i) & 1 && (s >> j) & 1 && c.V[i * 8 + j] >= 2) return false;
      return true;
    };
    const ed = exactDiagonalisation(req), d = denseGround(req, allowed);
    expect(ed.basis).toBe('blockade');
    // 1e-10 as above.
    expectAbs(ed.energyPerSite * 8, d.E0, 1e-10);
    const full = exactDiagonalisation({ ...req, blockade: undefined });
    // Cauchy interlacing: the lowest eigenvalue of a principal submatrix is not below that of H.
    expect(ed.energyPerSite).toBeGreaterThanOrEqual(full.energyPerSite - 1e-12);
  });
});

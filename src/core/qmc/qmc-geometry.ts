/**
 * What a Monte Carlo run needs to know of its cluster: the couplings the sampler draws
 * bonds from, the momenta of the structure factor and the distance shells of C(r).
 *
 * Periodic clusters are tori stored by displacement (torus.ts), so they scale to thousands
 * of sites; density Fourier components n_k = sum_r n_r exp(-i k.r) are then separable,
 *   n_(m1, m2) = sum_y exp(-2 pi i m2 y / Ly) sum_x exp(-2 pi i m1 x / Lx) n_(x, y),
 * at O(N (Lx + Ly)) a measurement. A user's array keeps the dense pair tables of the
 * exact diagonalisation (cluster.ts) and its momentum grid, with n_k summed directly.
 */
import { InputError } from '../input-error.ts';
import type { ClusterSpec } from '../cluster/spec.ts';
import { buildCluster } from '../cluster/spec.ts';
import { shellPairCounts, type Cluster } from '../cluster/cluster.ts';
import { lattice } from '../lattice/geometry.ts';
import { type Torus, torus } from './torus.ts';
import type { SseCouplings } from './sse-terms.ts';

/** Distances closer than this are one shell. */
const SHELL_TOLERANCE = 1e-9;

export interface QmcGeometry {
  readonly kind: 'torus' | 'array';
  readonly N: number;
  readonly couplings: SseCouplings;
  readonly positions: Float64Array;
  /** Momenta (kx, ky) at [2q], [2q + 1] and their integer labels (m1, m2). */
  readonly momenta: Float64Array;
  readonly momentumLabels: Int32Array;
  /** Distance shells of C(r), ascending, and the ordered pairs in each. */
  readonly shells: Float64Array;
  readonly shellPairs: Float64Array;
  /** Torus: shell of displacement d (-1 for d = 0). */
  readonly shellOfDisplacement: Int32Array | null;
  readonly torus: Torus | null;
  /** Array: the dense cluster (V_ij, shells of pairs). */
  readonly cluster: Cluster | null;
}

/** Build the geometry of a cluster spec; periodic specs become tori of any size up to the limit. */
export function qmcGeometry(spec: ClusterSpec): QmcGeometry {
  if (spec.kind === 'array') {
    const c = buildCluster(spec);
    return {
      kind: 'array', N: c.N, couplings: { kind: 'array', N: c.N, V: c.V }, positions: c.positions,
      momenta: c.momenta, momentumLabels: c.momentumLabels, shells: c.shells, shellPairs: shellPairCounts(c),
      shellOfDisplacement: null, torus: null, cluster: c,
    };
  }
  const l = lattice(spec.lattice);
  const size = spec.size;
  if (size.length !== l.dim) {
    throw new InputError(l.dim === 1 ? `a chain takes one size L, got ${size.join('x')}` : `the ${spec.lattice} lattice takes a size Lx x Ly, got ${size.join('x')}`, 'size');
  }
  const t = torus(spec.lattice, size[0], l.dim === 1 ? 1 : size[1], spec.interaction);
  const { N, Lx, Ly } = t;
  const momenta = new Float64Array(2 * N), momentumLabels = new Int32Array(2 * N);
  const B1 = [l.b1[0] / Lx, l.b1[1] / Lx], B2 = [l.b2[0] / Ly, l.b2[1] / Ly];
  for (let m2i = 0; m2i < Ly; m2i++) {
    for (let m1i = 0; m1i < Lx; m1i++) {
      const q = m1i + Lx * m2i, m1 = fold(m1i, Lx), m2 = fold(m2i, Ly);
      momenta[2 * q] = m1 * B1[0] + m2 * B2[0];
      momenta[2 * q + 1] = m1 * B1[1] + m2 * B2[1];
      momentumLabels[2 * q] = m1; momentumLabels[2 * q + 1] = m2;
    }
  }
  const order = Array.from({ length: N - 1 }, (_, i) => i + 1).sort((a, b) => t.distance[a] - t.distance[b]);
  const shells: number[] = [], counts: number[] = [];
  const shellOfDisplacement = new Int32Array(N).fill(-1);
  for (const d of order) {
    const r = t.distance[d];
    if (!shells.length || r - shells[shells.length - 1] > SHELL_TOLERANCE * Math.max(1, r)) { shells.push(r); counts.push(0); }
    shellOfDisplacement[d] = shells.length - 1;
    counts[shells.length - 1] += N;
  }
  return {
    kind: 'torus', N, couplings: { kind: 'torus', torus: t }, positions: t.positions, momenta, momentumLabels,
    shells: Float64Array.from(shells), shellPairs: Float64Array.from(counts), shellOfDisplacement, torus: t, cluster: null,
  };
}

/** m in 0..L-1 folded into (-L/2, L/2]. */
function fold(m: number, L: number): number {
  return m > L / 2 ? m - L : m;
}

/**
 * Finite periodic clusters: a ring of L sites (chain) or an Lx x Ly torus of the square or
 * triangular lattice, spanned by the superlattice vectors A1 = Lx a1 and A2 = Ly a2.
 *
 *   V_ij = sum_R V(|r_j - r_i + R|)   over all superlattice vectors R (converged), i != j,
 *   V_ii = 0                          (a site does not interact with its own images),
 *
 * which is the sublattice coupling J_ij(k = 0) of the lattice sums with the cluster as the
 * supercell (site (i, j) of the cluster is sublattice s = j Lx + i). The momenta of the
 * cluster are k = m1 B1 + m2 B2 with A_a . B_b = 2 pi delta_ab, m_a folded into (-L_a/2, L_a/2].
 */
import { InputError } from '../input-error.ts';
import { type LatticeName, lattice, position } from '../lattice/geometry.ts';
import { supercell, period, reciprocalSuperlattice, superlatticeVectors } from '../lattice/supercells.ts';
import { type InteractionSpec, resolvePotential } from '../interaction/potential.ts';
import { couplings } from '../interaction/lattice-sums.ts';
import { type Cluster, MAX_CLUSTER_SITES, distanceShells } from './cluster.ts';

/** Build the Lx x Ly periodic cluster (Ly = 1 for the chain) with the converged V_ij. */
export function periodicCluster(name: LatticeName, Lx: number, Ly: number, interaction: InteractionSpec): Cluster {
  const l = lattice(name);
  if (l.dim === 1 && Ly !== 1) throw new InputError(`a chain cluster has one row; give size L, got ${Lx}x${Ly}`, 'size');
  const sizes: [number, string][] = l.dim === 1 ? [[Lx, 'L']] : [[Lx, 'Lx'], [Ly, 'Ly']];
  for (const [L, axis] of sizes) {
    if (!Number.isInteger(L) || L < 2) throw new InputError(`cluster size ${axis} must be an integer >= 2, got ${L}`, 'size');
  }
  const N = Lx * Ly;
  if (N > MAX_CLUSTER_SITES) throw new InputError(`cluster of ${N} sites exceeds the limit of ${MAX_CLUSTER_SITES}`, 'size');
  const pot = resolvePotential(interaction, l);
  const cell = l.dim === 1 ? period(Lx) : supercell(Lx, 0, Ly);
  const J = couplings(l, cell, pot);
  const V = new Float64Array(N * N);
  for (let i = 0; i < N; i++) {
    for (let j = 0; j < N; j++) if (i !== j) V[i * N + j] = 0.5 * (J.re[i * N + j] + J.re[j * N + i]);
  }
  const positions = new Float64Array(2 * N);
  for (let s = 0; s < N; s++) {
    const [x, y] = position(l, s % Lx, Math.floor(s / Lx));
    positions[2 * s] = x; positions[2 * s + 1] = y;
  }
  const [A1, A2] = superlatticeVectors(l, cell);
  const distance = minimumImageDistances(positions, A1, l.dim === 1 ? null : A2);
  const { shells, shellOf } = distanceShells(N, distance);
  const [B1, B2] = reciprocalSuperlattice(l, cell);
  const momenta = new Float64Array(2 * N), momentumLabels = new Int32Array(2 * N);
  for (let m2i = 0; m2i < Ly; m2i++) {
    for (let m1i = 0; m1i < Lx; m1i++) {
      const q = m2i * Lx + m1i;
      const m1 = fold(m1i, Lx), m2 = l.dim === 1 ? 0 : fold(m2i, Ly);
      momenta[2 * q] = m1 * B1[0] + m2 * B2[0];
      momenta[2 * q + 1] = l.dim === 1 ? 0 : m1 * B1[1] + m2 * B2[1];
      momentumLabels[2 * q] = m1; momentumLabels[2 * q + 1] = m2;
    }
  }
  return { kind: 'periodic', lattice: name, N, Lx, Ly, positions, V, distance, shells, shellOf, momenta, momentumLabels };
}

/** m in 0..L-1 folded into (-L/2, L/2]. */
function fold(m: number, L: number): number {
  return m > L / 2 ? m - L : m;
}

/** d_ij = min over images R = p A1 + q A2 (|p|, |q| <= 2) of |r_j - r_i + R|. */
function minimumImageDistances(pos: Float64Array, A1: readonly number[], A2: readonly number[] | null): Float64Array {
  const N = pos.length / 2;
  const d = new Float64Array(N * N);
  const qmax = A2 ? 2 : 0;
  for (let i = 0; i < N; i++) {
    for (let j = 0; j < N; j++) {
      if (i === j) continue;
      const dx = pos[2 * j] - pos[2 * i], dy = pos[2 * j + 1] - pos[2 * i + 1];
      let best = Infinity;
      for (let p = -2; p <= 2; p++) {
        for (let q = -qmax; q <= qmax; q++) {
          const x = dx + p * A1[0] + (A2 ? q * A2[0] : 0), y = dy + p * A1[1] + (A2 ? q * A2[1] : 0);
          best = Math.min(best, Math.hypot(x, y));
        }
      }
      d[i * N + j] = best;
    }
  }
  return d;
}

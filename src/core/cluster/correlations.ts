/**
 * Density correlations of a cluster from the site densities <n_i> and pair expectations
 * P_ij = <n_i n_j> (P_ii = <n_i>), shared by exact diagonalisation and Monte Carlo:
 *
 *   S(k) = (1/N) sum_ij cos(k.(r_i - r_j)) (<n_i n_j> - <n_i><n_j>)     (real: the sum is symmetric)
 *   C(r) = mean over ordered pairs i != j at distance r of (<n_i n_j> - <n_i><n_j>)
 *
 * on the cluster's momenta and distance shells (minimum-image distances on periodic
 * clusters, where r_i - r_j may be taken in any image: the momenta are cluster momenta).
 */
import { type Cluster, shellPairCounts } from './cluster.ts';

export interface StructureFactorPoint {
  /** Momentum (kx, ky) in units of 1/a. */
  k: [number, number];
  /** Integer label (m1, m2) of the momentum. */
  m: [number, number];
  value: number;
}

export interface CorrelationPoint {
  /** Distance r (units of a). */
  r: number;
  value: number;
  /** Number of ordered pairs at this distance. */
  pairs: number;
}

/** S(k) on the cluster momenta. */
export function structureFactor(c: Cluster, density: ArrayLike<number>, pair: ArrayLike<number>): StructureFactorPoint[] {
  const N = c.N, out: StructureFactorPoint[] = [];
  for (let q = 0; q < c.momenta.length / 2; q++) {
    const kx = c.momenta[2 * q], ky = c.momenta[2 * q + 1];
    let sum = 0;
    for (let i = 0; i < N; i++) {
      for (let j = 0; j < N; j++) {
        const ph = kx * (c.positions[2 * i] - c.positions[2 * j]) + ky * (c.positions[2 * i + 1] - c.positions[2 * j + 1]);
        const conn = (i === j ? density[i] : pair[i * N + j]) - density[i] * density[j];
        sum += Math.cos(ph) * conn;
      }
    }
    out.push({ k: [kx, ky], m: [c.momentumLabels[2 * q], c.momentumLabels[2 * q + 1]], value: sum / N });
  }
  return out;
}

/** C(r) on the cluster's distance shells. */
export function densityCorrelation(c: Cluster, density: ArrayLike<number>, pair: ArrayLike<number>): CorrelationPoint[] {
  const N = c.N, counts = shellPairCounts(c), sums = new Float64Array(c.shells.length);
  for (let i = 0; i < N; i++) {
    for (let j = 0; j < N; j++) {
      if (i === j) continue;
      sums[c.shellOf[i * N + j]] += pair[i * N + j] - density[i] * density[j];
    }
  }
  return Array.from(c.shells, (r, d) => ({ r, value: sums[d] / counts[d], pairs: counts[d] }));
}

/**
 * Density-wave order parameter m^2 = <|n_k*|^2>/N^2 = (1/N^2) sum_ij cos(k*.(r_i - r_j)) <n_i n_j>
 * at the momentum k* != 0 where it is largest: the same whether the state keeps the
 * cluster's symmetry (order in S(k)) or breaks it (order in <n_i>); 1/4 for a perfect
 * half-filled period-2 crystal, O(1/N) without order. null on a cluster with only k = 0.
 */
export function densityWaveOrder(c: Cluster, density: ArrayLike<number>, pair: ArrayLike<number>): { k: [number, number]; m: [number, number]; value: number } | null {
  const N = c.N;
  let best: { k: [number, number]; m: [number, number]; value: number } | null = null;
  for (let q = 0; q < c.momenta.length / 2; q++) {
    if (c.momentumLabels[2 * q] === 0 && c.momentumLabels[2 * q + 1] === 0) continue;
    const kx = c.momenta[2 * q], ky = c.momenta[2 * q + 1];
    let sum = 0;
    for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) {
      const ph = kx * (c.positions[2 * i] - c.positions[2 * j]) + ky * (c.positions[2 * i + 1] - c.positions[2 * j + 1]);
      sum += Math.cos(ph) * (i === j ? density[i] : pair[i * N + j]);
    }
    if (!best || sum / (N * N) > best.value) best = { k: [kx, ky], m: [c.momentumLabels[2 * q], c.momentumLabels[2 * q + 1]], value: sum / (N * N) };
  }
  return best;
}

/**
 * Exact ground state of the emitters on a cluster at fixed photon amplitude alpha,
 *   H(alpha) = sum_i [ -mu n_i - alpha sigma^x_i ] + sum_{i<j} V_ij n_i n_j,
 * by Lanczos on the full 2^N basis (N <= 20) or the blockade-truncated basis. On a periodic
 * cluster the full basis is reduced to its translation-invariant (k = 0) sector, which holds
 * the unique ground state for alpha > 0 (translation-basis.ts): about N times fewer states.
 *
 * alpha = 0 is solved exactly without Lanczos: H is diagonal, E0 = min_s E_diag(s), and the
 * ground vector is the equal superposition of the degenerate classical ground states
 * (within 1e-12 of the energy scale), which keeps every symmetry of the cluster.
 */
import { InputError, requireFinite } from '../input-error.ts';
import type { Cluster } from '../cluster/cluster.ts';
import { type Basis, blockadeBasis, fullBasis } from './basis.ts';
import { diagonalEnergies, flipTable, hamiltonianProduct } from './hamiltonian.ts';
import { lanczosGround } from './lanczos.ts';
import { type TranslationBasis, clusterTranslations, expandToFull, translationBasis, translationProduct } from './translation-basis.ts';

/** The cluster's Hamiltonian pieces that do not depend on alpha, reused across alpha. */
export interface EdSystem {
  readonly cluster: Cluster;
  readonly basis: Basis;
  readonly mu: number;
  /** E_diag(s) per basis index. */
  readonly diag: Float64Array;
  /** Flip table of a truncated basis (null for the full basis). */
  readonly flips: Int32Array | null;
  /** The k = 0 sector the Lanczos vectors live in (null: they live in `basis`). */
  readonly sector: TranslationBasis | null;
}

export interface GroundState {
  alpha: number;
  /** E0(alpha), the lowest eigenvalue of H(alpha). */
  energy: number;
  /** Ground vector in the working basis (the k = 0 sector when there is one; see fullVector). */
  vector: Float64Array;
  iterations: number;
  residual: number;
}

/**
 * Build the basis and diagonal; `blockade` (Vb) selects the truncated basis; `symmetric`
 * (default true) uses the k = 0 sector of a periodic cluster's full basis.
 */
export function edSystem(cluster: Cluster, mu: number, blockade?: number, symmetric = true): EdSystem {
  requireFinite(mu, 'mu');
  const basis = blockade === undefined ? fullBasis(cluster.N) : blockadeBasis(cluster, blockade);
  const translations = blockade === undefined && symmetric ? clusterTranslations(cluster) : null;
  if (translations && translations.length > 1) {
    const sector = translationBasis(cluster.N, translations);
    const reps: Basis = { N: cluster.N, dimension: sector.dimension, states: sector.reps, blockade: null };
    return { cluster, basis, mu, diag: diagonalEnergies(cluster, reps, mu), flips: null, sector };
  }
  return { cluster, basis, mu, diag: diagonalEnergies(cluster, basis, mu), flips: flipTable(basis), sector: null };
}

/** The ground vector in `basis` (expanded from the k = 0 sector when there is one). */
export function fullVector(sys: EdSystem, g: GroundState): Float64Array {
  return sys.sector ? expandToFull(sys.sector, g.vector) : g.vector;
}

/** Ground state of H(alpha), alpha >= 0; `start` warm-starts Lanczos (e.g. from a nearby alpha). */
export function groundState(sys: EdSystem, alpha: number, start?: Float64Array, tolerance = 1e-10): GroundState {
  requireFinite(alpha, 'alpha');
  if (alpha < 0) {
    throw new InputError(`alpha must be >= 0 (the sign is a gauge choice: prod_i sigma^z_i maps alpha to -alpha), got ${alpha}`, 'alpha');
  }
  const D = sys.diag.length;
  if (alpha === 0) return classicalGround(sys);
  const apply = sys.sector ? translationProduct(sys.sector, sys.cluster.N, sys.diag, alpha) : hamiltonianProduct(sys.basis, sys.diag, alpha, sys.flips);
  // A positive start vector overlaps the positive (Perron-Frobenius) ground state.
  const r = lanczosGround(apply, D, { start, tolerance });
  return { alpha, energy: r.energy, vector: r.vector, iterations: r.iterations, residual: r.residual };
}

/** alpha = 0: the diagonal minimum and the equal superposition of its degenerate states. */
function classicalGround(sys: EdSystem): GroundState {
  const d = sys.diag;
  let min = Infinity, scale = 1;
  for (let k = 0; k < d.length; k++) { if (d[k] < min) min = d[k]; scale = Math.max(scale, Math.abs(d[k])); }
  const v = new Float64Array(d.length);
  let count = 0;
  for (let k = 0; k < d.length; k++) if (d[k] - min <= 1e-12 * scale) { v[k] = 1; count++; }
  for (let k = 0; k < d.length; k++) v[k] /= Math.sqrt(count);
  return { alpha: 0, energy: min, vector: v, iterations: 0, residual: 0 };
}

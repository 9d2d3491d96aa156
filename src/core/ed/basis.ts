/**
 * Occupation-number bases for exact diagonalisation. A state is the integer
 * s = sum_i n_i 2^i (bit i is n_i).
 *
 * Full basis: all 2^N states, index(s) = s, N <= 20.
 * Blockade-truncated basis: only states with no excited pair (i, j) whose coupling
 * V_ij >= Vb (both emitters inside each other's blockade radius when Vb = V(Rb) = 2);
 * exact in the limit V_ij -> infinity for those pairs, otherwise an approximation that
 * drops configurations costing at least Vb. States kept sorted, index(s) by bisection;
 * up to N = 30 sites and 2^20 states.
 */
import { InputError } from '../input-error.ts';
import type { Cluster } from '../cluster/cluster.ts';

/** Largest N of the full 2^N basis. */
export const MAX_FULL_SITES = 20;
/** Largest N of the truncated basis (states as 31-bit integers). */
export const MAX_TRUNCATED_SITES = 30;
/** Largest dimension of any basis: the full basis at N = 20. */
export const MAX_DIMENSION = 1 << MAX_FULL_SITES;

/** Double-precision vectors a full-basis Lanczos run holds: diagonal, 4 work vectors, ground vector and one spare. */
export const LANCZOS_VECTORS = 7;

export interface Basis {
  readonly N: number;
  readonly dimension: number;
  /** Sorted states of a truncated basis; null for the full basis (state = index). */
  readonly states: Uint32Array | null;
  /** Blockade threshold Vb of a truncated basis. */
  readonly blockade: number | null;
}

/** The full 2^N basis, refused above N = 20 with the memory it would need. */
export function fullBasis(N: number): Basis {
  if (N > MAX_FULL_SITES) {
    const gb = (LANCZOS_VECTORS * 8 * 2 ** N) / 2 ** 30;
    throw new InputError(
      `exact diagonalisation is limited to N <= ${MAX_FULL_SITES} sites: N = ${N} has 2^${N} = ${2 ** N} states, which take up to ` +
      `${LANCZOS_VECTORS} x 8 x 2^${N} bytes = ${gb.toFixed(1)} GiB (Lanczos vectors) and N 2^N = ${(N * 2 ** N).toExponential(1)} ` +
      'operations per Lanczos step, both doubling per site; ' +
      'use a smaller cluster, the blockade-truncated basis, or vmc', 'size');
  }
  return { N, dimension: 2 ** N, states: null, blockade: null };
}

/** The blockade-truncated basis: no excited pair with V_ij >= Vb. */
export function blockadeBasis(c: Cluster, Vb: number): Basis {
  const N = c.N;
  if (!(Vb > 0) || !Number.isFinite(Vb)) throw new InputError(`blockade threshold must be a positive number, got ${Vb}`, 'blockade');
  if (N > MAX_TRUNCATED_SITES) {
    throw new InputError(`the blockade-truncated basis is limited to N <= ${MAX_TRUNCATED_SITES} sites, got ${N}`, 'size');
  }
  const blocked = new Uint32Array(N);
  for (let i = 0; i < N; i++) {
    for (let j = 0; j < N; j++) if (i !== j && c.V[i * N + j] >= Vb) blocked[i] |= 1 << j;
  }
  const states: number[] = [];
  // Depth-first from the highest bit, 0 before 1, so the states come out ascending.
  const visit = (site: number, s: number): void => {
    if (states.length > MAX_DIMENSION) return;
    if (site < 0) { states.push(s >>> 0); return; }
    visit(site - 1, s);
    if ((s & blocked[site]) === 0) visit(site - 1, s | (1 << site));
  };
  visit(N - 1, 0);
  if (states.length > MAX_DIMENSION) {
    throw new InputError(
      `the blockade-truncated basis of ${N} sites with threshold ${Vb} exceeds ${MAX_DIMENSION} states ` +
      '(the N = 20 memory limit); raise the blockade radius or use vmc', 'blockade');
  }
  return { N, dimension: states.length, states: Uint32Array.from(states), blockade: Vb };
}

/** Index of state s in the basis, -1 if it is not in it. */
export function indexOf(b: Basis, s: number): number {
  if (b.states === null) return s;
  const st = b.states;
  let lo = 0, hi = st.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1, v = st[mid];
    if (v === s) return mid;
    if (v < s) lo = mid + 1; else hi = mid - 1;
  }
  return -1;
}

/** The state of basis index k. */
export function stateOf(b: Basis, k: number): number {
  return b.states === null ? k : b.states[k];
}

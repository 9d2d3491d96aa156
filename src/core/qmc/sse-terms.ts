/**
 * The operator decomposition of H(alpha) for stochastic series expansion,
 *
 *   H(alpha) = sum_i [-mu n_i - alpha sigma^x_i] + sum_{i<j} V_ij n_i n_j
 *            = E0 - sum_i alpha (1 + sigma^x_i) - sum_{i<j} H_ij - sum_{i in F} h_i ,
 *
 * in the form of Sandvik (Phys. Rev. E 68, 056701 (2003)) for the transverse field and of
 * Merali, De Vlugt and Melko (SciPost Phys. Core 7, 016 (2024), arXiv:2107.00766) for the
 * Rydberg bonds: a constant site operator alpha and a flip operator alpha sigma^x_i (both
 * weight alpha), and a diagonal bond operator that carries the pair repulsion with a share of
 * the chemical potential, shifted to positive weight,
 *
 *   H_ij = W_ij(n_i, n_j) = C_ij + mu_i^(j) n_i + mu_j^(i) n_j - V_ij n_i n_j,
 *   mu_i^(j) = mu |V_ij| / S_i,   S_i = sum_j |V_ij|   (so sum_j mu_i^(j) = mu),
 *   C_ij = -min over (n_i, n_j) of the rest + EPSILON (|V_ij| + |mu_i^(j)| + |mu_j^(i)|).
 *
 * EPSILON = 0: the least favoured configuration of a bond (a blockaded pair, or in the
 * transverse-field Ising limit an anti-aligned pair) carries no bond operator, as in
 * Sandvik's algorithm, so multibranch clusters follow domains and a domain wall of a random
 * start is removed by one cluster flip. A positive shift lets bonds sit across walls, binds
 * the domains into one cluster, and leaves walls to coarsen diffusively (measured: trapped
 * walls in a 32-site ring at beta = 64 tripled <sigma^x> at small alpha). Operators only ever
 * sit where their weight is positive, so no ratio divides by zero.
 *
 * A site with no interaction (S_i = 0, set F) carries mu alone in a diagonal field operator
 * h_i = mu n_i + C_i. E0 = N alpha + sum C. On the nearest-neighbour chain at mu = V1 the bond weights are
 * symmetric under flipping both sites (the transverse-field Ising point), so multibranch
 * clusters are accepted with probability one there.
 *
 * Bonds are drawn in O(1) from Walker alias tables: on a torus a site i uniformly and a
 * displacement d with probability Wmax_d / sum Wmax (every pair twice, by d and -d, which is
 * what its share of sum_{pairs} Wmax = N sum_d Wmax_d / 2 requires); on an open array the
 * pair itself from a table of all pairs.
 */
import { type AliasTable, aliasTable } from './alias-table.ts';
import type { Torus } from './torus.ts';

/** Relative positive shift of every diagonal weight (see the header for why it is zero). */
export const EPSILON = 0;

/** What the sampler needs of the cluster: couplings by displacement (torus) or by pair (array). */
export type SseCouplings =
  | { kind: 'torus'; torus: Torus }
  | { kind: 'array'; N: number; V: Float64Array };

export interface SseTerms {
  readonly N: number;
  readonly alpha: number;
  readonly kind: 'torus' | 'array';
  /** Torus: Lx, Ly of the displacement arithmetic. */
  readonly Lx: number;
  readonly Ly: number;
  /** Bond class c: W_c(n_i, n_j) at [4c + 2 n_i + n_j]; its maximum at wmax[c]. */
  readonly bondW: Float64Array;
  readonly bondMax: Float64Array;
  /**
   * Weight ratios of the off-diagonal moves at [4c + 2 n_i + n_j]: both sites flipped
   * (clusters), site i flipped, site j flipped (lines); 0 where the new weight is 0.
   */
  readonly flipBoth: Float64Array;
  readonly flipI: Float64Array;
  readonly flipJ: Float64Array;
  /** Torus: draw d (class = d) from this table over d = 1..N-1 (index d - 1). */
  readonly displacementTable: AliasTable | null;
  /** Array: class = pair index; pair sites and the table. */
  readonly pairI: Int32Array;
  readonly pairJ: Int32Array;
  readonly pairTable: AliasTable | null;
  /** Field operator weights h(n) at [n] and the sites that carry one. */
  readonly fieldW: Float64Array;
  readonly fieldMax: number;
  readonly fieldSites: Int32Array;
  /** Total maximal weight of each family: constant site operators, bonds, fields. */
  readonly constWeight: number;
  readonly bondWeight: number;
  readonly fieldWeight: number;
  /** E0 = N alpha + sum of the shifts. */
  readonly E0: number;
}

/** The four shifted weights of a bond of coupling V with chemical-potential shares a, b. */
function bondWeights(V: number, a: number, b: number, out: Float64Array, at: number): number {
  const raw = [0, b, a, a + b - V];
  const C = -Math.min(...raw) + EPSILON * (Math.abs(V) + Math.abs(a) + Math.abs(b));
  for (let s = 0; s < 4; s++) out[at + s] = raw[s] + C;
  return C;
}

/** Decompose H(alpha) on the couplings for chemical potential mu and field alpha >= 0. */
export function sseTerms(c: SseCouplings, mu: number, alpha: number): SseTerms {
  const N = c.kind === 'torus' ? c.torus.N : c.N;
  let E0 = N * alpha;
  let bondW: Float64Array, bondMax: Float64Array, bondWeight = 0;
  let displacementTable: AliasTable | null = null, pairTable: AliasTable | null = null;
  let pairI = new Int32Array(0), pairJ = new Int32Array(0);
  const isolated: number[] = [];
  if (c.kind === 'torus') {
    const Vd = c.torus.Vd;
    let S = 0;
    for (let d = 1; d < N; d++) S += Math.abs(Vd[d]);
    bondW = new Float64Array(4 * N); bondMax = new Float64Array(N);
    if (S > 0) {
      for (let d = 1; d < N; d++) {
        if (Vd[d] === 0) continue;
        const share = (mu * Math.abs(Vd[d])) / S;
        const C = bondWeights(Vd[d], share, share, bondW, 4 * d);
        bondMax[d] = Math.max(bondW[4 * d], bondW[4 * d + 1], bondW[4 * d + 2], bondW[4 * d + 3]);
        bondWeight += (N * bondMax[d]) / 2;
        E0 += (N * C) / 2;
      }
      displacementTable = aliasTable(bondMax.subarray(1));
    } else {
      for (let i = 0; i < N; i++) isolated.push(i);
    }
  } else {
    const V = c.V, S = new Float64Array(N);
    const pi: number[] = [], pj: number[] = [];
    for (let i = 0; i < N; i++) {
      for (let j = 0; j < N; j++) S[i] += Math.abs(V[i * N + j]);
      for (let j = i + 1; j < N; j++) if (V[i * N + j] !== 0) { pi.push(i); pj.push(j); }
      if (S[i] === 0) isolated.push(i);
    }
    pairI = Int32Array.from(pi); pairJ = Int32Array.from(pj);
    bondW = new Float64Array(4 * pi.length); bondMax = new Float64Array(pi.length);
    for (let t = 0; t < pi.length; t++) {
      const v = V[pi[t] * N + pj[t]];
      const C = bondWeights(v, (mu * Math.abs(v)) / S[pi[t]], (mu * Math.abs(v)) / S[pj[t]], bondW, 4 * t);
      bondMax[t] = Math.max(bondW[4 * t], bondW[4 * t + 1], bondW[4 * t + 2], bondW[4 * t + 3]);
      bondWeight += bondMax[t];
      E0 += C;
    }
    if (pi.length > 0) pairTable = aliasTable(bondMax);
  }
  // Field operator h(n) = mu n + C on sites without interaction (none needed when mu = 0).
  const fieldW = new Float64Array(2);
  let fieldMax = 0, fieldWeight = 0;
  const fieldSites = Int32Array.from(mu === 0 ? [] : isolated);
  if (fieldSites.length > 0) {
    const C = Math.max(0, -mu) + EPSILON * Math.abs(mu);
    fieldW[0] = C; fieldW[1] = mu + C;
    fieldMax = Math.max(fieldW[0], fieldW[1]);
    fieldWeight = fieldSites.length * fieldMax;
    E0 += fieldSites.length * C;
  }
  const ratio = (f: (s: number) => number) => bondW.map((w, x) => {
    const base = x & ~3, to = bondW[base + f(x & 3)];
    return w > 0 ? to / w : 0;
  });
  return {
    N, alpha, kind: c.kind, Lx: c.kind === 'torus' ? c.torus.Lx : N, Ly: c.kind === 'torus' ? c.torus.Ly : 1,
    bondW, bondMax, flipBoth: ratio((s) => 3 - s), flipI: ratio((s) => s ^ 2), flipJ: ratio((s) => s ^ 1), displacementTable, pairI, pairJ, pairTable, fieldW, fieldMax, fieldSites,
    constWeight: N * alpha, bondWeight, fieldWeight, E0,
  };
}

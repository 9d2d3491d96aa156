/**
 * The Jastrow wavefunction of the variational Monte Carlo, positive for every configuration:
 *
 *   psi(n) = exp( sum_i a_{g(i)} n_i + sum_{i<j} v_{d(i,j)} n_i n_j ),
 *
 * one-body amplitudes a_g per group g(i) of sites (one group; one per sublattice of a
 * chosen cell; or one per site, letting order develop wherever it wants) and a Jastrow
 * factor v_d per distance shell d (minimum-image distance on periodic clusters) up to a
 * range. Parameters theta = (a_0 .. a_{G-1}, v_0 .. v_{S-1}); their log-derivatives are
 *   O_{a_g} = sum_{i in g} n_i,   O_{v_d} = sum_{i<j, d(i,j) = d} n_i n_j.
 *
 * Each site keeps a neighbour list of the sites it couples to through V_ij != 0 or a Jastrow
 * shell, so a flip costs O(neighbours in range): independent of N at a fixed range (dense
 * rows only for a full-range interaction, where every pair couples).
 */
import { InputError } from '../input-error.ts';
import type { Cluster } from '../cluster/cluster.ts';
import { supercell, period, sublatticeOf } from '../lattice/supercells.ts';
import { lattice } from '../lattice/geometry.ts';

/** 'uniform': one a; 'site': one a per site; { cell }: one a per sublattice ([M] chain period, [a, b, c] 2D). */
export type OneBodySpec = 'uniform' | 'site' | { cell: number[] };

export interface AnsatzSpec {
  oneBody?: OneBodySpec;
  /** Jastrow shells with d <= range (default: the interaction's range on the cluster). */
  jastrowRange?: number;
}

/** At most this many Jastrow shells (the nearest): irregular arrays have a shell per pair. */
export const MAX_JASTROW_SHELLS = 64;

export interface Ansatz {
  readonly N: number;
  /** Group of each site and the number of groups G. */
  readonly group: Int32Array;
  readonly groups: number;
  /** Distances of the S Jastrow shells (the nearest S shells of the cluster). */
  readonly shellDistances: Float64Array;
  /** Number of parameters P = G + S. */
  readonly P: number;
  /** Neighbour lists (CSR): site i couples to nbrSite[nbrStart[i] .. nbrStart[i+1]). */
  readonly nbrStart: Int32Array;
  readonly nbrSite: Int32Array;
  readonly nbrV: Float64Array;
  /** Jastrow shell of the pair, -1 beyond the Jastrow range. */
  readonly nbrShell: Int32Array;
  /** Nearest-neighbour bonds (i, j), i < j, at [2b], [2b+1]: the exchange moves. */
  readonly bonds: Int32Array;
}

/** Build the ansatz's groups, shells and neighbour lists on a cluster. */
export function buildAnsatz(c: Cluster, spec: AnsatzSpec = {}): Ansatz {
  const N = c.N;
  const { group, groups } = siteGroups(c, spec.oneBody ?? 'site');
  let range = spec.jastrowRange;
  if (range === undefined) {
    range = 0;
    for (let p = 0; p < N * N; p++) if (c.V[p] !== 0) range = Math.max(range, c.distance[p]);
  }
  if (!(range >= 0) || Number.isNaN(range)) throw new InputError(`jastrow range must be >= 0, got ${range}`, 'jastrow-range');
  let S = 0;
  while (S < c.shells.length && S < MAX_JASTROW_SHELLS && c.shells[S] <= range + 1e-9) S++;
  const start = new Int32Array(N + 1), sites: number[] = [], Vs: number[] = [], shells: number[] = [];
  for (let i = 0; i < N; i++) {
    for (let j = 0; j < N; j++) {
      if (i === j) continue;
      const d = c.shellOf[i * N + j], v = c.V[i * N + j];
      if (v === 0 && d >= S) continue;
      sites.push(j); Vs.push(v); shells.push(d < S ? d : -1);
    }
    start[i + 1] = sites.length;
  }
  const bonds: number[] = [];
  for (let i = 0; i < N; i++) for (let j = i + 1; j < N; j++) if (c.shellOf[i * N + j] === 0) bonds.push(i, j);
  return {
    bonds: Int32Array.from(bonds), N, group, groups, shellDistances: c.shells.slice(0, S), P: groups + S,
    nbrStart: start, nbrSite: Int32Array.from(sites), nbrV: Float64Array.from(Vs), nbrShell: Int32Array.from(shells),
  };
}

/** The one-body groups of the sites. */
function siteGroups(c: Cluster, spec: OneBodySpec): { group: Int32Array; groups: number } {
  const N = c.N;
  if (spec === 'uniform') return { group: new Int32Array(N), groups: 1 };
  if (spec === 'site') return { group: Int32Array.from({ length: N }, (_, i) => i), groups: N };
  if (c.kind !== 'periodic') throw new InputError('a sublattice cell needs a periodic cluster; use one-body "site" or "uniform" on an array', 'cell');
  const dim = lattice(c.lattice).dim, cs = spec.cell;
  const bad = () => new InputError(`cell must be [M] on a chain or [a, b, c] (Hermite normal form, 0 <= b < a) in 2D, got [${cs.join(', ')}]`, 'cell');
  if (!cs.every((x) => Number.isInteger(x))) throw bad();
  if (dim === 1 ? cs.length !== 1 || cs[0] < 1 : cs.length !== 3 || cs[0] < 1 || cs[2] < 1 || cs[1] < 0 || cs[1] >= cs[0]) throw bad();
  const cell = dim === 1 ? period(cs[0]) : supercell(cs[0], cs[1], cs[2]);
  if (sublatticeOf(cell, c.Lx, 0) !== 0 || (dim === 2 && sublatticeOf(cell, 0, c.Ly) !== 0)) {
    throw new InputError(`the cell [${cs.join(', ')}] does not tile the ${c.Lx}x${c.Ly} cluster`, 'cell');
  }
  const group = new Int32Array(N);
  for (let s = 0; s < N; s++) group[s] = sublatticeOf(cell, s % c.Lx, Math.floor(s / c.Lx));
  return { group, groups: cell.M };
}

/**
 * Starting parameters: the one-body amplitude of the single-site ground state of
 * -mu n - alpha sigma^x, psi(1)/psi(0) = (mu/2 + sqrt(mu^2/4 + alpha^2))/alpha (clamped to
 * |a| <= 1 so the first sweeps stay mobile; SR takes it further), and no Jastrow correlation.
 */
export function initialParameters(a: Ansatz, mu: number, alpha: number): Float64Array {
  const theta = new Float64Array(a.P);
  const ratio = alpha > 0 ? (mu / 2 + Math.sqrt(mu * mu / 4 + alpha * alpha)) / alpha : mu > 0 ? Infinity : 0;
  const a0 = Math.max(-1, Math.min(1, Math.log(ratio)));
  for (let g = 0; g < a.groups; g++) theta[g] = a0;
  return theta;
}

/**
 * A periodic cluster for quantum Monte Carlo, stored by displacement so that it scales to
 * large tori (64 x 64 and beyond) without N x N tables. Site s = x + Lx y sits at
 * r = x a1 + y a2; the displacement d = dx + Lx dy (0 <= dx < Lx, 0 <= dy < Ly) couples
 * every site i to j = i + d with
 *
 *   V_d = sum over superlattice vectors R of V(|r_d + R|),   V_0 = 0 (no self-images),
 *
 * the same converged periodic coupling the exact diagonalisation uses. Full-range
 * interactions come from the lattice Fourier transform on the cluster momenta,
 *   V_d = (1/N) sum_k V(k) cos(k . r_d),   V(k) = sum_{r != 0} V(r) cos(k . r),
 * (the sum over k projects onto r = r_d modulo the superlattice), with V(k) the converged
 * Ewald sum of the mean-field code; finite ranges are summed directly over the images.
 * Momenta k = m1 B1 + m2 B2, A_a . B_b = 2 pi delta_ab, m folded into (-L/2, L/2].
 */
import { InputError } from '../input-error.ts';
import { type LatticeName, lattice, position } from '../lattice/geometry.ts';
import { type InteractionSpec, pairValue, resolvePotential } from '../interaction/potential.ts';
import { fourierV } from '../interaction/lattice-sums.ts';
import { torusCorrelation } from './torus-transform.ts';

/** Largest torus accepted (sites); the operator string is the memory that grows with N beta. */
export const MAX_TORUS_SITES = 128 * 128;

/** Most periodic images a finite-range direct sum may visit (a range far beyond the cluster). */
const MAX_IMAGE_TERMS = 5e7;

export interface Torus {
  readonly lattice: LatticeName;
  readonly N: number;
  readonly Lx: number;
  readonly Ly: number;
  /** V_d by displacement index d = dx + Lx dy; Vd[0] = 0. */
  readonly Vd: Float64Array;
  /** Minimum-image length of displacement d. */
  readonly distance: Float64Array;
  /** Site positions (units of a) at [2s], [2s + 1]. */
  readonly positions: Float64Array;
}

/** Build the Lx x Ly torus (Ly = 1 for the chain). */
export function torus(name: LatticeName, Lx: number, Ly: number, interaction: InteractionSpec): Torus {
  const l = lattice(name);
  for (const [L, axis] of [[Lx, 'Lx'], [Ly, 'Ly']] as const) {
    if (!Number.isInteger(L) || L < 1) throw new InputError(`cluster size ${axis} must be a positive integer, got ${L}`, 'size');
  }
  if (Lx < 2 || (l.dim === 2 && Ly < 2)) throw new InputError(`cluster size must be at least 2 along each axis, got ${Lx}x${Ly}`, 'size');
  if (l.dim === 1 && Ly !== 1) throw new InputError(`a chain takes one size L, got ${Lx}x${Ly}`, 'size');
  const N = Lx * Ly;
  if (N > MAX_TORUS_SITES) {
    throw new InputError(`a cluster of ${N} sites exceeds the Monte Carlo limit of ${MAX_TORUS_SITES} sites`, 'size');
  }
  const pot = resolvePotential(interaction, l);
  const A1 = [Lx * l.a1[0], Lx * l.a1[1]], A2 = [Ly * l.a2[0], Ly * l.a2[1]];
  const positions = new Float64Array(2 * N), distance = new Float64Array(N);
  for (let s = 0; s < N; s++) {
    const [x, y] = position(l, s % Lx, Math.floor(s / Lx));
    positions[2 * s] = x; positions[2 * s + 1] = y;
    let best = Infinity;
    const qmax = l.dim === 1 ? 0 : 2;
    for (let p = -2; p <= 2; p++) {
      for (let q = -qmax; q <= qmax; q++) best = Math.min(best, Math.hypot(x + p * A1[0] + q * A2[0], y + p * A1[1] + q * A2[1]));
    }
    distance[s] = best;
  }
  const Vd = Number.isFinite(pot.rmax)
    ? directImages(positions, A1, A2, l.dim, pot.rmax, (r) => pairValue(pot, r))
    : fourierImages(name, Lx, Ly, (k) => fourierV(l, pot, k));
  Vd[0] = 0;
  return { lattice: name, N, Lx, Ly, Vd, distance, positions };
}

/** V_d = sum_{R : |r_d + R| <= rmax} v(|r_d + R|), image R = p A1 + q A2. */
function directImages(pos: Float64Array, A1: number[], A2: number[], dim: number, rmax: number, v: (r: number) => number): Float64Array {
  const N = pos.length / 2;
  const n1 = Math.ceil(rmax / Math.hypot(A1[0], A1[1])) + 1;
  const n2 = dim === 1 ? 0 : Math.ceil(rmax / Math.hypot(A2[0], A2[1])) + 1;
  if (N * (2 * n1 + 1) * (2 * n2 + 1) > MAX_IMAGE_TERMS) {
    throw new InputError(`range ${rmax} spans too many periodic images of this cluster; give a smaller range or omit it for the full converged sum`, 'range');
  }
  const Vd = new Float64Array(N);
  for (let d = 1; d < N; d++) {
    let sum = 0;
    for (let q = -n2; q <= n2; q++) {
      for (let p = -n1; p <= n1; p++) {
        const r = Math.hypot(pos[2 * d] + p * A1[0] + q * A2[0], pos[2 * d + 1] + p * A1[1] + q * A2[1]);
        if (r <= rmax + 1e-9 && r > 1e-9) sum += v(r);
      }
    }
    Vd[d] = sum;
  }
  return Vd;
}

/** V_d = (1/N) sum_k V(k) cos(k . r_d) over the cluster momenta k = m1 B1 + m2 B2. */
function fourierImages(name: LatticeName, Lx: number, Ly: number, Vk: (k: [number, number]) => number): Float64Array {
  const l = lattice(name), N = Lx * Ly;
  const B1 = [l.b1[0] / Lx, l.b1[1] / Lx], B2 = [l.b2[0] / Ly, l.b2[1] / Ly];
  const table = new Float64Array(N);
  for (let m2 = 0; m2 < Ly; m2++) {
    for (let m1 = 0; m1 < Lx; m1++) {
      // V(k) = V(-k): take it from the partner when already computed.
      const p1 = (Lx - m1) % Lx, p2 = (Ly - m2) % Ly, partner = p1 + Lx * p2, q = m1 + Lx * m2;
      table[q] = partner < q ? table[partner] : Vk([m1 * B1[0] + m2 * B2[0], m1 * B1[1] + m2 * B2[1]]);
    }
  }
  const G = torusCorrelation(Lx, Ly, table);
  for (let d = 0; d < N; d++) G[d] *= N;
  return G;
}

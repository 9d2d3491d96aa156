/**
 * A lower bound on the T = 0 mean-field energy of every state of one supercell, so that the
 * search can skip a cell none of whose states can beat the best found (cell-search.ts).
 *
 * A product state of cell M (Bloch angles theta_s, m_s = sin^2(theta_s/2), photon
 * eliminated; bloch-angles.ts) has
 *
 *   Phi = -mu rho + (1/(2M)) m.J.m - X^2 / (4 D),   rho = mean m,  X = mean sin(theta),
 *   D = delta - mu > 0,
 *
 * and every converged candidate's Omega is Phi at a stationary point (sublattice.ts). Then:
 *
 * 1. J (real symmetric, translation invariant on the supercell) has the plane waves
 *    e^{i k.r_s} of the M wave vectors k of the superlattice as eigenvectors, with
 *    eigenvalues J(k) = sum_t J_0t cos(k.r_t); the uniform vector is the one of k = 0
 *    (J(0) = row sum). With m = rho 1 + v, v orthogonal to 1,
 *      m.J.m >= J(0) M rho^2 - L |v|^2,   L = max(0, -min_{k != 0} J(k)),
 *    and |v|^2 = M (q - rho^2) with q = mean m^2 in [rho^2, rho] (0 <= m_s <= 1).
 * 2. Cauchy-Schwarz: X^2 <= mean sin^2(theta) = 4 mean m (1 - m) = 4 (rho - q).
 * 3. So Phi >= -mu rho + J(0) rho^2 / 2 - (L/2)(q - rho^2) - (rho - q) / D, affine in q; its
 *    least value over q in [rho^2, rho] is
 *      Phi >= h(rho) = -mu rho + J(0) rho^2 / 2 - c rho (1 - rho),   c = max(1/D, L/2),
 *    and the cell's floor is min_{rho in [0, 1]} h (a quadratic: ends and vertex).
 *
 * Where c = 1/D the floor is exactly the best uniform state's energy (h is then Phi of the
 * one-site cell, whose minimum the M = 1 search finds): near mu -> delta at weak
 * interaction no larger cell can hold anything below the superradiant state, and the bound
 * proves it without solving them. Rounding: J's departure from exact translation invariance
 * (max row sum of |J_st - J_0,t-s|) bounds |m.J.m - m.J_c.m| / M, and both it and the
 * rounding of the sums are subtracted (cellFloor is a floor of the computed Omega too).
 */
import type { Supercell } from '../lattice/supercells.ts';
import { sublatticeOf } from '../lattice/supercells.ts';

/** The k-independent spectral data of one J array (cached). */
interface Spectrum {
  /** J(0), the row sum. */
  j0: number;
  /** max(0, -min_{k != 0} J(k)). */
  L: number;
  /** Bound on |J - J_circulant|_2 plus the rounding of the Fourier sums. */
  err: number;
  /** sum_t |J_0t|: the scale of a computed Omega's rounding. */
  scale: number;
}

const spectra = new WeakMap<Float64Array, Spectrum>();

function spectrum(cell: Supercell, J: Float64Array): Spectrum {
  const hit = spectra.get(J);
  if (hit) return hit;
  const { M, a, b, c, sites } = cell;
  // departure from translation invariance: J_st against J_0,(t - s)
  let dev = 0, scale = 0;
  for (let t = 0; t < M; t++) scale += Math.abs(J[t]);
  for (let s = 0; s < M; s++) {
    let row = 0;
    for (let t = 0; t < M; t++) {
      const u = sublatticeOf(cell, sites[2 * t] - sites[2 * s], sites[2 * t + 1] - sites[2 * s + 1]);
      row += Math.abs(J[s * M + t] - J[u]);
    }
    dev = Math.max(dev, row);
  }
  let j0 = 0;
  for (let t = 0; t < M; t++) j0 += J[t];
  // wave vectors kappa = (p/a, (q - p b / a)/c) in units of 2 pi per lattice step
  let low = Infinity;
  for (let p = 0; p < a; p++) {
    for (let q = 0; q < c; q++) {
      if (p === 0 && q === 0) continue;
      const k1 = p / a, k2 = (q - (p * b) / a) / c;
      let v = 0;
      for (let t = 0; t < M; t++) v += J[t] * Math.cos(2 * Math.PI * (k1 * sites[2 * t] + k2 * sites[2 * t + 1]));
      low = Math.min(low, v);
    }
  }
  const out: Spectrum = { j0, L: M > 1 ? Math.max(0, -low) : 0, err: dev + 1e-14 * M * scale, scale };
  spectra.set(J, out);
  return out;
}

/**
 * A floor under the computed Omega per site of every candidate of cell (M > 1, T = 0) at
 * chemical potential mu and detuning delta (see the module note), or -Infinity when the
 * bound does not apply (delta <= mu).
 */
export function cellFloor(cell: Supercell, J: Float64Array, mu: number, delta: number): number {
  const D = delta - mu;
  if (!(D > 0)) return -Infinity;
  const sp = spectrum(cell, J);
  // conservative: J(0) and -L lowered by err (each lowers h for rho > 0)
  const j0 = sp.j0 - sp.err, L = sp.L + sp.err;
  const cc = Math.max(1 / D, L / 2);
  // h(rho) = A rho^2 + B rho
  const A = j0 / 2 + cc, B = -mu - cc;
  let h = Math.min(0, A + B);
  if (A > 0) {
    const r = -B / (2 * A);
    if (r > 0 && r < 1) h = Math.min(h, -(B * B) / (4 * A));
  }
  // the rounding of h and of a candidate's computed Omega
  const slack = 1e-13 * (1 + Math.abs(mu) + sp.scale + cc) + sp.err / 2;
  return h - slack;
}

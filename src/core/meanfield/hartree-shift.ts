/**
 * The Hartree shift of sublattice s (DESIGN.md, "Sublattice mean-field at temperature T"):
 *
 *   xi_s = -mu + sum_t J_st(0) m_t,
 *
 * the energy of an excitation on s in the mean field of the others (J row-major, M x M).
 * The one place the mean-field solvers, the spectra and the soft modes compute it.
 */

/** xi_s = -mu + sum_t J[s M + t] m_t for one sublattice s. */
export function hartreeShift(J: ArrayLike<number>, M: number, mu: number, m: ArrayLike<number>, s: number): number {
  let xi = -mu;
  for (let t = 0; t < M; t++) xi += J[s * M + t] * m[t];
  return xi;
}

/** Every xi_s into `out` (length M); returns out. */
export function hartreeShifts(J: ArrayLike<number>, M: number, mu: number, m: ArrayLike<number>, out: Float64Array): Float64Array {
  for (let s = 0; s < M; s++) out[s] = hartreeShift(J, M, mu, m, s);
  return out;
}

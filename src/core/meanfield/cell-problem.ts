/**
 * The problem of one supercell and the options of its solvers, as plain types: the leaf
 * that sublattice.ts, bloch-angles.ts (T = 0), thermal-fields.ts and trial-state.ts (T > 0)
 * share, so that none of them imports another for its types.
 *
 *   xi_s = -mu + sum_t J_st(0) m_t   (J row-major, M x M; hartree-shift.ts)
 */

/** One supercell's problem: J_st(0) row-major (M x M), mu, delta, T. */
export interface CellProblem {
  readonly M: number;
  readonly J: Float64Array;
  readonly mu: number;
  readonly delta: number;
  readonly T: number;
}

export interface SolveCellOptions {
  /** Convergence threshold on max |dm| of a full step (default 1e-12). */
  tol?: number;
  maxIter?: number;
  /** Called after each step (diagnostics). */
  trace?: (m: Float64Array, alpha: number, phi: number, lambda: number) => void;
  /** Called after each step; returning true abandons the start (e.g. a known duplicate). */
  abandon?: (m: Float64Array, it: number) => boolean;
}

/**
 * The solved mean-field state as plain data (crosses to workers, printed as JSON by the CLI).
 */
export type PhaseLabel = 'empty' | 'filled' | 'normal' | 'density-wave' | 'superradiant' | 'supersolid';

export const PHASE_LABELS: readonly PhaseLabel[] = ['empty', 'filled', 'normal', 'density-wave', 'superradiant', 'supersolid'];

export interface MeanFieldState {
  phase: PhaseLabel;
  /** Filling fraction of the pattern ("1/3"), null for unmodulated phases. */
  fraction: string | null;
  /** Number of sublattices M of the supercell. */
  cellSize: number;
  /** Hermite normal form [[a, b], [0, c]] of the supercell (1D: a = M, b = 0, c = 1). */
  cell: { a: number; b: number; c: number };
  /** m_s = (1 + <sigma^z>_s)/2 per sublattice. */
  sublatticeDensities: number[];
  /** <sigma^x>_s per sublattice (coherence). */
  sublatticeCoherences: number[];
  /** Photon amplitude alpha >= 0, <a> = sqrt(N) alpha. */
  alpha: number;
  /** mean_s m_s. */
  emitterDensity: number;
  /** alpha^2. */
  photonDensity: number;
  /** rho = alpha^2 + mean_s m_s. */
  excitationDensity: number;
  /** Omega per site. */
  grandPotential: number;
  mu: number;
  delta: number;
  T: number;
}

/**
 * Phase separation at fixed density inside a first-order jump of rho(mu): the two phases
 * at the transition mu and their lever-rule fractions x_low + x_high = 1,
 * x_low rho_low + x_high rho_high = rho.
 */
export interface Coexistence {
  phases: [MeanFieldState, MeanFieldState];
  fractions: [number, number];
}

/** A solved point: the state, with the coexisting phases where a fixed density falls in a jump. */
export type SolveResult = MeanFieldState & { coexistence?: Coexistence | null };

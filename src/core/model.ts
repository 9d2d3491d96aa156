/**
 * The model's inputs as plain data, shared by the engine, the worker protocol, the CLI
 * and the page. Units: energies in g (collective coupling), lengths in the lattice spacing,
 * hbar = k_B = 1. Detuning delta is the cavity frequency minus the emitter line; mu is the
 * excitation chemical potential measured from the emitter line.
 */
import { InputError, requireBelowDetuning, requireFinite } from './input-error.ts';
import { LATTICE_NAMES, type LatticeName, lattice } from './lattice/geometry.ts';
import { type InteractionSpec, resolvePotential } from './interaction/potential.ts';

export interface ModelParams {
  lattice: LatticeName;
  interaction: InteractionSpec;
  /** Cavity detuning delta from the emitter line (units of g). */
  delta: number;
  /** Chemical potential of excitations; give mu or rho. */
  mu?: number;
  /** Fixed excitation density rho = alpha^2 + mean m (fixed-density mode). */
  rho?: number;
  /** Temperature T >= 0 (units of g). */
  T: number;
  /** Largest supercell (number of sublattices) searched. */
  maxCell: number;
  /** Only supercells of exactly this many sublattices (e.g. 1 for the uniform state). */
  cell?: number;
}

/** Default Mmax: 12 in 1D, 8 in 2D. */
export function defaultMaxCell(l: LatticeName): number {
  return l === 'chain' ? 12 : 8;
}

/** Largest Mmax accepted (1D, 2D): the cost grows like sum of sigma(M) times the starts. */
export const MAX_CELL_LIMIT = { chain: 32, plane: 12 } as const;

/**
 * Refuse bad input with an InputError naming the problem. mu >= delta is refused because
 * the photon term (delta - mu) a^dag a is then unbounded below.
 */
export function validateModel(p: ModelParams): void {
  if (!LATTICE_NAMES.includes(p.lattice)) {
    throw new InputError(`unknown lattice ${String(p.lattice)} (use ${LATTICE_NAMES.join(', ')})`, 'lattice');
  }
  requireFinite(p.delta, 'detuning');
  requireFinite(p.T, 'temperature');
  if (p.T < 0) throw new InputError(`temperature must be >= 0, got ${p.T}`, 'temperature');
  const hasMu = p.mu !== undefined, hasRho = p.rho !== undefined;
  if (hasMu === hasRho) throw new InputError('give exactly one of mu (chemical potential) or density', 'mu');
  if (hasMu) {
    requireBelowDetuning(p.mu as number, p.delta);
  } else {
    requireFinite(p.rho as number, 'density');
    if (!((p.rho as number) >= 0)) throw new InputError(`density must be >= 0, got ${p.rho}`, 'density');
  }
  const limit = p.lattice === 'chain' ? MAX_CELL_LIMIT.chain : MAX_CELL_LIMIT.plane;
  if (!Number.isInteger(p.maxCell) || p.maxCell < 1 || p.maxCell > limit) {
    throw new InputError(`max-cell must be an integer 1..${limit} on the ${p.lattice} lattice, got ${p.maxCell}`, 'max-cell');
  }
  if (p.cell !== undefined && (!Number.isInteger(p.cell) || p.cell < 1 || p.cell > limit)) {
    throw new InputError(`cell must be an integer 1..${limit}, got ${p.cell}`, 'cell');
  }
  // The interaction's own checks (missing rb / v1, NaN strengths, a bad range).
  if (!p.interaction || typeof p.interaction !== 'object') throw new InputError('no interaction given', 'interaction');
  resolvePotential(p.interaction, lattice(p.lattice));
}

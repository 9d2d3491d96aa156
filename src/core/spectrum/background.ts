/**
 * The stationary state a fluctuation calculation expands about, from a plain description
 * (lattice, interaction, supercell, m_s, alpha, mu, delta, T), independent of how it was
 * solved. Per sublattice s (DESIGN.md, "Sublattice mean-field at temperature T"):
 *
 *   xi_s = -mu + sum_t J_st(0) m_t,   B_s = (2 alpha, 0, xi_s),   E_s = |B_s|/2,
 *   S_s = r_s n_s,   n_s = -B_s/|B_s|,   r_s = tanh(E_s/T)   (T = 0: r = 1),
 *
 * the Bloch vector antiparallel to its field with the thermal length (alpha real >= 0 by
 * the U(1) gauge, so S^y = 0). Each sublattice gets a right-handed frame (e1, e2, n):
 * e1 = y, e2 = n x e1 = (xi/(2E), 0, -alpha/E); fluctuations transverse to n (along e1, e2)
 * precess, the longitudinal one (along n) changes the length |S| only and is a constant of
 * the motion dS/dt = B x S. Where E_s = 0, n = -z.
 *
 * The state is taken as exactly stationary: the Bloch vectors are rebuilt from the fields,
 * and the photon stiffness of a condensate is the self-consistent
 * (delta - mu)_eff = (1/M) sum_s r_s/(2E_s) (it equals delta - mu to the solver's
 * tolerance; using it keeps the Goldstone mode an exact zero). `residual` says how far the
 * given m_s and delta - mu are from stationarity.
 */
import { InputError, requireBelowDetuning } from '../input-error.ts';
import { type Lattice, type LatticeName, lattice } from '../lattice/geometry.ts';
import { type Supercell, supercell } from '../lattice/supercells.ts';
import { type InteractionSpec, type Potential, resolvePotential } from '../interaction/potential.ts';
import { blochCouplings } from './bloch-couplings.ts';
import { hartreeShift } from '../meanfield/hartree-shift.ts';

/** A state to expand about, as plain data. */
export interface FluctuationInput {
  lattice: LatticeName;
  interaction: InteractionSpec;
  /** Hermite normal form of the supercell (1D: {a: M, b: 0, c: 1}). */
  cell: { a: number; b: number; c: number };
  /** m_s = (1 + <sigma^z>_s)/2, one per sublattice. */
  densities: ArrayLike<number>;
  /** Photon amplitude alpha >= 0 (<a> = sqrt(N) alpha). */
  alpha: number;
  mu: number;
  delta: number;
  T: number;
  /**
   * alpha is an external field, not a cavity mode: no photon fluctuations (the
   * transverse-field Ising limit of the nn chain at mu = V1). Default false.
   */
  fixedPhoton?: boolean;
}

export interface Background {
  l: Lattice;
  spec: InteractionSpec;
  pot: Potential;
  cell: Supercell;
  M: number;
  alpha: number;
  mu: number;
  delta: number;
  T: number;
  /** The photon is a dynamical mode (false with fixedPhoton). */
  photon: boolean;
  /** Photon stiffness (delta - mu)_eff (see above). */
  dmu: number;
  xi: Float64Array;
  E: Float64Array;
  /** Bloch vector length tanh(E/T). */
  r: Float64Array;
  /** Frame vectors e1, e2, n of sublattice s at [9s .. 9s+8]. */
  frame: Float64Array;
  /** max_s |m_s - m_s(field)| and |(delta - mu) - (delta - mu)_eff| (0 without a condensate). */
  residual: { emitter: number; photon: number };
}

/** Prepare a state for linearisation, refusing inconsistent input. */
export function background(inp: FluctuationInput): Background {
  const l = lattice(inp.lattice);
  const { a, b, c } = inp.cell;
  const cell = supercell(a, b, c);
  const M = cell.M;
  if (inp.densities.length !== M) throw new InputError(`need ${M} sublattice densities for this cell, got ${inp.densities.length}`, 'densities');
  if (!(inp.alpha >= 0)) throw new InputError(`alpha must be >= 0, got ${inp.alpha}`, 'alpha');
  if (!(inp.T >= 0)) throw new InputError(`temperature must be >= 0, got ${inp.T}`, 'temperature');
  if (!inp.fixedPhoton) requireBelowDetuning(inp.mu, inp.delta);
  const pot = resolvePotential(inp.interaction, l);
  const J = blochCouplings(l, inp.interaction, pot, cell, [0, 0]).re;
  const xi = new Float64Array(M), E = new Float64Array(M), r = new Float64Array(M), frame = new Float64Array(9 * M);
  const { alpha, mu, T } = inp;
  let resE = 0, photonSum = 0;
  for (let s = 0; s < M; s++) {
    const x = hartreeShift(J, M, mu, inp.densities, s);
    xi[s] = x;
    E[s] = Math.sqrt(x * x / 4 + alpha * alpha);
    r[s] = T === 0 ? 1 : Math.tanh(E[s] / T);
    const f = frame.subarray(9 * s, 9 * s + 9);
    if (E[s] > 0) {
      const n = [-alpha / E[s], 0, -x / (2 * E[s])];
      f.set([0, 1, 0, -n[2], 0, n[0], n[0], n[1], n[2]]);
    } else {
      f.set([0, 1, 0, 1, 0, 0, 0, 0, -1]);
    }
    // m from the field: (1 + S^z)/2 with S^z = r n_z (T = 0 and E = 0: any m is stationary).
    if (E[s] > 0 || T > 0) resE = Math.max(resE, Math.abs(inp.densities[s] - (1 + r[s] * f[8]) / 2));
    if (E[s] > 0) photonSum += r[s] / (2 * E[s]);
  }
  const photon = !inp.fixedPhoton;
  let dmu = inp.delta - mu, resP = 0;
  if (photon && alpha > 0) {
    const eff = photonSum / M;
    resP = Math.abs(dmu - eff);
    dmu = eff;
  }
  return {
    l, spec: inp.interaction, pot, cell, M, alpha, mu, delta: inp.delta, T, photon, dmu,
    xi, E, r, frame, residual: { emitter: resE, photon: resP },
  };
}

/** J_st(k) of the background's cell and interaction. */
export function backgroundCouplings(bg: Background, k: readonly [number, number]): { re: Float64Array; im: Float64Array } {
  return blochCouplings(bg.l, bg.spec, bg.pot, bg.cell, k);
}

/** The description of a solved mean-field state (as `solve` returns it) for linearisation. */
export function inputFromState(
  s: { cell: { a: number; b: number; c: number }; sublatticeDensities: number[]; alpha: number; mu: number; delta: number; T: number },
  p: { lattice: LatticeName; interaction: InteractionSpec },
): FluctuationInput {
  return {
    lattice: p.lattice, interaction: p.interaction, cell: s.cell, densities: s.sublatticeDensities,
    alpha: s.alpha, mu: s.mu, delta: s.delta, T: s.T,
  };
}

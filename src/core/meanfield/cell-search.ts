/**
 * Fixed-mu search over supercells and starts (DESIGN.md: lowest Omega over all supercells
 * up to Mmax, never stopping at a metastable solution). Every cell with M <= Mmax (or
 * exactly M = cell) is solved from each of its starts (starts.ts) plus the continuation
 * guess where it fits (at T = 0 integer starts that descend to one pattern are solved once);
 * among converged solutions the lowest Omega per site wins. Ties
 * within 1e-12 relative keep the first found (smaller cells come first), so the result is
 * fixed by the inputs and the seed. The winner is reported on its primitive cell.
 */
import { type Lattice, lattice } from '../lattice/geometry.ts';
import { type Supercell, supercell, supercellsOfSize, supercellsUpTo } from '../lattice/supercells.ts';
import { type Potential, resolvePotential } from '../interaction/potential.ts';
import type { ModelParams } from '../model.ts';
import { ConvergenceError } from '../convergence-error.ts';
import { cellCouplings } from './coupling-cache.ts';
import { type CellSolution, solveCell, T_GROUND } from './sublattice.ts';
import { cellFloor } from './cell-bound.ts';
import { descendedPattern } from './bloch-angles.ts';
import { type Start, cellStarts } from './starts.ts';
import { classifyPhase, type PhaseTolerances } from './phase.ts';
import { isPrimitive, reduceToPrimitive, sameUpToTranslation, translations } from './pattern.ts';
import type { MeanFieldState } from './state.ts';

export interface SearchOptions {
  /** Seed of the random starts (default 1). */
  seed?: number;
  /** Continuation from a neighbouring scan point: one more start, never the only one. */
  guess?: MeanFieldState;
  /** Random starts per cell with M > 1 (default 1). */
  randomStarts?: number;
  /**
   * Fixed density only: every trial mu searches the cells of these sizes alone (an
   * adaptive map's region of one phase, or of one coexisting pair; refinement.ts).
   */
  cellSizes?: number[];
  /** Phase-label tolerances. */
  tolerances?: Partial<PhaseTolerances>;
  /**
   * Keep solutions of a smaller period than the cell (default false: the search over all
   * cells finds them in the smaller cell). solveInCell sets it, so that the state of one
   * given cell is returned even when it is uniform.
   */
  reducible?: boolean;
}

/** The resolved model: lattice, potential and the cells searched. */
export interface Context {
  l: Lattice;
  pot: Potential;
  p: ModelParams;
  cells: Supercell[];
}

/** Resolve lattice, interaction and the cells of p (p.cell: exactly that size, else <= maxCell). */
export function context(p: ModelParams): Context {
  const l = lattice(p.lattice);
  const pot = resolvePotential(p.interaction, l);
  const cells = p.cell !== undefined ? supercellsOfSize(l.dim, p.cell) : supercellsUpTo(l.dim, p.maxCell);
  return { l, pot, p, cells };
}

/** A converged solution with its cell and the start it came from. */
export interface Candidate {
  cell: Supercell;
  start: Start['kind'];
  sol: CellSolution;
}

function better(x: CellSolution, best: CellSolution | null): boolean {
  return !best || x.omega < best.omega - 1e-12 * Math.max(1, Math.abs(best.omega));
}

/** J_st(0) of `cell` for the context's interaction (cached). */
export function cellJ(ctx: Context, cell: Supercell): Float64Array {
  return cellCouplings(ctx.l, ctx.p.interaction, ctx.pot, cell);
}

/** Every converged start of one cell at chemical potential mu (the guess included if given). */
export function cellCandidates(ctx: Context, cell: Supercell, mu: number, o: SearchOptions = {}): Candidate[] {
  const J = cellJ(ctx, cell);
  const prob = { M: cell.M, J, mu, delta: ctx.p.delta, T: ctx.p.T };
  const starts = cellStarts(cell, J, { dim: ctx.l.dim, seed: o.seed ?? 1, randomStarts: o.randomStarts });
  const g = o.guess;
  if (g && g.cell.a === cell.a && g.cell.b === cell.b && g.cell.c === cell.c && g.sublatticeDensities.length === cell.M) {
    starts.unshift({ kind: 'guess', m: Float64Array.from(g.sublatticeDensities) });
  }
  const out: Candidate[] = [];
  const keep = o.reducible === true || cell.M === 1;
  if (keep && cell.M > 1) {
    for (const v of [0, 0.5, 1]) starts.push({ kind: 'uniform', m: new Float64Array(cell.M).fill(v) });
  }
  // A start is abandoned once its iterate has a smaller period (that solution belongs to a
  // smaller cell, searched there) or comes within DUPLICATE of a solution already found here.
  const abandon = cell.M === 1 ? undefined : (m: Float64Array) => {
    if (!keep && !isPrimitive(cell, [m], SYMMETRIC)) return true;
    for (const c of out) if (sameUpToTranslation(cell, c.sol.m, m, DUPLICATE)) return true;
    return false;
  };
  // At T = 0 integer starts that descend to the same pattern run the same iteration; the
  // later ones could only repeat a candidate already found (or abandoned), so they are
  // skipped. So are those that descend to a lattice translate of such a pattern: J is
  // translation invariant, so their iteration is the translate of the first one's (the same
  // start kick on every sublattice) and ends at the translate of its state, which the first
  // one's candidate already stands for (a later equal Omega never replaces it; a Newton run
  // is abandoned as a duplicate within DUPLICATE of it anyway).
  const descended = new Set<string>();
  for (const s of starts) {
    let m0 = s.m;
    if (prob.T === 0) {
      const n = descendedPattern(prob, m0);
      if (n) {
        const key = patternClass(cell, n);
        if (descended.has(key)) continue;
        descended.add(key);
        m0 = n;
      }
    }
    const sol = solveCell(prob, m0, { abandon });
    if (sol.converged && (keep || isPrimitive(cell, [sol.m], SYMMETRIC))) out.push({ cell, start: s.kind, sol });
  }
  return out;
}

/** The lexicographically smallest translate of the 0/1 pattern n: equal for translates. */
function patternClass(cell: Supercell, n: Float64Array): string {
  let best = '';
  for (const p of translations(cell)) {
    let t = '';
    for (let s = 0; s < p.length; s++) t += n[p[s]] ? '1' : '0';
    if (best === '' || t < best) best = t;
  }
  return best;
}

/** Iterates equal to this under a translation are treated as having the smaller period. */
const SYMMETRIC = 1e-9;
/** Iterates this close (max |dm|, up to translation) to a found solution are duplicates. */
const DUPLICATE = 1e-5;

/**
 * Lowest-Omega converged solution restricted to one given cell (states of a smaller period
 * included, e.g. the uniform state written on 12 sublattices), or null if no start
 * converged. p.mu must be set (fixed mu); p is not validated here.
 */
export function solveInCell(p: ModelParams, cell: Supercell | { a: number; b: number; c: number }, o: SearchOptions = {}): Candidate | null {
  const ctx = context(p);
  const sc = 'sites' in cell ? cell : supercell(cell.a, cell.b, cell.c);
  let best: Candidate | null = null;
  for (const c of cellCandidates(ctx, sc, p.mu as number, { ...o, reducible: true })) if (better(c.sol, best?.sol ?? null)) best = c;
  return best;
}

/** The plain-data state of solveInCell, on the given cell (not reduced). */
export function stateInCell(p: ModelParams, cell: Supercell | { a: number; b: number; c: number }, o: SearchOptions = {}): MeanFieldState | null {
  const c = solveInCell(p, cell, o);
  return c ? toState(context(p), c, p.mu as number, o.tolerances, false) : null;
}

/**
 * Whether no candidate of cell can replace `best` (at T = 0): its floor (cell-bound.ts, a
 * proven lower bound of every state's Omega in the cell, rounding included) is at least
 * best - 1e-12 |best| / 2, while `better` asks for more than best - 1e-12 |best| to replace.
 * Skipping such a cell therefore leaves every step of the search unchanged: the same winner,
 * bit for bit.
 */
function cannotBeat(ctx: Context, cell: Supercell, mu: number, best: CellSolution): boolean {
  if (cell.M === 1 || !(ctx.p.T === 0 || ctx.p.T < T_GROUND)) return false;
  return cellFloor(cell, cellJ(ctx, cell), mu, ctx.p.delta) >= best.omega - 0.5e-12 * Math.max(1, Math.abs(best.omega));
}

/** Lowest-Omega candidate over all cells of the context at chemical potential mu. */
export function searchCells(ctx: Context, mu: number, o: SearchOptions = {}): Candidate {
  let best: Candidate | null = null;
  for (const cell of ctx.cells) {
    if (best && cannotBeat(ctx, cell, mu, best.sol)) continue;
    for (const c of cellCandidates(ctx, cell, mu, o)) if (better(c.sol, best?.sol ?? null)) best = c;
  }
  if (!best) throw new ConvergenceError('mean-field', `no start converged in ${ctx.cells.length} cells at mu = ${mu}`);
  return best;
}

/** The plain-data state of a candidate, labelled, reduced to its primitive cell unless reduce = false. */
export function toState(ctx: Context, c: Candidate, mu: number, tol: Partial<PhaseTolerances> = {}, reduce = true): MeanFieldState {
  const modTol = tol.modulation ?? 1e-4;
  const red = reduce
    ? reduceToPrimitive(c.cell, [c.sol.m, c.sol.sx], Math.min(modTol, 1e-8))
    : { cell: c.cell, arrays: [Array.from(c.sol.m), Array.from(c.sol.sx)] };
  const [m, sx] = red.arrays;
  const a = c.sol.alpha * c.sol.alpha;
  const mean = m.reduce((x, y) => x + y, 0) / m.length;
  const { phase, fraction } = classifyPhase(m, a, tol);
  return {
    phase, fraction,
    cellSize: red.cell.M,
    cell: { a: red.cell.a, b: red.cell.b, c: red.cell.c },
    sublatticeDensities: m, sublatticeCoherences: sx,
    alpha: c.sol.alpha, emitterDensity: mean, photonDensity: a, excitationDensity: a + mean,
    grandPotential: c.sol.omega, mu, delta: ctx.p.delta, T: ctx.p.T,
  };
}

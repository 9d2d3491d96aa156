/**
 * One row segment of an adaptive map, point by point in the order a dense scan solves it,
 * giving every point exactly the state the dense scan (meanfield solveRun with
 * continuation: each point's guess is the previous point's state) would print, while
 * solving few points in full. A point is one of
 *
 *   - certified: its crystal P (cell and integer pattern) is the minimum there by the
 *     affine argument (docs/certified-maps.md). The dense search's winner is then in P's
 *     cell, so only that cell's candidate list is built (cellCandidates, with the same seed
 *     and guess as the dense search): the same candidates, the same first-found minimum.
 *     When the guess is P itself the list need not be built: the guess is the first start
 *     of its cell and a stable integer pattern returns at once (guessCandidate).
 *   - known: solved before without a guess (the refinement's corners). With no guess this
 *     is the dense answer. With a guess, the dense search differs from the cold one only by
 *     the guess's start (first in its cell): when that start converges to the cold winner
 *     (same cell, densities within 1e-9 up to a translation, Omega not above by more than
 *     rounding) the dense answer is that start's state; when it lands in another cell at an
 *     Omega clearly above the winner's it changes nothing; otherwise the point is solved.
 *   - neither: solved in full with the guess, as the dense scan does.
 * Ties of the search (1e-12 relative, first found kept) are reproduced by building the
 * same candidates in the same order; a competitor within 1e-13 of that tolerance is the
 * one case the argument does not see (see the doc).
 */
import { solveGroundState, type SolveResult } from '../meanfield/ground-state.ts';
import { cellCandidates, cellJ, context, searchCells, toState, type Candidate, type Context } from '../meanfield/cell-search.ts';
import { descendedPattern } from '../meanfield/bloch-angles.ts';
import { solveCell } from '../meanfield/sublattice.ts';
import { isPrimitive, sameUpToTranslation } from '../meanfield/pattern.ts';
import type { Supercell } from '../lattice/supercells.ts';
import { validateModel, type ModelParams } from '../model.ts';
import type { RegionCell } from './refinement.ts';

/** What the runner knows of one point of a segment. */
export interface AdaptivePixel {
  params: ModelParams;
  seed: number;
  /** Certified crystal: its cell (Hermite normal form) and pattern. */
  crystal?: { cell: { a: number; b: number; c: number }; n: number[] };
  /** The point solved without a guess (a refinement corner; solveCold). */
  cold?: ColdPoint;
  /**
   * Inside a rectangle whose corners share phase and cell, without certification (T > 0,
   * a temperature axis): solved in that cell only, with the dense search's starts there.
   */
  inCell?: RegionCell;
}

/** A point solved without a guess, with the cell its winner was found in (before reduction). */
export interface ColdPoint {
  state: SolveResult;
  /** The searched cell of the winning candidate (null at fixed density). */
  searchCell: { a: number; b: number; c: number } | null;
}

/**
 * solveGroundState without a guess, keeping the winner's search cell: validate, search the
 * cells, report the winner reduced to its primitive cell (the same calls, the same state).
 */
export function solveCold(params: ModelParams, seed: number): ColdPoint {
  if (params.rho !== undefined) return { state: solveGroundState(params, { seed }), searchCell: null };
  validateModel(params);
  const ctx = context(params);
  const mu = params.mu as number;
  const best = searchCells(ctx, mu, { seed });
  const { a, b, c } = best.cell;
  return { state: toState(ctx, best, mu), searchCell: { a, b, c } };
}

/** A point's outcome and whether it needed a full solve. */
export interface FilledPoint {
  state?: SolveResult;
  error?: string;
  /** 1 when the point was solved in full here, else 0. */
  solves: number;
  /** 1 when the point was solved in one cell only (an inCell pixel), else absent. */
  cellSolves?: number;
}

/** Must equal cell-search.ts: translations within this are symmetries (primitive test). */
const SYMMETRIC = 1e-9;

function better(x: Candidate, best: Candidate | null): boolean {
  return !best || x.sol.omega < best.sol.omega - 1e-12 * Math.max(1, Math.abs(best.sol.omega));
}

function reason(e: unknown): string {
  const m = e instanceof Error ? e.message : String(e);
  return m.replace(/\s*\n\s*/g, ' ').trim() || 'the point could not be solved';
}

function findCell(ctx: Context, c: { a: number; b: number; c: number }, M?: number): Supercell | undefined {
  return ctx.cells.find((s) => s.a === c.a && s.b === c.b && s.c === c.c && (M === undefined || s.M === M));
}

/**
 * The candidate the dense search gets from the guess's start (the first start of the
 * guess's cell: descended at T = 0, solved with the abandon rule of an empty list), or
 * null when the guess fits no searched cell or its start does not converge.
 */
export function guessCandidate(ctx: Context, guess: SolveResult, mu: number): Candidate | null {
  const cell = findCell(ctx, guess.cell, guess.sublatticeDensities.length);
  if (!cell) return null;
  const prob = { M: cell.M, J: cellJ(ctx, cell), mu, delta: ctx.p.delta, T: ctx.p.T };
  let m0: Float64Array = Float64Array.from(guess.sublatticeDensities);
  if (prob.T === 0) m0 = descendedPattern(prob, m0) ?? m0;
  const keep = cell.M === 1;
  const abandon = cell.M === 1 ? undefined : (m: Float64Array) => !keep && !isPrimitive(cell, [m], SYMMETRIC);
  const sol = solveCell(prob, m0, { abandon });
  return sol.converged && (keep || isPrimitive(cell, [sol.m], SYMMETRIC)) ? { cell, start: 'guess', sol } : null;
}

/** Max |x - y| after the best translation of y in cell (Infinity for different lengths). */
function translatedDistance(cell: Supercell, x: ArrayLike<number>, y: ArrayLike<number>, tol: number): boolean {
  return x.length === y.length && x.length === cell.M && sameUpToTranslation(cell, x, y, tol);
}

/** The dense state of a certified point (null: the argument's premise failed here; solve it). */
function certifiedState(ctx: Context, px: AdaptivePixel, guess: SolveResult | undefined): SolveResult | null {
  const cr = px.crystal as NonNullable<AdaptivePixel['crystal']>;
  const cell = findCell(ctx, cr.cell, cr.n.length);
  if (!cell) return null;
  const mu = px.params.mu as number;
  if (guess && guess.cell.a === cell.a && guess.cell.b === cell.b && guess.cell.c === cell.c && guess.sublatticeDensities.length === cell.M) {
    const g = guessCandidate(ctx, guess, mu);
    if (g && g.sol.alpha === 0 && g.sol.m.every((v) => v === 0 || v === 1) && translatedDistance(cell, cr.n, g.sol.m, 0)) {
      return toState(ctx, g, mu);
    }
  }
  let best: Candidate | null = null;
  for (const c of cellCandidates(ctx, cell, mu, { seed: px.seed, guess })) if (better(c, best)) best = c;
  if (!best || best.sol.alpha !== 0 || !translatedDistance(cell, cr.n, best.sol.m, 1e-9)) return null;
  return toState(ctx, best, mu);
}

/**
 * A pixel inside a uniform rectangle (no certification): the best candidate of the region's
 * cell, built as the dense search builds that cell's list (same seed, same guess). Equal to
 * the dense answer wherever the dense winner lies in that cell; null when no start there
 * converges (solve it in full). At fixed density the density solver runs over the cells
 * of the region's sizes (SearchOptions.cellSizes): an assumption like the region's, not an
 * equality.
 */
function inCellState(ctx: Context, px: AdaptivePixel, guess: SolveResult | undefined): SolveResult | null {
  const r = px.inCell as RegionCell;
  // at fixed density every trial mu of the density solver searches the region's cell
  // sizes only; where that fails (the density out of their reach) the pixel is solved in full
  if (px.params.rho !== undefined) {
    try {
      return solveGroundState(px.params, { seed: px.seed, guess, cellSizes: r.sizes ?? [r.M] });
    } catch {
      return null;
    }
  }
  const cell = findCell(ctx, r.cell, r.M);
  if (!cell) return null;
  const mu = px.params.mu as number;
  let best: Candidate | null = null;
  for (const c of cellCandidates(ctx, cell, mu, { seed: px.seed, guess })) if (better(c, best)) best = c;
  return best ? toState(ctx, best, mu) : null;
}

/** The dense state of a point solved cold, given the guess (null: solve it). */
function knownState(ctx: Context, known: ColdPoint, guess: SolveResult | undefined, mu: number): SolveResult | null {
  const cold = known.state, sc = known.searchCell;
  if (!guess) return cold;
  // At fixed density (no search cell) the cold state stands: a guess only steers the
  // density solver's trial mus (same phase and energy; on a plateau, another mu of it).
  // Not the dense scan's line in every digit: fixed-density maps are not certified.
  if (!sc) return cold;
  const g = guessCandidate(ctx, guess, mu);
  if (!g) return cold;
  const W = cold.grandPotential, scale = Math.max(1, Math.abs(W));
  const sameCell = g.cell.a === sc.a && g.cell.b === sc.b && g.cell.c === sc.c;
  if (sameCell && g.sol.omega <= W + 1e-13 * scale &&
      translatedDistance(g.cell, cold.sublatticeDensities, g.sol.m, 1e-9) &&
      translatedDistance(g.cell, cold.sublatticeCoherences, g.sol.sx, 1e-9)) {
    return toState(ctx, g, mu);
  }
  // In another cell the guess's start only adds a candidate (and drops some of its own
  // cell's): clearly above the winner it changes nothing.
  if (!sameCell && g.sol.omega > W + 1e-9 * scale) return cold;
  return null;
}

/**
 * The dense states of one segment's points (see the module note). Deterministic: the same
 * pixels give the same states on any worker.
 */
export function fillSegment(pixels: readonly AdaptivePixel[], continuation: boolean, onPoint?: (i: number, r: FilledPoint) => void): FilledPoint[] {
  const out: FilledPoint[] = [];
  let prev: SolveResult | undefined;
  for (let i = 0; i < pixels.length; i++) {
    const px = pixels[i];
    const guess = continuation ? prev : undefined;
    let r: FilledPoint;
    try {
      let state: SolveResult | null = null;
      if (px.crystal || px.cold || px.inCell) {
        const ctx = context(px.params);
        state = px.crystal ? certifiedState(ctx, px, guess) : px.cold ? knownState(ctx, px.cold, guess, px.params.mu as number) : inCellState(ctx, px, guess);
      }
      r = state ? { state, solves: 0, ...(px.inCell && !px.crystal && !px.cold ? { cellSolves: 1 } : {}) }
        : { state: solveGroundState(px.params, { seed: px.seed, guess }), solves: 1 };
      prev = r.state;
    } catch (e) {
      prev = undefined;
      r = { error: reason(e), solves: 1 };
    }
    out.push(r);
    onPoint?.(i, r);
  }
  return out;
}

/**
 * Mean-field method group of the engine worker: one point, a run of points with
 * continuation (each solved state the next point's guess; see src/core/scan/grid.ts), the
 * bisection of one plateau's edges, and a point's phase margin.
 */
import { solveGroundState, type SolveResult } from '../../src/core/meanfield/ground-state.ts';
import { refinePlateaus, type Plateau } from '../../src/core/meanfield/plateaus.ts';
import { phaseMargin, type PhaseMargin } from '../../src/core/scan/phase-margin.ts';
import { fillSegment, solveCold, type FilledPoint } from '../../src/core/scan/certified-fill.ts';
import { unpackSegment } from '../../src/core/scan/segment-pixels.ts';
import type {
  ColdOutcome, ColdRunRequest, FillSegmentRequest, PhaseMarginRequest, PlateauEdgeRequest, PointCallback, PointOutcome, SolveRequest, SolveRunRequest,
} from '../protocol.ts';

/** An error as one line for a scan row. */
function reason(e: unknown): string {
  const m = e instanceof Error ? e.message : String(e);
  return m.replace(/\s*\n\s*/g, ' ').trim() || 'the point could not be solved';
}

export const meanfieldApi = {
  /** The ground state of one point (solveGroundState). */
  solve(req: SolveRequest): SolveResult {
    return solveGroundState(req.params, { seed: req.seed, guess: req.guess });
  },

  /**
   * Solve the points of a run in order; onPoint (a Comlink proxy) hears of each as it
   * finishes. A point that cannot be solved gets its error (one line) and the run goes
   * on, the next point starting cold. Returns every outcome, in order.
   */
  solveRun(req: SolveRunRequest, onPoint?: PointCallback<PointOutcome>): PointOutcome[] {
    const out: PointOutcome[] = [];
    let prev: SolveResult | undefined;
    for (let i = 0; i < req.points.length; i++) {
      const guess = req.continuation ? prev : undefined;
      let r: PointOutcome;
      try {
        prev = solveGroundState(req.points[i], { seed: req.seeds[i], guess });
        r = { state: prev };
      } catch (e) {
        prev = undefined;
        r = { error: reason(e) };
      }
      out.push(r);
      void onPoint?.(i, r);
    }
    return out;
  },

  /** Points solved without a guess, each with its winner's search cell (an adaptive map's corners). */
  solveColdRun(req: ColdRunRequest): ColdOutcome[] {
    return req.points.map((p, i) => {
      try {
        return { cold: solveCold(p, req.seeds[i]) };
      } catch (e) {
        return { error: reason(e) };
      }
    });
  },

  /** Row segments of an adaptive map, each point as the dense run would give it (fillSegment, segment by segment). */
  fillSegment(req: FillSegmentRequest, onPoint?: PointCallback<FilledPoint>): FilledPoint[] {
    const pixels = unpackSegment(req.segment);
    const out: FilledPoint[] = [];
    for (const length of req.cuts ?? [pixels.length]) {
      const at = out.length;
      out.push(...fillSegment(pixels.slice(at, at + length), req.continuation, onPoint ? (i, r) => void onPoint(at + i, r) : undefined));
    }
    return out;
  },

  /** One plateau with its edges bisected to req.muTol (see PlateauEdgeRequest). */
  refinePlateau(req: PlateauEdgeRequest): Plateau {
    const around = [req.below, req.above].filter((s) => s !== undefined);
    const base = { ...req.base };
    delete base.rho;
    const solve = (mu: number) => solveGroundState({ ...base, mu }, { seed: req.seed });
    return refinePlateaus([req.plateau], around, req.base.maxCell, solve, req.muTol)[0];
  },

  /** How far the point is from the nearest change of phase along mu (phaseMargin). */
  phaseMargin(req: PhaseMarginRequest): PhaseMargin {
    const { params, ...o } = req;
    return phaseMargin(params, o);
  },
};

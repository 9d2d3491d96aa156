/**
 * Mean-field method group of the engine worker: one point, or a run of points with
 * continuation (each state the next point's guess; see src/core/scan/grid.ts), and the
 * bisection of plateau edges.
 */
import { solveGroundState, type SolveResult } from '../../src/core/meanfield/ground-state.ts';
import { refinePlateaus, type Plateau } from '../../src/core/meanfield/plateaus.ts';
import type { PlateauEdgeRequest, PointCallback, SolveRequest, SolveRunRequest } from '../protocol.ts';

export const meanfieldApi = {
  /** The ground state of one point (solveGroundState). */
  solve(req: SolveRequest): SolveResult {
    return solveGroundState(req.params, { seed: req.seed, guess: req.guess });
  },

  /**
   * Solve the points of a run in order; onPoint (a Comlink proxy) hears of each as it
   * finishes. Returns every state, in order.
   */
  solveRun(req: SolveRunRequest, onPoint?: PointCallback<SolveResult>): SolveResult[] {
    const out: SolveResult[] = [];
    let prev: SolveResult | undefined;
    for (let i = 0; i < req.points.length; i++) {
      const guess = req.continuation && prev ? prev : undefined;
      const r = solveGroundState(req.points[i], { seed: req.seeds[i], guess });
      out.push(r);
      void onPoint?.(i, r);
      prev = r;
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
};

/**
 * The staircase on the pool: the mu line as a map scan (same segments, seeds and
 * continuation as every scan), its plateaus found from the solved states (findPlateaus),
 * then each plateau's edges bisected to edgeTol, one worker task a plateau, starting from
 * the scan states just off it. Failed points are left out of the plateau search (they
 * keep their row with the error); a failed bisection keeps that plateau's grid edges and
 * its reason in edgeErrors.
 */
import { findPlateaus, type Plateau } from '../../src/core/meanfield/plateaus.ts';
import type { SolveResult } from '../../src/core/meanfield/ground-state.ts';
import type { Engine } from '../engine.ts';
import type { WorkerPool } from '../pool.ts';
import type { ScanOptions, ScanPoint, StaircaseRequest, StaircaseResult } from '../protocol.ts';
import { DEFAULT_POINT_BUDGET_MS, runMapScan } from './map-scan.ts';

/** Default edge tolerance of the bisection (units of g). */
export const EDGE_TOL = 1e-9;

/** Bisections of one edge take ~40 solves; its budget is that many points'. */
const SOLVES_PER_PLATEAU = 100;

/** Run the line, find its plateaus and (unless gridEdges) bisect their edges. */
export async function runStaircase(pool: WorkerPool<Engine>, req: StaircaseRequest, o: ScanOptions<ScanPoint> = {}): Promise<StaircaseResult> {
  const { points } = await runMapScan(pool, { kind: 'map', plan: req.plan }, o);
  return staircasePlateaus(pool, req, points, o);
}

/**
 * The plateaus of a solved line (its points in mu order) and their bisected edges: the
 * second half of runStaircase, also run on a line whose points were partly read back
 * from disk (the CLI's --resume).
 */
export async function staircasePlateaus(pool: WorkerPool<Engine>, req: StaircaseRequest, points: ScanPoint[], o: ScanOptions<ScanPoint> = {}): Promise<StaircaseResult> {
  const states = points.map((p) => p.state).filter((s): s is SolveResult => s !== undefined);
  const maxCell = req.plan.base.maxCell;
  const found = findPlateaus(states, maxCell);
  if (req.gridEdges || found.length === 0) return { points, plateaus: found, refined: !req.gridEdges, edgeErrors: [] };
  const sorted = [...states].sort((a, b) => a.mu - b.mu);
  const edgeErrors: string[] = [];
  const muTol = req.edgeTol ?? EDGE_TOL;
  const plateaus = await pool.run(found, (remote, plateau) => remote.meanfield.refinePlateau({
    base: req.plan.base, plateau, seed: req.plan.seed, muTol,
    below: sorted.filter((s) => s.mu < plateau.muLow).pop(),
    above: sorted.find((s) => s.mu > plateau.muHigh),
  }), {
    signal: o.signal,
    budgetMs: SOLVES_PER_PLATEAU * (o.pointBudgetMs ?? DEFAULT_POINT_BUDGET_MS),
    describe: (p: Plateau) => `edges of the ${p.fraction} plateau (mu ${p.muLow} .. ${p.muHigh}) at ${JSON.stringify(req.plan.base)}`,
    recover: (e, _i, p) => {
      edgeErrors.push(`${p.fraction}: ${e.message}`);
      return p;
    },
  });
  return { points, plateaus, refined: edgeErrors.length === 0, edgeErrors };
}

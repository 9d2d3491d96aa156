/**
 * Soft-mode lines (DESIGN.md, "Fluctuations and soft modes"): in a plane of two
 * parameters, the curve where a phase's own solution (own-solution.ts) first becomes
 * thermodynamically unstable, i.e. where the margin of its softest mode (softest.ts)
 * changes sign: the uniform condensate going soft towards a density wave at k*, the
 * normal (empty, filled, thermal) state or a crystal going soft towards condensation at
 * k = 0 or towards a density wave. Traced by zero-line-trace.ts (seed grid, bisection,
 * continuation), not read off a dense grid. One call is one interaction range and one
 * followed phase; where the phase does not exist (or mu >= delta) the margin is undefined
 * and lines end there. Each point carries k* and its kind.
 */
import { background } from '../spectrum/background.ts';
import { softestMode, type SoftestOptions } from './softest.ts';
import type { SoftKind } from './lowest-mode.ts';
import { type FollowedPhase, type PointModel, ownSolution, phaseName } from './own-solution.ts';
import { type PlaneAxis, checkPlane, planePoint } from './plane.ts';
import { traceZeroLines } from './zero-line-trace.ts';
import { InputError } from '../input-error.ts';

export interface SoftLineRequest {
  /** Lattice, base interaction (its strength; the shape comes from `range`), delta, mu, T. */
  base: PointModel;
  x: PlaneAxis;
  y: PlaneAxis;
  /** Range token (plane.ts): nn, vdw:2, vdw:inf, dipolar, ... */
  range: string;
  phase: FollowedPhase;
  /** Accuracy of the line in units of each axis' span (default 1e-3). */
  tol?: number;
  /** Zone grid of the softest-mode search (softest.ts). */
  zone?: SoftestOptions;
  maxEvaluations?: number;
}

export interface SoftLinePoint {
  x: number;
  y: number;
  /** Softest wavevector on the line (number in 1D, [kx, ky] in 2D). */
  k: number | [number, number];
  kind: SoftKind;
  /** The margin jumps through zero here (the followed solution changes discontinuously). */
  jump?: boolean;
}

export interface SoftLineResult {
  range: string;
  phase: string;
  lines: { points: SoftLinePoint[]; closed: boolean }[];
  /** Margin evaluations spent (each one a softest-mode search). */
  evaluations: number;
  /** The evaluation cap was reached: the lines may be incomplete. */
  truncated?: boolean;
}

/** Accuracy taken, in units of an axis span: the trace costs ~ length / sqrt(tol) evaluations. */
export const MIN_TOL = 1e-6;
/** Margin evaluations allowed (default and largest): each is a mean-field solve and a zone search. */
export const MAX_EVALUATIONS = 200000;
/** Seed points along an axis (the seed grid costs count^2 evaluations). */
export const MAX_SEED = 200;

/** The margin of the followed phase at a point (null where it does not exist). */
export function marginAt(phase: FollowedPhase, p: PointModel, zone?: SoftestOptions): { value: number | null; k: number | [number, number]; kind: SoftKind } {
  if (!(p.mu < p.delta) || !(p.T >= 0)) return { value: null, k: 0, kind: 'density' };
  const s = ownSolution(phase, p);
  if (!s) return { value: null, k: 0, kind: 'density' };
  const m = softestMode(background(s), zone);
  return { value: m.margin, k: m.k, kind: m.kind };
}

/** Trace the soft-mode lines of one range and phase over the plane. */
export function softLines(req: SoftLineRequest): SoftLineResult {
  checkPlane(req.x, req.y);
  const tol = req.tol ?? 1e-3;
  if (!(tol >= MIN_TOL && tol <= 0.25)) {
    throw new InputError(`tol must be in [${MIN_TOL}, 0.25] of the axis span, got ${tol}: finer lines cost ~1/sqrt(tol) solves each`, 'tol');
  }
  const maxEval = req.maxEvaluations ?? MAX_EVALUATIONS;
  if (!(Number.isInteger(maxEval) && maxEval >= 1 && maxEval <= MAX_EVALUATIONS)) {
    throw new InputError(`max-evaluations must be an integer 1..${MAX_EVALUATIONS}, got ${maxEval}`, 'max-evaluations');
  }
  if (Math.max(req.x.count, req.y.count) > MAX_SEED) {
    throw new InputError(`at most ${MAX_SEED} seed points along an axis (the seed grid costs count^2 solves)`, req.x.count > MAX_SEED ? 'x' : 'y');
  }
  const { x, y } = req;
  const X = (u: number) => x.start + u * (x.stop - x.start);
  const Y = (v: number) => y.start + v * (y.stop - y.start);
  // Resolve the range once so a bad token is refused before any work.
  planePoint(req.base, req.range, x, x.start, y, y.start);
  const f = (u: number, v: number) => {
    const p = planePoint(req.base, req.range, x, X(u), y, Y(v));
    const m = marginAt(req.phase, p, req.zone);
    return { value: m.value, payload: { k: m.k, kind: m.kind } };
  };
  const seed = Math.max(x.count, y.count);
  const t = traceZeroLines(f, { seed, tol, maxEvaluations: maxEval });
  return {
    range: req.range, phase: phaseName(req.phase), evaluations: t.evaluations,
    ...(t.evaluations >= maxEval ? { truncated: true } : {}),
    lines: t.lines.map((L) => ({
      closed: L.closed,
      points: L.points.map((q) => {
        const pt: SoftLinePoint = { x: X(q.u), y: Y(q.v), k: q.payload.k, kind: q.payload.kind };
        if (q.jump) pt.jump = true;
        return pt;
      }),
    })),
  };
}

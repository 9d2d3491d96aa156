/**
 * How far a point sits from the nearest change of phase along mu (the pump), for the lab
 * planner's verdict. A row of `count` mu values over mu +- span (above: only up to just
 * below delta) is solved as a scan row (segments of grid.ts, each cold, seeds from the
 * point index); the nearest value on each side whose phase (with its fraction) differs
 * is bisected against the point to `tol`. The nearest soft-mode line of the point's own
 * phase along mu is found by tracing the lines (softLines) in the plane mu +- span by
 * delta +- 0.25 and cutting them with delta = const. Distances in units of g.
 */
import { solveGroundState, type SolveResult } from '../meanfield/ground-state.ts';
import { InputError } from '../input-error.ts';
import { ConvergenceError } from '../convergence-error.ts';
import type { ModelParams } from '../model.ts';
import type { FollowedPhase } from '../softmode/own-solution.ts';
import { softLines, type SoftLineRequest } from '../softmode/soft-lines.ts';
import { pointSeed, rowCuts } from './grid.ts';

export interface PhaseMarginOptions {
  /** Base seed of the row's points (default 1, as the scans). */
  seed?: number;
  /** Half-width of the mu span, g (default 2). */
  span?: number;
  /** Points of the row (default 61). */
  count?: number;
  /** Bisection tolerance in mu, g (default 1e-3). */
  tol?: number;
}

/** A boundary on one side: its distance in mu and the phase beyond it. */
export interface MarginSide {
  distance: number;
  phase: string;
}

export interface SoftDistance {
  /** Distance in mu (g) from the point to the nearest soft-mode line of its own phase, at fixed delta. */
  distance: number;
  k: number | [number, number];
  kind: string;
}

export interface PhaseMargin {
  state: SolveResult;
  /** Nearest soft-mode line of the state's own phase along mu (null: none within the span). */
  soft: SoftDistance | null;
  /** Distance in mu to the nearest boundary below and above (null: none within the span). */
  below: MarginSide | null;
  above: MarginSide | null;
}

/** Bisection steps at most: 2 span / 2^60 is far below any tolerance a user can mean. */
const MAX_BISECTIONS = 60;

const keyOf = (s: SolveResult) => `${s.phase}${s.fraction ? ' ' + s.fraction : ''}`;

/** The phase margin of p (fixed mu). */
export function phaseMargin(p: ModelParams, o: PhaseMarginOptions = {}): PhaseMargin {
  const seed = o.seed ?? 1, span = o.span ?? 2, n = o.count ?? 61, tol = o.tol ?? 1e-3;
  const mu = p.mu as number;
  const lo = mu - span, hi = Math.min(mu + span, p.delta - 1e-6);
  const mus = Array.from({ length: n }, (_, i) => lo + ((hi - lo) * i) / (n - 1));
  const solve = (m: number) => solveGroundState({ ...p, mu: m }, { seed });
  const state = solve(mu);
  const row = solveRow(p, mus, seed);
  const k0 = keyOf(state);
  const side = (dir: 1 | -1): MarginSide | null => {
    const idx = mus.map((_, i) => i).filter((i) => (dir > 0 ? mus[i] > mu : mus[i] < mu))
      .sort((a, b) => Math.abs(mus[a] - mu) - Math.abs(mus[b] - mu));
    const j = idx.find((i) => keyOf(row[i]) !== k0);
    if (j === undefined) return null;
    let a = mu, b = mus[j], other = row[j];
    for (let it = 0; it < MAX_BISECTIONS && Math.abs(b - a) > tol; it++) {
      const mid = (a + b) / 2;
      const s = solve(mid);
      if (keyOf(s) === k0) a = mid; else { b = mid; other = s; }
    }
    return { distance: Math.abs((a + b) / 2 - mu), phase: keyOf(other) };
  };
  const below = side(-1), above = side(1);
  let soft: SoftDistance | null;
  try {
    soft = softLineDistance(p, state, span);
  } catch (e) {
    // a model the tracer refuses or cannot follow: the verdict stands without the soft line
    if (!(e instanceof InputError || e instanceof ConvergenceError)) throw e;
    soft = null;
  }
  return { state, below, above, soft };
}

/** The row solved as a scan row: cold segments, continuation inside each, seeds by index. */
function solveRow(p: ModelParams, mus: number[], seed: number): SolveResult[] {
  const out: SolveResult[] = [];
  for (const length of rowCuts(mus.length)) {
    let prev: SolveResult | undefined;
    for (let k = 0; k < length; k++) {
      const i = out.length;
      prev = solveGroundState({ ...p, mu: mus[i] }, { seed: pointSeed(seed, i), guess: prev });
      out.push(prev);
    }
  }
  return out;
}

/** The phase a state's soft-mode line follows: uniform condensate, normal, or its crystal (null for a supersolid). */
export function followedPhaseOf(s: SolveResult): FollowedPhase | null {
  if (s.phase === 'superradiant') return 'condensate';
  if (s.phase === 'empty' || s.phase === 'filled' || s.phase === 'normal') return 'normal';
  if (s.phase === 'density-wave') return { cell: s.cell, pattern: s.sublatticeDensities.map((m) => (m > 0.5 ? 1 : 0)) };
  return null;
}

/** Distance along mu to the nearest soft-mode line of the point's own phase (null: none here). */
function softLineDistance(p: ModelParams, s: SolveResult, span: number): SoftDistance | null {
  const phase = followedPhaseOf(s);
  if (!phase || p.mu === undefined) return null;
  const mu = p.mu, delta = p.delta;
  const req: SoftLineRequest = {
    base: { lattice: p.lattice, interaction: p.interaction, mu, delta, T: p.T },
    x: { name: 'mu', start: mu - span, stop: Math.min(mu + span, delta + 0.25 - 1e-6), count: 12 },
    y: { name: 'detuning', start: delta - 0.25, stop: delta + 0.25, count: 12 },
    range: rangeToken(p), phase, tol: 1e-3,
  };
  let best: SoftDistance | null = null;
  for (const L of softLines(req).lines) {
    for (let i = 1; i < L.points.length; i++) {
      const a = L.points[i - 1], b = L.points[i];
      if ((a.y - delta) * (b.y - delta) > 0 || a.y === b.y) continue;
      const x = a.x + ((delta - a.y) / (b.y - a.y)) * (b.x - a.x);
      const d = Math.abs(x - mu);
      if (!best || d < best.distance) best = { distance: d, k: a.k, kind: a.kind };
    }
  }
  return best;
}

/** The range token (src/core/softmode/plane.ts) of the model's own interaction. */
function rangeToken(p: ModelParams): string {
  const i = p.interaction;
  const r = i.rmax === undefined || !Number.isFinite(i.rmax) ? 'inf' : String(i.rmax);
  return i.shape === 'nn' ? 'nn' : `${i.shape}:${r}`;
}

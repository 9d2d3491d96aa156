/**
 * How far a point sits from the nearest change of phase along mu (the pump): solve a row
 * of mu values around the point on the interactive worker, take the nearest value whose
 * phase (with fraction) differs, and bisect between the two to `tol`. The answer is a
 * distance in units of g, with the phase found on the other side.
 */
import type { ModelParams } from '../../core/model.ts';
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import type { EngineClient } from './engine-client.ts';
import type { FollowedPhase } from '../../core/softmode/own-solution.ts';
import type { SoftLineRequest } from '../../core/softmode/soft-lines.ts';

export interface PhaseMargin {
  state: SolveResult;
  /** Nearest soft-mode line of the state's own phase along mu (null: none within the window). */
  soft?: SoftDistance | null;
  /** Distance in mu (g) to the nearest boundary below and above (null: none within the window). */
  below: { distance: number; phase: string } | null;
  above: { distance: number; phase: string } | null;
}

const keyOf = (s: SolveResult) => `${s.phase}${s.fraction ? ' ' + s.fraction : ''}`;

/** Search within mu +- window (above: only up to just below delta) with a row of n points. */
export async function phaseMargin(engine: EngineClient, p: ModelParams, signal: AbortSignal, window = 2, n = 61, tol = 1e-3): Promise<PhaseMargin> {
  const mu = p.mu as number;
  const lo = mu - window, hi = Math.min(mu + window, p.delta - 1e-6);
  const mus = Array.from({ length: n }, (_, i) => lo + ((hi - lo) * i) / (n - 1));
  const solveRow = (vals: number[]) => engine.call((r) => r.meanfield.solveRun(
    { points: vals.map((m) => ({ ...p, mu: m })), seeds: vals.map(() => 1), continuation: true }), signal);
  const [state] = await solveRow([mu]);
  const row = await solveRow(mus);
  const k0 = keyOf(state);
  const side = async (dir: 1 | -1) => {
    // nearest grid value on this side with another phase
    const idx = mus.map((m, i) => i).filter((i) => (dir > 0 ? mus[i] > mu : mus[i] < mu)).sort((a, b) => Math.abs(mus[a] - mu) - Math.abs(mus[b] - mu));
    const j = idx.find((i) => keyOf(row[i]) !== k0);
    if (j === undefined) return null;
    let a = mu, b = mus[j];
    let other = row[j];
    while (Math.abs(b - a) > tol) {
      const mid = (a + b) / 2;
      const [s] = await solveRow([mid]);
      if (keyOf(s) === k0) a = mid; else { b = mid; other = s; }
    }
    return { distance: Math.abs((a + b) / 2 - mu), phase: keyOf(other) };
  };
  const below = await side(-1), above = await side(1);
  const soft = await softLineDistance(engine, p, state, signal, window).catch((e: unknown) => {
    if (e instanceof Error && e.name === 'AbortError') throw e;
    return null; // a softcore or unusual model the tracer refuses: the verdict stands without it
  });
  return { state, below, above, soft };
}

/** The phase a state's soft-mode line follows: uniform condensate, normal, or its crystal (null for a supersolid). */
export function followedPhaseOf(s: SolveResult): FollowedPhase | null {
  if (s.phase === 'superradiant') return 'condensate';
  if (s.phase === 'empty' || s.phase === 'filled' || s.phase === 'normal') return 'normal';
  if (s.phase === 'density-wave') return { cell: s.cell, pattern: s.sublatticeDensities.map((m) => (m > 0.5 ? 1 : 0)) };
  return null;
}

export interface SoftDistance {
  /** Distance in mu (g) from the point to the nearest soft-mode line of its own phase, at fixed delta. */
  distance: number;
  k: number | [number, number];
  kind: string;
}

/**
 * Distance along mu to the nearest soft-mode line of the point's own phase: trace the
 * lines (softLines, one pool task) in the plane mu +- window by delta +- 0.25 around the
 * point and cut them with the line delta = const. Null when the phase has no own line here.
 */
export async function softLineDistance(engine: EngineClient, p: ModelParams, s: SolveResult, signal: AbortSignal, window = 2): Promise<SoftDistance | null> {
  const phase = followedPhaseOf(s);
  if (!phase || p.mu === undefined) return null;
  const mu = p.mu, delta = p.delta;
  const req: SoftLineRequest = {
    base: { lattice: p.lattice, interaction: p.interaction, mu, delta, T: p.T },
    x: { name: 'mu', start: mu - window, stop: Math.min(mu + window, delta + 0.25 - 1e-6), count: 12 },
    y: { name: 'detuning', start: delta - 0.25, stop: delta + 0.25, count: 12 },
    range: rangeToken(p), phase, tol: 1e-3,
  };
  const r = await engine.call((e) => e.spectrum.softLines(req), signal);
  let best: SoftDistance | null = null;
  for (const L of r.lines) {
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

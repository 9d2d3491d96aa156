/**
 * How far a point sits from the nearest change of phase along mu (the pump): solve a row
 * of mu values around the point on the interactive worker, take the nearest value whose
 * phase (with fraction) differs, and bisect between the two to `tol`. The answer is a
 * distance in units of g, with the phase found on the other side.
 */
import type { ModelParams } from '../../core/model.ts';
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import type { EngineClient } from './engine-client.ts';

export interface PhaseMargin {
  state: SolveResult;
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
  return { state, below: await side(-1), above: await side(1) };
}

/**
 * Density plateaus of a mu scan (DESIGN.md, "Plateaus and the staircase"). A scan point is
 * on a plateau when it is incompressible in the mean field: no condensate (alpha^2 below
 * the condensate tolerance) and every sublattice empty or filled to within the saturation
 * tolerance (exact at T = 0; at T > 0 up to exp(-gap/T)). Its fraction is the cell's integer
 * occupation p/M, reduced, and is accepted only when the continued fraction of the density
 * gives the same p/q as its best approximation with q <= Mmax. Consecutive points with the
 * same fraction form one plateau [muLow, muHigh]; muLow = muHigh for a plateau seen at one
 * grid point. The edges are those of the grid (inside by less than one step) unless refined
 * by bisection (refinePlateaus), which needs the solver.
 *
 * The empty and filled states are reported as the plateaus "0/1" and "1/1"; `openLow` /
 * `openHigh` mark a plateau that reaches the end of the scan (its edge is not known).
 */
import type { MeanFieldState } from './state.ts';
import { bestRational, DEFAULT_PHASE_TOLERANCES, fractionString, type PhaseTolerances } from './phase.ts';

export interface Plateau {
  /** Reduced fraction "p/q" of the emitter filling. */
  fraction: string;
  muLow: number;
  muHigh: number;
  width: number;
  /** Number of scan points on it. */
  points: number;
  /** The plateau reaches the low / high end of the scan. */
  openLow: boolean;
  openHigh: boolean;
}

/**
 * The plateau fraction of one state, or null when it is compressible (condensed or some
 * sublattice partly filled) or its filling is not a fraction with denominator <= maxCell.
 */
export function plateauFraction(s: MeanFieldState, maxCell: number, tol: Partial<PhaseTolerances> = {}): string | null {
  const t = { ...DEFAULT_PHASE_TOLERANCES, ...tol };
  if (s.photonDensity >= t.condensate) return null;
  let p = 0;
  for (const m of s.sublatticeDensities) {
    if (m > 1 - t.saturation) p++;
    else if (!(m < t.saturation)) return null;
  }
  const M = s.sublatticeDensities.length;
  const f = fractionString(p, M);
  const [pc, qc] = bestRational(s.emitterDensity, maxCell);
  if (fractionString(pc, qc) !== f || Math.abs(s.emitterDensity - pc / qc) > t.saturation) return null;
  return f;
}

/**
 * The state's pattern uses the largest cell the search tried (M = Mmax): such a point may
 * be an artefact of the limit, and a larger Mmax can replace it by a longer period.
 */
export function atSearchLimit(s: Pick<MeanFieldState, 'cellSize'>, maxCell: number): boolean {
  return s.cellSize === maxCell;
}

/** Plateaus of a scan (sorted by mu here; the input is not modified). */
export function findPlateaus(points: MeanFieldState[], maxCell: number, tol: Partial<PhaseTolerances> = {}): Plateau[] {
  const pts = [...points].sort((a, b) => a.mu - b.mu);
  const out: Plateau[] = [];
  let cur: Plateau | null = null;
  pts.forEach((s, i) => {
    const f = plateauFraction(s, maxCell, tol);
    if (f !== null && cur && cur.fraction === f) {
      cur.muHigh = s.mu; cur.points++; cur.openHigh = i === pts.length - 1;
    } else {
      if (cur) out.push(cur);
      cur = f === null ? null : { fraction: f, muLow: s.mu, muHigh: s.mu, width: 0, points: 1, openLow: i === 0, openHigh: i === pts.length - 1 };
    }
  });
  if (cur) out.push(cur);
  for (const p of out) p.width = p.muHigh - p.muLow;
  return out;
}

/**
 * Move each plateau's edges from the grid to the true edges, by bisection between the last
 * point on the plateau and the first point off it, to within muTol (default 1e-9), calling
 * solve(mu) for the state at each trial mu. Open edges (at the ends of the scan) stay.
 * Assumes each plateau is one interval of mu (true of a ground state: rho(mu) is monotone).
 */
export function refinePlateaus(
  plateaus: Plateau[], points: MeanFieldState[], maxCell: number,
  solve: (mu: number) => MeanFieldState, muTol = 1e-9, tol: Partial<PhaseTolerances> = {},
): Plateau[] {
  const mus = points.map((s) => s.mu).sort((a, b) => a - b);
  const on = (mu: number, f: string) => plateauFraction(solve(mu), maxCell, tol) === f;
  const edge = (inside: number, outside: number, f: string) => {
    let a = inside, b = outside;
    // Capped: a muTol below the spacing of doubles near mu would never be reached.
    for (let it = 0; it < 200 && Math.abs(b - a) > muTol; it++) {
      const mid = 0.5 * (a + b);
      if (mid === a || mid === b) break;
      if (on(mid, f)) a = mid; else b = mid;
    }
    return a;
  };
  return plateaus.map((p) => {
    const r = { ...p };
    const below = mus.filter((m) => m < p.muLow).pop();
    const above = mus.find((m) => m > p.muHigh);
    if (!p.openLow && below !== undefined) r.muLow = edge(p.muLow, below, p.fraction);
    if (!p.openHigh && above !== undefined) r.muHigh = edge(p.muHigh, above, p.fraction);
    r.width = r.muHigh - r.muLow;
    return r;
  });
}

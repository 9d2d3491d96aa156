/**
 * The photon amplitude from the free energy (exact as N -> infinity, where the cavity
 * field is classical at any T):
 *
 *   f(alpha) - f(0) = (delta - mu) alpha^2 - int_0^alpha <sigma^x>(a) da,
 *
 * since <sigma^x> = -d f_spin / d alpha (Hellmann-Feynman). The integral is the trapezoid
 * rule over the grid of independent Monte Carlo runs, its error propagated from theirs. The
 * global minimum over the grid picks the phase even where the transition is first order
 * (iterating alpha = <sigma^x> / (2 (delta - mu)) finds local solutions only); the
 * stationary point of that basin, d f / d alpha = 2 (delta - mu) alpha - <sigma^x> = 0, is
 * interpolated linearly between grid points. Since <sigma^x> <= 1, every minimum lies in
 * [0, 1 / (2 (delta - mu))].
 */
import type { Estimate } from '../vmc/binning.ts';

export interface AlphaScanPoint {
  alpha: number;
  sigmaX: Estimate;
  /** f(alpha) - f(0) per site. */
  f: Estimate;
}

export interface AlphaMinimum {
  alpha: number;
  f: Estimate;
}

/** The coarse grid 0 .. 1/(2 (delta - mu)), G points. */
export function alphaGrid(delta: number, mu: number, G: number): number[] {
  const top = 1 / (2 * (delta - mu));
  return Array.from({ length: G }, (_, g) => (top * g) / (G - 1));
}

/** f(alpha) - f(0) on a sorted grid of <sigma^x> estimates (alpha_0 = 0). */
export function freeEnergyCurve(delta: number, mu: number, pts: { alpha: number; sigmaX: Estimate }[]): AlphaScanPoint[] {
  const s = [...pts].sort((a, b) => a.alpha - b.alpha);
  if (s.length === 0 || s[0].alpha !== 0) throw new Error('free-energy curve: the grid must start at alpha = 0');
  // weights[h]: trapezoid weight of point h in the integral up to the current point.
  const weights = new Float64Array(s.length);
  let integral = 0;
  return s.map((p, g) => {
    if (g > 0) {
      const h = s[g].alpha - s[g - 1].alpha;
      integral += (h * (s[g].sigmaX.value + s[g - 1].sigmaX.value)) / 2;
      weights[g - 1] += h / 2; weights[g] += h / 2;
    }
    let v = 0;
    for (let h = 0; h <= g; h++) v += (weights[h] * s[h].sigmaX.error) ** 2;
    return { alpha: p.alpha, sigmaX: p.sigmaX, f: { value: (delta - mu) * p.alpha * p.alpha - integral, error: Math.sqrt(v) } };
  });
}

/** Index of the global minimum of f on the curve. */
export function globalMinimum(curve: AlphaScanPoint[]): number {
  let best = 0;
  for (let g = 1; g < curve.length; g++) if (curve[g].f.value < curve[best].f.value) best = g;
  return best;
}

/** Local minima of f on the grid (the ends count when f rises away from them). */
export function localMinima(curve: AlphaScanPoint[]): AlphaMinimum[] {
  const out: AlphaMinimum[] = [];
  for (let g = 0; g < curve.length; g++) {
    const f = curve[g].f.value;
    const left = g === 0 || curve[g - 1].f.value > f, right = g === curve.length - 1 || curve[g + 1].f.value > f;
    if (left && right) out.push({ alpha: curve[g].alpha, f: curve[g].f });
  }
  return out;
}

/**
 * The stationary point 2 (delta - mu) alpha = <sigma^x> in the basin of grid point g:
 * where D = 2 (delta - mu) alpha - <sigma^x> turns from negative to positive next to g,
 * by linear interpolation; alpha = 0 when g = 0.
 */
export function stationaryAlpha(delta: number, mu: number, curve: AlphaScanPoint[], g: number): number {
  if (g === 0) return 0;
  const D = (k: number) => 2 * (delta - mu) * curve[k].alpha - curve[k].sigmaX.value;
  for (const k of [g - 1, g]) {
    if (k + 1 < curve.length && D(k) <= 0 && D(k + 1) >= 0) {
      const a = curve[k].alpha, b = curve[k + 1].alpha, da = D(k), db = D(k + 1);
      return db === da ? a : a + ((b - a) * -da) / (db - da);
    }
  }
  return curve[g].alpha;
}

/** Refinement grid: R points strictly inside the neighbours of g on the current grid. */
export function refinementGrid(curve: AlphaScanPoint[], g: number, R: number): number[] {
  const lo = curve[Math.max(0, g - 1)].alpha, hi = curve[Math.min(curve.length - 1, g + 1)].alpha;
  const out: number[] = [];
  for (let r = 1; r <= R; r++) {
    const a = lo + ((hi - lo) * r) / (R + 1);
    if (!curve.some((p) => Math.abs(p.alpha - a) < 1e-12 * Math.max(1, hi))) out.push(a);
  }
  return out;
}

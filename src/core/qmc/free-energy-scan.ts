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

/**
 * Local minima of f on the grid that noise alone cannot make: f rises away from the point on
 * both sides (the ends count when f rises away from them), and, away from alpha = 0, the
 * highest f on each side (up to the ends) lies more than z errors of f above it. A shallow
 * dip near alpha = 0, where f - f(0) ~ alpha^2 is below the error bars, is no minimum.
 */
export function localMinima(curve: AlphaScanPoint[], z = 2): AlphaMinimum[] {
  const out: AlphaMinimum[] = [];
  const n = curve.length;
  // alpha = 0 (f = 0 exactly) is a minimum unless f dips significantly below 0 before it
  // rises significantly above.
  for (let k = 1; k <= n; k++) {
    if (k === n || curve[k].f.value - z * curve[k].f.error > 0) { out.push({ alpha: 0, f: curve[0].f }); break; }
    if (curve[k].f.value + z * curve[k].f.error < 0) break;
  }
  for (let g = 1; g < n; g++) {
    const f = curve[g].f.value, e = curve[g].f.error;
    const left = curve[g - 1].f.value > f, right = g === n - 1 || curve[g + 1].f.value > f;
    if (!left || !right) continue;
    let hl = -Infinity, hr = -Infinity;
    for (let k = 0; k < g; k++) hl = Math.max(hl, curve[k].f.value);
    for (let k = g + 1; k < n; k++) hr = Math.max(hr, curve[k].f.value);
    if (hl - f <= z * e || (g < n - 1 && hr - f <= z * e)) continue;
    out.push({ alpha: curve[g].alpha, f: curve[g].f });
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

/**
 * The global minimum when it lies significantly below f(0) = 0, f_min + z sigma_f < 0, else
 * 0 (alpha = 0): near alpha = 0, f - f(0) ~ alpha^2 is below any error bar, and a minimum
 * that noise alone can make must not decide the phase.
 */
export function resolvedMinimum(curve: AlphaScanPoint[], z = 2): number {
  const g = globalMinimum(curve);
  return curve[g].f.value + z * curve[g].f.error < 0 ? g : 0;
}

/** The largest alpha, contiguous from 0, whose f is within z errors of f(0) = 0: the range alpha = 0 cannot exclude. */
export function unresolvedRange(curve: AlphaScanPoint[], z = 2): number {
  let a = 0;
  for (const p of curve) {
    if (p.f.value + z * p.f.error < 0) break;
    a = p.alpha;
    if (p.f.value - z * p.f.error > 0) break;
  }
  return a;
}

/**
 * The detuning below which the condensate wins, from the same curve (valid at this mu and T):
 * with I(alpha) = int_0^alpha <sigma^x>, f(alpha) - f(0) = (delta - mu) alpha^2 - I(alpha) does
 * not depend on delta through I, so alpha = 0 is the global minimum exactly when
 *   delta - mu >= x_c = max_{alpha > 0} I(alpha) / alpha^2,
 * and at x_c alpha jumps to the maximiser (a first-order jump when it is away from 0). The
 * grid point chosen is the one whose lower bound I/alpha^2 - error is highest (near
 * alpha = 0 the ratio's error grows like 1/alpha^2); its value and error are reported.
 */
export function condensateThreshold(delta: number, mu: number, curve: AlphaScanPoint[]): { deltaMinusMu: Estimate; alpha: number } | null {
  let best: { deltaMinusMu: Estimate; alpha: number } | null = null, bound = -Infinity;
  for (const p of curve) {
    if (p.alpha <= 0) continue;
    const a2 = p.alpha * p.alpha;
    const r = ((delta - mu) * a2 - p.f.value) / a2, e = p.f.error / a2;
    if (r - e > bound) { bound = r - e; best = { deltaMinusMu: { value: r, error: e }, alpha: p.alpha }; }
  }
  return best;
}

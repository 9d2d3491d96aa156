/**
 * Where the Binder cumulants of two cluster sizes cross along a scan axis: the finite-size
 * estimate of a continuous transition (Binder, Z. Phys. B 43, 119 (1981): U_L(x) is
 * size-independent at the critical point up to corrections that shrink with L).
 *
 * With the difference d_i = U_2(x_i) - U_1(x_i) on the common axis points, a crossing is
 * a sign change between x_i and x_(i+1), located by linear interpolation of d,
 *
 *   x* = x_i + h d_i / (d_i - d_(i+1)),   h = x_(i+1) - x_i,
 *
 * and its error propagated linearly from the independent errors of the four cumulants,
 *
 *   sigma_x*^2 = (h / (d_i - d_(i+1))^2)^2 ( d_(i+1)^2 sigma_i^2 + d_i^2 sigma_(i+1)^2 ),
 *   sigma_i^2 = sigma(U_1(x_i))^2 + sigma(U_2(x_i))^2 .
 *
 * Noise can make d change sign more than once near a shallow crossing: every sign change
 * is listed, except where all four cumulants sit at a limit where every size agrees, the
 * ordered 2/3 or the disordered 0, within two errors or LIMIT_BAND (frozen chains report
 * near-zero errors there): such a sign change carries no information on a transition. Points where either cumulant is
 * not finite (no order parameter) are skipped.
 */
import type { Estimate } from '../vmc/binning.ts';

/** U(x) of one cluster size along the axis. */
export interface BinderCurve {
  size: number;
  x: readonly number[];
  binder: readonly (Estimate | null)[];
}

export interface BinderCrossing {
  /** The two sizes, smaller first. */
  sizes: [number, number];
  at: number;
  error: number;
  /** The axis points that bracket it. */
  between: [number, number];
}

/** Half-width of the band around U = 2/3 and U = 0 where sizes cannot be told apart. */
const LIMIT_BAND = 0.01;

/** Every sign change of U_b - U_a along the common axis points of two curves (see the header). */
export function crossingsOf(a: BinderCurve, b: BinderCurve): BinderCrossing[] {
  const ub = new Map<number, Estimate>();
  b.x.forEach((x, i) => { const u = b.binder[i]; if (usable(u)) ub.set(x, u); });
  const pts: { x: number; d: number; s2: number }[] = [];
  const atLimit: boolean[] = [];
  a.x.forEach((x, i) => {
    const u = a.binder[i], v = ub.get(x);
    if (usable(u) && v) {
      pts.push({ x, d: v.value - u.value, s2: u.error * u.error + v.error * v.error });
      atLimit.push([u, v].every((w) => [2 / 3, 0].some((L) => Math.abs(w.value - L) <= Math.max(2 * w.error, LIMIT_BAND)))
        && (Math.abs(u.value - v.value) <= Math.max(2 * Math.hypot(u.error, v.error), LIMIT_BAND)));
    }
  });
  const order = pts.map((_, i) => i).sort((i, j) => pts[i].x - pts[j].x);
  const sortedPts = order.map((i) => pts[i]), limit = order.map((i) => atLimit[i]);
  pts.splice(0, pts.length, ...sortedPts);
  const sizes: [number, number] = a.size <= b.size ? [a.size, b.size] : [b.size, a.size];
  const out: BinderCrossing[] = [];
  for (let i = 0; i + 1 < pts.length; i++) {
    const p = pts[i], q = pts[i + 1];
    if (p.d === 0) { out.push({ sizes, at: p.x, error: 0, between: [p.x, p.x] }); continue; }
    if (!(p.d * q.d < 0)) continue;
    if (limit[i] && limit[i + 1]) continue;
    const h = q.x - p.x, D = p.d - q.d;
    const scale = h / (D * D);
    out.push({ sizes, at: p.x + (h * p.d) / D, error: scale * Math.sqrt(q.d * q.d * p.s2 + p.d * p.d * q.s2), between: [p.x, q.x] });
  }
  const last = pts[pts.length - 1];
  if (last && last.d === 0) out.push({ sizes, at: last.x, error: 0, between: [last.x, last.x] });
  return out;
}

/** Crossings of each pair of consecutive sizes (curves sorted by size first). */
export function binderCrossings(curves: readonly BinderCurve[]): BinderCrossing[] {
  const s = [...curves].sort((p, q) => p.size - q.size);
  const out: BinderCrossing[] = [];
  for (let i = 0; i + 1 < s.length; i++) out.push(...crossingsOf(s[i], s[i + 1]));
  return out;
}

function usable(u: Estimate | null | undefined): u is Estimate {
  return u !== null && u !== undefined && Number.isFinite(u.value) && Number.isFinite(u.error);
}

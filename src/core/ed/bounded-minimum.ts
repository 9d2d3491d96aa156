/**
 * Minimum of f on [a, b] by Brent's method: golden-section steps with parabolic
 * interpolation through the three best points when it stays inside the bracket
 * (R. P. Brent, Algorithms for Minimization without Derivatives (1973), ch. 5, procedure
 * localmin). Converges to |x - x*| <= 2 tol(x) with tol(x) = rel |x| + abs.
 */
export interface BoundedMinimum {
  x: number;
  fx: number;
  evaluations: number;
}

const GOLDEN = 0.5 * (3 - Math.sqrt(5));

/** A local minimum of f in [a, b]. */
export function boundedMinimum(f: (x: number) => number, a: number, b: number, rel = 1e-8, abs = 1e-10, maxEval = 200): BoundedMinimum {
  let x = a + GOLDEN * (b - a), w = x, v = x;
  let fx = f(x), fw = fx, fv = fx, evaluations = 1;
  let d = 0, e = 0;
  while (evaluations < maxEval) {
    const m = 0.5 * (a + b), tol = rel * Math.abs(x) + abs, t2 = 2 * tol;
    if (Math.abs(x - m) <= t2 - 0.5 * (b - a)) break;
    let useGolden = true;
    if (Math.abs(e) > tol) {
      // Parabola through (v, fv), (w, fw), (x, fx).
      let r = (x - w) * (fx - fv), q = (x - v) * (fx - fw), p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p; else q = -q;
      r = e; e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < t2 || b - u < t2) d = x < m ? tol : -tol;
        useGolden = false;
      }
    }
    if (useGolden) { e = (x < m ? b : a) - x; d = GOLDEN * e; }
    const u = x + (Math.abs(d) >= tol ? d : d > 0 ? tol : -tol);
    const fu = f(u); evaluations++;
    if (fu <= fx) {
      if (u < x) b = x; else a = x;
      v = w; fv = fw; w = x; fw = fx; x = u; fx = fu;
    } else {
      if (u < x) a = u; else b = u;
      if (fu <= fw || w === x) { v = w; fv = fw; w = u; fw = fu; }
      else if (fu <= fv || v === x || v === w) { v = u; fv = fu; }
    }
  }
  return { x, fx, evaluations };
}

/**
 * One emitter (one sublattice) in its mean field: the two-level system
 *
 *   h_s = xi_s n + alpha sigma^x,   xi_s = -mu + sum_t J_st(0) m_t  (Hartree shift),
 *
 * whose levels are xi_s/2 -+ E_s with E_s = sqrt(xi_s^2/4 + alpha^2). In thermal equilibrium
 *
 *   <sigma^z>_s = -xi_s g_s,  <sigma^x>_s = -2 alpha g_s,  g_s = tanh(E_s/T) / (2 E_s),
 *   m_s = (1 + <sigma^z>_s)/2,
 *
 * and at T = 0 tanh -> 1. Everything here is written in a = alpha^2, because the photon
 * equation is smooth in alpha^2 (g depends on alpha only through E^2 = xi^2/4 + a).
 * Derivatives are returned through q = (dg/dE)/E, so dg/dxi = q xi/4 and dg/da = q/2 stay
 * finite at E -> 0 for T > 0 (q -> -1/(3 T^3)).
 */

/** Below this x = E/T the series of tanh(x)/x and of its derivative are used (error ~x^6 < 1e-12). */
const SMALL_X = 1e-2;

/** g = tanh(E/T)/(2E) (T = 0: 1/(2E)). E = 0 at T = 0 gives Infinity (the photon then condenses). */
export function gOf(E: number, T: number): number {
  if (T === 0) return 1 / (2 * E);
  const x = E / T;
  if (x < SMALL_X) { const x2 = x * x; return (1 - x2 / 3 + (2 * x2 * x2) / 15) / (2 * T); }
  return Math.tanh(x) / (2 * E);
}

/**
 * q = (dg/dE)/E. T = 0: -1/(2E^3). T > 0: (x sech^2 x - tanh x)/(2 E^3), x = E/T, by the
 * series -(1/(2T^3)) (2/3 - 8x^2/15 + 34x^4/105) for small x to avoid cancellation.
 */
export function qOf(E: number, T: number): number {
  if (T === 0) return -1 / (2 * E * E * E);
  const x = E / T;
  if (x < SMALL_X) {
    const x2 = x * x;
    return -(2 / 3 - (8 * x2) / 15 + (34 * x2 * x2) / 105) / (2 * T * T * T);
  }
  const t = Math.tanh(x);
  const sech2 = x > 20 ? 4 * Math.exp(-2 * x) : 1 - t * t;
  return (x * sech2 - t) / (2 * E * E * E);
}

/**
 * m = (1 - xi g)/2, written without cancellation: for xi > 0 (nearly empty)
 *   1 - xi g = [4a/(2E + xi) + xi (1 - tanh x)] / (2E),  1 - tanh x = 2/(e^{2x} + 1).
 */
export function occupation(xi: number, a: number, E: number, g: number, T: number): number {
  if (xi <= 0) return (1 - xi * g) / 2;
  const oneMinusT = T === 0 ? 0 : 2 / (Math.exp(2 * E / T) + 1);
  return (4 * a / (2 * E + xi) + xi * oneMinusT) / (2 * E) / 2;
}

/**
 * Free energy of the emitter's levels, -T ln(2 cosh(E/T)) = -E - T ln(1 + e^{-2E/T})
 * (T = 0: -E).
 */
export function levelFreeEnergy(E: number, T: number): number {
  if (T === 0) return -E;
  return -E - T * Math.log1p(Math.exp(-2 * E / T));
}

/**
 * Photon self-consistency in a = alpha^2 for fixed Hartree shifts xi_s:
 *
 *   (delta - mu) = (1/M) sum_s g_s(a),   g_s = tanh(E_s/T)/(2E_s),  E_s^2 = xi_s^2/4 + a.
 *
 * The right side falls with a, so there is one root a > 0 if (delta - mu) < mean g_s(0),
 * else a = 0 (the normal state). Since g_s <= 1/(2 sqrt a), the root lies below
 * 1/(4 (delta-mu)^2). Safeguarded Newton on the bracket, started from `aGuess` (the
 * previous iterate), converged to 1e-15 relative.
 */
export function photonDensity(xi: Float64Array, dmu: number, T: number, aGuess = 0): number {
  const M = xi.length;
  let G0 = 0;
  for (let s = 0; s < M; s++) G0 += gOf(Math.abs(xi[s]) / 2, T);
  G0 /= M;
  if (!(G0 > dmu)) return 0;
  let lo = 0, hi = 1 / (4 * dmu * dmu);
  let a = aGuess > 0 && aGuess < hi ? aGuess : hi / 2;
  for (let it = 0; it < 200; it++) {
    let h = -dmu, dh = 0;
    for (let s = 0; s < M; s++) {
      const E = Math.sqrt(xi[s] * xi[s] / 4 + a);
      h += gOf(E, T) / M;
      dh += qOf(E, T) / (2 * M);
    }
    if (h > 0) lo = a; else hi = a;
    if (h === 0) return a;
    let next = a - h / dh;
    if (!(next > lo && next < hi)) next = lo > 0 ? Math.sqrt(lo * hi) : hi / 16;
    if (Math.abs(next - a) <= 1e-15 * a || hi - lo <= 1e-15 * hi) return next;
    a = next;
  }
  return a;
}

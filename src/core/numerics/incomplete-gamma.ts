/**
 * Special functions for Ewald sums of power laws, accurate to ~1e-15 relative.
 *
 * erfc by the positive series erf(x) = (2/sqrt pi) e^{-x^2} sum_n 2^n x^{2n+1}/(2n+1)!!
 * (no cancellation) for x < 2.5 and a Lentz continued fraction beyond; E1 by its power
 * series for x <= 1 and its continued fraction beyond (Abramowitz and Stegun 5.1.11, 5.1.22);
 * the upper incomplete gamma Gamma(a, x) for 2a an integer by the recurrence
 * Gamma(a+1, x) = a Gamma(a, x) + x^a e^{-x} (A&S 6.5.22) from Gamma(1/2, x) = sqrt(pi) erfc(sqrt x),
 * Gamma(0, x) = E1(x) and Gamma(1, x) = e^{-x}.
 */

const SQRT_PI = Math.sqrt(Math.PI);
const EULER_GAMMA = 0.5772156649015329;

/** Complementary error function erfc(x). */
export function erfc(x: number): number {
  if (x < 0) return 2 - erfc(-x);
  if (x < 2.5) {
    let term = x, sum = x;
    for (let n = 1; n < 200; n++) {
      term *= (2 * x * x) / (2 * n + 1);
      sum += term;
      if (term < 1e-17 * sum) break;
    }
    return 1 - (2 / SQRT_PI) * Math.exp(-x * x) * sum;
  }
  // erfc(x) = e^{-x^2}/sqrt(pi) * 1/(x + (1/2)/(x + 1/(x + (3/2)/(x + 2/(x + ...)))))
  const tiny = 1e-300;
  let f = x, C = x, D = 0;
  for (let n = 1; n < 500; n++) {
    const an = n / 2;
    D = x + an * D; D = Math.abs(D) < tiny ? tiny : D; D = 1 / D;
    C = x + an / C; C = Math.abs(C) < tiny ? tiny : C;
    const delta = C * D;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(-x * x) / (SQRT_PI * f);
}

/** Exponential integral E1(x) = int_x^inf e^{-t}/t dt, x > 0. */
export function expint1(x: number): number {
  if (!(x > 0)) throw new Error(`E1 needs x > 0, got ${x}`);
  if (x <= 1) {
    let sum = 0, term = 1;
    for (let n = 1; n < 100; n++) {
      term *= -x / n;
      const add = -term / n;
      sum += add;
      if (Math.abs(add) < 1e-17 * Math.abs(sum)) break;
    }
    return -EULER_GAMMA - Math.log(x) + sum;
  }
  // Modified Lentz on E1(x) = e^{-x} / (x + 1 - 1/(x + 3 - 4/(x + 5 - ...))).
  const tiny = 1e-300;
  let b = x + 1, c = 1 / tiny, d = 1 / b, h = d;
  for (let i = 1; i < 1000; i++) {
    const an = -i * i;
    b += 2;
    d = 1 / (an * d + b);
    c = b + an / c;
    const del = c * d;
    h *= del;
    if (Math.abs(del - 1) < 1e-16) break;
  }
  return h * Math.exp(-x);
}

/** Upper incomplete gamma Gamma(a, x) = int_x^inf t^{a-1} e^{-t} dt for x > 0, 2a an integer. */
export function upperGamma(a: number, x: number): number {
  const twoA = Math.round(2 * a);
  if (Math.abs(twoA - 2 * a) > 1e-12) throw new Error(`upperGamma needs 2a integer, got a = ${a}`);
  if (!(x > 0)) throw new Error(`upperGamma needs x > 0, got ${x}`);
  const ex = Math.exp(-x);
  const half = twoA % 2 !== 0;
  let g: number, cur: number;
  if (half) { cur = 0.5; g = SQRT_PI * erfc(Math.sqrt(x)); }
  else if (twoA >= 2) { cur = 1; g = ex; }
  else { cur = 0; g = expint1(x); }
  while (cur < a - 1e-9) { g = cur * g + Math.pow(x, cur) * ex; cur += 1; }
  while (cur > a + 1e-9) { cur -= 1; g = (g - Math.pow(x, cur) * ex) / cur; }
  return g;
}

/** Gamma(a) for 2a a positive integer. */
export function gammaHalfInteger(a: number): number {
  const twoA = Math.round(2 * a);
  if (twoA < 1 || Math.abs(twoA - 2 * a) > 1e-12) throw new Error(`gammaHalfInteger needs 2a a positive integer, got ${a}`);
  let g = twoA % 2 ? SQRT_PI : 1, cur = twoA % 2 ? 0.5 : 1;
  while (cur < a - 1e-9) { g *= cur; cur += 1; }
  return g;
}

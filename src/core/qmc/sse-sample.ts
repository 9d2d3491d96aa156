/**
 * Estimators read off one stochastic series expansion configuration (Sandvik, Phys. Rev. E
 * 68, 056701 (2003); J. Phys. A 25, 3667 (1992)), with n operators in the string:
 *
 *   <sigma^x>         n_flip / (beta alpha N)            (<sum_i alpha sigma^x_i> = <n_flip> / beta)
 *   density           (1 / (n N)) sum_p N(p)              (N(p): excitations before operator p)
 *   Kubo integral     int_0^beta <N(tau) N> dtau = beta / (n (n + 1)) [ (sum_p N(p))^2 + sum_p N(p)^2 ]
 *
 * (with n = 0: the state itself), the last giving the compressibility
 * d rho / d mu = (1/N) [ int <N(tau) N> - beta <N>^2 ].
 */
import type { VertexLinks } from './vertex-links.ts';

export interface ConfigSample {
  density: number;
  sigmaX: number;
  /** The Kubo integral of the excitation number with itself. */
  kubo: number;
  /** (1/n) sum_p N(p): the time-averaged excitation number. */
  number: number;
  /** Operators in the string. */
  operators: number;
}

/** The estimators from the counts of the last vertex-link pass over N sites. */
export function sampleConfig(counts: VertexLinks['counts'], N: number, beta: number, alpha: number): ConfigSample {
  const { operators: n, flips, start, sum, sum2 } = counts;
  const number = n > 0 ? sum / n : start;
  const kubo = n > 0 ? (beta * (sum * sum + sum2)) / (n * (n + 1)) : beta * start * start;
  return {
    density: number / N,
    sigmaX: alpha > 0 ? flips / (beta * alpha * N) : 0,
    kubo, number, operators: n,
  };
}

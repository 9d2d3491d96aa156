/**
 * Estimators read off one stochastic series expansion configuration (Sandvik, Phys. Rev. E
 * 68, 056701 (2003); J. Phys. A 25, 3667 (1992)), with n operators in the string:
 *
 *   energy per site   e = (E0 - n / beta) / N
 *   <sigma^x>         n_flip / (beta alpha N)            (<sum_i alpha sigma^x_i> = <n_flip> / beta)
 *   density           (1 / (n N)) sum_p N(p)              (N(p): excitations before operator p)
 *   Kubo integral     int_0^beta <N(tau) N> dtau = beta / (n (n + 1)) [ (sum_p N(p))^2 + sum_p N(p)^2 ]
 *
 * (with n = 0: the state itself), the last giving the compressibility
 * d rho / d mu = (1/N) [ int <N(tau) N> - beta <N>^2 ].
 */
import { type SseConfig, EMPTY, FLIP } from './operator-string.ts';

export interface ConfigSample {
  energy: number;
  density: number;
  sigmaX: number;
  /** The Kubo integral of the excitation number with itself. */
  kubo: number;
  /** (1/n) sum_p N(p): the time-averaged excitation number. */
  number: number;
  /** Operators in the string. */
  operators: number;
}

/** Read the estimators of configuration c (scratch: a copy of the state, length N). */
export function sampleConfig(c: SseConfig, E0: number, beta: number, alpha: number, scratch: Uint8Array): ConfigSample {
  const N = c.N, kind = c.kind, siteA = c.siteA;
  scratch.set(c.state);
  let Ncur = 0;
  for (let i = 0; i < N; i++) Ncur += scratch[i];
  let n = 0, flips = 0, sum = 0, sum2 = 0;
  for (let p = 0; p < c.L; p++) {
    const k = kind[p];
    if (k === EMPTY) continue;
    sum += Ncur; sum2 += Ncur * Ncur; n++;
    if (k === FLIP) {
      flips++;
      const i = siteA[p];
      Ncur += scratch[i] ? -1 : 1;
      scratch[i] ^= 1;
    }
  }
  const number = n > 0 ? sum / n : Ncur;
  const kubo = n > 0 ? (beta * (sum * sum + sum2)) / (n * (n + 1)) : beta * Ncur * Ncur;
  return {
    energy: (E0 - n / beta) / N,
    density: number / N,
    sigmaX: alpha > 0 ? flips / (beta * alpha * N) : 0,
    kubo, number, operators: n,
  };
}

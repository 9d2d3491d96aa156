/**
 * Soft-core chain sums by Poisson summation (src/core/interaction/softcore-poisson.ts)
 * against a brute direct sum over images written here from the definition
 *   J_st(k) = sum_{n, r != 0} V(|d + nM|) e^{ik(d + nM)},  d = t - s,  V = V0 / (1 + (r/Rc)^6),
 * and the transform F(u) = int cos(ux)/(1 + x^6) dx against Simpson quadrature and the
 * closed form F(0) = 2 pi / 3 (int_0^inf dx/(1 + x^n) = (pi/n)/sin(pi/n): Gradshteyn and
 * Ryzhik, Table of Integrals, 3.241.2).
 */
import { describe, it, expect } from 'vitest';
import { softcorePoissonChain, softcoreTransform } from '../../../src/core/interaction/softcore-poisson.ts';
import { expectAbs } from '../../references.ts';

/** 2 int_0^X cos(u x)/(1 + x^6) dx by composite Simpson with step h. */
function simpson(u: number, X = 60, h = 1e-3): number {
  const f = (x: number) => Math.cos(u * x) / (1 + x ** 6);
  const m = Math.round(X / h);
  let s = f(0) + f(X);
  for (let i = 1; i < m; i++) s += (i % 2 ? 4 : 2) * f(i * h);
  return (2 * s * h) / 3;
}

function direct(M: number, V0: number, Rc: number, k: number, nmax: number) {
  const re = new Float64Array(M * M), im = new Float64Array(M * M);
  for (let s = 0; s < M; s++) for (let t = 0; t < M; t++) {
    let a = 0, b = 0;
    // sum the small far terms first
    for (let n = nmax; n >= -nmax; n -= 1) {
      const x = t - s + n * M;
      if (x === 0) continue;
      const v = V0 / (1 + (Math.abs(x) / Rc) ** 6);
      a += v * Math.cos(k * x); b += v * Math.sin(k * x);
    }
    re[s * M + t] = a; im[s * M + t] = b;
  }
  return { re, im };
}

describe('soft-core lattice sum on the chain by Poisson summation', () => {
  it('F(0) = 2 pi/3 and F(u) matches quadrature', () => {
    expectAbs(softcoreTransform(0), (2 * Math.PI) / 3, 1e-14);
    // Simpson with h = 1e-3 on a smooth integrand: error ~ h^4 |f''''| ~ 1e-12; the tail beyond
    // x = 60 is below 2/(5 * 60^5) ~ 5e-10, so 2e-9.
    for (const u of [0.5, 1, 2.5, 6]) expectAbs(softcoreTransform(u), simpson(u), 2e-9);
  });

  it('J_st(k) matches the direct image sum (M = 1, 2, 3; Rc = 1, 1.7, 3)', () => {
    for (const [M, V0, Rc] of [[1, 2, 1], [2, 5, 1.7], [3, 1.3, 3]] as const) {
      for (const k of [0, 0.4, Math.PI / M, 2.9]) {
        const J = { re: new Float64Array(M * M), im: new Float64Array(M * M) };
        softcorePoissonChain(M, V0, Rc, k, J);
        // nmax M = 2e4: the omitted tail is below 2 V0 Rc^6 / (5 (2e4)^5) ~ 1e-19.
        const ref = direct(M, V0, Rc, k, Math.ceil(2e4 / M));
        // Terms of size <= V0 ~ 5 summed with rounding ~1e-15 each; the Poisson side drops terms
        // below e^-50 of the largest. 1e-12 absolute.
        for (let i = 0; i < M * M; i++) {
          expectAbs(J.re[i], ref.re[i], 1e-12);
          expectAbs(J.im[i], ref.im[i], 1e-12);
        }
      }
    }
  });

  it('adds into J rather than overwriting it', () => {
    const J = { re: Float64Array.from([10]), im: Float64Array.from([0]) };
    softcorePoissonChain(1, 1, 1, 0, J);
    const ref = direct(1, 1, 1, 0, 20000);
    expectAbs(J.re[0], 10 + ref.re[0], 1e-12);
    expect(J.im[0]).toBeCloseTo(0, 12);
  });
});

import { describe, it, expect } from 'vitest';
import { lattice } from '../../../src/core/lattice/geometry.ts';
import { period, supercell } from '../../../src/core/lattice/supercells.ts';
import { resolvePotential } from '../../../src/core/interaction/potential.ts';
import { couplings, fourierV } from '../../../src/core/interaction/lattice-sums.ts';
import { InputError } from '../../../src/core/input-error.ts';
import { expectRel } from '../../references.ts';

const chain = lattice('chain'), square = lattice('square');
const soft = (V0: number, Rc: number, l = chain, rmax?: number) => resolvePotential({ shape: 'softcore', V0, Rc, rmax }, l);

/**
 * Brute force reference: sum_{n=1}^{N} 2 V(n) cos(k n), added from the small far terms in,
 * with Kahan compensation, plus the Euler-Maclaurin tail at k = 0 (Abramowitz and Stegun
 * 23.1.30) of V ~ V0 Rc^6 n^-6, int_N^inf = V0 Rc^6 N^-5/5 (relative size (Rc/N)^5).
 */
function bruteChain(V0: number, Rc: number, k: number, N: number): number {
  let sum = 0, c = 0;
  for (let n = N; n >= 1; n--) {
    const y = 2 * (V0 / (1 + Math.pow(n / Rc, 6))) * Math.cos(k * n) - c;
    const t = sum + y; c = (t - sum) - y; sum = t;
  }
  if (k === 0) sum += 2 * (V0 * Math.pow(Rc, 6) * Math.pow(N, -5) / 5 - V0 / (1 + Math.pow(N / Rc, 6)) / 2);
  return sum;
}

describe('soft-core lattice sum, stable at any core radius (issue 10)', () => {
  for (const Rc of [3, 12, 300, 1000]) {
    it(`chain, Rc = ${Rc}: J(0) and J(k) equal a brute-force direct sum`, () => {
      // Tolerance 1e-10: Kahan-summed brute force over 2e3 Rc terms (tail (1/2000)^5 relative);
      // the old split was off by 4% at Rc = 300 and had the wrong sign at Rc = 1000.
      const N = Math.round(2000 * Rc);
      expectRel(fourierV(chain, soft(1.7, Rc), [0, 0]), bruteChain(1.7, Rc, 0, N), 1e-10);
      // At k != 0 the terms oscillate and the direct sum converges like the r^-6 tail itself.
      const k = 0.7;
      const J = fourierV(chain, soft(1.7, Rc), [k, 0]);
      expectRel(J, bruteChain(1.7, Rc, k, N), 1e-9, 1e-12 * 1.7 * Rc);
    });
  }

  it('chain, Rc = 1e6 and 1e9: J(0) -> V0 Rc int dx/(1+x^6) - V0 with int dx/(1+x^6) = (pi/3)/sin(pi/6)', () => {
    // The lattice sum of an analytic function of scale Rc equals its integral up to e^{-pi Rc}
    // (Poisson); the integral int_0^inf dx/(1+x^n) = (pi/n)/sin(pi/n) (Gradshteyn and Ryzhik
    // 3.241.2, from memory). Tolerance 1e-12: rounding.
    for (const Rc of [1e6, 1e9]) {
      const exact = 2 * Rc * (Math.PI / 6) / Math.sin(Math.PI / 6) - 1;
      expectRel(fourierV(chain, soft(1, Rc), [0, 0]), exact, 1e-12);
    }
  });

  it('a 2-sublattice cell sums to the uniform J(0); Hermitian J_st(k)', () => {
    // Invariants: sum_t J_st(0) over a cell = J(0) of the primitive cell; J_ts(k) = conj J_st(k). Tolerance 1e-12 (rounding).
    for (const Rc of [3, 50, 5000]) {
      const pot = soft(0.9, Rc);
      const J1 = fourierV(chain, pot, [0, 0]);
      const J2 = couplings(chain, period(2), pot);
      expectRel(J2.re[0] + J2.re[1], J1, 1e-12);
      const Jk = couplings(chain, period(3), pot, [0.4, 0]);
      for (let s = 0; s < 3; s++) for (let t = 0; t < 3; t++) {
        expectRel(Jk.re[s * 3 + t], Jk.re[t * 3 + s], 1e-12, 1e-15 * Rc);
        expectRel(Jk.im[s * 3 + t], -Jk.im[t * 3 + s], 1e-12, 1e-15 * Rc);
      }
    }
  });

  it('square, Rc = 1e6 with range 3.5: a constant V0 to every site in range (the Rc -> inf limit)', () => {
    // V0/(1 + (r/Rc)^6) = V0 (1 - 2e-33) within the range; sites counted here by enumeration.
    let count = 0;
    for (let m = -4; m <= 4; m++) for (let n = -4; n <= 4; n++) if ((m || n) && m * m + n * n <= 3.5 * 3.5) count++;
    expectRel(fourierV(square, soft(2.5, 1e6, square, 3.5), [0, 0]), 2.5 * count, 1e-14);
    expectRel(fourierV(chain, soft(2.5, 1e6, chain, 3.5), [0, 0]), 2.5 * 6, 1e-14);
  });

  it('square, Rc = 5: J(0) equals a direct sum out to 400 plus its continuum tail', () => {
    // Tail (2 pi) int_R^inf V0 Rc^6 r^-5 dr = 2 pi V0 Rc^6 R^-4 / 4 (unit cell area 1), ~ 1e-7 of J;
    // its own error is of the size of V(R) R^{2/3} ~ 1e-10 relative. Tolerance 1e-9.
    const R = 400, V0 = 1, Rc = 5;
    let sum = 0;
    for (let m = -R; m <= R; m++) for (let n = -R; n <= R; n++) {
      const r2 = m * m + n * n;
      if (r2 === 0 || r2 > R * R) continue;
      sum += V0 / (1 + Math.pow(r2 / (Rc * Rc), 3));
    }
    sum += 2 * Math.PI * V0 * Math.pow(Rc, 6) * Math.pow(R, -4) / 4;
    expectRel(fourierV(square, soft(V0, Rc, square), [0, 0]), sum, 1e-9);
  });

  it('refuses a 2D full-range sum past Rc = 20 and a 2D range past 200, naming the limit', () => {
    expect(() => soft(1, 1e6, square)).toThrow(InputError);
    expect(() => soft(1, 1e6, square)).toThrow(/20/);
    expect(() => resolvePotential({ shape: 'vdw', Rb: 1.5, rmax: 1e4 }, square)).toThrow(/200/);
    expect(() => couplings(square, supercell(1, 0, 1), soft(1, 20, square))).not.toThrow();
  });
});

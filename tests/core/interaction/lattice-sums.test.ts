import { describe, it } from 'vitest';
import { lattice } from '../../../src/core/lattice/geometry.ts';
import { period, supercellsUpTo } from '../../../src/core/lattice/supercells.ts';
import { resolvePotential } from '../../../src/core/interaction/potential.ts';
import { couplings, fourierV } from '../../../src/core/interaction/lattice-sums.ts';
import { expectRel } from '../../references.ts'; // citations: SOURCES in tests/references.ts

const chain = lattice('chain'), square = lattice('square'), tri = lattice('triangular');
const r6 = (l = chain) => resolvePotential({ shape: 'vdw', V1: 1 }, l);
const r3 = (l = chain) => resolvePotential({ shape: 'dipolar', V1: 1 }, l);

/**
 * Hurwitz zeta(s, a) = sum_{n>=0} (n+a)^-s: direct sum to N plus the Euler-Maclaurin tail
 * (Abramowitz and Stegun 23.1.30); with N = 1000 the first omitted term is ~N^{-s-5}, below 1e-15.
 */
function hurwitz(s: number, a: number): number {
  const N = 1000;
  let sum = 0;
  for (let n = N - 1; n >= 0; n--) sum += Math.pow(n + a, -s);
  const x = N + a;
  return sum + Math.pow(x, 1 - s) / (s - 1) + Math.pow(x, -s) / 2 + (s * Math.pow(x, -s - 1)) / 12
    - (s * (s + 1) * (s + 2) * Math.pow(x, -s - 3)) / 720;
}

/** Riemann zeta(s) = zeta(s, 1). */
const zeta = (s: number) => hurwitz(s, 1);

/** Dirichlet L-series sum_n chi(n) n^-s = q^-s sum_r chi(r) zeta(s, r/q) for a character of period q. */
function dirichletL(chi: number[], s: number): number {
  const q = chi.length;
  let sum = 0;
  for (let r = 1; r < q; r++) if (chi[r]) sum += chi[r] * hurwitz(s, r / q);
  return sum * Math.pow(q, -s);
}

describe('converged lattice sums J(k)', () => {
  it('chain: sum_{n != 0} |n|^-6 = 2 zeta(6) = 2 pi^6/945', () => {
    // source: SOURCES.riemannZeta6; tolerance 1e-12: the Ewald sum is exact to rounding.
    expectRel(fourierV(chain, r6(), [0, 0]), (2 * Math.PI ** 6) / 945, 1e-12);
  });

  it('square: sum\' (m^2+n^2)^-3 = 4 zeta(3) beta(3), beta(3) = pi^3/32', () => {
    // source: SOURCES.squareLatticeSum; beta(3) = pi^3/32 is Euler's closed form.
    expectRel(fourierV(square, r6(square), [0, 0]), 4 * zeta(3) * (Math.PI ** 3 / 32), 1e-9);
  });

  it('triangular: sum\' (m^2+mn+n^2)^-3 = 6 zeta(3) L_-3(3)', () => {
    // source: SOURCES.triangularLatticeSum; L_-3(3) summed in the test and checked against 4 pi^3/(81 sqrt 3).
    const L3 = dirichletL([0, 1, -1], 3);
    expectRel(L3, (4 * Math.PI ** 3) / (81 * Math.sqrt(3)), 1e-12);
    expectRel(fourierV(tri, r6(tri), [0, 0]), 6 * zeta(3) * L3, 1e-9);
  });

  it('dipolar square: sum\' (m^2+n^2)^-3/2 = 4 zeta(3/2) beta(3/2)', () => {
    // same identity at s = 3/2 (SOURCES.squareLatticeSum); both series summed in the test.
    const beta = dirichletL([0, 1, 0, -1], 1.5);
    expectRel(fourierV(square, r3(square), [0, 0]), 4 * zeta(1.5) * beta, 1e-9);
  });

  it('dipolar triangular: 6 zeta(3/2) L_-3(3/2)', () => {
    const L = dirichletL([0, 1, -1], 1.5);
    expectRel(fourierV(tri, r3(tri), [0, 0]), 6 * zeta(1.5) * L, 1e-9);
  });

  it('chain at k != 0 equals the direct sum sum_n 2 cos(kn) V(n) (converges absolutely for r^-6)', () => {
    for (const k of [0.4, 1.7, Math.PI]) {
      let s = 0;
      for (let n = 20000; n >= 1; n--) s += (2 * Math.cos(k * n)) / n ** 6;
      expectRel(fourierV(chain, r6(), [k, 0]), s, 1e-11);
    }
  });

  it('dipolar chain at k = pi: -(3/2) zeta(3) (alternating zeta, closed form)', () => {
    // sum_{n != 0} (-1)^n |n|^-3 = -2 eta(3) = -2 (1 - 2^-2) zeta(3)
    expectRel(fourierV(chain, r3(), [Math.PI, 0]), -1.5 * zeta(3), 1e-11);
  });

  it('softcore chain equals the brute-force sum at several k', () => {
    const p = resolvePotential({ shape: 'softcore', V0: 1, Rc: 2 }, chain);
    for (const k of [0, 0.9, 2.5]) {
      let s = 0;
      for (let n = 20000; n >= 1; n--) s += (2 * Math.cos(k * n)) / (1 + (n / 2) ** 6);
      expectRel(fourierV(chain, p, [k, 0]), s, 1e-10);
    }
  });

  it('coset sums add up to V(k = 0) for every supercell (sum_t J_st(0) = V(0)) and J is Hermitian', () => {
    for (const [l, Mmax] of [[chain, 12], [square, 6], [tri, 6]] as const) {
      const pot = r6(l);
      const V0 = fourierV(l, pot, [0, 0]);
      for (const cell of supercellsUpTo(l.dim, Mmax)) {
        const J = couplings(l, cell, pot, [0.3, 0.2 * (l.dim - 1)]);
        const J0 = couplings(l, cell, pot);
        for (let s = 0; s < cell.M; s++) {
          let row = 0;
          for (let t = 0; t < cell.M; t++) {
            row += J0.re[s * cell.M + t];
            expectRel(J.re[s * cell.M + t], J.re[t * cell.M + s], 1e-12, 1e-15);
            expectRel(J.im[s * cell.M + t], -J.im[t * cell.M + s], 1e-12, 1e-15);
          }
          expectRel(row, V0, 1e-12);
        }
      }
    }
  });

  it('range cut rmax = 1 keeps only nearest neighbours', () => {
    const p = resolvePotential({ shape: 'vdw', V1: 3, rmax: 1 }, tri);
    expectRel(fourierV(tri, p, [0, 0]), 6 * 3, 1e-14);
    const J = couplings(chain, period(2), resolvePotential({ shape: 'vdw', V1: 3, rmax: 2 }, chain));
    expectRel(J.re[0], 2 * 3 / 64, 1e-14); // two second neighbours on the same sublattice
    expectRel(J.re[1], 2 * 3, 1e-14);
  });
});

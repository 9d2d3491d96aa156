/**
 * The nearest-neighbour chain at mu = V1 is a transverse-field Ising ring. With
 * n = (1 + sigma^z)/2 and sum over the L bonds of a ring,
 *   -mu sum n_i + V1 sum n_i n_{i+1} - alpha sum sigma^x_i
 *     = (V1/4) sum sigma^z_i sigma^z_{i+1} - alpha sum sigma^x_i - L V1/4     (mu = V1),
 * i.e. J = V1/4, h = alpha, constant -V1/4 per site; on an even ring the sign of J is
 * removed by rotating every other spin.
 *
 * Finite ring (derived here): Jordan-Wigner maps H = -J sum zz - h sum x to free fermions,
 * but the boundary bond carries the fermion parity P = prod_i sigma^x_i: the even sector
 * (P = +1) has antiperiodic fermions, k = pi (2m - 1)/L, the odd sector periodic ones,
 * k = 2 pi m / L. For h > 0 the ground state is positive in the sigma^z basis
 * (Perron-Frobenius) and so even under the global flip P, hence
 *   E0 / L = -(1/L) sum_{m=1..L} sqrt(J^2 + h^2 - 2 J h cos(pi (2m - 1)/L)).
 * Infinite chain (Pfeuty 1970, normalisation checked: his Lambda_k sum with Pauli matrices):
 *   e_inf = -(1/pi) int_0^pi sqrt(J^2 + h^2 + 2 J h cos k) dk = -(2/pi)(J + h) E(kappa),
 *   kappa^2 = 4 J h / (J + h)^2 (complete elliptic integral of the second kind).
 * At h = J the ring sum is exactly -2J / (L sin(pi/2L)) -> e_inf - pi J/(6 L^2) (c = 1/2, v = 2J).
 */
import { describe, it, expect } from 'vitest';
import { exactDiagonalisation } from '../../../src/core/ed/exact-diagonalisation.ts';
import { SOURCES, expectAbs } from '../../references.ts';

const V1 = 1, J = V1 / 4;
const ring = (L: number, h: number) => exactDiagonalisation({
  cluster: { kind: 'periodic', lattice: 'chain', size: [L], interaction: { shape: 'nn', V1 } }, mu: V1, alpha: h,
});

/** Free-fermion ring energy per site of the even (antiperiodic) or odd-momentum (periodic) set. */
function fermionRing(L: number, h: number, antiperiodic = true): number {
  let s = 0;
  for (let m = 1; m <= L; m++) {
    const k = antiperiodic ? (Math.PI * (2 * m - 1)) / L : (2 * Math.PI * m) / L;
    s += Math.sqrt(J * J + h * h - 2 * J * h * Math.cos(k));
  }
  return -s / L;
}

/** E(kappa) by the arithmetic-geometric mean (Abramowitz and Stegun 17.6): E = K (1 - sum 2^(n-1) c_n^2). */
function ellipticE(kappa: number): number {
  if (kappa >= 1) return 1; // E(1) = 1 (A&S 17.3.12); the AGM for K diverges there.
  let a = 1, b = Math.sqrt(1 - kappa * kappa), sum = 0.5 * kappa * kappa, pow = 0.5;
  for (let n = 0; n < 40 && Math.abs(a - b) > 1e-17; n++) {
    const c = 0.5 * (a - b);
    [a, b] = [0.5 * (a + b), Math.sqrt(a * b)];
    pow *= 2; sum += pow * c * c;
  }
  return (Math.PI / (2 * a)) * (1 - sum);
}

const pfeuty = (h: number) => (-(2 / Math.PI) * (J + h) * ellipticE((2 * Math.sqrt(J * h)) / (J + h)));

describe(`nn chain at mu = V1 as a transverse-field Ising ring (${SOURCES.pfeuty})`, () => {
  it('elliptic form of the infinite-chain energy equals the integral (Simpson, 2000 panels)', () => {
    for (const h of [0.1, 0.6]) {
      const n = 2000, f = (k: number) => Math.sqrt(J * J + h * h + 2 * J * h * Math.cos(k));
      let s = f(0) + f(Math.PI);
      for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f((Math.PI * i) / n);
      // tolerance 1e-12: Simpson's error ~ (pi/n)^4 |f''''| is ~1e-14 for this smooth integrand off criticality.
      expectAbs(pfeuty(h), -(s * Math.PI) / (3 * n) / Math.PI, 1e-12);
    }
  });

  it('ED ring energies equal the even-parity free-fermion sum to 1e-10, not the periodic-momentum one', () => {
    for (const L of [8, 12, 14]) {
      for (const h of [0.1, 0.25, 0.6]) {
        const e = ring(L, h).energyPerSite;
        // tolerance 1e-10: Lanczos residual 1e-10 relative; the energy error is its square over the gap.
        expectAbs(e, fermionRing(L, h) - V1 / 4, 1e-10);
      }
    }
    // The parity sector matters: at criticality the periodic-momentum set is off by O(1/L^2).
    expect(Math.abs(ring(8, J).energyPerSite - (fermionRing(8, J, false) - V1 / 4))).toBeGreaterThan(1e-3);
  });

  it('critical ring: E0/L = -2J/(L sin(pi/2L)) - V1/4, approaching Pfeuty as e_inf - pi J/(6 L^2)', () => {
    for (const L of [10, 16]) {
      const e = ring(L, J).energyPerSite + V1 / 4;
      expectAbs(e, (-2 * J) / (L * Math.sin(Math.PI / (2 * L))), 1e-10);
      // e_inf = -4J/pi (E(1) = 1); the next correction is O(L^-4): 7 pi^3 J/(1440 L^4) from the sine series,
      // below 2e-5 at L = 10, so tolerance 2e-5 / (L/10)^4.
      expectAbs(pfeuty(J), (-4 * J) / Math.PI, 1e-14); // exact: E(1) = 1
      expectAbs(e, pfeuty(J) - (Math.PI * J) / (6 * L * L), 2e-5 * (10 / L) ** 4);
    }
  });

  it('gapped rings converge to Pfeuty exponentially fast', () => {
    // h = 0.6 = 2.4 J: the finite-size error falls like (J/h)^L = exp(-L/xi), xi = 1/ln(h/J) = 1.14,
    // i.e. by ~(J/h)^2 = 0.17 per two sites; allow 0.25 for the prefactor's drift, and at L = 14
    // (J/h)^14 = 5e-6 times a prefactor below 0.02 gives the bound 1e-7.
    const d12 = Math.abs(ring(12, 0.6).energyPerSite + V1 / 4 - pfeuty(0.6));
    const d14 = Math.abs(ring(14, 0.6).energyPerSite + V1 / 4 - pfeuty(0.6));
    expect(d14).toBeLessThan(1e-7);
    expect(d14 / d12).toBeLessThan(0.25);
  });

  it('h = 0: the classical density wave, -V1/2 per site (closed form)', () => {
    expectAbs(ring(8, 0).energyPerSite, -V1 / 2, 1e-14);
  });
});

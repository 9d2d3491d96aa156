/**
 * T = 0 minimisation over Bloch angles: its converged states must satisfy the T = 0
 * mean-field equations of DESIGN.md ("Sublattice mean-field at temperature T"), recomputed
 * here from the returned m and alpha:
 *   xi_s = -mu + sum_t J_st m_t, E_s = sqrt(xi_s^2/4 + alpha^2),
 *   m_s = (1 - xi_s/(2E_s))/2, <sigma^x>_s = -alpha/E_s, (delta - mu) = mean 1/(2E_s) if alpha > 0;
 * without a photon, an integer pattern with xi_s < 0 exactly on the occupied sublattices.
 * At V = 0 the condensate sets in at the lower polariton mu = delta/2 - sqrt(delta^2/4 + 1)
 * (SOURCES.hopfield).
 */
import { describe, expect, it } from 'vitest';
import { descendedPattern, solveAngles } from '../../../src/core/meanfield/bloch-angles.ts';
import type { CellProblem } from '../../../src/core/meanfield/cell-problem.ts';
import { couplings } from '../../../src/core/interaction/lattice-sums.ts';
import { lattice } from '../../../src/core/lattice/geometry.ts';
import { period } from '../../../src/core/lattice/supercells.ts';
import { type InteractionSpec, resolvePotential } from '../../../src/core/interaction/potential.ts';
import { expectAbs, expectRel } from '../../references.ts'; // citations: SOURCES in tests/references.ts

function chainProblem(spec: InteractionSpec, M: number, mu: number, delta: number): CellProblem {
  const l = lattice('chain');
  return { M, J: couplings(l, period(M), resolvePotential(spec, l)).re, mu, delta, T: 0 };
}

/** mean_s g_s at alpha = 0 (DESIGN: the photon condenses iff (delta - mu) is below it). */
function G0(p: CellProblem, m: Float64Array): number {
  const M = p.M;
  let G = 0;
  for (let s = 0; s < M; s++) {
    let xi = -p.mu;
    for (let t = 0; t < M; t++) xi += p.J[s * M + t] * m[t];
    G += 1 / (2 * Math.abs(xi)) / M;
  }
  return G;
}

/** Largest violation of the T = 0 equations (see the module note) by (m, sx, alpha). */
function violation(p: CellProblem, m: Float64Array, sx: Float64Array, alpha: number): number {
  const M = p.M;
  let worst = 0, G = 0;
  for (let s = 0; s < M; s++) {
    let xi = -p.mu;
    for (let t = 0; t < M; t++) xi += p.J[s * M + t] * m[t];
    if (alpha === 0) {
      worst = Math.max(worst, m[s] === 1 ? (xi < 0 ? 0 : 1) : m[s] === 0 ? (xi > 0 ? 0 : 1) : 1);
      continue;
    }
    const E = Math.sqrt(xi * xi / 4 + alpha * alpha);
    worst = Math.max(worst, Math.abs((1 - xi / (2 * E)) / 2 - m[s]), Math.abs(-alpha / E - sx[s]));
    G += 1 / (2 * E) / M;
  }
  // A condensate (alpha^2 >= 1e-8, DESIGN's label tolerance) obeys the photon equation; a normal
  // state (alpha ~ 0) must have no photon root: (delta - mu) >= mean g at alpha = 0 (DESIGN).
  if (alpha * alpha >= 1e-8) worst = Math.max(worst, Math.abs(G - (p.delta - p.mu)));
  else worst = Math.max(worst, Math.max(0, G0(p, m) - (p.delta - p.mu) - 1e-12));
  return worst;
}

/** Classical energy per site -mu mean n + (1/2M) n.J.n (the alpha = 0 limit of Omega, DESIGN). */
function classicalEnergy(p: CellProblem, n: ArrayLike<number>): number {
  let e = 0;
  for (let s = 0; s < p.M; s++) {
    e -= p.mu * n[s];
    for (let t = 0; t < p.M; t++) e += p.J[s * p.M + t] * n[s] * n[t] / 2;
  }
  return e / p.M;
}

describe('Bloch-angle minimisation at T = 0', () => {
  it('V = 0, one sublattice: the closed-form condensate (delta - mu) = 1/(2E)', () => {
    const p = chainProblem({ shape: 'nn', V1: 0 }, 1, -0.2, 1);
    const r = solveAngles(p, [0.3]);
    expect(r.converged).toBe(true);
    const E = 1 / (2 * (p.delta - p.mu)), xi = -p.mu;
    // DESIGN: alpha^2 = E^2 - xi^2/4, m = (1 - xi/(2E))/2. 1e-10: angles converged to 1e-12.
    expectRel(r.alpha, Math.sqrt(E * E - xi * xi / 4), 1e-10);
    expectAbs(r.m[0], (1 - xi / (2 * E)) / 2, 1e-10);
  });

  it('V = 0: condensate just above the lower polariton, none just below (Hopfield 1958)', () => {
    const delta = 1.5, muC = delta / 2 - Math.sqrt(delta * delta / 4 + 1);
    const above = solveAngles(chainProblem({ shape: 'nn', V1: 0 }, 1, muC + 1e-3, delta), [0.5]);
    const below = solveAngles(chainProblem({ shape: 'nn', V1: 0 }, 1, muC - 1e-3, delta), [0.5]);
    expect(above.alpha).toBeGreaterThan(1e-3);
    expect(below.alpha).toBeLessThan(1e-6);
    expect(below.m[0]).toBeLessThan(1e-6);
  });

  // [name, problem, starts, whether the converged states are condensed]
  const cases: [string, CellProblem, number[][], boolean][] = [
    ['nn chain, period 2, supersolid region', chainProblem({ shape: 'nn', V1: 3 }, 2, 0.4, 1.5), [[0.2, 0.7], [1, 0], [0.5, 0.5]], true],
    ['vdw chain, period 3, crystal', chainProblem({ shape: 'vdw', Rb: 1.5 }, 3, 0.9, 2), [[0.1, 0.8, 0.3], [1, 0, 0], [0.9, 0.9, 0.9]], false],
    ['vdw chain, period 3, condensed', chainProblem({ shape: 'vdw', Rb: 1.5 }, 3, 0.3, 1), [[0.1, 0.8, 0.3], [1, 0, 0]], true],
    ['nn chain, period 2, deep crystal', chainProblem({ shape: 'nn', V1: 4 }, 2, 3, 20), [[1, 0], [0.6, 0.4]], false],
  ];
  for (const [name, p, starts, condensed] of cases) {
    it(`${name}: converged states satisfy the mean-field equations to 1e-10`, () => {
      for (const m0 of starts) {
        const r = solveAngles(p, m0);
        expect(r.converged).toBe(true);
        expect(r.alpha * r.alpha >= 1e-8).toBe(condensed);
        // 1e-10: the step tolerance is 1e-12 in m and sin theta; J is O(10), so xi carries ~1e-11.
        expect(violation(p, r.m, r.sx, r.alpha)).toBeLessThan(1e-10);
      }
    });
  }

  it('descended pattern: null for non-integer starts; no single flip lowers the classical energy', () => {
    const p = chainProblem({ shape: 'vdw', Rb: 1.7 }, 6, 1.1, 5);
    expect(descendedPattern(p, [0, 0.5, 1, 0, 1, 0])).toBeNull();
    for (const n0 of [[1, 1, 1, 1, 1, 1], [0, 0, 0, 0, 0, 0], [1, 1, 0, 0, 1, 0]]) {
      const n = descendedPattern(p, n0)!;
      expect(classicalEnergy(p, n)).toBeLessThanOrEqual(classicalEnergy(p, n0) + 1e-14);
      const e = classicalEnergy(p, n);
      for (let s = 0; s < p.M; s++) {
        const f = Float64Array.from(n); f[s] = 1 - f[s];
        expect(classicalEnergy(p, f)).toBeGreaterThanOrEqual(e - 1e-12);
      }
      // The descent of a descended pattern is itself (module note).
      expect(Array.from(descendedPattern(p, n)!)).toEqual(Array.from(n));
    }
  });
});

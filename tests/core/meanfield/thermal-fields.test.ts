/**
 * Finite-T Newton on the trial fields: converged states satisfy the self-consistency of
 * DESIGN.md ("Sublattice mean-field at temperature T"), recomputed here from m and alpha:
 *   xi_s = -mu + sum_t J_st m_t, E_s = sqrt(xi_s^2/4 + alpha^2),
 *   m_s = (1 - xi_s tanh(E_s/T)/(2E_s))/2, <sigma^x>_s = -alpha tanh(E_s/T)/E_s,
 *   (delta - mu) = mean tanh(E_s/T)/(2E_s) when alpha > 0;
 * and the normal state turns superradiant at (delta - mu) = tanh(|mu|/(2T))/|mu| for V = 0
 * (SOURCES.heppLieb).
 */
import { describe, expect, it } from 'vitest';
import { fieldsOf, solveFields } from '../../../src/core/meanfield/thermal-fields.ts';
import type { CellProblem } from '../../../src/core/meanfield/cell-problem.ts';
import { couplings } from '../../../src/core/interaction/lattice-sums.ts';
import { lattice } from '../../../src/core/lattice/geometry.ts';
import { period } from '../../../src/core/lattice/supercells.ts';
import { type InteractionSpec, resolvePotential } from '../../../src/core/interaction/potential.ts';
import { expectAbs } from '../../references.ts'; // citations: SOURCES in tests/references.ts

function chainProblem(spec: InteractionSpec, M: number, mu: number, delta: number, T: number): CellProblem {
  const l = lattice('chain');
  return { M, J: couplings(l, period(M), resolvePotential(spec, l)).re, mu, delta, T };
}

/** mean_s g_s at alpha = 0 (DESIGN: the photon condenses iff (delta - mu) is below it). */
function G0(p: CellProblem, m: Float64Array): number {
  const { M, T } = p;
  let G = 0;
  for (let s = 0; s < M; s++) {
    let xi = -p.mu;
    for (let t = 0; t < M; t++) xi += p.J[s * M + t] * m[t];
    G += Math.tanh(Math.abs(xi) / (2 * T)) / Math.abs(xi) / M;
  }
  return G;
}

function violation(p: CellProblem, m: Float64Array, sx: Float64Array, alpha: number): number {
  const { M, T } = p;
  let worst = 0, G = 0;
  for (let s = 0; s < M; s++) {
    let xi = -p.mu;
    for (let t = 0; t < M; t++) xi += p.J[s * M + t] * m[t];
    const E = Math.sqrt(xi * xi / 4 + alpha * alpha);
    const th = E === 0 ? 0 : Math.tanh(E / T) / E; // tanh(E/T)/E -> 1/T at E = 0
    const r = E === 0 ? 1 / T : th;
    worst = Math.max(worst, Math.abs((1 - xi * r / 2) / 2 - m[s]), Math.abs(-alpha * r - sx[s]));
    G += r / 2 / M;
  }
  // A condensate (alpha^2 >= 1e-8, DESIGN's label tolerance) obeys the photon equation; a normal
  // state (alpha ~ 0) must have no photon root: (delta - mu) >= mean g at alpha = 0 (DESIGN).
  if (alpha * alpha >= 1e-8) worst = Math.max(worst, Math.abs(G - (p.delta - p.mu)));
  else worst = Math.max(worst, Math.max(0, G0(p, m) - (p.delta - p.mu) - 1e-12));
  return worst;
}

describe('finite-T trial-field solver', () => {
  // [name, problem, starts, whether the converged states are condensed]
  const cases: [string, CellProblem, number[][], boolean][] = [
    ['nn chain period 2, condensed', chainProblem({ shape: 'nn', V1: 3 }, 2, 0.5, 1.2, 0.2), [[0.2, 0.7], [1, 0]], true],
    ['vdw chain period 3, crystal', chainProblem({ shape: 'vdw', Rb: 1.5 }, 3, 0.9, 2, 0.15), [[0.1, 0.8, 0.3], [1, 0, 0]], false],
    ['vdw chain period 3, condensed', chainProblem({ shape: 'vdw', Rb: 1.5 }, 3, 0.3, 1, 0.15), [[0.1, 0.8, 0.3], [1, 0, 0]], true],
    ['nn chain period 2, thermal crystal without photon', chainProblem({ shape: 'nn', V1: 4 }, 2, 4, 20, 0.5), [[0.9, 0.1], [0.6, 0.4]], false],
  ];
  for (const [name, p, starts, condensed] of cases) {
    it(`${name}: converged states satisfy the self-consistency equations to 1e-10`, () => {
      for (const m0 of starts) {
        const r = solveFields(p, m0);
        expect(r.converged).toBe(true);
        expect(r.alpha * r.alpha >= 1e-8).toBe(condensed);
        // 1e-10: converged to 1e-12 in m and <sigma^x>; J is O(10).
        expect(violation(p, r.m, r.sx, r.alpha)).toBeLessThan(1e-10);
      }
    });
  }

  it('fieldsOf: the Hartree shifts of m and the photon root they support', () => {
    const p = chainProblem({ shape: 'nn', V1: 2 }, 2, 0.75, 1.5, 0.3);
    const h = fieldsOf(p, [0.5, 0.25]);
    // nn period 2: J_01 = J_10 = 2 V1 = 4, J_00 = 0; xi = (-0.75 + 4(0.25), -0.75 + 4(0.5)) = (0.25, 1.25).
    expectAbs(h[0], 0.25, 1e-13);
    expectAbs(h[1], 1.25, 1e-13);
    const a = h[2];
    expect(a).toBeGreaterThan(0);
    let G = 0;
    for (const xi of [0.25, 1.25]) { const E = Math.sqrt(xi * xi / 4 + a * a); G += Math.tanh(E / p.T) / (2 * E) / 2; }
    expectAbs(G, p.delta - p.mu, 1e-12);
  });

  it('V = 0: superradiant just below (delta - mu) = tanh(|mu|/(2T))/|mu|, normal just above (Hepp and Lieb 1973)', () => {
    const mu = -0.6, T = 0.4, crit = Math.tanh(Math.abs(mu) / (2 * T)) / Math.abs(mu);
    const sr = solveFields(chainProblem({ shape: 'nn', V1: 0 }, 1, mu, mu + crit * 0.98, T), [0.3]);
    const nm = solveFields(chainProblem({ shape: 'nn', V1: 0 }, 1, mu, mu + crit * 1.02, T), [0.3]);
    expect(sr.alpha).toBeGreaterThan(1e-3);
    expect(nm.alpha).toBeLessThan(1e-6);
    // Normal state: m = (1 - tanh(xi/(2T)))/2 with xi = -mu (Fermi function; common practice, no source).
    expectAbs(nm.m[0], (1 - Math.tanh(-mu / (2 * T))) / 2, 1e-10);
  });
});

/**
 * The trial product state and its Gibbs-Bogoliubov free energy Phi(h) (module note;
 * Feynman, Statistical Mechanics (1972), ch. 2). Checked from outside:
 *   - at a self-consistent solution (from the field solver) the residual H(h) - h vanishes
 *     and Phi equals the grand potential of DESIGN.md,
 *       Omega = (delta-mu) alpha^2 + mean_s [xi_s/2 - T ln 2cosh(E_s/T)] - (1/2M) sum J m m;
 *   - the analytic gradient and slope equal central differences of Phi;
 *   - negativeCurvature finds a downhill direction at the uniform saddle of a chain that
 *     orders below the Bragg-Williams T_c = V1/2 (SOURCES.braggWilliams: 1 + V(pi) m(1-m)/T = 0,
 *     V(pi) = -2 V1, m = 1/2), and none at the stable ordered state.
 */
import { describe, expect, it } from 'vitest';
import { evaluate, gradient, negativeCurvature, newTrial, slope } from '../../../src/core/meanfield/trial-state.ts';
import { solveFields } from '../../../src/core/meanfield/thermal-fields.ts';
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

/** DESIGN's Omega of (m, alpha). */
function omega(p: CellProblem, m: ArrayLike<number>, alpha: number): number {
  const { M, T } = p;
  let local = 0, jmm = 0;
  for (let s = 0; s < M; s++) {
    let xi = -p.mu;
    for (let t = 0; t < M; t++) { xi += p.J[s * M + t] * m[t]; jmm += p.J[s * M + t] * m[s] * m[t]; }
    const E = Math.sqrt(xi * xi / 4 + alpha * alpha);
    local += xi / 2 - T * Math.log(2 * Math.cosh(E / T));
  }
  return (p.delta - p.mu) * alpha * alpha + local / M - jmm / (2 * M);
}

const phiAt = (p: CellProblem, h: Float64Array) => { const t = newTrial(p.M); evaluate(p, h, t, false); return t.phi; };

describe('trial state', () => {
  const problems: [string, CellProblem, number[]][] = [
    ['condensed nn chain', chainProblem({ shape: 'nn', V1: 1 }, 2, 0.3, 1.0, 0.2), [0.3, 0.6]],
    ['vdw chain period 3', chainProblem({ shape: 'vdw', Rb: 1.3 }, 3, 0.7, 1.5, 0.25), [0.2, 0.9, 0.4]],
  ];
  for (const [name, p, m0] of problems) {
    it(`${name}: at the solution r = 0 and Phi = Omega (DESIGN)`, () => {
      const r = solveFields(p, m0);
      expect(r.converged).toBe(true);
      const h = Float64Array.from([...r.xi, r.alpha]);
      const t = newTrial(p.M);
      evaluate(p, h, t, true);
      // 1e-10: the solution is converged to 1e-12 in m; J and the fields are O(1-10).
      for (let s = 0; s < p.M; s++) { expectAbs(t.xi[s], h[s], 1e-10); expectAbs(t.m[s], r.m[s], 1e-10); }
      expectAbs(t.alpha, h[p.M], 1e-10);
      expectAbs(t.phi, omega(p, r.m, r.alpha), 1e-10);
    });

    it(`${name}: gradient and slope are derivatives of Phi (central differences)`, () => {
      const h = Float64Array.from([0.4, -0.3, 0.9].slice(0, p.M).concat([0.15]));
      const t = newTrial(p.M), g = new Float64Array(p.M + 1);
      evaluate(p, h, t, true);
      gradient(p, t, h, g);
      const eps = 1e-5;
      for (let i = 0; i <= p.M; i++) {
        const hp = Float64Array.from(h), hm = Float64Array.from(h);
        hp[i] += eps; hm[i] -= eps;
        // 1e-8: truncation ~eps^2 Phi''' ~ 1e-10 plus rounding 1e-16/eps ~ 1e-11.
        expectAbs(g[i], (phiAt(p, hp) - phiAt(p, hm)) / (2 * eps), 1e-8);
      }
      const d = Float64Array.from({ length: p.M + 1 }, (_, i) => 0.3 - 0.2 * i);
      let gd = 0;
      for (let i = 0; i <= p.M; i++) gd += g[i] * d[i];
      expectAbs(slope(p, t, h, d), gd, 1e-13);
    });
  }

  it('negative curvature: downhill at the uniform saddle below T_c = V1/2, none at the ordered minimum', () => {
    // nn chain, V1 = 4, mu = V(0)/2 = 4 (half filling), delta - mu = 16 (no photon), T = 1 < T_c = 2.
    const p = chainProblem({ shape: 'nn', V1: 4 }, 2, 4, 20, 1);
    // h = 0 gives m = 1/2 on both: xi = -4 + 8/2 = 0, a self-consistent saddle. Start just off
    // it (the direction search starts from the gradient, which vanishes at the saddle itself).
    const cur = newTrial(2), work = newTrial(2);
    evaluate(p, Float64Array.of(0, 0, 0), cur, true);
    expectAbs(cur.m[0], 0.5, 1e-15);
    expectAbs(cur.xi[0], 0, 1e-15);
    const h = Float64Array.of(0.01, 0.02, 0.001);
    evaluate(p, h, cur, true);
    const v = negativeCurvature(p, h, cur, work);
    expect(v).not.toBeNull();
    const hv = Float64Array.from(h, (x, i) => x + 1e-2 * v![i]);
    expect(phiAt(p, hv)).toBeLessThan(cur.phi);
    // The ordered state is a minimum: no negative curvature there.
    const r = solveFields(p, [0.9, 0.1]);
    const h2 = Float64Array.from([...r.xi, r.alpha]);
    evaluate(p, h2, cur, true);
    expect(negativeCurvature(p, h2, cur, work)).toBeNull();
    // And it lies below the saddle (Bogoliubov: the minimum of Phi is the lowest trial free energy).
    expect(cur.phi).toBeLessThan(phiAt(p, h));
  });
});

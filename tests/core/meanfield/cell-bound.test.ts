/**
 * The cell floor (src/core/meanfield/cell-bound.ts): a lower bound of the T = 0 mean-field
 * energy per site of every product state of a supercell,
 *
 *   Phi = -mu mean m + (1/(2M)) m.J.m - (mean sin theta)^2 / (4 (delta - mu)),
 *   m_s = sin^2(theta_s / 2)      (DESIGN.md, "Sublattice mean-field at temperature T").
 *
 * Checked against hand-worked closed forms on the nearest-neighbour chain (J(0) = 2 V1,
 * J(pi) = -2 V1: each site has two neighbours; common practice, no source), and as a bound
 * against Phi evaluated from its definition at seeded random states of real cells (a state
 * below the floor would fail). Tolerance: the floor subtracts a rounding slack of 1e-13 times
 * (1 + |mu| + sum_t |J_0t| + c), below 2e-12 in these cases, so it must lie in
 * [closed form - 2e-12, closed form].
 */
import { describe, expect, it } from 'vitest';
import seedrandom from 'seedrandom';
import { cellFloor } from '../../../src/core/meanfield/cell-bound.ts';
import { couplings } from '../../../src/core/interaction/lattice-sums.ts';
import { lattice } from '../../../src/core/lattice/geometry.ts';
import { period, supercell, type Supercell } from '../../../src/core/lattice/supercells.ts';
import { resolvePotential } from '../../../src/core/interaction/potential.ts';
import type { InteractionSpec } from '../../../src/core/interaction/potential.ts';

function cellJ(name: 'chain' | 'square', spec: InteractionSpec, cell: Supercell): Float64Array {
  const l = lattice(name);
  return couplings(l, cell, resolvePotential(spec, l)).re;
}

/** Phi of a product state from the definition above. */
function phi(J: Float64Array, M: number, mu: number, delta: number, theta: number[]): number {
  const m = theta.map((t) => Math.sin(t / 2) ** 2);
  let mJm = 0, X = 0, rho = 0;
  for (let s = 0; s < M; s++) {
    rho += m[s] / M;
    X += Math.sin(theta[s]) / M;
    for (let t = 0; t < M; t++) mJm += m[s] * J[s * M + t] * m[t];
  }
  return -mu * rho + mJm / (2 * M) - (X * X) / (4 * (delta - mu));
}

function near(floor: number, closed: number): void {
  expect(floor).toBeLessThanOrEqual(closed);
  expect(floor).toBeGreaterThan(closed - 2e-12);
}

describe('cell floor', () => {
  it('nn chain, period 2, weak V1: the floor is the best uniform state (here the filled one)', () => {
    // V1 = 0.5, mu = 2, delta = 3: L = 2 V1 = 1 <= 2 / (delta - mu) = 2, so c = 1/D = 1 and
    // h(rho) = -2 rho + (1/2)(2 V1) rho^2 - rho (1 - rho) = 1.5 rho^2 - 3 rho,
    // decreasing on [0, 1]: the floor is h(1) = -1.5 = -mu + V1 (the filled chain).
    const J = cellJ('chain', { shape: 'nn', V1: 0.5 }, period(2));
    near(cellFloor(period(2), J, 2, 3), -1.5);
  });

  it('nn chain, period 2, strong V1: the classical bound -mu rho + V1 rho^2 - V1 rho (1 - rho)', () => {
    // V1 = 3, mu = 1, delta = 3: L/2 = V1 = 3 > 1/D = 0.5, so c = 3 and
    // h(rho) = -rho + 3 rho^2 - 3 rho (1 - rho) = 6 rho^2 - 4 rho, vertex rho = 1/3,
    // floor -4/6 = -2/3 (below the period-2 crystal's -1/2: a bound, not the answer).
    const J = cellJ('chain', { shape: 'nn', V1: 3 }, period(2));
    near(cellFloor(period(2), J, 1, 3), -2 / 3);
  });

  it('no state of a cell lies below its floor (seeded random Bloch angles, 1D and 2D, vdw and nn)', () => {
    const rng = seedrandom('cell-floor');
    const cases: Array<{ name: 'chain' | 'square'; spec: InteractionSpec; cells: Supercell[] }> = [
      { name: 'chain', spec: { shape: 'vdw', Rb: 1.3 }, cells: [period(2), period(5), period(12)] },
      { name: 'chain', spec: { shape: 'nn', V1: 1.7 }, cells: [period(3), period(4)] },
      { name: 'square', spec: { shape: 'vdw', Rb: 1.1 }, cells: [supercell(2, 0, 2), supercell(2, 1, 3), supercell(1, 0, 5)] },
    ];
    let checked = 0;
    for (const { name, spec, cells } of cases) {
      for (const cell of cells) {
        const J = cellJ(name, spec, cell);
        for (const [mu, delta] of [[-0.5, 4], [1.2, 4], [3.6, 4], [2.9, 3]]) {
          const floor = cellFloor(cell, J, mu, delta);
          for (let k = 0; k < 400; k++) {
            // near-integer, near-uniform and random states all in the sample
            const mode = k % 3;
            const theta = Array.from({ length: cell.M }, (_, s) => (mode === 0 ? Math.PI * rng()
              : mode === 1 ? (rng() < 0.5 ? 0.02 : Math.PI - 0.02) * rng() + (s % 2) * 0.01 : 0.3 + 0.01 * rng()));
            expect(phi(J, cell.M, mu, delta, theta)).toBeGreaterThanOrEqual(floor - 1e-12);
            checked++;
          }
        }
      }
    }
    expect(checked).toBe(8 * 4 * 400);
  });

  it('no floor where delta <= mu (the photon term has no bound there)', () => {
    const J = cellJ('chain', { shape: 'nn', V1: 1 }, period(2));
    expect(cellFloor(period(2), J, 3, 3)).toBe(-Infinity);
  });
});

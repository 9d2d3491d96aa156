/**
 * The Hartree shift xi_s = -mu + sum_t J_st(0) m_t (DESIGN.md, "Sublattice mean-field at
 * temperature T") on a hand-computed 3-sublattice case, and on the period-2 chain with
 * nearest-neighbour repulsion, where J_01(0) = 2 V1 (each site has two neighbours on the
 * other sublattice; common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { hartreeShift, hartreeShifts } from '../../../src/core/meanfield/hartree-shift.ts';
import { couplings } from '../../../src/core/interaction/lattice-sums.ts';
import { lattice } from '../../../src/core/lattice/geometry.ts';
import { period } from '../../../src/core/lattice/supercells.ts';
import { resolvePotential } from '../../../src/core/interaction/potential.ts';

describe('Hartree shift', () => {
  it('hand-computed 3x3 case (dyadic numbers: exact in floating point)', () => {
    const J = [0, 2, 1, 2, 0, 3, 1, 3, 0], m = [0.5, 0.25, 1], mu = 0.75;
    // xi_0 = -0.75 + 2(0.25) + 1(1) = 0.75; xi_1 = -0.75 + 2(0.5) + 3(1) = 3.25;
    // xi_2 = -0.75 + 1(0.5) + 3(0.25) = 0.5.
    expect(hartreeShift(J, 3, mu, m, 0)).toBe(0.75);
    expect(hartreeShift(J, 3, mu, m, 1)).toBe(3.25);
    expect(hartreeShift(J, 3, mu, m, 2)).toBe(0.5);
    const out = new Float64Array(3);
    const ret = hartreeShifts(J, 3, mu, m, out);
    expect(ret).toBe(out);
    expect(Array.from(out)).toEqual([0.75, 3.25, 0.5]);
  });

  it('empty lattice: xi_s = -mu whatever J', () => {
    const J = [5, -1, -1, 7];
    expect(Array.from(hartreeShifts(J, 2, 0.3, [0, 0], new Float64Array(2)))).toEqual([-0.3, -0.3]);
  });

  it('period-2 chain, nn V1 = 3, pattern (1, 0): xi = (-mu, -mu + 2 V1)', () => {
    const l = lattice('chain');
    const J = couplings(l, period(2), resolvePotential({ shape: 'nn', V1: 3 }, l)).re;
    const xi = hartreeShifts(J, 2, 1.25, [1, 0], new Float64Array(2));
    // 1e-12: the nn lattice sum is a finite sum of exact numbers.
    expect(xi[0]).toBeCloseTo(-1.25, 12);
    expect(xi[1]).toBeCloseTo(-1.25 + 6, 12);
  });
});

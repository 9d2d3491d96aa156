/**
 * The coupling cache is plain memoisation (module note): it must return the J_st(0) of a
 * fresh lattice sum (couplings(), tested against zeta(6) and Zucker's sums in
 * tests/core/interaction/lattice-sums.test.ts), and its keys must keep different strengths,
 * ranges and cells apart. Power laws scale as C (C = 2 Rb^6 for vdw: V(Rb) = 2).
 */
import { describe, expect, it } from 'vitest';
import { cellCouplings } from '../../../src/core/meanfield/coupling-cache.ts';
import { couplings } from '../../../src/core/interaction/lattice-sums.ts';
import { lattice, type LatticeName } from '../../../src/core/lattice/geometry.ts';
import { period, supercell, type Supercell } from '../../../src/core/lattice/supercells.ts';
import { type InteractionSpec, resolvePotential } from '../../../src/core/interaction/potential.ts';
import { expectRel } from '../../references.ts';

function both(name: LatticeName, spec: InteractionSpec, cell: Supercell): [Float64Array, Float64Array] {
  const l = lattice(name), pot = resolvePotential(spec, l);
  return [cellCouplings(l, spec, pot, cell), couplings(l, cell, pot).re];
}

/** Elementwise relative agreement; 1e-13: the cache scales a unit-strength sum by C, one rounding per entry. */
function expectSame(a: Float64Array, b: Float64Array): void {
  expect(a.length).toBe(b.length);
  let scale = 0;
  for (const v of b) scale = Math.max(scale, Math.abs(v));
  for (let i = 0; i < a.length; i++) expectRel(a[i], b[i], 1e-13, 1e-13 * scale);
}

describe('coupling cache', () => {
  const specs: [LatticeName, InteractionSpec, Supercell][] = [
    ['chain', { shape: 'vdw', Rb: 1.4 }, period(3)],
    ['chain', { shape: 'dipolar', V1: 2.5 }, period(4)],
    ['chain', { shape: 'softcore', V0: 3, Rc: 2.2 }, period(5)],
    ['square', { shape: 'vdw', Rb: 1.2 }, supercell(2, 1, 2)],
    ['triangular', { shape: 'nn', V1: 4, V2: 0.5 }, supercell(3, 0, 1)],
  ];
  for (const [name, spec, cell] of specs) {
    it(`${name} ${spec.shape} cell ${cell.a},${cell.b},${cell.c}: same as a fresh lattice sum, twice`, () => {
      const [cached, fresh] = both(name, spec, cell);
      expectSame(cached, fresh);
      const [again] = both(name, spec, cell);
      expectSame(again, fresh);
      // J_st(0) is real symmetric (module note; common practice, no source).
      const M = cell.M;
      for (let s = 0; s < M; s++) for (let t = 0; t < M; t++) expectRel(cached[s * M + t], cached[t * M + s], 1e-14, 1e-300);
    });
  }

  it('different strengths do not collide: vdw J scales as Rb^6', () => {
    const [J1] = both('chain', { shape: 'vdw', Rb: 1.4 }, period(3));
    const [J2] = both('chain', { shape: 'vdw', Rb: 2.1 }, period(3));
    const r = (2.1 / 1.4) ** 6;
    for (let i = 0; i < J1.length; i++) expectRel(J2[i], r * J1[i], 1e-13, 1e-300);
    const [J1again] = both('chain', { shape: 'vdw', Rb: 1.4 }, period(3));
    expectSame(J1again, couplings(lattice('chain'), period(3), resolvePotential({ shape: 'vdw', Rb: 1.4 }, lattice('chain'))).re);
  });

  it('nn strengths, softcore radii, ranges and cells are keyed apart', () => {
    const cases: [LatticeName, InteractionSpec, Supercell][] = [
      ['chain', { shape: 'nn', V1: 1 }, period(2)],
      ['chain', { shape: 'nn', V1: 2 }, period(2)],
      ['chain', { shape: 'nn', V1: 1, V2: 0.5 }, period(2)],
      ['chain', { shape: 'softcore', V0: 1, Rc: 1.5 }, period(2)],
      ['chain', { shape: 'softcore', V0: 1, Rc: 2.5 }, period(2)],
      ['chain', { shape: 'vdw', V1: 1, rmax: 1 }, period(2)],
      ['chain', { shape: 'vdw', V1: 1 }, period(2)],
      ['square', { shape: 'nn', V1: 1 }, supercell(2, 0, 1)],
      ['square', { shape: 'nn', V1: 1 }, supercell(1, 0, 2)],
    ];
    for (const [name, spec, cell] of cases) {
      const [cached, fresh] = both(name, spec, cell);
      expectSame(cached, fresh);
    }
    // nn chain period 2: J_01 = 2 V1, J_00 = 2 V2 (two neighbours at each distance; common practice, no source).
    const [a] = both('chain', { shape: 'nn', V1: 2, V2: 0.5 }, period(2));
    expect(a[1]).toBeCloseTo(4, 12);
    expect(a[0]).toBeCloseTo(1, 12);
  });
});

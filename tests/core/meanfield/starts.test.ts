/**
 * Starting states of a cell (DESIGN.md: start from the uniform state, from the classical
 * ground states of each fraction the cell can hold - the generalised Wigner lattice in 1D,
 * sites floor(j q / p) (SOURCES.wignerLattice: Hubbard 1978) - and from seeded random states).
 * The Wigner patterns are written out in the test and compared up to a translation done here.
 */
import { describe, expect, it } from 'vitest';
import { cellStarts } from '../../../src/core/meanfield/starts.ts';
import { cellCouplings } from '../../../src/core/meanfield/coupling-cache.ts';
import { lattice, type LatticeName } from '../../../src/core/lattice/geometry.ts';
import { period, supercell, type Supercell } from '../../../src/core/lattice/supercells.ts';
import { type InteractionSpec, resolvePotential } from '../../../src/core/interaction/potential.ts';

function J(name: LatticeName, spec: InteractionSpec, cell: Supercell): Float64Array {
  const l = lattice(name);
  return cellCouplings(l, spec, resolvePotential(spec, l), cell);
}

/** Whether 1D patterns x, y of period M agree after a cyclic shift. */
function cyclicEqual(x: ArrayLike<number>, y: ArrayLike<number>): boolean {
  const M = x.length;
  for (let u = 0; u < M; u++) {
    let ok = true;
    for (let s = 0; s < M && ok; s++) ok = x[(s + u) % M] === y[s];
    if (ok) return true;
  }
  return false;
}

const gcd = (a: number, b: number): number => (b ? gcd(b, a % b) : a);

describe('starts of a cell', () => {
  it('M = 1: empty, half and filled uniform states', () => {
    const s = cellStarts(period(1), J('chain', { shape: 'vdw', Rb: 1.5 }, period(1)), { dim: 1, seed: 1 });
    expect(s.map((x) => x.m[0])).toEqual([0, 0.5, 1]);
  });

  for (const q of [5, 7, 8, 12, 13]) {
    it(`chain period ${q}: every generalised Wigner lattice floor(j q/p), gcd(p, q) = 1, is a start`, () => {
      const cell = period(q);
      const starts = cellStarts(cell, J('chain', { shape: 'vdw', Rb: 1.6 }, cell), { dim: 1, seed: 3 });
      const integer = starts.filter((s) => s.kind !== 'random');
      for (let p = 1; p < q; p++) {
        if (gcd(p, q) !== 1) continue;
        // Hubbard 1978: particle j at site floor(j q / p), j = 0..p-1.
        const w = new Array(q).fill(0);
        for (let j = 0; j < p; j++) w[Math.floor((j * q) / p)] = 1;
        expect(integer.some((s) => cyclicEqual(s.m, w)), `p/q = ${p}/${q}`).toBe(true);
      }
      // Integer starts are 0/1 patterns, pairwise distinct up to translation.
      for (const s of integer) for (const v of s.m) expect(v === 0 || v === 1).toBe(true);
      for (let i = 0; i < integer.length; i++) for (let k = 0; k < i; k++) expect(cyclicEqual(integer[i].m, integer[k].m)).toBe(false);
    });
  }

  it('period 4: no pattern of a smaller period (e.g. 1010) among the integer starts', () => {
    const cell = period(4);
    const starts = cellStarts(cell, J('chain', { shape: 'nn', V1: 2, V2: 0.3 }, cell), { dim: 1, seed: 0 });
    for (const s of starts.filter((x) => x.kind !== 'random')) {
      expect(cyclicEqual(s.m, [1, 0, 1, 0])).toBe(false);
      expect(cyclicEqual(s.m, [0, 0, 0, 0]) || cyclicEqual(s.m, [1, 1, 1, 1])).toBe(false);
    }
  });

  it('random starts: in [0, 1], fixed by the seed, different for another seed', () => {
    const cell = supercell(2, 1, 3), Jc = J('square', { shape: 'vdw', Rb: 1.3 }, cell);
    const a = cellStarts(cell, Jc, { dim: 2, seed: 11, randomStarts: 3 }).filter((s) => s.kind === 'random');
    const b = cellStarts(cell, Jc, { dim: 2, seed: 11, randomStarts: 3 }).filter((s) => s.kind === 'random');
    const c = cellStarts(cell, Jc, { dim: 2, seed: 12, randomStarts: 3 }).filter((s) => s.kind === 'random');
    expect(a.length).toBe(3);
    for (const s of a) for (const v of s.m) { expect(v).toBeGreaterThanOrEqual(0); expect(v).toBeLessThan(1); }
    expect(a.map((s) => Array.from(s.m))).toEqual(b.map((s) => Array.from(s.m)));
    expect(Array.from(a[0].m)).not.toEqual(Array.from(c[0].m));
    expect(Array.from(a[0].m)).not.toEqual(Array.from(a[1].m));
  });
});

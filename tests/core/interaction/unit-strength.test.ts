/**
 * Unit-strength form of a potential (src/core/interaction/unit-strength.ts): the invariant
 * scale * unit.V(r) = pot.V(r) for every r (lattice sums are linear in the strength, common
 * practice, no source), keys shared by potentials that differ only in strength and distinct
 * when the shape, core radius or range differ.
 */
import { describe, it, expect } from 'vitest';
import { unitStrength } from '../../../src/core/interaction/unit-strength.ts';
import { type InteractionSpec, resolvePotential } from '../../../src/core/interaction/potential.ts';
import { lattice } from '../../../src/core/lattice/geometry.ts';
import { expectRel } from '../../references.ts';

const l = lattice('square');
const of = (spec: InteractionSpec) => unitStrength(l, spec, resolvePotential(spec, l));

describe('unit-strength potentials', () => {
  const specs: InteractionSpec[] = [
    { shape: 'vdw', V1: 7.5 },
    { shape: 'vdw', Rb: 1.8 },
    { shape: 'dipolar', V1: -0.6, rmax: 5 },
    { shape: 'softcore', V0: 3.2, Rc: 1.4 },
    { shape: 'nn', V1: 2, V2: 0.5 },
  ];

  it('scale * unit.V(r) = V(r) at every distance', () => {
    for (const spec of specs) {
      const pot = resolvePotential(spec, l), u = unitStrength(l, spec, pot);
      for (const r of [1, Math.SQRT2, 2, 2.5, 7]) expectRel(u.scale * u.unit.V(r), pot.V(r), 1e-14, 1e-300);
      expect(u.unit.rmax).toBe(pot.rmax);
    }
  });

  it('power laws and softcore have unit strength (V(1) = 1 for power laws, V(0) = 1 for softcore)', () => {
    expectRel(of({ shape: 'vdw', V1: 7.5 }).unit.V(1), 1, 1e-15);
    expectRel(of({ shape: 'dipolar', Rb: 2 }).unit.V(1), 1, 1e-15);
    expectRel(of({ shape: 'softcore', V0: 3.2, Rc: 1.4 }).unit.V(0), 1, 1e-15);
    // Rb = 1.8 means V(Rb) = 2 (the blockade radius definition, README.md): scale = 2 Rb^6.
    expectRel(of({ shape: 'vdw', Rb: 1.8 }).scale, 2 * 1.8 ** 6, 1e-14);
  });

  it('keys: equal across strengths, distinct across shape, Rc and range', () => {
    expect(of({ shape: 'vdw', V1: 7.5 }).key).toBe(of({ shape: 'vdw', V1: 0.1 }).key);
    expect(of({ shape: 'softcore', V0: 3, Rc: 1.4 }).key).toBe(of({ shape: 'softcore', V0: 9, Rc: 1.4 }).key);
    const distinct = [
      of({ shape: 'vdw', V1: 1 }).key, of({ shape: 'dipolar', V1: 1 }).key, of({ shape: 'vdw', V1: 1, rmax: 4 }).key,
      of({ shape: 'softcore', V0: 1, Rc: 1.4 }).key, of({ shape: 'softcore', V0: 1, Rc: 2 }).key,
      of({ shape: 'nn', V1: 1 }).key, of({ shape: 'nn', V1: 2 }).key,
    ];
    expect(new Set(distinct).size).toBe(distinct.length);
  });
});

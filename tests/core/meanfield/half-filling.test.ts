import { describe, it, expect } from 'vitest';
import { solveGroundState } from '../../../src/core/meanfield/ground-state.ts';
import { expectRel } from '../../references.ts';

// Particle-hole symmetric point of the nearest-neighbour chain far from the cavity
// (delta = 51, so the photon stays empty): mu = V(0)/2 = V1 gives xi = 0 at m = 1/2.
// Mean-field lattice gas (Bragg-Williams, common practice, no source): the half-filled
// normal state has Omega = -T ln 2 - V(0)/8 and orders into the 1/2 density wave below
// T_c = |V(pi)|/4 = V1/2.
describe('half filling at the particle-hole symmetric point', () => {
  const base = { lattice: 'chain' as const, interaction: { shape: 'nn' as const, V1: 1 }, delta: 51, mu: 1, maxCell: 4 };

  it('above T_c: the normal state m = 1/2 with Omega = -T ln 2 - V(0)/8 (xi = 0 exactly)', () => {
    const s = solveGroundState({ ...base, T: 0.6 });
    expect(s.phase).toBe('normal');
    expectRel(s.emitterDensity, 0.5, 1e-12);
    expectRel(s.grandPotential, -0.6 * Math.LN2 - 2 / 8, 1e-12); // rounding only
  });

  it('below T_c = V1/2: the 1/2 density wave', () => {
    const s = solveGroundState({ ...base, T: 0.4 });
    expect(s.phase).toBe('density-wave');
    expect(s.fraction).toBe('1/2');
  });
});

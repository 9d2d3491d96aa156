import { describe, it, expect } from 'vitest';
import { solveGroundState } from '../../../src/core/meanfield/ground-state.ts';
import type { ModelParams } from '../../../src/core/model.ts';
import { InputError } from '../../../src/core/input-error.ts';
import { SOURCES, expectAbs } from '../../references.ts';

const chain = (interaction: ModelParams['interaction'], rest: Partial<ModelParams>): ModelParams =>
  ({ lattice: 'chain', interaction, delta: 2, T: 0, maxCell: 12, ...rest });

/**
 * Points of issue 10 that raised "no start converged" although they have an answer: marginal
 * points where the filled state meets the condensate ((delta - mu) mu = 1 at the edge of the
 * filled lobe, SOURCES.filledLobe, a quartic minimum that Newton reaches only linearly),
 * blockades so strong that m ~ 1/V is below 1e-16, and a temperature of 5e-324.
 */
describe('mean-field answers at marginal and blockaded points (issue 10)', () => {
  it('V = 0, delta 2, mu 1: the filled state, Omega = -mu = -1', () => {
    // The filled state's Omega = xi/2 - |xi|/2 = -mu (xi = -mu, no Hartree term at V = 0);
    // tolerance 1e-12: alpha ~ 2e-7 is left by the quartic minimum, Omega ~ alpha^4 below rounding.
    const s = solveGroundState(chain({ shape: 'nn', V1: 0 }, { mu: 1 }));
    expect(s.phase).toBe('filled');
    expectAbs(s.grandPotential, -1, 1e-12);
  });

  it('V1 = 0.5, delta 3, mu 2: the filled state on the edge of its lobe, Omega = -mu + J(0)/2 = -1.5', () => {
    // (delta - mu) |xi| = 1 with xi = -mu + J(0) = -1 (J(0) = 2 V1): the same marginal point, shifted by the Hartree term.
    const s = solveGroundState(chain({ shape: 'nn', V1: 0.5 }, { delta: 3, mu: 2 }));
    expect(s.phase).toBe('filled');
    expectAbs(s.grandPotential, -1.5, 1e-12);
  });

  it('V = 0, delta 2: every density is reached (no coexistence at V = 0 in the condensate)', () => {
    // Tolerance 1e-9: the fixed-density solver matches rho to RHO_TOL = 1e-12 or brackets mu to 1e-11.
    for (const rho of [0.25, 0.5, 1, 1.5]) {
      const s = solveGroundState(chain({ shape: 'nn', V1: 0 }, { rho }));
      if (!s.coexistence) expectAbs(s.excitationDensity, rho, 1e-9);
    }
  });

  it('rb = 1000 and rb = 50 (cell 1): the blockaded, essentially empty state', () => {
    // Every cell up to 12 sites holds a pair within 12 a, where V >= 2 (1000/12)^6 ~ 7e11 g, so a
    // density costs ~V m^2 and m ~ 1/V: Omega and the density vanish to 1e-9 (a closed-form bound,
    // not a computed value). At rb = 50 the uniform cell has V(1) = 3e10.
    for (const p of [chain({ shape: 'vdw', Rb: 1000 }, { mu: 0.5 }), chain({ shape: 'vdw', Rb: 50 }, { mu: 0.5, cell: 1 })]) {
      const s = solveGroundState(p);
      expect(s.emitterDensity).toBeLessThan(1e-9);
      expectAbs(s.grandPotential, 0, 1e-9);
    }
  });

  it('T = 5e-324 gives the T = 0 state (the thermal Newton matrix would hold 1/T^3)', () => {
    // Tolerance 1e-12 relative: at T < 1e-12 the thermal weights e^{-2E/T} are below rounding.
    const p = chain({ shape: 'nn', V1: 1 }, { mu: 0.5 });
    const cold = solveGroundState(p), tiny = solveGroundState({ ...p, T: 5e-324 });
    expect(tiny.phase).toBe(cold.phase);
    expectAbs(tiny.grandPotential, cold.grandPotential, 1e-12 * (1 + Math.abs(cold.grandPotential)));
  });

  it('strengths past 1e30 g are refused with the limit named (V1 = 1e308 hung a shift loop)', () => {
    for (const interaction of [{ shape: 'nn' as const, V1: 1e308 }, { shape: 'vdw' as const, Rb: 1e60 }]) {
      expect(() => solveGroundState(chain(interaction, { mu: 0.5 }))).toThrow(InputError);
      expect(() => solveGroundState(chain(interaction, { mu: 0.5 }))).toThrow(/1e\+30/);
    }
  });
});

/**
 * selfConsistentGround (src/core/ed/self-consistent-alpha.ts) called directly, against the
 * V = 0 closed form (model of README.md; Hopfield 1958 for the lower polariton): each emitter is a
 * two-level system with E0/N = -mu/2 - E, E = sqrt(mu^2/4 + alpha^2), and de/dalpha = 0 gives
 * the condensate where (delta - mu) = 1/(2E), i.e. alpha^2 = 1/(4 (delta - mu)^2) - mu^2/4 if
 * positive, else alpha = 0.
 */
import { describe, it, expect } from 'vitest';
import { selfConsistentGround } from '../../../src/core/ed/self-consistent-alpha.ts';
import { edSystem } from '../../../src/core/ed/exact-ground-state.ts';
import { buildCluster } from '../../../src/core/cluster/spec.ts';
import { SOURCES, expectAbs } from '../../references.ts';

const free = (N: number) => buildCluster({ kind: 'periodic', lattice: 'chain', size: [N], interaction: { shape: 'nn', V1: 0 } });

describe(`selfConsistentGround at V = 0 (${SOURCES.hopfield})`, () => {
  it('alpha* and e(alpha*) match the two-level closed form', () => {
    for (const [delta, mu] of [[1, -0.3], [2, 0.5], [0.8, 0.1]]) {
      const r = selfConsistentGround(edSystem(free(5), mu), delta);
      const gap = delta - mu, a2 = 1 / (4 * gap * gap) - (mu * mu) / 4;
      expect(a2).toBeGreaterThan(0);
      // 1e-7 on alpha: the minimum is flat, e rounded at ~1e-14 fixes alpha only to ~1e-7;
      // e is stationary there, so 1e-12 on e.
      expectAbs(r.ground.alpha, Math.sqrt(a2), 1e-7);
      expectAbs(r.e, gap * a2 - mu / 2 - Math.sqrt((mu * mu) / 4 + a2), 1e-12);
      // the condensate condition itself: (delta - mu) = 1/(2E)
      expectAbs(2 * gap * Math.sqrt((mu * mu) / 4 + r.ground.alpha ** 2), 1, 1e-6);
    }
  });

  it('no condensate below threshold: alpha* = 0 and e = min(0, -mu)', () => {
    // (delta - mu)|mu| = 1.5 * 1 > 1 with mu = -1: the empty state, e = 0.
    const r = selfConsistentGround(edSystem(free(4), -1), 0.5);
    expect(r.ground.alpha).toBe(0);
    expectAbs(r.e, 0, 1e-14);
  });
});

/**
 * Self-consistent photon amplitude by minimising e(alpha) = (delta - mu) alpha^2 + E0(alpha)/N.
 *
 * Closed form at V = 0: every emitter is a two-level system with E0/N = -mu/2 - sqrt(mu^2/4 + alpha^2),
 * so de/dalpha = 0 gives sqrt(mu^2/4 + alpha^2) = 1/(2 (delta - mu)), i.e.
 *   alpha^2 = 1/(4 (delta - mu)^2) - mu^2/4   when positive, else alpha = 0,
 * the condensate threshold (delta - mu)|mu| = 1 at the lower polariton (Hopfield 1958).
 */
import { describe, it, expect } from 'vitest';
import { exactDiagonalisation } from '../../../src/core/ed/exact-diagonalisation.ts';
import { edSystem, groundState } from '../../../src/core/ed/exact-ground-state.ts';
import { buildCluster } from '../../../src/core/cluster/spec.ts';
import { SOURCES, expectAbs } from '../../references.ts';

const chain = (L: number, interaction: object) => ({ kind: 'periodic' as const, lattice: 'chain' as const, size: [L], interaction: interaction as never });

describe(`self-consistent alpha (${SOURCES.hopfield})`, () => {
  it('V = 0: alpha and e match the two-level closed form, and alpha = 0 below threshold', () => {
    for (const [delta, mu] of [[1, -0.3], [0.5, -0.2], [2, 0.5]]) {
      const r = exactDiagonalisation({ cluster: chain(6, { shape: 'nn', V1: 0 }), mu, delta });
      const gap = delta - mu, a2 = Math.max(0, 1 / (4 * gap * gap) - (mu * mu) / 4);
      // tolerance 1e-7 on alpha: Brent stops at |dalpha| ~ 1e-9 relative, and the minimum is flat, so the
      // 1e-14 rounding of e moves it by ~1e-7; e is quadratic there, so 1e-12 on e.
      expectAbs(r.alpha, Math.sqrt(a2), 1e-7);
      expectAbs(r.energyPerSite, gap * a2 - mu / 2 - Math.sqrt((mu * mu) / 4 + a2), 1e-12);
    }
    const below = exactDiagonalisation({ cluster: chain(6, { shape: 'nn', V1: 0 }), mu: -1, delta: 0.5 });
    expect(below.alpha).toBe(0); // (delta - mu)|mu| = 1.5 > 1: no condensate
  });

  it('interacting ring: Hellmann-Feynman de/dalpha = 0 at alpha*, and no grid alpha does better', () => {
    const req = { cluster: chain(10, { shape: 'vdw', Rb: 1.2 }), mu: 0.3, delta: 1 };
    const r = exactDiagonalisation(req);
    expect(r.alpha).toBeGreaterThan(0);
    // de/dalpha = 2 (delta - mu) alpha - <sigma^x>; its residual ~ e''(alpha) * dalpha ~ 1e-8.
    expectAbs(r.dEdAlpha as number, 0, 1e-6);
    const sys = edSystem(buildCluster(req.cluster), req.mu);
    const gap = req.delta - req.mu;
    for (let a = 0; a <= 1 / (2 * gap); a += 0.02) {
      // common practice, no source: a brute-force scan bounds the minimum from above.
      expect(r.energyPerSite).toBeLessThanOrEqual(gap * a * a + groundState(sys, a).energy / 10 + 1e-12);
    }
  });

  it('alpha -> 0 recovers the classical crystal (brute force over all 2^N configurations)', () => {
    const req = { cluster: chain(12, { shape: 'vdw', Rb: 1.5 }), mu: 2 };
    const c = buildCluster(req.cluster);
    let best = Infinity;
    for (let s = 0; s < 1 << 12; s++) {
      let e = 0;
      for (let i = 0; i < 12; i++) if ((s >> i) & 1) { e -= req.mu; for (let j = 0; j < i; j++) if ((s >> j) & 1) e += c.V[i * 12 + j]; }
      best = Math.min(best, e);
    }
    expectAbs(exactDiagonalisation({ ...req, alpha: 0 }).energyPerSite, best / 12, 1e-12);
    // Weyl: ||alpha sum sigma^x|| = alpha N, so |E0(alpha)/N - e_cl| <= alpha; second order makes it ~alpha^2.
    for (const alpha of [1e-3, 1e-2]) {
      const e = exactDiagonalisation({ ...req, alpha }).energyPerSite;
      expect(e).toBeLessThanOrEqual(best / 12);
      expect(best / 12 - e).toBeLessThanOrEqual(alpha);
    }
  });
});

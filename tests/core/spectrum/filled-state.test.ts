import { describe, it, expect } from 'vitest';
import { background } from '../../../src/core/spectrum/background.ts';
import { modesAt } from '../../../src/core/spectrum/modes.ts';
import { softestMode } from '../../../src/core/softmode/softest.ts';
import { SOURCES, expectAbs, expectRel } from '../../references.ts';

/**
 * The filled state (all m = 1, alpha = 0) is stationary for any mu; whether it is stable
 * differs between the two criteria (DESIGN.md). Linearising about S = (0, 0, +1):
 * i dbeta/dt = xi beta - alpha, i dalpha/dt = (delta - mu) alpha + beta, xi = V(0) - mu < 0.
 *  - dynamics at k = 0: [[delta - mu, 1], [-1, xi]] has eigenvalues
 *    (delta - mu + xi)/2 +- sqrt(((delta - V(0))/2)^2 - 1): complex, a growing mode with rate
 *    sqrt(1 - ((delta - V(0))/2)^2), exactly when |delta - V(0)| < 2;
 *  - statics: photon stiffness 2(delta - mu), emitter stiffness E = |xi|/2 and coupling 1
 *    give the scaled stability matrix [[1, c], [c, 1]], c^2 = 1/((delta - mu)(mu - V(0))),
 *    lowest eigenvalue 1 - c: unstable where (delta - mu)(mu - V(0)) < 1.
 * At V = 0 these are the closed forms of SOURCES.filledLobe: thermodynamically unstable
 * where (delta - mu) mu < 1, dynamically only for delta < 2. With interactions V(0) shifts
 * both (derived here; DESIGN.md states the V = 0 case).
 * Tolerance 1e-12: 4 x 4 eigenproblems in exact arithmetic.
 */
function filled(V1: number, mu: number, delta: number) {
  return background({ lattice: 'chain', interaction: { shape: 'nn', V1 }, cell: { a: 1, b: 0, c: 1 }, densities: [1], alpha: 0, mu, delta, T: 0 });
}

describe(`filled state: thermodynamic against dynamical stability (${SOURCES.filledLobe})`, () => {
  it('V = 0: margin 1 - 1/sqrt((delta - mu) mu), sign change at (delta - mu) mu = 1', () => {
    for (const [delta, mu] of [[5, 2.5], [5, 4.8], [3, 1.5], [3, 2.9], [1.5, 1], [4, 0.2]] as const) {
      const sm = softestMode(filled(0, mu, delta));
      expectRel(sm.margin, 1 - 1 / Math.sqrt((delta - mu) * mu), 1e-12);
      expect(sm.stable).toBe((delta - mu) * mu > 1);
      expect(sm.k).toBe(0);
      expect(sm.kind).toBe('photon');
    }
  });

  it('V = 0: dynamically unstable only for delta < 2, with growth sqrt(1 - delta^2/4)', () => {
    for (const [delta, mu] of [[1.5, 1], [1.9, 0.5], [2.5, 2], [3, 2.9], [4, 0.2]] as const) {
      const m = modesAt(filled(0, mu, delta), [0, 0]);
      if (delta < 2) expectRel(m.growth, Math.sqrt(1 - delta * delta / 4), 1e-12);
      else expect(m.growth).toBe(0);
    }
    // delta = 3, mu = 2.9: (delta - mu) mu = 0.29 < 1 (thermodynamically unstable) yet real frequencies.
    const b = filled(0, 2.9, 3);
    expect(softestMode(b).stable).toBe(false);
    expect(modesAt(b, [0, 0]).growth).toBe(0);
  });

  it('with a nearest-neighbour repulsion: (delta - mu)(mu - V(0)) < 1 and |delta - V(0)| < 2; flat band mu - V(0) at k != 0', () => {
    const V1 = 0.5, V0 = 2 * V1;
    for (const [delta, mu] of [[4, 2.5], [4, 3.8], [2.5, 1.8], [6, 5]] as const) {
      const bg = filled(V1, mu, delta);
      expectRel(softestMode(bg).margin, 1 - 1 / Math.sqrt((delta - mu) * (mu - V0)), 1e-12);
      const g = modesAt(bg, [0, 0]).growth;
      if (Math.abs(delta - V0) < 2) expectRel(g, Math.sqrt(1 - ((delta - V0) / 2) ** 2), 1e-12);
      else expect(g).toBe(0);
      expectAbs(modesAt(bg, [1.1, 0]).omega[0], mu - V0, 1e-12);
    }
  });
});

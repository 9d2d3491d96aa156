import { describe, it, expect } from 'vitest';
import { fluctuationSpectrum } from '../../../src/core/spectrum/spectrum.ts';
import { background } from '../../../src/core/spectrum/background.ts';
import { softestMode } from '../../../src/core/softmode/softest.ts';
import { SOURCES, expectAbs, expectRel } from '../../references.ts';

/**
 * The nearest-neighbour chain at mu = V1 with alpha a fixed external field (no photon
 * dynamics) is the antiferromagnetic transverse-field Ising chain H = J sum sz sz + h sum sx,
 * J = V1/4, h = alpha (DESIGN.md, exact diagonalisation checks). Its mean-field states and
 * their linear spin waves:
 *  - paramagnet (h > 2J): m = 1/2, S = -x; omega_k^2 = 4h(h + 2J cos k) (SOURCES.stinchcombe,
 *    from memory). Cross-check with the exact free-fermion energies of SOURCES.pfeuty,
 *    eps_k^2 = 4(h^2 + J^2 + 2hJ cos k) (antiferromagnetic sign): the linear spin wave
 *    misses exactly the 4J^2, omega_k^2 = eps_k^2 - 4J^2 at every k. The mean-field gap closes
 *    at k = pi when h = 2J = zJ (mean-field critical field, z = 2).
 *  - Neel state (h < 2J): two sublattices tilted by sin(theta) = h/(2J), m = (1 +- cos theta)/2,
 *    E = V1/2 on both; derived here from the linearised equations: with J_AB(k) = 2 V1 cos k,
 *    omega_+-(k)^2 = V1^2 (1 +- sin^2(theta) cos k) = 16J^2 +- 4h^2 cos k, joining the
 *    paramagnet's branches at h = 2J.
 * Tolerance 1e-12: closed forms against small eigenproblems.
 */
const V1 = 2, J = V1 / 4;

describe('transverse-field Ising chain limit (nn chain at mu = V1, fixed alpha)', () => {
  it('paramagnet: omega_k^2 = 4h(h + 2J cos k) = eps_k^2 - 4J^2 against the exact Pfeuty dispersion', () => {
    for (const h of [1.2, 2, 5]) {
      const sp = fluctuationSpectrum({
        lattice: 'chain', interaction: { shape: 'nn', V1 }, cell: { a: 1, b: 0, c: 1 }, densities: [0.5],
        alpha: h, mu: V1, delta: 10, T: 0, fixedPhoton: true,
      }, { points: 33 });
      for (const b of sp.branches) {
        const k = b.k as number;
        expect(b.omega).toHaveLength(1);
        expectRel(b.omega[0] ** 2, 4 * h * (h + 2 * J * Math.cos(k)), 1e-12);
        const pfeuty = 4 * (h * h + J * J + 2 * h * J * Math.cos(k));
        expectRel(b.omega[0] ** 2 + 4 * J * J, pfeuty, 1e-12);
      }
      expect(sp.dynamicallyStable).toBe(true);
      expect(SOURCES.pfeuty).toContain('Pfeuty');
    }
  });

  it('paramagnet: margin 1 - 2J/h at k* = pi (soft at the mean-field critical field h = 2J)', () => {
    for (const h of [0.8, 1, 1.5, 3]) {
      const sm = softestMode(background({
        lattice: 'chain', interaction: { shape: 'nn', V1 }, cell: { a: 1, b: 0, c: 1 }, densities: [0.5],
        alpha: h, mu: V1, delta: 10, T: 0, fixedPhoton: true,
      }));
      expectRel(sm.margin, 1 - (2 * J) / h, 1e-12);
      expectAbs(sm.k as number, Math.PI, 1e-12);
      expect(sm.kind).toBe('density');
    }
  });

  it('Neel state: omega_+-^2 = 16J^2 +- 4h^2 cos k, stable below h = 2J', () => {
    for (const h of [0.3, 0.7, 0.95]) {
      const sin = h / (2 * J), cos = Math.sqrt(1 - sin * sin);
      const inp = {
        lattice: 'chain' as const, interaction: { shape: 'nn' as const, V1 }, cell: { a: 2, b: 0, c: 1 },
        densities: [(1 + cos) / 2, (1 - cos) / 2], alpha: h, mu: V1, delta: 10, T: 0, fixedPhoton: true,
      };
      const sp = fluctuationSpectrum(inp, { points: 33 });
      expect(sp.residual.emitter).toBeLessThan(1e-14);
      for (const b of sp.branches) {
        const k = b.k as number;
        const exp = [16 * J * J - 4 * h * h * Math.abs(Math.cos(k)), 16 * J * J + 4 * h * h * Math.abs(Math.cos(k))];
        expect(b.omega).toHaveLength(2);
        b.omega.forEach((w, i) => expectRel(w * w, exp[i], 1e-12));
      }
      expect(softestMode(background(inp)).stable).toBe(true);
    }
  });
});

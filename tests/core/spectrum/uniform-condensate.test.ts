import { describe, it, expect } from 'vitest';
import { fluctuationSpectrum } from '../../../src/core/spectrum/spectrum.ts';
import { background } from '../../../src/core/spectrum/background.ts';
import { modesAt } from '../../../src/core/spectrum/modes.ts';
import { expectAbs, expectRel } from '../../references.ts';

/**
 * The uniform condensate, built in the test from its closed form. At any T the photon
 * equation tanh(E/T)/(2E) = delta - mu fixes E (T = 0: E = 1/(2(delta - mu)), DESIGN.md),
 * and with r = tanh(E/T) the Hartree equation xi = -mu + V(0)(1 - xi r/(2E))/2 is linear:
 * xi = (V(0)/2 - mu)/(1 + V(0) r/(4E)), alpha^2 = E^2 - xi^2/4.
 *
 * V(k) is summed directly here: nn 2 V1 cos k; vdw sum_{n=1}^{20000} 2 V1 n^-6 cos(nk)
 * (tail below 2 V1/(5 * 20000^5) ~ 1e-22).
 */
function condensate(V0: number, mu: number, delta: number, T: number) {
  let E = 1 / (2 * (delta - mu));
  if (T > 0) {
    let lo = 0, hi = E;
    for (let i = 0; i < 200; i++) { const m = (lo + hi) / 2; if (Math.tanh(m / T) / (2 * m) > delta - mu) lo = m; else hi = m; }
    E = (lo + hi) / 2;
  }
  const r = T === 0 ? 1 : Math.tanh(E / T);
  const xi = (V0 / 2 - mu) / (1 + (V0 * r) / (4 * E));
  const a2 = E * E - xi * xi / 4;
  return { E, xi, r, alpha: Math.sqrt(a2), m: (1 - (xi * r) / (2 * E)) / 2 };
}

const vdwChain = (V1: number) => (k: number) => { let s = 0; for (let n = 20000; n >= 1; n--) s += (2 * V1 * Math.cos(n * k)) / n ** 6; return s; };
const nnChain = (V1: number) => (k: number) => 2 * V1 * Math.cos(k);

const cases = [
  { name: 'nn chain', spec: { shape: 'nn' as const, V1: 1 }, V: nnChain(1) },
  { name: 'vdw chain', spec: { shape: 'vdw' as const, V1: 1.2 }, V: vdwChain(1.2) },
];

describe('uniform condensate at T = 0', () => {
  for (const c of cases) {
    const delta = 1, mu = 0.2;
    const V0 = c.V(0);
    const s = condensate(V0, mu, delta, 0);
    const inp = { lattice: 'chain' as const, interaction: c.spec, cell: { a: 1, b: 0, c: 1 }, densities: [s.m], alpha: s.alpha, mu, delta, T: 0 };

    it(`${c.name}: omega(k)^2 = 4E^2 + V(k) alpha^2/E at every k != 0 (closed form of DESIGN.md)`, () => {
      const sp = fluctuationSpectrum(inp, { points: 65 });
      expect(s.alpha).toBeGreaterThan(0.1);
      for (const b of sp.branches.slice(1)) {
        const k = b.k as number;
        expect(b.omega).toHaveLength(1);
        // 1e-10: the direct sum and the Ewald sum agree to ~1e-12 relative.
        expectRel(b.omega[0], Math.sqrt(4 * s.E ** 2 + (c.V(k) * s.alpha ** 2) / s.E), 1e-10);
      }
      expect(sp.residual.emitter).toBeLessThan(1e-12);
    });

    it(`${c.name}: Goldstone zero at k = 0 and the amplitude mode with the photon`, () => {
      // With the photon at k = 0 the map on (da, db, u, v) is
      //   da' = (db/E - u)/2, db' = -(da/E + c v)/2, u' = 2(E + W) v + 2 c da, v' = 2 b - 2 E u,
      // c = xi/(2E), W = V(0) alpha^2/(4E^2); eigenvalues 0, 0, +-i Omega_A with
      // -2 Omega_A^2 = tr L^2, i.e. Omega_A^2 = 4E^2 + V(0) alpha^2/E + (delta-mu)^2 + 2 (delta-mu) xi
      // (derived here; DESIGN.md's "every k" formula holds for k != 0 only: the photon joins at k = 0).
      const m = modesAt(background(inp), [0, 0], true);
      expect(m.omega).toHaveLength(2);
      // 1e-7: the Goldstone pair is a Jordan block, split by rounding to ~sqrt(eps) E.
      expectAbs(m.omega[0], 0, 1e-7);
      const dm = delta - mu;
      expectRel(m.omega[1], Math.sqrt(4 * s.E ** 2 + (V0 * s.alpha ** 2) / s.E + dm * dm + 2 * dm * s.xi), 1e-10);
      expect(m.growth).toBe(0);
    });
  }

  it('past the density-wave soft mode the k = pi branch turns imaginary: growth sqrt(-(4E^2 + V(pi) alpha^2/E))', () => {
    const V1 = 2.2, delta = 1, mu = 0.2;
    const s = condensate(2 * V1, mu, delta, 0);
    const w2 = 4 * s.E ** 2 + (-2 * V1 * s.alpha ** 2) / s.E;
    expect(w2).toBeLessThan(0);
    const bg = background({ lattice: 'chain', interaction: { shape: 'nn', V1 }, cell: { a: 1, b: 0, c: 1 }, densities: [s.m], alpha: s.alpha, mu, delta, T: 0 });
    const m = modesAt(bg, [Math.PI, 0]);
    expectRel(m.growth, Math.sqrt(-w2), 1e-10);
    expect(fluctuationSpectrum(bg, { points: 9 }).dynamicallyStable).toBe(false);
  });
});

describe('uniform condensate at T > 0', () => {
  it('omega(k)^2 = 4E^2 + tanh(E/T) V(k) alpha^2/E (the T = 0 form with the Bloch length r = tanh(E/T))', () => {
    // Derived here: the transverse amplitudes precess with Poisson tensor 2r and stiffnesses
    // E/r and E/r + V(k) alpha^2/(4E^2) (stability-matrix.ts), so omega^2 = 4 r^2 (E/r)(E/r + V alpha^2/(4E^2)).
    const V1 = 1, delta = 1, mu = 0.3, T = 0.2;
    const V = vdwChain(V1);
    const s = condensate(V(0), mu, delta, T);
    expect(s.alpha).toBeGreaterThan(0.1);
    const sp = fluctuationSpectrum({ lattice: 'chain', interaction: { shape: 'vdw', V1 }, cell: { a: 1, b: 0, c: 1 }, densities: [s.m], alpha: s.alpha, mu, delta, T }, { points: 33 });
    for (const b of sp.branches.slice(1)) {
      expectRel(b.omega[0], Math.sqrt(4 * s.E ** 2 + (s.r * V(b.k as number) * s.alpha ** 2) / s.E), 1e-10);
    }
    expectAbs(sp.zoneCentre.omega[0], 0, 1e-7);
  });

  it('the same state on a 2-sublattice cell has the branches of k and k + pi (folding)', () => {
    const V1 = 1, delta = 1, mu = 0.3, T = 0.2;
    const V = vdwChain(V1);
    const s = condensate(V(0), mu, delta, T);
    const sp = fluctuationSpectrum({ lattice: 'chain', interaction: { shape: 'vdw', V1 }, cell: { a: 2, b: 0, c: 1 }, densities: [s.m, s.m], alpha: s.alpha, mu, delta, T }, { points: 17 });
    const w = (k: number) => Math.sqrt(4 * s.E ** 2 + (s.r * V(k) * s.alpha ** 2) / s.E);
    for (const b of sp.branches) {
      const k = b.k as number;
      if (k < 1e-12 || Math.abs(k - Math.PI) < 1e-12) continue; // zone centres of the 2-cell: photon joins
      const expected = [w(k), w(k + Math.PI)].sort((x, y) => x - y);
      b.omega.forEach((x, i) => expectRel(x, expected[i], 1e-10));
    }
  });
});

describe('uniform condensate on the square and triangular lattices', () => {
  // nn Fourier sums in closed form: square 2V1(cos kx + cos ky); triangular
  // 2V1(cos kx + 2 cos(kx/2) cos(sqrt3 ky/2)) (six neighbours at unit distance).
  const cases = [
    { lat: 'square' as const, V: (k: [number, number]) => 2 * (Math.cos(k[0]) + Math.cos(k[1])) },
    { lat: 'triangular' as const, V: (k: [number, number]) => 2 * (Math.cos(k[0]) + 2 * Math.cos(k[0] / 2) * Math.cos((Math.sqrt(3) * k[1]) / 2)) },
  ];
  for (const c of cases) {
    it(`${c.lat}, nn V1 = 1: omega(k)^2 = 4E^2 + V(k) alpha^2/E along the path`, () => {
      const delta = 1, mu = 0.3;
      const s = condensate(c.V([0, 0]), mu, delta, 0);
      const sp = fluctuationSpectrum({ lattice: c.lat, interaction: { shape: 'nn', V1: 1 }, cell: { a: 1, b: 0, c: 1 }, densities: [s.m], alpha: s.alpha, mu, delta, T: 0 }, { points: 40 });
      for (const b of sp.branches) {
        const k = b.k as [number, number];
        if (Math.hypot(k[0], k[1]) < 1e-12) continue; // Gamma: photon joins
        const w2 = 4 * s.E ** 2 + (c.V(k) * s.alpha ** 2) / s.E;
        if (w2 > 0) expectRel(b.omega[0], Math.sqrt(w2), 1e-10);
        else expectRel(b.growth, Math.sqrt(-w2), 1e-10);
      }
    });
  }
});

import { describe, it, expect } from 'vitest';
import { background } from '../../../src/core/spectrum/background.ts';
import { softestMode } from '../../../src/core/softmode/softest.ts';
import { lowestMode } from '../../../src/core/softmode/lowest-mode.ts';
import { SOURCES, expectAbs, expectRel } from '../../references.ts';

/**
 * The stability margin is the lowest eigenvalue of 1 - chi0 U(k) (stability-matrix.ts):
 * 1 without couplings, 0 on a soft-mode line. Closed forms, each derived in DESIGN.md or
 * here from the Hessian of the mean-field grand potential.
 */
const uniform = (lat: 'chain' | 'square' | 'triangular', interaction: object, m: number, alpha: number, mu: number, delta: number, T: number) =>
  background({ lattice: lat, interaction: interaction as never, cell: { a: 1, b: 0, c: 1 }, densities: [m], alpha, mu, delta, T });

describe('uniform condensate at T = 0: margin 1 + V(k) alpha^2/(4E^3), soft where V(k*) = -4E^3/alpha^2', () => {
  // The transverse stiffnesses are E (along y) and E + V(k) alpha^2/(4E^2) (in the x-z plane,
  // whose S^z part is alpha/E): instability at V(k*) = -4E^3/alpha^2, DESIGN.md's formula
  // (checked: it is right). Closed-form state as in tests/core/spectrum/uniform-condensate.
  const nn = (V1: number) => (k: number) => 2 * V1 * Math.cos(k);
  for (const V1 of [0.6, 1.2, 2]) {
    it(`nn chain V1 = ${V1}: margin, k* = pi, and the zero crossing in mu`, () => {
      const delta = 1;
      const state = (mu: number) => {
        const E = 1 / (2 * (delta - mu)), V0 = 2 * V1;
        const xi = (V0 / 2 - mu) / (1 + V0 / (4 * E));
        return { E, xi, alpha: Math.sqrt(E * E - xi * xi / 4), m: (1 - xi / (2 * E)) / 2 };
      };
      const margin = (mu: number) => { const s = state(mu); return 1 + (nn(V1)(Math.PI) * s.alpha ** 2) / (4 * s.E ** 3); };
      const mu = 0.2, s = state(mu);
      const sm = softestMode(uniform('chain', { shape: 'nn', V1 }, s.m, s.alpha, mu, delta, 0));
      expectRel(sm.margin, margin(mu), 1e-12);
      expectAbs(sm.k as number, Math.PI, 1e-12);
      expect(sm.kind).toBe('density');
      expect(sm.stable).toBe(margin(mu) > 0);
    });
  }
});

describe(`normal state at T > 0: superradiant line (${SOURCES.heppLieb})`, () => {
  it('margin 1 - sqrt(tanh(E/T)/(2E(delta - mu))), zero on (delta - mu) = tanh(|mu|/(2T))/|mu| at V = 0', () => {
    // k = 0 block: photon stiffness 2(delta - mu), transverse emitter stiffness E coth(E/T),
    // coupling 1: scaled [[1, c], [c, 1]] with c^2 = tanh(E/T)/(2E(delta - mu)), E = |xi|/2.
    const delta = 1.5;
    for (const [mu, T] of [[-0.5, 0.2], [-0.5, 0.6], [-1.2, 0.3], [-0.2, 1]] as const) {
      const m = (1 - Math.tanh(-mu / (2 * T))) / 2; // thermal occupation at xi = -mu
      const E = Math.abs(mu) / 2;
      const c = Math.sqrt(Math.tanh(E / T) / (2 * E * (delta - mu)));
      const sm = softestMode(uniform('chain', { shape: 'nn', V1: 0 }, m, 0, mu, delta, T));
      expectRel(sm.margin, 1 - c, 1e-12);
      expect(sm.k).toBe(0);
      expect(sm.kind).toBe('photon');
      expect(sm.stable).toBe(delta - mu > Math.tanh(Math.abs(mu) / (2 * T)) / Math.abs(mu));
    }
  });
});

describe(`normal state at T > 0: density-wave spinodal (${SOURCES.braggWilliams})`, () => {
  // Longitudinal stiffness T cosh^2(E/T) = T/(4 m(1-m)) against the coupling V(k)/4: margin
  // 1 + V(k) m(1-m)/T. At half filling (xi = 0, m = 1/2) it is 1 + V(k*)/(4T): T_c = -V(k*)/4.
  // The cavity is detuned far (delta - mu = 50) so the photon channel, soft below
  // T = 1/(2(delta - mu)) = 0.01, stays out of the way.
  const cases = [
    { lat: 'chain' as const, Vmin: -2, V0: 2, k: Math.PI },
    { lat: 'square' as const, Vmin: -4, V0: 4, k: [Math.PI, Math.PI] },
    { lat: 'triangular' as const, Vmin: -3, V0: 6, k: (4 * Math.PI) / 3 },
  ];
  for (const c of cases) {
    it(`${c.lat}, nn V1 = 1: margin 1 + V(k*)/(4T) at k* = ${c.lat === 'triangular' ? 'K' : c.lat === 'square' ? 'M' : 'pi'}`, () => {
      const mu = c.V0 / 2;
      for (const T of [0.3, -c.Vmin / 4, 1.5]) {
        const sm = softestMode(uniform(c.lat, { shape: 'nn', V1: 1 }, 0.5, 0, mu, mu + 50, T));
        expectAbs(sm.margin, 1 + c.Vmin / (4 * T), 1e-12);
        expect(sm.kind).toBe('density');
        if (typeof c.k === 'number' && c.lat === 'chain') expectAbs(sm.k as number, c.k, 1e-12);
        else if (typeof c.k === 'number') { const k = sm.k as [number, number]; expectAbs(k[0], c.k, 1e-12); expectAbs(k[1], 0, 1e-12); } // K = (4 pi/3, 0)
        else { const k = sm.k as [number, number]; expectAbs(k[0], Math.PI, 1e-12); expectAbs(k[1], Math.PI, 1e-12); }
      }
    });
  }

  it('away from half filling the spinodal follows m(1 - m): 1 + V(pi) m(1-m)/T with the self-consistent m', () => {
    const V1 = 1, T = 0.35, mu = 1.4;
    let m = 0.5;
    for (let i = 0; i < 2000; i++) m = 0.5 * m + 0.5 * (1 - Math.tanh((-mu + 2 * V1 * m) / (2 * T))) / 2;
    const bg = uniform('chain', { shape: 'nn', V1 }, m, 0, mu, mu + 50, T);
    expectRel(lowestMode(bg, [Math.PI, 0]).value, 1 - (2 * V1 * m * (1 - m)) / T, 1e-10);
  });
});

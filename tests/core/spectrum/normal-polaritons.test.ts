import { describe, it, expect } from 'vitest';
import { fluctuationSpectrum } from '../../../src/core/spectrum/spectrum.ts';
import { background } from '../../../src/core/spectrum/background.ts';
import { modesAt } from '../../../src/core/spectrum/modes.ts';
import { stateSpectrum } from '../../../src/core/spectrum/state-spectrum.ts';
import type { ModelParams } from '../../../src/core/model.ts';
import { SOURCES, expectAbs, expectRel } from '../../references.ts';

/**
 * The empty state below the emitter line (mu < 0, below the lower polariton so it is the
 * ground state). Linearising about S = (0, 0, -1) with beta = (S^x - i S^y)/2 gives
 * i dbeta/dt = xi beta + alpha and i dalpha/dt = (delta - mu) alpha + mean beta, xi = -mu
 * (m = 0: no Hartree shift, whatever V). At k = 0 the matrix [[delta - mu, 1], [1, -mu]] has
 * eigenvalues delta/2 - mu +- sqrt(delta^2/4 + 1): the polaritons of SOURCES.hopfield, in the
 * frame rotating at mu. DESIGN.md's formula is right, with the sign convention that mu < 0
 * below the emitter line (both branches positive). At k != 0 the photon is absent: a flat
 * emitter band at -mu. Photon fraction of the lower polariton (Hopfield coefficient):
 * (1 - delta/sqrt(delta^2 + 4))/2.
 * Tolerance 1e-12: exact arithmetic on a 4 x 4 real eigenproblem.
 */
describe('normal state: polaritons and the flat emitter band', () => {
  for (const [delta, mu] of [[1, -1], [3, -0.5], [-2, -2.5]] as const) {
    it(`delta = ${delta}, mu = ${mu}: Hopfield polaritons at k = 0, -mu elsewhere (${SOURCES.hopfield})`, () => {
      const inp = { lattice: 'chain' as const, interaction: { shape: 'vdw' as const, Rb: 1.3 }, cell: { a: 1, b: 0, c: 1 }, densities: [0], alpha: 0, mu, delta, T: 0 };
      const sp = fluctuationSpectrum(inp, { points: 33 });
      const root = Math.sqrt(delta * delta / 4 + 1);
      const [lo, hi] = sp.zoneCentre.omega;
      expect(sp.zoneCentre.omega).toHaveLength(2);
      expectRel(lo, delta / 2 - mu - root, 1e-12);
      expectRel(hi, delta / 2 - mu + root, 1e-12);
      expectAbs(sp.zoneCentre.photonWeight[0], (1 - delta / Math.sqrt(delta * delta + 4)) / 2, 1e-12);
      expectAbs(sp.zoneCentre.photonWeight[1], (1 + delta / Math.sqrt(delta * delta + 4)) / 2, 1e-12);
      for (const b of sp.branches.slice(1)) {
        expect(b.omega).toHaveLength(1);
        expectRel(b.omega[0], -mu, 1e-12);
      }
      expect(sp.dynamicallyStable).toBe(true);
    });
  }

  it('square and triangular lattices: the same polaritons at Gamma, -mu at every other point of the path', () => {
    for (const lat of ['square', 'triangular'] as const) {
      const delta = 2, mu = -0.8;
      const sp = fluctuationSpectrum({ lattice: lat, interaction: { shape: 'nn', V1: 1 }, cell: { a: 1, b: 0, c: 1 }, densities: [0], alpha: 0, mu, delta, T: 0 }, { points: 40 });
      const root = Math.sqrt(delta * delta / 4 + 1);
      expectRel(sp.zoneCentre.omega[0], delta / 2 - mu - root, 1e-12);
      // Gamma appears at both ends of the 2D path.
      for (const b of sp.branches) {
        const k = b.k as [number, number];
        if (Math.hypot(k[0], k[1]) < 1e-12) { expect(b.omega).toHaveLength(2); continue; }
        expectRel(b.omega[0], -mu, 1e-12);
      }
    }
  });

  it('a supercell description of the empty state folds the photon onto every reciprocal superlattice vector', () => {
    // On a 3-sublattice cell k = 2 pi/3 is a zone centre: polaritons plus two flat bands there.
    const delta = 1, mu = -1;
    const bg = background({ lattice: 'chain', interaction: { shape: 'nn', V1: 2 }, cell: { a: 3, b: 0, c: 1 }, densities: [0, 0, 0], alpha: 0, mu, delta, T: 0 });
    const w = modesAt(bg, [(2 * Math.PI) / 3, 0]).omega;
    const root = Math.sqrt(delta * delta / 4 + 1);
    const expected = [delta / 2 - mu - root, -mu, -mu, delta / 2 - mu + root].sort((a, b) => a - b);
    expect(w).toHaveLength(4);
    w.forEach((x, i) => expectRel(x, expected[i], 1e-12));
  });

  // Issue 10: with no interaction (or none felt by the empty state) the k = 0 matrix has zero
  // trace and the plain double-shift QR sweep of JAMA is its own fixed point: these solved
  // points spun for ever. The closed forms are SOURCES.hopfield's, computed here;
  // tolerance 1e-12 (exact arithmetic on a 4 x 4 eigenproblem).
  const photonless: [string, ModelParams][] = [
    ['nn V1 = 0, delta 2, mu -1.5', { lattice: 'chain', interaction: { shape: 'nn', V1: 0 }, delta: 2, mu: -1.5, T: 0, maxCell: 12 }],
    ['vdw Rb = 50, delta 2, mu -1.5', { lattice: 'chain', interaction: { shape: 'vdw', Rb: 50 }, delta: 2, mu: -1.5, T: 0, maxCell: 4 }],
    ['nn V1 = 1, delta 0, mu -50', { lattice: 'chain', interaction: { shape: 'nn', V1: 1 }, delta: 0, mu: -50, T: 0, maxCell: 4 }],
    ['square, nn V1 = 0, delta -1, mu -3', { lattice: 'square', interaction: { shape: 'nn', V1: 0 }, delta: -1, mu: -3, T: 0, maxCell: 2 }],
  ];
  for (const [name, p] of photonless) {
    it(`solved empty state, ${name}: polaritons delta/2 - mu +- sqrt(delta^2/4 + 1) and the flat band -mu`, () => {
      const sp = stateSpectrum(p, { points: 17 });
      const mu = p.mu as number, delta = p.delta;
      expect(sp.state.phase).toBe('empty');
      const root = Math.sqrt(delta * delta / 4 + 1);
      expect(sp.zoneCentre.omega).toHaveLength(2);
      expectRel(sp.zoneCentre.omega[0], delta / 2 - mu - root, 1e-12);
      expectRel(sp.zoneCentre.omega[1], delta / 2 - mu + root, 1e-12);
      for (const b of sp.branches) {
        const k = typeof b.k === 'number' ? [b.k, 0] : b.k;
        if (Math.hypot(k[0], k[1]) < 1e-12) continue;
        expect(b.omega).toHaveLength(1);
        expectRel(b.omega[0], -mu, 1e-12);
      }
      expect(sp.dynamicallyStable).toBe(true);
    });
  }
});

/**
 * No emitter-emitter interaction (V = 0): the Dicke / Tavis-Cummings limit, where every
 * check value is a closed form computed here.
 *
 * At V = 0 the Hartree shift is xi = -mu for every site, so the solution is uniform and
 *   T = 0, normal (alpha = 0):  empty for mu < 0 (stable while (delta - mu)(-mu) >= 1, the
 *        photon equation having no root), filled for mu > 0 (stable while (delta-mu) mu >= 1);
 *   T = 0, condensate:  (delta - mu) = 1/(2E) with E = sqrt(mu^2/4 + alpha^2), so
 *        alpha^2 = 1/(4 (delta-mu)^2) - mu^2/4,
 *        m = (1 - xi/(2E))/2 = (1 + mu (delta - mu))/2,
 *        rho = alpha^2 + m;
 *   T > 0, normal -> superradiant where (delta - mu) = tanh(|mu|/(2T))/|mu|.
 */
import { describe, expect, it } from 'vitest';
import { solveGroundState } from '../../../src/core/meanfield/ground-state.ts';
import type { ModelParams } from '../../../src/core/model.ts';
import { SOURCES } from '../../references.ts';

/** |actual - expected| <= tol, the source of the expected value named in the failure. */
function expectAbs(actual: number, expected: number, tol: number, source: string): void {
  expect(Math.abs(actual - expected), `${actual} vs ${expected} (${source})`).toBeLessThanOrEqual(tol);
}

const free = (delta: number, T: number, mu: number, maxCell = 4): ModelParams => ({
  lattice: 'chain', interaction: { shape: 'nn', V1: 0 }, delta, T, mu, maxCell,
});

/** Bisection for the mu where pred turns from false (at lo) to true (at hi). */
function bisect(pred: (mu: number) => boolean, lo: number, hi: number, tol: number): number {
  expect(pred(lo)).toBe(false);
  expect(pred(hi)).toBe(true);
  while (hi - lo > tol) {
    const mid = 0.5 * (lo + hi);
    if (pred(mid)) hi = mid; else lo = mid;
  }
  return 0.5 * (lo + hi);
}

describe('V = 0 at T = 0', () => {
  it('the condensate appears at the lower polariton energy', () => {
    // SOURCES.hopfield: mu_c = delta/2 - sqrt(delta^2/4 + 1), from (delta - mu)(-mu) = 1.
    for (const delta of [-2, 0, 1, 3]) {
      const expected = delta / 2 - Math.sqrt(delta * delta / 4 + 1);
      const condensed = (mu: number) => solveGroundState(free(delta, 0, mu)).alpha > 0;
      const found = bisect(condensed, expected - 0.5, expected + 0.1, 1e-12);
      // Bisection stopped at 1e-12; 1e-10 leaves room for alpha ~ sqrt(mu - mu_c) being
      // resolved by the solver only down to alpha^2 ~ 1e-16 (rounding of the angles).
      expectAbs(found, expected, 1e-10, SOURCES.hopfield);
    }
  });

  it('in the condensate (delta - mu) = 1/(2E) and rho(mu) has its closed form', () => {
    // Closed form derived in the header (SOURCES.hopfield for the polariton picture).
    for (const delta of [-1, 0.5, 2]) {
      const muC = delta / 2 - Math.sqrt(delta * delta / 4 + 1);
      for (const mu of [muC + 0.01, muC + 0.3, Math.min(delta - 0.05, muC + 1.2)]) {
        const s = solveGroundState(free(delta, 0, mu));
        const a2 = 1 / (4 * (delta - mu) ** 2) - mu * mu / 4;
        if (a2 <= 0) continue; // filled-lobe side, checked below
        const E = Math.sqrt(mu * mu / 4 + s.photonDensity);
        // 1e-10: the solver converges m to 1e-12 and alpha^2 follows with O(1) factors.
        const src = 'closed form derived in this file';
        expectAbs(delta - mu, 1 / (2 * E), 1e-10, src);
        expectAbs(s.photonDensity, a2, 1e-10, src);
        expectAbs(s.emitterDensity, (1 + mu * (delta - mu)) / 2, 1e-10, src);
        expectAbs(s.excitationDensity, a2 + (1 + mu * (delta - mu)) / 2, 1e-10, src);
        expect(s.phase).toBe('superradiant');
      }
    }
  });

  it('the filled state exists only for delta > 2, exactly where (delta - mu) mu > 1', () => {
    // SOURCES.filledLobe (common practice, no source). Points within 1e-6 of an edge are
    // skipped: there the filled state and the condensate meet continuously.
    for (const delta of [1.5, 2, 2.5, 4]) {
      let filledSeen = false;
      for (let i = 0; i <= 60; i++) {
        const mu = -1 + ((delta + 1) * i) / 61;
        const f = (delta - mu) * mu;
        if (Math.abs(f - 1) < 1e-6) continue;
        const s = solveGroundState(free(delta, 0, mu));
        expect(s.phase === 'filled', `delta ${delta} mu ${mu} (${SOURCES.filledLobe})`).toBe(f > 1);
        if (s.phase === 'filled') { filledSeen = true; expectAbs(s.excitationDensity, 1, 1e-12, 'rho = 1 when filled'); }
      }
      expect(filledSeen, SOURCES.filledLobe).toBe(delta > 2);
    }
  });
});

describe('V = 0 at T > 0', () => {
  it('the normal state turns superradiant where (delta - mu) = tanh(|mu|/2T)/|mu|', () => {
    // SOURCES.heppLieb: the thermodynamic Dicke transition; the root of the closed form is
    // found here by its own bisection (f is monotone on the bracket used).
    for (const [delta, T] of [[1, 0.2], [1, 0.4], [0, 0.3]]) {
      const f = (mu: number) => (delta - mu) - Math.tanh(Math.abs(mu) / (2 * T)) / Math.abs(mu);
      let lo = -3, hi = -1e-6;
      expect(f(lo) > 0 && f(hi) < 0).toBe(true);
      while (hi - lo > 1e-14) { const mid = 0.5 * (lo + hi); if (f(mid) > 0) lo = mid; else hi = mid; }
      const expected = 0.5 * (lo + hi);
      const condensed = (mu: number) => solveGroundState(free(delta, T, mu)).alpha > 0;
      const found = bisect(condensed, expected - 0.3, Math.min(-1e-3, expected + 0.3), 1e-12);
      expectAbs(found, expected, 1e-10, SOURCES.heppLieb); // bisection 1e-12 plus the onset's sqrt resolution
      // The normal state below: m is the Fermi function 1/(1 + e^{-mu/T}) (xi = -mu).
      const below = solveGroundState(free(delta, T, expected - 0.05));
      expect(below.phase).toBe('normal');
      expectAbs(below.emitterDensity, 1 / (1 + Math.exp(-(expected - 0.05) / T)), 1e-12, 'Fermi function, closed form');
    }
  });
});

describe('V = 0 with the vdw shape', () => {
  it('vdw with V1 = 0 gives the same onset as the nn shape', () => {
    // SOURCES.hopfield, as above; checks the power-law path with zero strength.
    const delta = 1, expected = delta / 2 - Math.sqrt(delta * delta / 4 + 1);
    const p = (mu: number): ModelParams => ({ lattice: 'chain', interaction: { shape: 'vdw', V1: 0 }, delta, T: 0, mu, maxCell: 6 });
    expect(solveGroundState(p(expected - 1e-6)).phase, SOURCES.hopfield).toBe('empty');
    expect(solveGroundState(p(expected + 1e-6)).phase, SOURCES.hopfield).toBe('superradiant');
  });
});

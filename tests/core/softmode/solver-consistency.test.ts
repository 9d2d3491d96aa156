import { describe, it, expect } from 'vitest';
import { solveInCell } from '../../../src/core/meanfield/cell-search.ts';
import { marginAt } from '../../../src/core/softmode/soft-lines.ts';
import type { ModelParams } from '../../../src/core/model.ts';

/**
 * DESIGN.md: past a soft-mode line the mean-field solver must find a lower Omega in the
 * modulated cell of wavevector k*; before it, it does not. k* = pi on the chain, held by
 * the 2-sublattice cell. The solver (src/core/meanfield) is independent of the stability
 * code; solveInCell returns null when every start of the cell relaxes to a state of smaller
 * period (the uniform one). The lines are located here by bisection on the margin
 * (60 halvings: to rounding); points 1% of V1 (or T) either side of it. Both transitions
 * are continuous, so the modulation and the gain in Omega grow from zero past the line
 * (Omega differences of 1e-6 and more, far above the solver's 1e-12 convergence).
 */
const root = (f: (x: number) => number, lo: number, hi: number) => {
  const s = Math.sign(f(lo));
  for (let i = 0; i < 60; i++) { const m = (lo + hi) / 2; if (Math.sign(f(m)) === s) lo = m; else hi = m; }
  return (lo + hi) / 2;
};

function modulatedGain(p: ModelParams): { gain: number; modulation: number } | null {
  const u = solveInCell(p, { a: 1, b: 0, c: 1 });
  const m2 = solveInCell(p, { a: 2, b: 0, c: 1 });
  if (!u) throw new Error('no uniform solution');
  if (!m2) return null;
  return { gain: u.sol.omega - m2.sol.omega, modulation: Math.abs(m2.sol.m[0] - m2.sol.m[1]) };
}

describe('soft-mode lines against the mean-field solver', () => {
  it('uniform condensate -> supersolid at k* = pi (nn chain, delta = 1, mu = 0.2, T = 0)', () => {
    const delta = 1, mu = 0.2;
    const margin = (V1: number) => marginAt('condensate', { lattice: 'chain', interaction: { shape: 'nn', V1 }, mu, delta, T: 0 });
    const V1s = root((V1) => margin(V1).value as number, 0.5, 3);
    expect(margin(V1s * 1.01).k).toBeCloseTo(Math.PI, 12);
    const at = (V1: number): ModelParams => ({ lattice: 'chain', interaction: { shape: 'nn', V1 }, delta, mu, T: 0, maxCell: 2 });
    const before = modulatedGain(at(V1s * 0.99));
    expect(before === null || (before.modulation < 1e-6 && before.gain <= 1e-12)).toBe(true);
    const after = modulatedGain(at(V1s * 1.01));
    expect(after).not.toBeNull();
    expect(after!.modulation).toBeGreaterThan(1e-3);
    expect(after!.gain).toBeGreaterThan(1e-7);
  });

  it('thermal normal state -> density wave at k* = pi (nn chain near half filling)', () => {
    // mu = 1.05 with V(0) = 2: off the exactly half-filled point xi = 0.
    const V1 = 1, mu = 1.05, delta = 51;
    const margin = (T: number) => marginAt('normal', { lattice: 'chain', interaction: { shape: 'nn', V1 }, mu, delta, T });
    const Tc = root((T) => margin(T).value as number, 0.2, 1);
    expect(margin(Tc * 0.99).k).toBeCloseTo(Math.PI, 12);
    const at = (T: number): ModelParams => ({ lattice: 'chain', interaction: { shape: 'nn', V1 }, delta, mu, T, maxCell: 2 });
    const above = modulatedGain(at(Tc * 1.01));
    expect(above === null || (above.modulation < 1e-6 && above.gain <= 1e-12)).toBe(true);
    const below = modulatedGain(at(Tc * 0.99));
    expect(below).not.toBeNull();
    expect(below!.modulation).toBeGreaterThan(1e-2);
    expect(below!.gain).toBeGreaterThan(1e-6);
    // Bragg-Williams: T_c = 2 V1 m(1 - m) with the self-consistent m = (1 - tanh((2 V1 m - mu)/(2 T_c)))/2
    // (stability test); m by bisection here, to the precision of the root.
    let lo = 0, hi = 1;
    for (let i = 0; i < 60; i++) { const m = (lo + hi) / 2; if (m - (1 - Math.tanh((2 * V1 * m - mu) / (2 * Tc))) / 2 < 0) lo = m; else hi = m; }
    expect(Math.abs(Tc - 2 * V1 * lo * (1 - lo))).toBeLessThan(1e-10);
  });
});

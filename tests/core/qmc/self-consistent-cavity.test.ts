/**
 * Check 3 of issue 8: the self-consistent cavity on the nearest-neighbour chain at
 * mu = V1, exact as N -> infinity. The emitters are the transverse-field Ising chain
 * (J = V1/4, h = alpha, -V1/4 per site; transverse-ising-chain.test.ts), so with
 * c = delta - mu
 *   f(alpha) = c alpha^2 + e(alpha) - V1/4,   e(h) the free-fermion energy (T = 0)
 * (transverse-ising-free-fermions.ts; Pfeuty 1970). For small h, e(h) = -J - h^2/(4J) + O(h^4)
 * (from the integral: the mean of (h sin k)^2/(2J) over k), so alpha = 0 (the crystal) is a
 * local minimum while c > 1/(4J) = 1/V1. Where the condensed minimum first falls to f(0),
 * at c_c, the crystal gives way; if c_c > 1/V1 the crystal is still locally stable there
 * and alpha jumps from 0 to alpha(c_c): a first-order transition. All computed below.
 *
 * Mean-field (product states, DESIGN.md) puts it elsewhere: for the Neel state canted by
 * the field, e_MF(h) = -J - h^2/(4J) for h < 2J and -h beyond, so f_MF = (c - 1/V1) alpha^2
 * - J up to alpha = 2J: the transition is at c = 1/V1 exactly, with alpha jumping to
 * 1/(2c) = V1/2. The project's mean-field solver is checked to say so on both sides.
 * Exact: c_c = 1.1953/V1 (computed here), jump 0.363 V1; mean-field: c = 1/V1, jump V1/2. So mean-field puts the transition 16% too low in delta - mu (in units of 1/V1) and
 * overstates the jump by 38%.
 *
 * The Monte Carlo self-consistent run (ring of 16, T = 1/16) is compared on either side
 * with margins of +-0.15/V1 in c: the condensed side's alpha with the exact one at that
 * T (same integral, finite T: corrections from the ring are O(exp(-L/xi)), xi < 2 sites in
 * the gapped paramagnet at alpha ~ 0.43 > J), the crystal side's alpha with 0.
 */
import { describe, expect, it } from 'vitest';
import { quantumMonteCarlo } from '../../../src/core/qmc/quantum-monte-carlo.ts';
import { solveGroundState } from '../../../src/core/meanfield/ground-state.ts';
import { SOURCES, expectAbs, expectWithinSigmas, gridAllowance } from '../../references.ts';
import { transverseIsingChain } from './transverse-ising-free-fermions.ts';

const V1 = 1, J = V1 / 4, mu = V1;
const f = (c: number, alpha: number, T = 0) => c * alpha * alpha + transverseIsingChain(J, alpha, T).f - V1 / 4;

/** The condensed minimum of f: golden section on [J/2, 1/(2c)] (sigma^x <= 1 bounds alpha by 1/(2c)). */
function condensed(c: number, T = 0): { alpha: number; f: number } {
  let a = J / 2, b = 1 / (2 * c);
  const r = (Math.sqrt(5) - 1) / 2;
  for (let it = 0; it < 80; it++) {
    const x1 = b - r * (b - a), x2 = a + r * (b - a);
    if (f(c, x1, T) < f(c, x2, T)) b = x2; else a = x1;
  }
  const alpha = 0.5 * (a + b);
  return { alpha, f: f(c, alpha, T) };
}

/** c_c: where the condensed minimum reaches f(0) = -J - V1/4, by bisection. */
function transition(): number {
  let lo = 1, hi = 1.5; // condensed below, crystal above (checked)
  const wins = (c: number) => condensed(c).f < f(c, 0);
  expect(wins(lo)).toBe(true);
  expect(wins(hi)).toBe(false);
  while (hi - lo > 1e-9) { const m = 0.5 * (lo + hi); if (wins(m)) lo = m; else hi = m; }
  return 0.5 * (lo + hi);
}

const meanField = (c: number) => solveGroundState({ lattice: 'chain', interaction: { shape: 'nn', V1 }, mu, delta: mu + c, T: 0, maxCell: 2 });
const ring = { kind: 'periodic' as const, lattice: 'chain' as const, size: [16], interaction: { shape: 'nn' as const, V1 } };
const T = 1 / 16;

describe(`self-consistent cavity on the nn chain at mu = V1, exact from free fermions (${SOURCES.pfeutyFreeEnergy})`, () => {
  const cc = transition();
  const jump = condensed(cc).alpha;

  it('exact (N -> infinity, T = 0): the crystal gives way at c_c = 1.1953/V1, first order, alpha jumps by 0.363 V1', () => {
    // Computed here; the numbers in the title are its output (to the digits shown).
    expectAbs(cc, 1.1953, 1e-4);
    expectAbs(jump, 0.3632, 1e-4);
    // First order: at c_c alpha = 0 is still a strict local minimum (c_c > 1/V1) ...
    expect(cc).toBeGreaterThan(1 / V1 + 0.1);
    for (const a of [1e-3, 1e-2, 0.05]) expect(f(cc, a)).toBeGreaterThan(f(cc, 0));
    // ... and the condensed minimum is stationary: 2 c alpha = <sigma^x> (1e-6: golden section to 1e-9 in alpha).
    expectAbs(2 * cc * jump, transverseIsingChain(J, jump, 0).sigmaX, 1e-6);
    // Between the two, f rises above both minima (a barrier, not a single valley).
    expect(f(cc, jump / 2)).toBeGreaterThan(f(cc, 0) + 1e-3);
  });

  it('mean-field puts the transition at c = 1/V1 (not 1.1953/V1), with alpha jumping to V1/2', () => {
    const below = meanField(1 / V1 - 0.01), above = meanField(1 / V1 + 0.01);
    // Derived in the header: alpha = 1/(2c) in the mean-field condensate (1e-6: solver tolerance).
    expectAbs(below.alpha, 1 / (2 * (1 / V1 - 0.01)), 1e-6);
    expect(above.alpha).toBe(0);
    expect(above.phase).toBe('density-wave');
    // Between 1/V1 and c_c mean-field keeps the crystal where the exact answer is condensed.
    expect(meanField(1.05).alpha).toBe(0);
    expect(condensed(1.05).f).toBeLessThan(f(1.05, 0) - 0.01);
  });

  it(`Monte Carlo, condensed side c = c_c - 0.15: alpha at the exact value (ring of 16, T = ${T})`, () => {
    const c = 1.05;
    const exact = condensed(c, T).alpha;
    const r = quantumMonteCarlo({ cluster: ring, mu, delta: mu + c, temperature: T, sweeps: 2000, seed: 1 });
    const extra = gridAllowance(r.alphaScan!.map((p) => p.alpha), c, (a) => transverseIsingChain(J, a, T).sigmaX, exact);
    expectWithinSigmas(r.alpha, exact, `alpha (exact ${exact}, mean-field 0)`, { extra, maxError: 0.01 });
    expect(r.phase).toBe('superradiant');
  });

  it(`Monte Carlo, crystal side c = c_c + 0.15: alpha = 0 (ring of 16, T = ${T})`, () => {
    const c = 1.35;
    // The condensed local minimum lies 0.005 above the crystal (computed: a margin of
    // about 40 times the error of f(alpha) - f(0) in such a run).
    expect(condensed(c, T).f).toBeGreaterThan(f(c, 0, T) + 0.004);
    const r = quantumMonteCarlo({ cluster: ring, mu, delta: mu + c, temperature: T, sweeps: 2000, seed: 1 });
    expectWithinSigmas(r.alpha, 0, 'alpha (exact 0)');
    expect(['superradiant', 'supersolid']).not.toContain(r.phase);
  });

  // Longer variant (QMC_LONG=1, about 50 s): the crystal side over several seeds. Near
  // alpha = 0 the refined grid resolves f(alpha) - f(0) ~ 0.35 alpha^2 below its noise, and a
  // noise minimum can be taken as the global one with an error bar that excludes 0: with
  // the core of d29b88c seed 4 gave alpha = 0.0057 +- 0.0009 here (seed 11 at 1000 sweeps
  // 0.022 +- 0.002); with a04a594 seeds 1 to 6 pass, but the same mechanism fails the
  // normal side of no-interaction.test.ts (reported).
  it.skipIf(!process.env.QMC_LONG)('crystal side, seeds 1 to 6: alpha = 0 within 4 sigma for every seed', () => {
    for (let seed = 1; seed <= 6; seed++) {
      const r = quantumMonteCarlo({ cluster: ring, mu, delta: mu + 1.35, temperature: T, sweeps: 2000, seed });
      expectWithinSigmas(r.alpha, 0, `alpha (exact 0), seed ${seed}`);
    }
  });
});

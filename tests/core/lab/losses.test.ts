import { describe, it, expect } from 'vitest';
import {
  SMALL_LOSS_RATIO, cooperativity, lossBudget, polaritonScales, strongCoupling, validateLosses,
} from '../../../src/core/lab/losses.ts';
import { InputError } from '../../../src/core/input-error.ts';
import { expectRel } from '../../references.ts';

// Every expected value below is a closed form worked out by hand in the comment beside it;
// the arithmetic is a few roundings, so 1e-12 relative.
const TOL = 1e-12;

describe('losses: cooperativity', () => {
  it('C1 = 4 g0^2 / (kappa gamma) with full widths', () => {
    // g0 = 0.5, kappa = 0.2, gamma = 6: 4 * 0.25 / 1.2 = 5/6.
    expectRel(cooperativity(0.5, 0.2, 6), 5 / 6, TOL);
    // g0 = 2, kappa = 1, gamma = 4: 16 / 4 = 4.
    expectRel(cooperativity(2, 1, 4), 4, TOL);
  });

  it('collective C = N C1 through g = g0 sqrt(N)', () => {
    // N = 200, g0 = 0.5: g^2 = 50, C = 200 / (0.2 * 6) = 500/3 = 200 * 5/6.
    const b = lossBudget({
      losses: { kappaMHz: 0.2, gammaMHz: 6, gammaPhiMHz: 0 }, gMHz: 0.5 * Math.sqrt(200), g0MHz: 0.5,
      detuningMHz: 21, muMHz: 7, marginMHz: null,
    });
    expectRel(b.c1!, 5 / 6, TOL);
    expectRel(b.c, 500 / 3, TOL);
    expectRel(b.c, 200 * b.c1!, TOL);
  });

  it('dephasing widens the emitter line: C1 with gamma + gammaPhi', () => {
    // g0 = 1, kappa = 2, gamma = 1, gammaPhi = 3: C1 = 4/2 = 2, with dephasing 4/(2*4) = 1/2.
    const b = lossBudget({
      losses: { kappaMHz: 2, gammaMHz: 1, gammaPhiMHz: 3 }, gMHz: 10, g0MHz: 1, detuningMHz: 0, muMHz: -50,
    });
    expectRel(b.c1!, 2, TOL);
    expectRel(b.c1Dephased!, 0.5, TOL);
    expectRel(b.gammaTotMHz, 4, TOL);
    // C = 4 * 100 / 2 = 200, with dephasing 400 / 8 = 50.
    expectRel(b.c, 200, TOL);
    expectRel(b.cDephased, 50, TOL);
  });

  it('no C1 when only the collective splitting is known', () => {
    const b = lossBudget({ losses: { kappaMHz: 1, gammaMHz: 1, gammaPhiMHz: 0 }, gMHz: 5, detuningMHz: 0, muMHz: -10 });
    expect(b.c1).toBeNull();
    expect(b.c1Dephased).toBeNull();
    expectRel(b.c, 100, TOL); // 4 * 25 / 1
  });
});

describe('losses: strong coupling', () => {
  it('2g against the polariton full width (kappa + gammaTot)/2', () => {
    // g = 1, kappa = 3, gammaTot = 0.5: width 1.75 < 2 -> strong; |3 - 0.5|/4 = 0.625 < 1 -> split.
    const s = strongCoupling(1, 3, 0.5);
    expectRel(s.splittingMHz, 2, TOL);
    expectRel(s.polaritonWidthMHz, 1.75, TOL);
    expect(s.strong).toBe(true);
    expect(s.split).toBe(true);
    // g = 1, kappa = 4, gammaTot = 1: width 2.5 > 2 -> not strong; 3/4 < 1 -> split but unresolved.
    const w = strongCoupling(1, 4, 1);
    expect(w.strong).toBe(false);
    expect(w.split).toBe(true);
    // g = 1, kappa = 6, gammaTot = 1: 5/4 > 1 -> not even split.
    expect(strongCoupling(1, 6, 1).split).toBe(false);
  });

  it('the criterion uses the dephased emitter width', () => {
    // g = 1, kappa = 1, gamma = 1: width 1 < 2; with gammaPhi = 3: width (1 + 4)/2 = 2.5 > 2.
    const base = { gMHz: 1, g0MHz: 1, detuningMHz: 0, muMHz: -5 };
    expect(lossBudget({ ...base, losses: { kappaMHz: 1, gammaMHz: 1, gammaPhiMHz: 0 } }).strong.strong).toBe(true);
    expect(lossBudget({ ...base, losses: { kappaMHz: 1, gammaMHz: 1, gammaPhiMHz: 3 } }).strong.strong).toBe(false);
  });
});

describe('losses: polariton scales', () => {
  it('E_LP = Delta/2 - sqrt(Delta^2/4 + g^2), gap sqrt(Delta^2 + 4 g^2)', () => {
    // Delta = 6, g = 4: sqrt(9 + 16) = 5, E_LP = 3 - 5 = -2, gap 10; mu = -7: |-7 + 2| = 5.
    const p = polaritonScales(4, 6, -7);
    expectRel(p.lowerPolaritonMHz, -2, TOL);
    expectRel(p.polaritonGapMHz, 10, TOL);
    expectRel(p.pumpToLowerPolaritonMHz, 5, TOL);
    // resonance Delta = 0, g = 3: E_LP = -3, gap 6 = 2g.
    const r = polaritonScales(3, 0, 0);
    expectRel(r.lowerPolaritonMHz, -3, TOL);
    expectRel(r.polaritonGapMHz, 6, TOL);
  });
});

describe('losses: the quasi-equilibrium check', () => {
  // Delta = 6, g = 4 (gap 10, E_LP = -2), mu = -7 (5 from E_LP).
  const base = { gMHz: 4, detuningMHz: 6, muMHz: -7 };

  it('applies when the largest loss is small against the smallest gap', () => {
    // kappa = 0.1, gammaTot = 0.2 + 0.1 = 0.3: max 0.3; margin 4 -> smallest gap 4 (margin); 0.3/4 = 0.075 < 0.1.
    const b = lossBudget({ ...base, losses: { kappaMHz: 0.1, gammaMHz: 0.2, gammaPhiMHz: 0.1 }, marginMHz: 4 });
    expectRel(b.maxLossMHz, 0.3, TOL);
    expect(b.smallestGapName).toBe('phase margin');
    expectRel(b.smallestGapMHz, 4, TOL);
    expectRel(b.lossOverGap, 0.075, TOL);
    expect(b.verdict).toBe('applies');
  });

  it('marginal between the small ratio and 1; does not apply at or above 1', () => {
    // kappa = 1: no margin given -> smallest gap is |mu - E_LP| = 5; 1/5 = 0.2.
    const m = lossBudget({ ...base, losses: { kappaMHz: 1, gammaMHz: 0.5, gammaPhiMHz: 0 } });
    expect(m.marginMHz).toBeNull();
    expect(m.smallestGapName).toBe('pump to lower polariton');
    expectRel(m.lossOverGap, 0.2, TOL);
    expect(0.2).toBeGreaterThan(SMALL_LOSS_RATIO);
    expect(m.verdict).toBe('marginal');
    // kappa = 1 against a margin of 0.5: 2 -> does not apply (the coupling is still strong: (1 + 0.5)/2 < 8).
    const d = lossBudget({ ...base, losses: { kappaMHz: 1, gammaMHz: 0.5, gammaPhiMHz: 0 }, marginMHz: 0.5 });
    expect(d.strong.strong).toBe(true);
    expectRel(d.lossOverGap, 2, TOL);
    expect(d.verdict).toBe('does not apply');
  });

  it('does not apply without strong coupling, however small the ratio', () => {
    // g = 0.01, kappa = gamma = 0.1: width 0.1 > 0.02. Delta = 1000, mu = -1000: gaps are huge.
    const b = lossBudget({
      losses: { kappaMHz: 0.1, gammaMHz: 0.1, gammaPhiMHz: 0 }, gMHz: 0.01, detuningMHz: 1000, muMHz: -1000, marginMHz: 1000,
    });
    expect(b.lossOverGap).toBeLessThan(SMALL_LOSS_RATIO);
    expect(b.verdict).toBe('does not apply');
  });

  it('refuses bad widths with the field named', () => {
    const ok = { kappaMHz: 1, gammaMHz: 1, gammaPhiMHz: 0 };
    const field = (l: typeof ok) => { try { validateLosses(l); return null; } catch (e) { expect(e).toBeInstanceOf(InputError); return (e as InputError & { field?: string }).field; } };
    expect(field(ok)).toBeNull();
    expect(field({ ...ok, kappaMHz: 0 })).toBe('kappa');
    expect(field({ ...ok, gammaMHz: -1 })).toBe('gamma');
    expect(field({ ...ok, gammaPhiMHz: -0.1 })).toBe('dephasing');
    expect(field({ ...ok, kappaMHz: NaN })).toBe('kappa');
  });
});

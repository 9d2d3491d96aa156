// The correlated check's verdict on VMC (src/ui/views/qmc-reference.ts) and the QMC number
// formatting (qmc-numbers.ts): pure helpers, checked on constructed inputs whose answer is
// known by construction.
import { describe, it, expect } from 'vitest';
import { SIGMAS, traceVerdict, vmcWarnings } from '../../../src/ui/views/qmc-reference.ts';
import { plusMinus } from '../../../src/ui/views/qmc-numbers.ts';
import type { VmcResult } from '../../../src/core/vmc/vmc-result.ts';

/** A trace of n steps: e(step) = f(step) with a deterministic +-noise alternation. */
function trace(n: number, f: (s: number) => number, noise = 1e-3) {
  return Array.from({ length: n }, (_, s) => ({ step: s + 1, energyPerSite: f(s) + (s % 2 ? noise : -noise), error: noise, alpha: 0, acceptance: 0.5 }));
}

function vmc(e: number, err: number, t = trace(60, () => e)): VmcResult {
  return { energyPerSite: { value: e, error: err }, trace: t } as unknown as VmcResult;
}

describe('traceVerdict', () => {
  it('a flat noisy trace is converged', () => {
    const v = traceVerdict(trace(60, () => -0.5));
    expect(v.converged).toBe(true);
    expect(v.window).toBe(12);
    expect(Math.abs(v.change)).toBeLessThan(1e-12); // the alternation cancels over an even window
  });

  it('a trace still falling by 1e-3 a step (noise 1e-3) is not', () => {
    // the last 12 steps lie 12e-3 below the 12 before: many sigmas of the window scatter
    const v = traceVerdict(trace(60, (s) => -0.5 - 1e-3 * s));
    expect(v.converged).toBe(false);
    expect(v.change).toBeCloseTo(-12e-3, 12);
    expect(v.sigmas).toBeGreaterThan(SIGMAS);
  });

  it('fewer than 10 steps cannot be judged', () => {
    expect(traceVerdict(trace(9, () => 0)).converged).toBeNull();
  });
});

describe('vmcWarnings', () => {
  it('warns when VMC is above ED beyond 3 sigma, not within it', () => {
    expect(vmcWarnings(vmc(-0.49, 1e-3), { ed: -0.5 }).join(' ')).toMatch(/above the exact ED energy/);
    expect(vmcWarnings(vmc(-0.4975, 1e-3), { ed: -0.5 })).toEqual([]); // 2.5 sigma above: within the errors
    expect(vmcWarnings(vmc(-0.51, 1e-3), { ed: -0.5 })).toEqual([]); // below: no warning here
  });

  it('holds VMC against QMC with the combined error', () => {
    // difference 5e-3, combined error hypot(1e-3, 1e-3) = 1.41e-3: 3.5 sigma
    expect(vmcWarnings(vmc(-0.495, 1e-3), { qmc: { value: -0.5, error: 1e-3 } }).join(' ')).toMatch(/trust QMC/);
    // difference 4e-3: 2.8 sigma
    expect(vmcWarnings(vmc(-0.496, 1e-3), { qmc: { value: -0.5, error: 1e-3 } })).toEqual([]);
  });

  it('warns above mean field and on a drifting trace', () => {
    const w = vmcWarnings(vmc(-0.3, 1e-3, trace(60, (s) => -0.2 - 1e-3 * s)), { meanField: -0.4 });
    expect(w.length).toBe(2);
    expect(w[0]).toMatch(/mean-field/);
    expect(w[1]).toMatch(/not converged/);
  });
});

describe('plusMinus', () => {
  it('rounds the value to the second significant digit of its error', () => {
    expect(plusMinus(0.398437, 0.005612)).toBe('0.3984 \u00b1 0.0056');
    expect(plusMinus(-12.34567, 0.21)).toBe('-12.35 \u00b1 0.21');
    expect(plusMinus(0.5, 0)).toBe('0.5 \u00b1 0');
    expect(plusMinus(-0.297762064572, 6.3e-17)).toBe('-0.297762 \u00b1 0'); // rounding-level error of a frozen chain
  });
});

// Scan axes: parsing of start:stop:count and name=start:stop:count, the evenly spaced
// values, and how an axis value lands in ModelParams. Checks are exact arithmetic
// (common practice, no source): linspace endpoints must be the given numbers exactly.
import { describe, expect, it } from 'vitest';
import { applyAxis, parseAxis, parseRange, rangeValues } from '../../../src/core/scan/axes.ts';
import { InputError } from '../../../src/core/input-error.ts';
import type { ModelParams } from '../../../src/core/model.ts';

const base: ModelParams = { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 3, mu: 0.5, T: 0, maxCell: 12 };

describe('ranges', () => {
  it('parses start:stop:count and includes both ends exactly', () => {
    const r = parseRange('-1:2:7', 'mu');
    expect(r).toEqual({ start: -1, stop: 2, count: 7 });
    const v = rangeValues(r);
    expect(v.length).toBe(7);
    expect(v[0]).toBe(-1);
    expect(v[6]).toBe(2);
    // equal steps of (stop - start)/(count - 1) = 0.5, to rounding (1e-15: a few ulps of 2)
    for (let i = 1; i < 7; i++) expect(Math.abs(v[i] - v[i - 1] - 0.5)).toBeLessThan(1e-15);
  });

  it('count 1 is the start alone; a descending range runs downwards', () => {
    expect(rangeValues(parseRange('0.3:9:1', 'mu'))).toEqual([0.3]);
    expect(rangeValues(parseRange('1:0:3', 'mu'))).toEqual([1, 0.5, 0]);
  });

  it.each([
    ['1:2', /start:stop:count/],
    ['1:2:0', /empty range/],
    ['1:2:-3', /whole number/],
    ['1:2:2.5', /whole number/],
    ['a:2:3', /start must be a finite number/],
    ['1:NaN:3', /stop must be a finite number/],
    ['1::3', /stop must be a finite number/],
    ['0:1:100000', /above the limit/],
  ])('refuses %s', (text, msg) => {
    expect(() => parseRange(text, 'mu')).toThrow(InputError);
    expect(() => parseRange(text, 'mu')).toThrow(msg);
  });
});

describe('axes', () => {
  it('parses name=range for each axis name', () => {
    for (const name of ['rb', 'v1', 'mu', 'density', 'detuning', 'temperature']) {
      const a = parseAxis(`${name}=0:1:3`, 'x');
      expect(a.name).toBe(name);
      expect(a.values).toEqual([0, 0.5, 1]);
    }
  });

  it('refuses unknown names and missing =', () => {
    expect(() => parseAxis('alpha=0:1:3', 'x')).toThrow(/unknown axis 'alpha'/);
    expect(() => parseAxis('0:1:3', 'y')).toThrow(/--y must be name=start:stop:count/);
  });

  it('applies values to a copy of the model, keeping the exclusive pairs exclusive', () => {
    const rb = applyAxis({ ...base, interaction: { shape: 'vdw', V1: 3 } }, 'rb', 2);
    expect(rb.interaction).toEqual({ shape: 'vdw', Rb: 2 });
    const rho = applyAxis(base, 'density', 0.25);
    expect(rho.rho).toBe(0.25);
    expect(rho.mu).toBeUndefined();
    const mu = applyAxis(rho, 'mu', -1);
    expect(mu.mu).toBe(-1);
    expect('rho' in mu).toBe(false);
    expect(applyAxis(base, 'detuning', 5).delta).toBe(5);
    expect(applyAxis(base, 'temperature', 0.1).T).toBe(0.1);
    expect(base).toEqual({ lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 3, mu: 0.5, T: 0, maxCell: 12 });
  });

  it('refuses an rb axis on shapes without a blockade radius', () => {
    const nn: ModelParams = { ...base, interaction: { shape: 'nn', V1: 1 } };
    expect(() => applyAxis(nn, 'rb', 1)).toThrow(/rb axis needs the vdw or dipolar/);
    expect(applyAxis(nn, 'v1', 2).interaction.V1).toBe(2);
  });
});

// Scan axes: parsing of start..stop xN (and the old start:stop:count, read with a note),
// the evenly spaced values, and how an axis value lands in ModelParams. Checks are exact
// arithmetic (common practice, no source): linspace endpoints must be the given numbers exactly.
import { describe, expect, it } from 'vitest';
import { applyAxis, cliRange, formatRange, parseAxis, parseRange, rangeNote, rangeValues } from '../../../src/core/scan/axes.ts';
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

  it('one point needs start = stop; a descending range runs downwards', () => {
    expect(rangeValues(parseRange('0.3..0.3 x1', 'mu'))).toEqual([0.3]);
    expect(rangeValues(parseRange('0.3:0.3:1', 'mu'))).toEqual([0.3]);
    expect(rangeValues(parseRange('1..0 x3', 'mu'))).toEqual([1, 0.5, 0]);
    expect(rangeValues(parseRange('1:0:3', 'mu'))).toEqual([1, 0.5, 0]);
  });

  it.each([
    ['-1..2 x7'], ['-1..2x7'], [' -1 .. 2  x 7 '], ['\u22121..2 \u00d77'], ['-1:2:7'], ['-1 : 2 : 7'],
  ])('%s is the same range as -1:2:7 (both forms, spacing and typographic minus free)', (text) => {
    expect(parseRange(text, 'mu')).toEqual({ start: -1, stop: 2, count: 7 });
  });

  it('both forms give the same axis, value for value', () => {
    const a = parseAxis('mu=-1..3.9 x200', 'x'), b = parseAxis('mu=-1:3.9:200', 'x');
    expect(a).toEqual(b);
    expect(a.values[199]).toBe(3.9);
    expect(formatRange({ start: 0.8, stop: 2.4, count: 40 })).toBe('0.8..2.4x40');
    expect(formatRange({ start: 0.8, stop: 2.4, count: 40 }, true)).toBe('0.8..2.4 x40');
    expect(parseAxis(`rb=${formatRange({ start: 0.8, stop: 2.4, count: 40 }, true)}`, 'y')).toEqual(parseAxis('rb=0.8:2.4:40', 'y'));
  });

  it('writes a range as one command-line argument whichever form it was typed in', () => {
    expect(cliRange('mu=-1..2.9 x64')).toBe('mu=-1..2.9x64');
    expect(cliRange('mu=-1:2.9:64')).toBe('mu=-1..2.9x64');
    expect(cliRange('-0.5 .. 2.5 x 400')).toBe('-0.5..2.5x400');
    expect(cliRange('mu=oops')).toBe('mu=oops');
  });

  it('notes the old form with the range in the new form, and nothing for the new form', () => {
    expect(rangeNote('mu=-1:2.9:64')).toBe("'mu=-1:2.9:64' is the old start:stop:count form, read as mu=-1..2.9x64 (64 points from -1 to 2.9); please write it that way.");
    expect(rangeNote('-1..2.9 x64')).toBeNull();
    expect(rangeNote('mu=-1..2.9x64')).toBeNull();
    expect(rangeNote('1:2:0')).toBeNull(); // refused: its error speaks, not the note
    // numbers that also read as start:step:stop get that reading spelled out: 0 to 2 in steps of 0.5 is 5 points
    expect(rangeNote('0:0.5:2')).toMatch(/read as 0\.\.0\.5x2 .*If 0\.5 was meant as a step from 0 to 2, write 0\.\.2x5\./);
  });

  it.each([
    // start:step:stop typed into start:stop:count: 0 to 1 in steps of 0.1 is 11 points
    ['0:0.1:1', /reads as start 0, stop 0\.1 and 1 point .*the middle number .* is the stop, not a step.*If 0\.1 was meant as a step from 0 to 1, write 0\.\.1x11\./],
    // start:stop:step: the count is not whole, the step reading is offered
    ['0:1:0.1', /count must be a whole number of points \(the last number of start:stop:count\), got '0\.1'\. If 0\.1 was meant as a step from 0 to 1, write 0\.\.1x11\./],
    ['-2:0.25:1', /If 0\.25 was meant as a step from -2 to 1, write -2\.\.1x13\./],
  ])('a count/step mix-up %s says what was probably meant', (text, msg) => {
    expect(() => parseRange(text, 'mu')).toThrow(InputError);
    expect(() => parseRange(text, 'mu')).toThrow(msg);
  });

  it.each([
    ['1..2', /needs its number of points: start\.\.stop xN, e\.g\. -1\.\.3\.9x200/],
    ['1 to 2, 5 points', /must be start\.\.stop xN \(N points from start to stop, both ends included/],
    ['1..2 x2.5', /number of points N must be a whole number, got '2\.5'/],
    ['1..2 x0', /empty range/],
    ['0..1 x1', /one point needs start = stop \(0\.\.0x1\)/],
    ['0x10..1 x3', /start must be a finite number, got '0x10'/],
    ['1..inf x3', /stop must be a finite number/],
    ['1:2', /start\.\.stop xN/],
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
    expect(() => parseAxis('0:1:3', 'y')).toThrow(/--y must be name=start\.\.stop xN/);
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

/**
 * k* as a multiple of pi (issue 11, item 19): the closed forms k = p pi / q against
 * Math.PI, and values that are no such multiple kept as decimals.
 */
import { describe, it, expect } from 'vitest';
import { kText, piMultiple } from '../../../src/ui/model/pi-multiple.ts';

describe('piMultiple', () => {
  it('names the commensurate wavevectors of small cells', () => {
    expect(piMultiple(Math.PI)).toBe('\u03c0');
    expect(piMultiple((2 * Math.PI) / 3)).toBe('2\u03c0/3');
    expect(piMultiple(Math.PI / 2)).toBe('\u03c0/2');
    expect(piMultiple(-Math.PI / 3)).toBe('\u2212\u03c0/3');
    expect(piMultiple((5 * Math.PI) / 12)).toBe('5\u03c0/12');
    // 4 pi / 6 reduces to 2 pi / 3 (the smallest denominator is tried first)
    expect(piMultiple((4 * Math.PI) / 6)).toBe('2\u03c0/3');
    expect(piMultiple(0)).toBe('0');
  });

  it('takes a refined k within 1e-6 and refuses one 1e-5 away or no multiple', () => {
    // the compass search stops at 1e-7 in zone fractions: ~6e-7 in k at most
    expect(piMultiple((2 * Math.PI) / 3 + 5e-7)).toBe('2\u03c0/3');
    expect(piMultiple((2 * Math.PI) / 3 + 1e-5)).toBeNull();
    // 1 rad is no multiple p pi / q with q <= 12 (pi is irrational; nearest 4pi/13 is past q = 12)
    expect(piMultiple(1)).toBeNull();
    // pi / 13 needs a denominator above 12
    expect(piMultiple(Math.PI / 13)).toBeNull();
  });

  it('prints k* with its decimal in 1D and per component in 2D', () => {
    expect(kText((2 * Math.PI) / 3)).toBe('2\u03c0/3 (2.0944)');
    expect(kText(1.234567)).toBe('1.2346');
    expect(kText([Math.PI, 0])).toBe('(\u03c0, 0)');
    expect(kText([(4 * Math.PI) / 3, 0.3])).toBe('(4\u03c0/3, 0.3)');
  });
});

/**
 * Which lattice an array is cut from (common practice, no source: a site set is a patch of a
 * Bravais lattice when every site is an integer combination of its primitive vectors).
 */
import { describe, expect, it } from 'vitest';
import { arrayLattice } from '../../../src/core/cluster/array-lattice.ts';

const S3 = Math.sqrt(3);

describe('the lattice of a user array', () => {
  it('a row of unit-spaced sites is a chain; the model lattice wins when it fits too', () => {
    expect(arrayLattice([0, 0, 1, 0, 3, 0])).toBe('chain');
    expect(arrayLattice([0, 0, 1, 0, 3, 0], 'square')).toBe('square');
  });
  it('a 2 x 2 block is square, not a chain, and not triangular', () => {
    const block = [0, 0, 1, 0, 0, 1, 1, 1];
    expect(arrayLattice(block)).toBe('square');
    expect(arrayLattice(block, 'chain')).toBe('square');
    expect(arrayLattice(block, 'triangular')).toBe('square');
  });
  it('a triangle of unit side is triangular', () => {
    expect(arrayLattice([0, 0, 1, 0, 0.5, S3 / 2, 1.5, S3 / 2])).toBe('triangular');
  });
  it('a ring of sites is no lattice', () => {
    const ring = Array.from({ length: 6 }, (_, k) => [Math.cos((2 * Math.PI * k) / 6) * 1.3, Math.sin((2 * Math.PI * k) / 6) * 1.3]).flat();
    expect(arrayLattice(ring)).toBeNull();
  });
});

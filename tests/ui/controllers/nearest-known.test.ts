// The map's preview paint (src/ui/controllers/map-scan.ts nearestKnown): every cell gets a
// known cell at the least number of grid steps |dx| + |dy| from it. Checked against the
// definition by brute force over every known cell (exact integers: equality).
import { describe, expect, it } from 'vitest';
import seedrandom from 'seedrandom';
import { nearestKnown } from '../../../src/ui/controllers/map-scan.ts';

describe('nearest known cell', () => {
  it.each([[13, 7, 5], [40, 25, 30], [1, 9, 2], [17, 1, 3], [8, 8, 64]])('%i x %i grid, %i known cells', (nx, ny, k) => {
    const rng = seedrandom(`nearest ${nx} ${ny} ${k}`);
    const known = new Set<number>();
    while (known.size < k) known.add(Math.floor(rng() * nx * ny));
    const from = nearestKnown(nx, ny, (i) => known.has(i));
    const dist = (a: number, b: number) => Math.abs((a % nx) - (b % nx)) + Math.abs(Math.floor(a / nx) - Math.floor(b / nx));
    for (let i = 0; i < nx * ny; i++) {
      expect(known.has(from[i])).toBe(true);
      expect(dist(i, from[i])).toBe(Math.min(...[...known].map((j) => dist(i, j))));
    }
  });

  it('nothing known: -1 everywhere', () => {
    expect([...nearestKnown(4, 3, () => false)]).toEqual(new Array(12).fill(-1));
  });
});

// The seeded uniforms of the mean-field search's random starts against the seedrandom
// package (a general-purpose reference library from the registry, whose default generator
// they reproduce): every draw equal bit for bit, over seeds of the forms the search uses
// and others (empty, long, non-ASCII).
import { describe, expect, it } from 'vitest';
import seedrandom from 'seedrandom';
import { arc4Uniforms } from '../../../src/core/numerics/arc4-uniforms.ts';

describe('ARC4 uniforms', () => {
  it('equal seedrandom(seed)() draw for draw', () => {
    const seeds = ['', '1|2,0,1|0', '3735928559|12,0,1|0', '7|4,2,3|1', 'x'.repeat(300), 'é∂ƒ漢字', '0'];
    for (let s = 0; s < 200; s++) seeds.push(`${(s * 2654435761) >>> 0}|${1 + (s % 12)},${s % 5},${1 + (s % 3)}|${s % 2}`);
    for (const seed of seeds) {
      const ref = seedrandom(seed);
      const mine = arc4Uniforms(seed, new Float64Array(40));
      for (let i = 0; i < mine.length; i++) expect(mine[i]).toBe(ref());
    }
  });
});

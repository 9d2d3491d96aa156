// Merging shard outputs: the merged rows equal the unsharded scan in point order, and
// every defect (missing, repeated, incomplete, foreign part) is refused with its name.
// Invariant checks (common practice, no source).
import { describe, expect, it } from 'vitest';
import { mergeShards, type ShardPart } from '../../../src/core/scan/merge.ts';
import { shardIndices } from '../../../src/core/scan/shards.ts';
import { InputError } from '../../../src/core/input-error.ts';

const nx = 40, ny = 3, n = 4;

function parts(): ShardPart<string>[] {
  return Array.from({ length: n }, (_, j) => ({
    source: `part-${j + 1}.csv`,
    meta: { k: j + 1, n, scan: 'cafe0001', nx, ny },
    rows: shardIndices(nx, ny, { k: j + 1, n }).map((index) => ({ index, row: `row ${index}` })),
  }));
}

describe('merge', () => {
  it('joins all parts, in any order, into the full scan in point order', () => {
    const ps = parts().reverse();
    const rows = mergeShards(ps);
    expect(rows).toEqual(Array.from({ length: nx * ny }, (_, i) => `row ${i}`));
  });

  it('names a missing part', () => {
    const ps = parts().filter((p) => p.meta.k !== 3);
    expect(() => mergeShards(ps)).toThrow(InputError);
    expect(() => mergeShards(ps)).toThrow('shard 3/4 is missing');
    expect(() => mergeShards(ps.slice(0, 1))).toThrow('3 shards are missing: 2/4, 3/4, 4/4');
  });

  it('refuses a part given twice, an incomplete part and a part of another scan', () => {
    const twice = [...parts(), parts()[1]];
    expect(() => mergeShards(twice)).toThrow(/shard 2\/4 is given twice/);
    const cut = parts();
    cut[0].rows.pop();
    expect(() => mergeShards(cut)).toThrow(/shard 1\/4 \(part-1.csv\) is incomplete/);
    const foreign = parts();
    foreign[2].meta = { ...foreign[2].meta, scan: 'beef0002' };
    expect(() => mergeShards(foreign)).toThrow(/part-3.csv belongs to a different scan/);
    const other = parts();
    other[1].meta = { ...other[1].meta, n: 5 };
    expect(() => mergeShards(other)).toThrow(/5-part scan/);
    const stray = parts();
    stray[0].rows[0] = { index: stray[1].rows[0].index, row: 'x' };
    expect(() => mergeShards(stray)).toThrow(/not part of shard 1\/4/);
    expect(() => mergeShards([])).toThrow(/needs the output files/);
  });
});

// Segments and shards: every grid point is computed by exactly one segment of exactly one
// shard, segments are contiguous runs along x, and the cut depends on nx alone.
// Invariant checks (common practice, no source).
import { describe, expect, it } from 'vitest';
import { rowCuts, segments, pointSeed, SEGMENT_TARGET, checkAxes } from '../../../src/core/scan/grid.ts';
import { parseShard, scanFingerprint, shardIndices, shardSegments } from '../../../src/core/scan/shards.ts';
import { parseAxis } from '../../../src/core/scan/axes.ts';
import type { ScanPlan } from '../../../src/core/scan/grid.ts';

describe('segments', () => {
  it.each([1, 2, 15, 16, 17, 31, 200, 1001])('cut a row of %i points into near-equal runs of at most the target', (nx) => {
    const cuts = rowCuts(nx);
    expect(cuts.reduce((a, b) => a + b, 0)).toBe(nx);
    expect(Math.max(...cuts)).toBeLessThanOrEqual(SEGMENT_TARGET);
    expect(Math.max(...cuts) - Math.min(...cuts)).toBeLessThanOrEqual(1);
  });

  it('tile the grid row by row without gaps', () => {
    const nx = 37, ny = 5;
    const covered = new Array(nx * ny).fill(0);
    let expectIx0 = 0, lastIy = 0;
    for (const s of segments(nx, ny)) {
      if (s.iy !== lastIy) [expectIx0, lastIy] = [0, s.iy];
      expect(s.ix0).toBe(expectIx0);
      expectIx0 += s.length;
      for (let i = 0; i < s.length; i++) covered[s.iy * nx + s.ix0 + i]++;
    }
    expect(covered.every((c) => c === 1)).toBe(true);
  });
});

describe('shards', () => {
  it.each([
    [200, 200, 7], [10, 1, 3], [5, 3, 1], [16, 1, 4], [3, 2, 50], [400, 13, 16],
  ])('a %i x %i grid in %i parts: every point exactly once', (nx, ny, n) => {
    const count = new Uint8Array(nx * ny);
    for (let k = 1; k <= n; k++) for (const i of shardIndices(nx, ny, { k, n })) count[i]++;
    expect(count.every((c) => c === 1)).toBe(true);
  });

  it('interleave segments so each part samples every region of the map', () => {
    const segs = shardSegments(200, 200, { k: 2, n: 8 });
    expect(segs.every((s) => s.id % 8 === 1)).toBe(true);
    const rows = new Set(segs.map((s) => s.iy));
    // 13 segments a row, 8 parts: part 2 has segments in nearly every row, top to bottom
    expect(Math.min(...rows)).toBe(0);
    expect(Math.max(...rows)).toBeGreaterThan(190);
  });

  it('parse k/n and refuse malformed ones', () => {
    expect(parseShard('3/8')).toEqual({ k: 3, n: 8 });
    expect(parseShard(' 1 / 1 ')).toEqual({ k: 1, n: 1 });
    for (const bad of ['0/4', '5/4', '1/0', '2', 'a/b', '1/2/3', '-1/4', '1.5/4']) {
      expect(() => parseShard(bad)).toThrow(/--shard/);
    }
  });

  it('fingerprint the scan: equal plans agree, any change differs', () => {
    const plan = (mu: string, rb = 1.5): ScanPlan => ({
      base: { lattice: 'chain', interaction: { shape: 'vdw', Rb: rb }, delta: 3, T: 0, maxCell: 12 },
      x: parseAxis(mu, 'x'), seed: 1,
    });
    expect(scanFingerprint(plan('mu=0:1:5'))).toBe(scanFingerprint(plan('mu=0:1:5')));
    expect(scanFingerprint(plan('mu=0:1:5'))).not.toBe(scanFingerprint(plan('mu=0:1:6')));
    expect(scanFingerprint(plan('mu=0:1:5'))).not.toBe(scanFingerprint(plan('mu=0:1:5', 1.6)));
  });
});

describe('plans', () => {
  it('point seeds are distinct for neighbouring points and fixed by the index', () => {
    const seeds = Array.from({ length: 1000 }, (_, i) => pointSeed(1, i));
    expect(new Set(seeds).size).toBe(1000);
    expect(pointSeed(1, 17)).toBe(seeds[17]);
    expect(pointSeed(2, 17)).not.toBe(seeds[17]);
  });

  it('two axes must set different parameters', () => {
    expect(() => checkAxes(parseAxis('mu=0:1:2', 'x'), parseAxis('density=0:1:2', 'y'))).toThrow(/both set the pump/);
    expect(() => checkAxes(parseAxis('rb=1:2:2', 'x'), parseAxis('v1=0:1:2', 'y'))).toThrow(/both set the strength/);
    expect(() => checkAxes(parseAxis('mu=0:1:2', 'x'), parseAxis('rb=1:2:2', 'y'))).not.toThrow();
  });
});

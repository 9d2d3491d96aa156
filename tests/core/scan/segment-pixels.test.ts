// A packed segment (what travels to a worker) unpacks to the pixels the scan builds from
// the full plan: parameters and seeds of each grid point, its crystal, cold outcome and
// region. Round-trip invariant (common practice, no source).
import { describe, expect, it } from 'vitest';
import { packSegment, unpackSegment } from '../../../src/core/scan/segment-pixels.ts';
import { gridPoint, pointSeed, type ScanPlan } from '../../../src/core/scan/grid.ts';
import { parseAxis } from '../../../src/core/scan/axes.ts';
import type { ColdPoint } from '../../../src/core/scan/certified-fill.ts';

const plan: ScanPlan = {
  base: { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 4, T: 0, maxCell: 6 },
  x: parseAxis('mu=-1..3.9 x37', 'x'), y: parseAxis('rb=1..2.5 x11', 'y'), seed: 17,
};

describe('packed segments', () => {
  it("unpack to gridPoint and pointSeed of the full plan, with each pixel's knowledge", () => {
    const half = { cell: { a: 2, b: 0, c: 1 }, n: [1, 0] }, third = { cell: { a: 3, b: 0, c: 1 }, n: [1, 0, 0] };
    const cold = { state: { phase: 'empty' }, searchCell: null } as unknown as ColdPoint;
    const region = { cell: { a: 1, b: 0, c: 1 }, M: 1 };
    const iy = 7, ix0 = 16, length = 16, nx = 37;
    const seg = packSegment(plan, iy, ix0, length, {
      crystal: (i) => (i % 3 === 0 ? half : i % 3 === 1 ? third : undefined),
      cold: (i) => (i === iy * nx + ix0 + 5 ? cold : undefined),
      inCell: (i) => (i === iy * nx + ix0 + 8 ? region : undefined),
    });
    // two crystals, sent once each
    expect(seg.crystals).toHaveLength(2);
    const px = unpackSegment(seg);
    expect(px).toHaveLength(length);
    for (let i = 0; i < length; i++) {
      const index = iy * nx + ix0 + i;
      expect(px[i].params).toEqual(gridPoint(plan, ix0 + i, iy));
      expect(px[i].seed).toBe(pointSeed(plan.seed, index));
      expect(px[i].crystal).toEqual(index % 3 === 0 ? half : index % 3 === 1 ? third : undefined);
    }
    expect(px[5].cold).toBe(cold);
    expect(px.filter((p) => p.cold)).toHaveLength(1);
    expect(px[8].inCell).toEqual(region);
    expect(px.filter((p) => p.inCell)).toHaveLength(1);
  });

  it('a one-axis plan packs and unpacks too', () => {
    const line: ScanPlan = { base: plan.base, x: parseAxis('mu=-1..3.9 x20', 'x'), seed: 2 };
    const px = unpackSegment(packSegment(line, 0, 4, 10, { crystal: () => undefined, cold: () => undefined, inCell: () => undefined }));
    expect(px.map((p) => p.params)).toEqual(Array.from({ length: 10 }, (_, i) => gridPoint(line, 4 + i, 0)));
  });
});

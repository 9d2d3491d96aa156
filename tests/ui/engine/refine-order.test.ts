/**
 * Coarse-to-fine order of a map: every grid point exactly once, the coarse level first and
 * spanning the whole plane, and each cell painted by a computed point before its own turn.
 * Invariants checked by enumeration (common practice, no source).
 */
import { describe, it, expect } from 'vitest';
import { coarsestStride, paintingIndex, refineRuns } from '../../../src/ui/engine/refine-order.ts';

describe('coarse-to-fine runs', () => {
  for (const [nx, ny] of [[64, 40], [7, 5], [1, 9], [128, 80]]) {
    it(`${nx} x ${ny}: each point once, runs along rows`, () => {
      const runs = refineRuns(nx, ny, 8);
      const seen = new Uint8Array(nx * ny);
      for (const r of runs) {
        expect(r.indices.length).toBeLessThanOrEqual(8);
        for (const i of r.indices) { expect(seen[i]).toBe(0); seen[i] = 1; }
      }
      expect(seen.every((v) => v === 1)).toBe(true);
      // level numbers never decrease: coarse first
      for (let k = 1; k < runs.length; k++) expect(runs[k].level).toBeGreaterThanOrEqual(runs[k - 1].level);
    });
  }

  it('after level 0 every cell has a painting point', () => {
    const nx = 64, ny = 40, stride = coarsestStride(nx, ny);
    const done = new Uint8Array(nx * ny);
    for (const r of refineRuns(nx, ny, 8, stride)) if (r.level === 0) for (const i of r.indices) done[i] = 1;
    for (let iy = 0; iy < ny; iy++) for (let ix = 0; ix < nx; ix++) {
      const p = paintingIndex(done, nx, ny, ix, iy, stride);
      expect(p).toBeGreaterThanOrEqual(0);
      expect(done[p]).toBe(1);
    }
  });
});

// Refinement without certification (docs/certified-maps.md, last section): the coarse
// rectangles tile the band and are small enough, and a rectangle is uniform exactly when
// its corners share phase, pattern and cell. States built by hand; exact integer checks
// (common practice, no source).
import { describe, it, expect } from 'vitest';
import { bandRects, corners, refineUniformLevel, subdivide, regionKey, UNIFORM_STEP, type Rect } from '../../../src/core/scan/refinement.ts';
import type { SolveResult } from '../../../src/core/meanfield/ground-state.ts';

const st = (phase: string, fraction: string | null, M: number) =>
  ({ phase, fraction, cell: { a: M, b: 0, c: 1 }, sublatticeDensities: Array(M).fill(0.3) } as unknown as SolveResult);

describe('uniform refinement', () => {
  it('subdivided rectangles cover every pixel of the band and no side exceeds the step', () => {
    const rects = subdivide(bandRects([0, 13, 27, 39], 16, 32), UNIFORM_STEP);
    const seen = new Set<string>();
    for (const r of rects) {
      expect(r.x1 - r.x0).toBeLessThanOrEqual(UNIFORM_STEP);
      expect(r.y1 - r.y0).toBeLessThanOrEqual(UNIFORM_STEP);
      for (let y = r.y0; y <= r.y1; y++) for (let x = r.x0; x <= r.x1; x++) seen.add(`${x},${y}`);
    }
    expect(seen.size).toBe(40 * 17);
  });

  it('uniform only when all four corners share phase, pattern and cell', () => {
    const r: Rect = { x0: 0, x1: 4, y0: 0, y1: 4 };
    const dw3 = st('density-wave', '1/3', 3), dw3b = st('density-wave', '2/3', 3), ss3 = st('supersolid', '1/3', 3);
    const uniform = refineUniformLevel([r], () => dw3);
    expect(uniform.uniform).toHaveLength(1);
    expect(uniform.uniform[0].region).toEqual({ cell: { a: 3, b: 0, c: 1 }, M: 3 });
    for (const other of [dw3b, ss3, undefined]) {
      const lvl = refineUniformLevel([r], (x, y) => (x === 4 && y === 4 ? other : dw3));
      expect(lvl.uniform).toHaveLength(0);
      expect(lvl.children).toHaveLength(4);
      expect(new Set(lvl.children.flatMap((c) => corners(c).map(String))).size).toBe(9);
    }
    expect(regionKey(undefined)).toBeNull();
  });
});

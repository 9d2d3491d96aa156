// Scan points packed into typed-array blocks (workers/point-blocks.ts) come back unchanged:
// real solver states (crystals, a condensate, a supersolid, a coexistence at fixed density,
// an error) packed, sent through structuredClone with their buffers transferred (as
// postMessage does), and unpacked, equal the originals exactly, keys in the same order (so
// JSON written from them is byte for byte the same). Exact equality is the check (common
// practice, no source): the block holds float64 values and integers, nothing is rounded.
import { describe, expect, it } from 'vitest';
import { blockBuffers, packPoints, unpackPoints } from '../../workers/point-blocks.ts';
import { solveGroundState } from '../../src/core/meanfield/ground-state.ts';
import type { ModelParams } from '../../src/core/model.ts';
import type { ScanPoint } from '../../src/core/scan/grid.ts';

const base: ModelParams = { lattice: 'chain', interaction: { shape: 'vdw', Rb: 1.5 }, delta: 3, T: 0, maxCell: 6 };

function points(): ScanPoint[] {
  const out: ScanPoint[] = [];
  // mu from the empty state through the condensate into density waves
  [-1.5, -0.2, 0.4, 1.2, 2.0].forEach((mu, i) => out.push({ index: i, ix: i, iy: 0, state: solveGroundState({ ...base, mu }, { seed: 3 + i }) }));
  // a square lattice (2D cell) at T > 0
  out.push({ index: 7, ix: 2, iy: 1, state: solveGroundState({ ...base, lattice: 'square', maxCell: 4, mu: 1.5, T: 0.05 }, { seed: 9 }) });
  // fixed density inside a first-order jump: two coexisting phases (a state the layout does not hold)
  out.push({ index: 8, ix: 3, iy: 1, state: solveGroundState({ ...base, rho: 0.35 }, { seed: 5 }) });
  out.push({ index: 9, ix: 4, iy: 1, error: 'the point could not be solved: a reason' });
  return out;
}

describe('point blocks', () => {
  const pts = points();

  it('the test points cover several phases and one coexistence', () => {
    expect(new Set(pts.map((p) => p.state?.phase).filter(Boolean)).size).toBeGreaterThanOrEqual(3);
    expect(pts.some((p) => p.state?.coexistence)).toBe(true);
  });

  it('round trip through a transferring structured clone gives the same points', () => {
    const block = packPoints(pts);
    const sent = structuredClone(block, { transfer: blockBuffers(block) });
    expect(block.ints.byteLength).toBe(0); // transferred, not copied
    const back = unpackPoints(sent);
    expect(back).toStrictEqual(pts);
    expect(JSON.stringify(back)).toBe(JSON.stringify(pts));
  });

  it('an empty block and a block of one error point', () => {
    expect(unpackPoints(packPoints([]))).toStrictEqual([]);
    const one: ScanPoint[] = [{ index: 41, ix: 1, iy: 2, error: 'x' }];
    expect(unpackPoints(packPoints(one))).toStrictEqual(one);
  });
});

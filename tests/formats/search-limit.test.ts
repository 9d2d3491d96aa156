// The map's atSearchLimit column (issue 9): true exactly where the winning pattern uses the
// largest cell searched. Checked on the nearest-neighbour chain far from the cavity
// (delta large, so the photon field stays zero), where the classical ground state is a fact
// of the trade (common practice, no source): empty for mu < 0, the period-2 crystal
// |1 0 1 0 ...> (density 1/2) for 0 < mu < 2 V1, filled above. With Mmax = 2 the crystal
// sits on the limit; with Mmax = 4 it is found in its own two-site cell, off the limit.
import { describe, it, expect } from 'vitest';
import { solveGroundState } from '../../src/core/meanfield/ground-state.ts';
import { mapCsv, mapHeader, mapJson } from '../../src/formats/map-columns.ts';
import { parseAxis } from '../../src/core/scan/axes.ts';
import type { ModelParams } from '../../src/core/model.ts';

describe('atSearchLimit', () => {
  it('marks the period-2 crystal at Mmax = 2 and not at Mmax = 4', () => {
    for (const maxCell of [2, 4]) {
      const base: ModelParams = { lattice: 'chain', interaction: { shape: 'nn', V1: 1 }, delta: 40, T: 0, maxCell };
      const x = parseAxis('mu=-0.5:1:2', 'x');
      const plan = { base, x, seed: 1 };
      const pts = x.values.map((mu, i) => ({ index: i, ix: i, iy: 0, state: solveGroundState({ ...base, mu }) }));
      expect(pts.map((p) => p.state.cellSize)).toEqual([1, 2]);
      const [head, ...rows] = mapCsv(mapHeader(plan), pts).trimEnd().split('\n');
      const k = head.split(',').indexOf('atSearchLimit');
      expect(k).toBeGreaterThan(0);
      expect(rows.map((r) => r.split(',')[k])).toEqual(['false', String(maxCell === 2)]);
      const doc = JSON.parse(mapJson(mapHeader(plan), pts, true)) as { points: { atSearchLimit: boolean }[] };
      expect(doc.points.map((p) => p.atSearchLimit)).toEqual([false, maxCell === 2]);
    }
  });
});

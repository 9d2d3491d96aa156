/**
 * A row segment of an adaptive map as it travels to a worker: the segment's own slice of the
 * plan (its x values, its one y value) instead of one parameter object a pixel, and the
 * certified crystals as a table with one index a pixel (most pixels of a map are certified,
 * by a handful of crystals). unpackSegment gives back exactly the pixels the scan would
 * have built (gridPoint and pointSeed of the full plan), so a packed segment fills to the
 * same states.
 */
import { gridPoint, pointSeed, type ScanPlan } from './grid.ts';
import type { AdaptivePixel, ColdPoint } from './certified-fill.ts';
import type { RegionCell } from './refinement.ts';

type Cell = { a: number; b: number; c: number };

export interface PackedSegment {
  /** The plan cut to the segment: x values ix0..ix0+length-1, y the segment's one value. */
  plan: ScanPlan;
  /** Index of the segment's first pixel in the full grid (seeds come from it). */
  index0: number;
  /** The seed of the full plan. */
  seed: number;
  /** Certified crystals met in the segment. */
  crystals: Array<{ cell: Cell; n: number[] }>;
  /** Per pixel: its index in crystals, or -1 (not certified). */
  crystalIndex: Int32Array;
  /** Pixels solved cold before (refinement corners), by offset in the segment. */
  cold: Array<[number, ColdPoint]>;
  /** Pixels to solve in one cell (uniform refinement), by offset in the segment. */
  inCell: Array<[number, RegionCell]>;
}

/** What the scan knows of a pixel at grid index: its certified crystal, cold outcome, region. */
export interface PixelKnowledge {
  crystal(index: number): { cell: Cell; n: number[] } | undefined;
  cold(index: number): ColdPoint | undefined;
  inCell(index: number): RegionCell | undefined;
}

/** Pack the segment of row iy from ix0, `length` pixels long. */
export function packSegment(plan: ScanPlan, iy: number, ix0: number, length: number, know: PixelKnowledge): PackedSegment {
  const nx = plan.x.values.length;
  const cut: ScanPlan = {
    base: plan.base, seed: plan.seed,
    x: { ...plan.x, values: plan.x.values.slice(ix0, ix0 + length) },
    ...(plan.y ? { y: { ...plan.y, values: [plan.y.values[iy]] } } : {}),
  };
  const crystals: PackedSegment['crystals'] = [];
  const ids = new Map<object, number>();
  const crystalIndex = new Int32Array(length).fill(-1);
  const cold: PackedSegment['cold'] = [], inCell: PackedSegment['inCell'] = [];
  for (let i = 0; i < length; i++) {
    const index = iy * nx + ix0 + i;
    const cr = know.crystal(index), c = know.cold(index), region = c ? undefined : know.inCell(index);
    if (cr) {
      let k = ids.get(cr);
      if (k === undefined) { ids.set(cr, k = crystals.length); crystals.push({ cell: cr.cell, n: cr.n }); }
      crystalIndex[i] = k;
    }
    if (c) cold.push([i, c]);
    if (region) inCell.push([i, region]);
  }
  return { plan: cut, index0: iy * nx + ix0, seed: plan.seed, crystals, crystalIndex, cold, inCell };
}

/** The pixels of a packed segment, as the scan would have built them from the full plan. */
export function unpackSegment(s: PackedSegment): AdaptivePixel[] {
  const cold = new Map(s.cold), inCell = new Map(s.inCell);
  return Array.from(s.crystalIndex, (k, i) => {
    const c = cold.get(i), region = inCell.get(i);
    return {
      params: gridPoint(s.plan, i, 0), seed: pointSeed(s.seed, s.index0 + i),
      ...(k >= 0 ? { crystal: s.crystals[k] } : {}), ...(c ? { cold: c } : {}), ...(region ? { inCell: region } : {}),
    };
  });
}

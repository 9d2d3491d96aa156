/**
 * Label spots of the regions of a categorical grid: one per connected region, at its
 * deepest cell (farthest from any edge), small regions left unlabelled. Checked on grids
 * whose answer follows by inspection (common practice, no source).
 */
import { describe, it, expect } from 'vitest';
import { regionLabels } from '../../../src/ui/figures/region-labels.ts';

describe('region labels', () => {
  it('labels each connected region once at its centre', () => {
    // 9 x 9: a 5 x 5 block of B centred at (4, 4) in a sea of A
    const key = (i: number, j: number) => (Math.abs(i - 4) <= 2 && Math.abs(j - 4) <= 2 ? 'B' : 'A');
    const labels = regionLabels(9, 9, key, (k) => k === 'B', 1);
    expect(labels).toHaveLength(1);
    expect(labels[0]).toMatchObject({ key: 'B', ix: 4, iy: 4, depth: 2, size: 25 });
  });

  it('splits disconnected regions of one key and skips the shallow ones', () => {
    // two B columns (x = 1 alone, and x = 5..7) in a 9 x 9 grid of A
    const key = (i: number) => (i === 1 || (i >= 5 && i <= 7) ? 'B' : 'A');
    const all = regionLabels(9, 9, key, (k) => k === 'B', 0);
    expect(all).toHaveLength(2);
    const deep = regionLabels(9, 9, key, (k) => k === 'B', 1);
    expect(deep).toHaveLength(1);
    expect(deep[0].ix).toBe(6);
  });
});

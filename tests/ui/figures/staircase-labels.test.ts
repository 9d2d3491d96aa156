/**
 * Staircase plateau labels never overlap (issue 11, item 19): each goes to the first row
 * whose last label ends left of it; with every row taken it is left out (the plateau table
 * lists it). Checked on plateaus whose answer follows by inspection (common practice, no source).
 */
import { describe, it, expect } from 'vitest';
import { LABEL_ROWS, placeLabels } from '../../../src/ui/figures/staircase-figure.ts';
import { makeFrame } from '../../../src/ui/plot/frame.ts';

// 1 px per unit of mu: a plot area 600 px wide over mu 0..600
const f = makeFrame({ width: 616 + 58, height: 300, margin: { left: 58, right: 16 }, x: [0, 600], y: [0, 1] });

describe('placeLabels', () => {
  it('puts far-apart labels in the first row and neighbours in the next rows', () => {
    const wide = placeLabels(f, [{ x0: 0, x1: 100, text: '1/3' }, { x0: 300, x1: 400, text: '1/2' }], { top: 20 });
    expect(wide.map((p) => p.y)).toEqual([31, 31]);
    // three 4-character labels on plateaus 10 px wide, side by side: one a row
    const tight = placeLabels(f, [0, 10, 20].map((x) => ({ x0: 200 + x, x1: 210 + x, text: '5/12' })), { top: 20 });
    expect(tight.map((p) => p.y)).toEqual([31, 44, 57]);
  });

  it('leaves out a label no row has room for, and no two placed labels overlap', () => {
    const list = [0, 5, 10, 15, 20].map((x) => ({ x0: 300 + x, x1: 304 + x, text: '7/12' }));
    const placed = placeLabels(f, list, { top: 20 });
    expect(placed).toHaveLength(LABEL_ROWS);
    const w = 4 * 6.6 + 6; // labelWidth('7/12')
    for (let i = 0; i < placed.length; i++) for (let j = i + 1; j < placed.length; j++) {
      const a = placed[i], b = placed[j];
      expect(a.y !== b.y || Math.abs(a.x - b.x) >= w).toBe(true);
    }
  });
});

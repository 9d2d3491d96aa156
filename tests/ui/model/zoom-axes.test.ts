// Zooming a map into a box (src/ui/model/zoom-axes.ts) and finding the grid points two maps
// share (src/ui/controllers/map-cache.ts matches). Checks against the arithmetic of evenly
// spaced axes (value_i = start + (stop - start) i / (count - 1), src/core/scan/axes.ts):
// the zoomed axis spans the old grid values bracketing the box, its step is the old step
// over a whole number k, so every k-th new value is an old value. Tolerances: the ends are
// written in shortest round-trip form, so they are exact (===); interior shared values
// are recomputed from the ends, so they agree to rounding, 1e-12 of the step (common
// practice, no source: a few units in the last place of numbers of order 1).
import { describe, expect, it } from 'vitest';
import { parseAxis } from '../../../src/core/scan/axes.ts';
import { snapSpan, zoomAxis } from '../../../src/ui/model/zoom-axes.ts';
import { matches } from '../../../src/ui/controllers/map-cache.ts';

const demoX = parseAxis('mu=-1..2.9 x64', 'x');
const demoY = parseAxis('rb=0.8..2.4 x40', 'y');

describe('zoom axes', () => {
  it('snaps the box outward to the grid values around it', () => {
    // step 3.9/63 = 0.061905; 0.3 lies between i = 21 (0.3000) and 22; 1.2 between 35 and 36
    const [i0, i1] = snapSpan(demoX, 1.2, 0.3) as [number, number];
    expect(demoX.values[i0]).toBeLessThanOrEqual(0.3 + 1e-12);
    expect(demoX.values[i0 + 1]).toBeGreaterThan(0.3);
    expect(demoX.values[i1]).toBeGreaterThanOrEqual(1.2);
    expect(demoX.values[i1 - 1]).toBeLessThan(1.2);
    expect([i0, i1]).toEqual([21, 36]);
  });

  it('a box inside one cell still spans one step; a box past the ends is clipped', () => {
    expect(snapSpan(demoX, 0.5, 0.51)).toEqual([24, 25]);
    expect(snapSpan(demoX, -5, 9)).toEqual([0, 63]);
    expect(snapSpan(parseAxis('mu=1..1 x1', 'x'), 0, 2)).toBeNull();
  });

  it.each([
    [demoX, 0.3, 1.2], [demoY, 1.1, 1.9], [demoX, 0.5, 0.51], [parseAxis('mu=-1..2.9 x200', 'x'), -0.7, 2.2],
    [parseAxis('detuning=5..1 x41', 'x'), 2.2, 3.1],
  ])('%# the zoomed axis refines the old grid k-fold with about as many values', (axis, a, b) => {
    const [i0, i1] = snapSpan(axis, a, b) as [number, number];
    const z = parseAxis(zoomAxis(axis, a, b) as string, 'x');
    expect(z.name).toBe(axis.name);
    expect(z.start).toBe(axis.values[i0]);
    expect(z.stop).toBe(axis.values[i1]);
    const k = (z.count - 1) / (i1 - i0);
    expect(Number.isInteger(k)).toBe(true);
    expect(Math.abs(z.count - axis.count)).toBeLessThanOrEqual((i1 - i0) / 2 + 1);
    const step = Math.abs(axis.stop - axis.start) / (axis.count - 1);
    for (let m = 0; m <= i1 - i0; m++) expect(Math.abs(z.values[m * k] - axis.values[i0 + m])).toBeLessThan(1e-12 * step);
    // every old value in the span is found by matches, at the k-th new values
    const pairs = matches(z, axis);
    expect(pairs).toEqual(Array.from({ length: i1 - i0 + 1 }, (_, m) => [m * k, i0 + m]));
  });

  it('matches finds nothing between axes of different grids and all of an equal axis', () => {
    expect(matches(parseAxis('mu=0..1 x11', 'x'), parseAxis('mu=0.05..0.95 x10', 'x'))).toEqual([]);
    expect(matches(demoX, demoX)).toEqual(demoX.values.map((_, i) => [i, i]));
  });
});

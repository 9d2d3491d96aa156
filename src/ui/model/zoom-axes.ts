/**
 * Zooming a map into a dragged box: the box is snapped outward to the map's own grid lines
 * and the new axis refines that span k-fold (k a whole number), so every k-th new value is
 * a value of the old axis and the points already solved there can be reused, not solved
 * again. k is chosen so that the new axis has about as many values as the old one:
 *
 *   i0 = the last old index at or below the box's low end, i1 = the first at or above its
 *   high end (at least one step apart); k = max(1, round((count - 1) / (i1 - i0)));
 *   new axis = values[i0] .. values[i1] x((i1 - i0) k + 1).
 *
 * The ends are written in JavaScript's shortest round-trip form, so the new axis's ends equal
 * the old values exactly; its interior shared values (the even spacing is recomputed from
 * the ends) equal the old ones to a few units in the last place (map-cache.ts matches).
 */
import { MAX_AXIS_COUNT, formatRange, type Axis } from '../../core/scan/axes.ts';

/** The old grid indices [i0, i1] spanning data interval [a, b] (either order), snapped outward, at least one step apart. */
export function snapSpan(axis: Axis, a: number, b: number): [number, number] | null {
  const n = axis.count;
  if (n < 2) return null;
  const [lo, hi] = [Math.min(a, b), Math.max(a, b)];
  const step = (axis.stop - axis.start) / (n - 1);
  // position along the axis in steps (the axis may run downward: step < 0)
  const t = (v: number) => (v - axis.start) / step;
  let i0 = Math.floor(Math.min(t(lo), t(hi)) + 1e-9), i1 = Math.ceil(Math.max(t(lo), t(hi)) - 1e-9);
  i0 = Math.max(0, Math.min(n - 1, i0));
  i1 = Math.max(0, Math.min(n - 1, i1));
  if (i1 === i0) { if (i1 < n - 1) i1++; else i0--; }
  return [i0, i1];
}

/** The text `name=start..stop xN` of the zoomed axis over old indices [i0, i1], about `target` values. */
export function zoomAxisText(axis: Axis, i0: number, i1: number, target = axis.count): string {
  const span = i1 - i0;
  let k = Math.max(1, Math.round((target - 1) / span));
  while (span * k + 1 > MAX_AXIS_COUNT && k > 1) k--;
  return `${axis.name}=${formatRange({ start: axis.values[i0], stop: axis.values[i1], count: span * k + 1 }, true)}`;
}

/** The zoomed axis text for the data interval [a, b] (null: the axis has a single value). */
export function zoomAxis(axis: Axis, a: number, b: number): string | null {
  const s = snapSpan(axis, a, b);
  return s ? zoomAxisText(axis, s[0], s[1]) : null;
}

/**
 * The page's memory of map scans, keyed by the scan request (the plan as JSON): finished
 * grids and the part of an unfinished one done before its view left the page. It lives
 * for the page, not for a view element, so a tab switch does not throw a map away, and
 * inputs that come back to a computed state show its map at once instead of solving it
 * again. Least recently used grids go first once the points held pass a cap.
 *
 * A new map (a zoom into a box, another range) also takes the points it shares with a
 * kept map of the same model and axes (`shared`): the same grid point, its axis values
 * equal to rounding, so they need not be solved again.
 */
import type { Axis } from '../../core/scan/axes.ts';
import type { ScanPoint } from '../../core/scan/grid.ts';
import type { MapGrid, MapPlan } from './map-scan.ts';

/**
 * Axis values closer than this fraction of the finer step are the same grid point: the
 * zoomed axis recomputes the even spacing from its ends, which moves a shared value by a
 * few units in the last place (about 1e-16 relative), never by a visible amount.
 */
export const SAME_VALUE = 1e-9;

/** Points held at most (a 200 x 200 map is 40 000; states are small arrays each). */
export const MAP_CACHE_POINTS = 250_000;

export class MapCache {
  private grids = new Map<string, MapGrid>();
  constructor(private readonly maxPoints = MAP_CACHE_POINTS) {}

  /** The grid of this request (finished or partly done), marked as just used. */
  get(key: string): MapGrid | undefined {
    const g = this.grids.get(key);
    if (g) { this.grids.delete(key); this.grids.set(key, g); }
    return g;
  }

  /** Keep a grid that has points; drop the least recently used beyond the cap. */
  put(g: MapGrid): void {
    if (g.count === 0) return;
    this.grids.delete(g.key);
    this.grids.set(g.key, g);
    let held = 0;
    for (const x of this.grids.values()) held += x.nx * x.ny;
    for (const [k, x] of this.grids) {
      if (held <= this.maxPoints || x === g) break;
      this.grids.delete(k);
      held -= x.nx * x.ny;
    }
  }

  get size(): number { return this.grids.size; }

  /**
   * The solved points (no errors) of kept maps with the plan's model and axis names that
   * lie on the plan's grid, keyed by the plan's index, taken from the most recently used
   * map first.
   */
  shared(plan: MapPlan): Map<number, ScanPoint> {
    const out = new Map<number, ScanPoint>();
    const base = JSON.stringify(plan.base);
    const nx = plan.x.count;
    for (const g of [...this.grids.values()].reverse()) {
      if (g.plan.x.name !== plan.x.name || g.plan.y.name !== plan.y.name || JSON.stringify(g.plan.base) !== base) continue;
      const xs = matches(plan.x, g.plan.x), ys = matches(plan.y, g.plan.y);
      for (const [jy, iy] of ys) for (const [jx, ix] of xs) {
        const index = jy * nx + jx;
        const p = g.points[iy * g.nx + ix];
        if (p?.state && p.error === undefined && !out.has(index)) out.set(index, { index, ix: jx, iy: jy, state: p.state });
      }
    }
    return out;
  }
}

/** The page's one cache (shared by every atlas view element the page creates). */
export const mapCache = new MapCache();

/** Pairs [index on next, index on old] of the values two axes share (to SAME_VALUE of the finer step). */
export function matches(next: Axis, old: Axis): Array<[number, number]> {
  const step = (a: Axis) => (a.count > 1 ? Math.abs(a.stop - a.start) / (a.count - 1) : Infinity);
  const tol = SAME_VALUE * Math.min(step(next), step(old), Math.max(Math.abs(next.start), Math.abs(next.stop), 1));
  const out: Array<[number, number]> = [];
  const sorted = old.values.map((v, i) => [v, i] as const).sort((a, b) => a[0] - b[0]);
  next.values.forEach((v, j) => {
    // binary search for the nearest old value
    let lo = 0, hi = sorted.length - 1;
    while (lo < hi) { const mid = (lo + hi) >> 1; if (sorted[mid][0] < v) lo = mid + 1; else hi = mid; }
    for (const k of [lo - 1, lo]) if (k >= 0 && Math.abs(sorted[k][0] - v) <= tol) { out.push([j, sorted[k][1]]); break; }
  });
  return out;
}

/**
 * The page's memory of map scans, keyed by the scan request (the plan as JSON): finished
 * grids and the part of an unfinished one done before its view left the page. It lives
 * for the page, not for a view element, so a tab switch does not throw a map away, and
 * inputs that come back to a computed state show its map at once instead of solving it
 * again. Least recently used grids go first once the points held pass a cap.
 */
import type { MapGrid } from './map-scan.ts';

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
}

/** The page's one cache (shared by every atlas view element the page creates). */
export const mapCache = new MapCache();

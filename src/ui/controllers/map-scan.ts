/**
 * Reactive controller of a phase-map scan: the grid of points, filled by the one scan
 * driver (workers/scan-driver.ts, the CLI's path) in 'spread' order, rows coarse to fine,
 * with progress, timing and cancellation. A new run aborts the old one at once; the old
 * map stays on screen until the new run delivers its first points. Points arrive in blocks
 * (an adaptive map's band at a time, from the coordinating worker); host updates are
 * throttled (at least throttleMs apart, so at most one a frame), so rendering never floods
 * the main thread while results stream in.
 * Grids are kept in the page's map cache (map-cache.ts) by request: a finished one comes
 * back without a scan, a part-done one (its view left the page) is completed by a new run
 * that keeps the points it has. Cancel stops; only resume() or new inputs start again.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { ModelParams } from '../../core/model.ts';
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import type { Axis } from '../../core/scan/axes.ts';
import type { Boundary } from '../../core/scan/boundaries.ts';
import { gridPoint, pointSeed, type ScanPlan, type ScanPoint } from '../../core/scan/grid.ts';
import { type EngineClient, isAbort } from '../engine/engine-client.ts';
import { mapCache, type MapCache } from './map-cache.ts';

/** Seed of the page's scans (the CLI's default, so both give the same answers). */
export const SCAN_SEED = 1;

export interface MapPlan { base: ModelParams; x: Axis; y: Axis }

/**
 * For every cell of an nx x ny grid, the index of the nearest cell with known(index) true, in
 * steps along the grid (4-neighbour breadth-first search from every known cell at once,
 * O(nx ny)); -1 where nothing is known.
 */
export function nearestKnown(nx: number, ny: number, known: (index: number) => boolean): Int32Array {
  const n = nx * ny, from = new Int32Array(n).fill(-1), queue = new Int32Array(n);
  let head = 0, tail = 0;
  for (let i = 0; i < n; i++) if (known(i)) { from[i] = i; queue[tail++] = i; }
  while (head < tail) {
    const i = queue[head++], x = i % nx;
    for (const j of [i - nx, x > 0 ? i - 1 : -1, x < nx - 1 ? i + 1 : -1, i + nx]) {
      if (j >= 0 && j < n && from[j] < 0) { from[j] = from[i]; queue[tail++] = j; }
    }
  }
  return from;
}

/** One scan's grid of points. */
export class MapGrid {
  readonly nx: number;
  readonly ny: number;
  readonly points: (ScanPoint | undefined)[];
  /** Points done per row. */
  readonly rowCount: Uint32Array;
  /** The plan as the driver runs it (with the page's seed). */
  readonly scanPlan: ScanPlan;
  count = 0;
  /** ms the scan that finished this grid took (null while unfinished). */
  totalMs: number | null = null;
  /** Boundary lines, points really solved and notes the scan returned (the driver returns them when the scan finishes: null until then, and for a dense scan, which locates none). */
  boundaries: Boundary[] | null = null;
  solves: number | null = null;
  notes: string[] = [];
  /** Indices whose point is, for now, a kept map's point at the same grid point (a zoom's parent): a preview until the scan's own arrives. */
  readonly preview = new Set<number>();
  constructor(readonly plan: MapPlan, readonly key: string) {
    this.nx = plan.x.count;
    this.ny = plan.y.count;
    this.points = new Array(this.nx * this.ny);
    this.rowCount = new Uint32Array(this.ny);
    this.scanPlan = { ...plan, seed: SCAN_SEED };
  }
  /** Parameters of point (ix, iy). */
  point(ix: number, iy: number): ModelParams {
    return gridPoint(this.scanPlan, ix, iy);
  }
  /** Seed of point (ix, iy), as the scan derives it. */
  seed(ix: number, iy: number): number {
    return pointSeed(SCAN_SEED, iy * this.nx + ix);
  }
  /** The computed state of (ix, iy) itself, if any. */
  own(ix: number, iy: number): SolveResult | undefined {
    return this.points[iy * this.nx + ix]?.state;
  }
  /**
   * The state that paints cell (ix, iy): its own, else that of the nearest cell known (by
   * steps along the grid; ties as the search meets them): a row done paints the rows around it,
   * and a preview (the scan's coarse corners, or a kept map's points at the same grid points)
   * paints the plane at once, each new point sharpening the picture.
   */
  paint(ix: number, iy: number): SolveResult | undefined {
    const own = this.own(ix, iy);
    if (own) return own;
    const version = this.count + this.preview.size * 1e9;
    if (this.nearest === null || this.nearestVersion !== version) {
      this.nearest = nearestKnown(this.nx, this.ny, (i) => this.points[i]?.state !== undefined);
      this.nearestVersion = version;
    }
    const k = this.nearest[iy * this.nx + ix];
    return k < 0 ? undefined : this.points[k]?.state;
  }
  private nearest: Int32Array | null = null;
  private nearestVersion = -1;
  /** The points computed so far, in index order. */
  done(): ScanPoint[] {
    return this.points.filter((p): p is ScanPoint => p !== undefined);
  }
  get complete(): boolean { return this.count === this.nx * this.ny; }
}

export class MapScanController implements ReactiveController {
  /** The grid being filled (or last filled). */
  current: MapGrid | null = null;
  /** The grid on screen: the current one once it has points, else the previous one. */
  shown: MapGrid | null = null;
  status: 'idle' | 'running' | 'done' | 'cancelled' | 'error' = 'idle';
  error: string | null = null;
  /** Points of the current grid that could not be solved. */
  failed = 0;
  /** ms from start to the first picture (the scan's first preview points or its first whole row: from then on every cell is painted, from its nearest point known), and to the last point. */
  firstPictureMs: number | null = null;
  totalMs: number | null = null;
  /** performance.now() at the start of the current run. */
  startedAt = 0;
  /** Runs started, and runs stopped before they finished (superseded or cancelled). */
  started = 0;
  cancelled = 0;
  /** True when the current grid came finished from the map cache (no scan was run). */
  fromCache = false;
  private ctrl: AbortController | null = null;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private t0 = 0;

  constructor(
    private readonly host: ReactiveControllerHost, private readonly engine: () => EngineClient,
    private readonly throttleMs = 150, private readonly cache: MapCache = mapCache,
  ) {
    host.addController(this);
  }

  /** Start a scan of `plan` (key identifies the inputs; an equal running or finished scan is kept). */
  run(plan: MapPlan, key: string): void {
    if (this.current?.key === key && (this.status === 'running' || this.status === 'done')) return;
    this.cancel();
    const kept = this.cache.get(key);
    this.error = null;
    this.firstPictureMs = null;
    if (kept?.complete) {
      this.current = this.shown = kept;
      this.fromCache = true;
      this.status = 'done';
      this.failed = kept.done().filter((p) => p.error !== undefined).length;
      this.totalMs = kept.totalMs;
      this.host.requestUpdate();
      return;
    }
    this.started++;
    this.fromCache = false;
    const grid = kept ?? new MapGrid(plan, key);
    if (kept) this.shown = kept;
    // a new map shows at once the points it shares with kept maps (a zoom into a box of
    // one): they paint a coarse first picture while the scan runs, and the scan's own
    // answers replace them as they arrive. They go to the scan as known points: where the
    // adaptive map would solve one cold (a refinement corner) the known state is taken
    // (workers/scan-host.ts). The map itself runs whole: solving only the other points
    // densely (the adaptive map takes whole rows only) cost three times the solves on a
    // demo zoom and broke the located boundary lines at every reused row.
    const shared = kept ? null : this.cache.shared(plan);
    if (shared?.size) {
      for (const p of shared.values()) { grid.points[p.index] = p; grid.preview.add(p.index); }
      this.shown = grid;
      this.firstPictureMs = 0;
    }
    this.current = grid;
    this.status = 'running';
    this.failed = grid.done().filter((p) => p.error !== undefined).length;
    this.totalMs = null;
    this.t0 = performance.now();
    this.startedAt = this.t0;
    this.painted = false;
    const ctrl = new AbortController();
    this.ctrl = ctrl;
    const deliver = (pt: ScanPoint) => {
      if (ctrl.signal.aborted) return;
      if (!grid.preview.delete(pt.index) && grid.points[pt.index]) return;
      grid.points[pt.index] = pt;
      grid.rowCount[pt.iy]++;
      grid.count++;
      if (pt.error !== undefined) this.failed++;
      if (this.firstPictureMs === null && grid.rowCount[pt.iy] === grid.nx) this.firstPictureMs = performance.now() - this.t0;
      if (this.shown !== grid) this.shown = grid;
      this.schedule();
    };
    // the scan's own preview: grid points its workers solved cold (the adaptive map's
    // refinement corners), coarse grid first, shown until their rows arrive
    const onPreview = (pts: ScanPoint[]) => {
      if (ctrl.signal.aborted) return;
      for (const p of pts) if (!grid.points[p.index]) { grid.points[p.index] = p; grid.preview.add(p.index); }
      if (this.firstPictureMs === null) this.firstPictureMs = performance.now() - this.t0;
      if (this.shown !== grid) this.shown = grid;
      this.schedule();
    };
    this.finished = this.engine().scan({ kind: 'map', plan: grid.scanPlan, order: 'spread' }, {
      signal: ctrl.signal, onItem: deliver, onPreview, ...(shared?.size ? { known: [...shared.values()] } : {}),
    }).then(
      (result) => {
        if (this.ctrl !== ctrl) return;
        this.totalMs = performance.now() - this.t0;
        grid.totalMs = this.totalMs;
        grid.boundaries = result.boundaries ?? null;
        grid.solves = result.solves ?? null;
        grid.notes = result.notes ?? [];
        this.cache.put(grid);
        this.status = 'done';
        this.ctrl = null;
        this.flush();
      },
      (e: unknown) => {
        if (this.ctrl !== ctrl) return;
        this.ctrl = null;
        dropPreview(grid);
        this.status = isAbort(e) ? 'cancelled' : 'error';
        this.error = isAbort(e) ? null : e instanceof Error ? e.message : String(e);
        this.flush();
      },
    );
    this.host.requestUpdate();
  }

  /** Settles (never rejects) when the latest run ends, its state recorded (for scripts and tests). */
  finished: Promise<void> = Promise.resolve();

  /** Start the current plan again after a cancel, keeping the points it has. */
  resume(): void {
    const g = this.current;
    if (g && this.status !== 'running' && !g.complete) this.run(g.plan, g.key);
  }

  /** Stop the running scan; what has been computed stays (and is kept for a later run of the same request). */
  cancel(): void {
    if (this.ctrl) {
      const c = this.ctrl;
      this.ctrl = null;
      this.cancelled++;
      if (this.current) { dropPreview(this.current); this.cache.put(this.current); }
      c.abort();
      this.status = 'cancelled';
      this.flush();
    }
  }

  /** Fraction done of the current scan. */
  get progress(): number {
    const g = this.current;
    return g ? g.count / (g.nx * g.ny) : 0;
  }

  /** Smoothed cost of one redraw of the host (ms), reported by the host after each update. */
  private renderCost = 0;

  /** The host says how long its last redraw took; redraws are spaced ten times their script cost apart, which with layout and paint (about as much again) keeps their share of a core near 20%. */
  reportRender(ms: number): void {
    this.renderCost = this.renderCost === 0 ? ms : 0.7 * this.renderCost + 0.3 * ms;
  }

  /**
   * A redraw after the throttle delay (the first points of a run at once). Redraws are at
   * least throttleMs apart, so never more than one a frame; they run in a task of their own,
   * not in an animation-frame callback, so the browser's layout and paint of the new figure
   * come in the next frame's task instead of lengthening this one.
   */
  private schedule() {
    if (this.timer !== null) return;
    const delay = this.painted ? Math.min(1500, Math.max(this.throttleMs, 10 * this.renderCost)) : 0;
    this.timer = setTimeout(() => this.flush(), delay);
  }

  /** The current run has been drawn once (its first points come without a throttle delay). */
  private painted = false;

  private flush() {
    if (this.timer !== null) { clearTimeout(this.timer); this.timer = null; }
    this.painted = true;
    this.host.requestUpdate();
  }

  hostDisconnected(): void {
    this.cancel();
  }
}

/** Take a stopped run's preview points off its grid (they are another map's; a later run solves them). */
function dropPreview(g: MapGrid): void {
  for (const i of g.preview) g.points[i] = undefined;
  g.preview.clear();
}

/**
 * Reactive controller of a phase-map scan: the grid of states, filled coarse to fine
 * (engine/refine-order.ts) by the scan workers, with progress, timing and cancellation.
 * A new run aborts the old one at once; the old map stays on screen until the new run
 * delivers its first points. Host updates are throttled so rendering never floods the
 * main thread while results stream in.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { ModelParams } from '../../core/model.ts';
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import { applyAxis, type Axis } from '../../core/scan/axes.ts';
import { pointSeed } from '../../core/scan/grid.ts';
import { type EngineClient, isAbort } from '../engine/engine-client.ts';
import { coarsestStride, paintingIndex, refineRuns, type PointRun } from '../engine/refine-order.ts';

/** Seed of the page's scans (the CLI's default, so both give the same answers). */
export const SCAN_SEED = 1;

export interface MapPlan { base: ModelParams; x: Axis; y: Axis }

/** One scan's grid of results. */
export class MapGrid {
  readonly nx: number;
  readonly ny: number;
  readonly states: (SolveResult | undefined)[];
  readonly done: Uint8Array;
  readonly stride: number;
  count = 0;
  constructor(readonly plan: MapPlan, readonly key: string) {
    this.nx = plan.x.count;
    this.ny = plan.y.count;
    this.states = new Array(this.nx * this.ny);
    this.done = new Uint8Array(this.nx * this.ny);
    this.stride = coarsestStride(this.nx, this.ny);
  }
  /** Parameters of point (ix, iy). */
  point(ix: number, iy: number): ModelParams {
    return applyAxis(applyAxis(this.plan.base, this.plan.x.name, this.plan.x.values[ix]), this.plan.y.name, this.plan.y.values[iy]);
  }
  /** The computed state of (ix, iy) itself, if any. */
  own(ix: number, iy: number): SolveResult | undefined {
    return this.states[iy * this.nx + ix];
  }
  /** The state that paints cell (ix, iy): its own or its coarser representative's. */
  paint(ix: number, iy: number): SolveResult | undefined {
    const i = paintingIndex(this.done, this.nx, this.ny, ix, iy, this.stride);
    return i >= 0 ? this.states[i] : undefined;
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
  /** ms from start to the first complete coarse level, and to the last point. */
  firstPictureMs: number | null = null;
  totalMs: number | null = null;
  /** performance.now() at the start of the current run. */
  startedAt = 0;
  /** Runs started, and runs stopped before they finished (superseded or cancelled). */
  started = 0;
  cancelled = 0;
  private ctrl: AbortController | null = null;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private t0 = 0;

  constructor(private readonly host: ReactiveControllerHost, private readonly engine: () => EngineClient, private readonly throttleMs = 150) {
    host.addController(this);
  }

  /** Start a scan of `plan` (key identifies the inputs; an equal running or finished scan is kept). */
  run(plan: MapPlan, key: string): void {
    if (this.current?.key === key && (this.status === 'running' || this.status === 'done')) return;
    this.cancel();
    this.started++;
    const grid = new MapGrid(plan, key);
    this.current = grid;
    this.status = 'running';
    this.error = null;
    this.firstPictureMs = null;
    this.totalMs = null;
    this.t0 = performance.now();
    this.startedAt = this.t0;
    const ctrl = new AbortController();
    this.ctrl = ctrl;
    const runs = refineRuns(grid.nx, grid.ny, 8);
    const level0 = runs.filter((r) => r.level === 0).reduce((a, r) => a + r.indices.length, 0);
    const deliver = (index: number, s: SolveResult) => {
      if (ctrl.signal.aborted || grid.done[index]) return;
      grid.states[index] = s;
      grid.done[index] = 1;
      grid.count++;
      if (this.firstPictureMs === null && grid.count >= level0) this.firstPictureMs = performance.now() - this.t0;
      if (this.shown !== grid) this.shown = grid;
      this.schedule();
    };
    const exec = async (remote: Parameters<Parameters<EngineClient['scan']>[1]>[0], run: PointRun) => {
      const points = run.indices.map((i) => grid.point(i % grid.nx, Math.floor(i / grid.nx)));
      const seeds = run.indices.map((i) => pointSeed(SCAN_SEED, i));
      // a run takes ~10 ms: its states come back together (a message per point would cost more than it shows)
      const states = await remote.meanfield.solveRun({ points, seeds, continuation: true });
      states.forEach((s, k) => deliver(run.indices[k], s));
      return states.length;
    };
    this.engine().scan(runs, exec, { signal: ctrl.signal }).then(
      () => {
        if (this.ctrl !== ctrl) return;
        this.totalMs = performance.now() - this.t0;
        this.status = 'done';
        this.ctrl = null;
        this.flush();
      },
      (e: unknown) => {
        if (this.ctrl !== ctrl) return;
        this.ctrl = null;
        this.status = isAbort(e) ? 'cancelled' : 'error';
        this.error = isAbort(e) ? null : e instanceof Error ? e.message : String(e);
        this.flush();
      },
    );
    this.host.requestUpdate();
  }

  /** Stop the running scan; what has been computed stays. */
  cancel(): void {
    if (this.ctrl) {
      const c = this.ctrl;
      this.ctrl = null;
      this.cancelled++;
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

  private schedule() {
    if (this.timer === null) {
      const delay = Math.min(1500, Math.max(this.throttleMs, 10 * this.renderCost));
      this.timer = setTimeout(() => this.flush(), delay);
    }
  }

  private flush() {
    if (this.timer !== null) { clearTimeout(this.timer); this.timer = null; }
    this.host.requestUpdate();
  }

  hostDisconnected(): void {
    this.cancel();
  }
}

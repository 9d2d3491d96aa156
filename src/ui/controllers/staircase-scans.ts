/**
 * Reactive controller of the staircases run side by side (the model's interaction range
 * and a range to compare): each series is a 'staircase' scan of the one scan driver (the
 * CLI's path: the mu line in segments with continuation, its plateaus, their edges
 * bisected), all series at once on the scan workers. A new run aborts the old one; the
 * old curves stay on screen until the new ones are complete.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { ScanPlan } from '../../core/scan/grid.ts';
import type { StaircaseResult } from '../../../workers/protocol.ts';
import { type EngineClient, isAbort } from '../engine/engine-client.ts';

export interface StaircaseSeries { label: string; plan: ScanPlan }

export interface StaircaseScans { key: string; series: { label: string; plan: ScanPlan; result: StaircaseResult }[] }

export class StaircaseScansController implements ReactiveController {
  status: 'idle' | 'running' | 'done' | 'cancelled' | 'error' = 'idle';
  error: string | null = null;
  /** The last complete result (kept while a new one runs). */
  value: StaircaseScans | null = null;
  /** Points solved and their total over every series. */
  done = 0;
  total = 0;
  private key: string | null = null;
  private ctrl: AbortController | null = null;
  private last: StaircaseSeries[] = [];

  constructor(private readonly host: ReactiveControllerHost, private readonly engine: () => EngineClient) {
    host.addController(this);
  }

  /**
   * Run every series; skipped when `key` equals the latest run's, whatever its end (a
   * cancelled or failed run is not restarted by an unrelated redraw: resume() does that).
   */
  run(key: string, series: StaircaseSeries[]): void {
    if (key === this.key) return;
    this.last = series;
    this.cancel();
    this.key = key;
    const ctrl = new AbortController();
    this.ctrl = ctrl;
    this.done = 0;
    this.total = series.reduce((a, s) => a + s.plan.x.count, 0);
    this.status = 'running';
    this.error = null;
    const done = series.map(() => 0);
    Promise.all(series.map((s, i) => this.engine().scan({ kind: 'staircase', plan: s.plan }, {
      signal: ctrl.signal,
      onProgress: (d) => {
        done[i] = d;
        this.done = done.reduce((a, b) => a + b, 0);
        this.host.requestUpdate();
      },
    }))).then((results) => {
      if (this.ctrl !== ctrl) return;
      this.ctrl = null;
      this.value = { key, series: series.map((s, i) => ({ ...s, result: results[i] })) };
      this.status = 'done';
      this.host.requestUpdate();
    }, (e: unknown) => {
      if (this.ctrl !== ctrl) return;
      this.ctrl = null;
      ctrl.abort(); // the other series stop too
      this.status = isAbort(e) ? 'cancelled' : 'error';
      this.error = isAbort(e) ? null : e instanceof Error ? e.message : String(e);
      this.host.requestUpdate();
    });
    this.host.requestUpdate();
  }

  /** True when the result on screen is not that of the latest inputs. */
  get stale(): boolean {
    return this.value !== null && this.value.key !== this.key;
  }

  /** Run the latest inputs again after a cancel or a failure. */
  resume(): void {
    if (this.status === 'running' || this.key === null) return;
    const key = this.key;
    this.key = null;
    this.run(key, this.last);
  }

  /** Stop the running scans. */
  cancel(): void {
    if (!this.ctrl) return;
    const c = this.ctrl;
    this.ctrl = null;
    c.abort();
    this.status = 'cancelled';
    this.host.requestUpdate();
  }

  hostDisconnected(): void {
    this.cancel();
  }
}

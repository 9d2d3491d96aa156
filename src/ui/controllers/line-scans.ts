/**
 * Reactive controller of one or more one-parameter scans run side by side (the
 * staircase's two interaction ranges): each series is a list of points, cut into runs of
 * consecutive points solved in order with continuation on the scan workers, seeds as the
 * CLI derives them (pointSeed(1, index)). A new run aborts the old one; the old curves
 * stay on screen until the new ones are complete.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { ModelParams } from '../../core/model.ts';
import type { SolveResult } from '../../core/meanfield/ground-state.ts';
import { pointSeed } from '../../core/scan/grid.ts';
import { type EngineClient, type EngineRemote, isAbort } from '../engine/engine-client.ts';
import { SCAN_SEED } from './map-scan.ts';

export interface LineSeries { label: string; points: ModelParams[] }

export interface LineScanResult { key: string; series: { label: string; points: ModelParams[]; states: SolveResult[] }[] }

const RUN = 16;

export class LineScansController implements ReactiveController {
  status: 'idle' | 'running' | 'done' | 'cancelled' | 'error' = 'idle';
  error: string | null = null;
  /** The last complete result (kept while a new one runs). */
  value: LineScanResult | null = null;
  done = 0;
  total = 0;
  private key: string | null = null;
  private ctrl: AbortController | null = null;

  constructor(private readonly host: ReactiveControllerHost, private readonly engine: () => EngineClient) {
    host.addController(this);
  }

  /** Scan every series (skipped when `key` equals the running or finished scan's). */
  run(key: string, series: LineSeries[]): void {
    if (key === this.key && this.status !== 'cancelled' && this.status !== 'error') return;
    this.cancel();
    this.key = key;
    const ctrl = new AbortController();
    this.ctrl = ctrl;
    const states = series.map((s) => new Array<SolveResult>(s.points.length));
    const tasks: { si: number; i0: number; n: number }[] = [];
    series.forEach((s, si) => { for (let i0 = 0; i0 < s.points.length; i0 += RUN) tasks.push({ si, i0, n: Math.min(RUN, s.points.length - i0) }); });
    this.done = 0;
    this.total = series.reduce((a, s) => a + s.points.length, 0);
    this.status = 'running';
    this.error = null;
    const exec = async (remote: EngineRemote, t: { si: number; i0: number; n: number }) => {
      const pts = series[t.si].points.slice(t.i0, t.i0 + t.n);
      const seeds = pts.map((_, k) => pointSeed(SCAN_SEED, t.i0 + k));
      const out = await remote.meanfield.solveRun({ points: pts, seeds, continuation: true });
      out.forEach((s, k) => { states[t.si][t.i0 + k] = s; });
      return out.length;
    };
    this.engine().scan(tasks, exec, {
      signal: ctrl.signal, units: (t) => t.n,
      onProgress: (d) => { this.done = d; this.host.requestUpdate(); },
    }).then(() => {
      if (this.ctrl !== ctrl) return;
      this.ctrl = null;
      this.value = { key, series: series.map((s, i) => ({ label: s.label, points: s.points, states: states[i] })) };
      this.status = 'done';
      this.host.requestUpdate();
    }, (e: unknown) => {
      if (this.ctrl !== ctrl) return;
      this.ctrl = null;
      this.status = isAbort(e) ? 'cancelled' : 'error';
      this.error = isAbort(e) ? null : e instanceof Error ? e.message : String(e);
      this.host.requestUpdate();
    });
    this.host.requestUpdate();
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

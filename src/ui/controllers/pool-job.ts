/**
 * What the page's Monte Carlo controllers share (qmc-task.ts, boundary-check.ts): the
 * EngineTask of one job on the scan workers (a new request aborts the stale one; only the
 * latest may change the state; the last good result stays shown), its cancel and rerun,
 * and host redraws throttled while the job streams progress.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { EngineClient } from '../engine/engine-client.ts';
import { EngineTask } from './engine-task.ts';

export abstract class PoolJob<T> implements ReactiveController {
  /** The job (status, value, error, valueKey). */
  readonly task: EngineTask<T>;
  private redraw = false;

  constructor(
    protected readonly host: ReactiveControllerHost, protected readonly engine: () => EngineClient | undefined,
    private readonly throttleMs: number,
  ) {
    host.addController(this);
    this.task = new EngineTask<T>(host);
  }

  /** Cancel the pending job (the last result stays). */
  cancel(): void {
    this.task.abort();
  }

  /** True when the latest request was cancelled (its result is not the one shown). */
  get cancelled(): boolean {
    return this.task.cancelled;
  }

  /** Run the latest request again (after a cancel). */
  rerun(): void {
    this.task.retry();
  }

  get status() { return this.task.status; }
  get value() { return this.task.value; }
  get error() { return this.task.error; }

  /** Ask the host to redraw, at most once every throttleMs. */
  protected later(): void {
    if (this.redraw) return;
    this.redraw = true;
    setTimeout(() => { this.redraw = false; this.host.requestUpdate(); }, this.throttleMs);
  }

  hostDisconnected(): void {
    this.task.abort();
  }
}

/**
 * A reactive controller holding one async engine call at a time (the Lit pattern of a
 * task with explicit states). run() aborts the previous call through its AbortSignal and
 * starts the new one; only the latest call may change the state, so an out-of-date
 * answer arriving late is dropped. The last good value stays available while a new call
 * is pending or after it fails, so the page keeps showing it.
 */
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import { isAbort } from '../engine/engine-client.ts';

export type TaskStatus = 'idle' | 'pending' | 'complete' | 'error';

export class EngineTask<T> implements ReactiveController {
  status: TaskStatus = 'idle';
  /** The last good result (kept through later failures and while pending). */
  value: T | undefined;
  /** Message of the latest failure, cleared when a run starts. */
  error: string | null = null;
  /** Key of the inputs the current value belongs to (to skip re-running on equal inputs). */
  valueKey: string | null = null;
  /** Key of the latest inputs asked for (whether their run finished, failed or was cancelled). */
  latestKey: string | null = null;
  private lastFn: ((signal: AbortSignal) => Promise<T>) | null = null;
  private controller: AbortController | null = null;
  private pendingKey: string | null = null;
  private generation = 0;

  constructor(private readonly host: ReactiveControllerHost) {
    host.addController(this);
  }

  /**
   * Start `fn` for inputs identified by `key`. A run for the latest key is skipped whatever
   * became of it (pending, complete, failed or cancelled), so a redraw never restarts a
   * cancelled or failing call; `force` runs it again (a "run again" button).
   */
  run(key: string, fn: (signal: AbortSignal) => Promise<T>, force = false): Promise<void> {
    if (!force && key === this.latestKey) return Promise.resolve();
    this.latestKey = key;
    this.lastFn = fn;
    this.abort();
    if (key === this.valueKey) { this.status = 'complete'; this.error = null; this.host.requestUpdate(); return Promise.resolve(); }
    const ctrl = new AbortController();
    const gen = ++this.generation;
    this.controller = ctrl;
    this.pendingKey = key;
    this.status = 'pending';
    this.error = null;
    this.host.requestUpdate();
    return fn(ctrl.signal).then(
      (v) => {
        if (gen !== this.generation) return;
        this.value = v;
        this.valueKey = key;
        this.status = 'complete';
        this.controller = null;
        this.host.requestUpdate();
      },
      (e: unknown) => {
        if (gen !== this.generation) return;
        this.controller = null;
        if (isAbort(e)) { this.status = this.value === undefined ? 'idle' : 'complete'; } else {
          this.status = 'error';
          this.error = e instanceof Error ? e.message : String(e);
        }
        this.host.requestUpdate();
      },
    );
  }

  /** Run the latest inputs again (after a cancel or a failure). */
  retry(): void {
    if (this.latestKey !== null && this.lastFn && this.status !== 'pending') void this.run(this.latestKey, this.lastFn, true);
  }

  /** True when the latest call was cancelled (nothing pending or failed, and its result is not the one shown). */
  get cancelled(): boolean {
    return this.status !== 'pending' && this.status !== 'error' && this.latestKey !== null && this.latestKey !== this.valueKey;
  }

  /** True when the value shown belongs to other inputs than the latest asked for. */
  get stale(): boolean {
    return this.value !== undefined && this.latestKey !== null && this.valueKey !== this.latestKey;
  }

  /** Cancel the pending call, if any (the value stays). */
  abort(): void {
    if (this.controller) {
      this.generation++;
      this.controller.abort();
      this.controller = null;
      this.pendingKey = null;
      if (this.status === 'pending') this.status = this.value === undefined ? 'idle' : 'complete';
      this.host.requestUpdate();
    }
  }

  hostDisconnected(): void {
    this.abort();
  }

  /** Back on the page (an element moved, not rebuilt): finish what its leaving stopped. */
  hostConnected(): void {
    if (this.latestKey !== null && this.valueKey !== this.latestKey && this.status !== 'pending' && this.status !== 'error') this.retry();
  }
}

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
  private controller: AbortController | null = null;
  private pendingKey: string | null = null;
  private generation = 0;

  constructor(private readonly host: ReactiveControllerHost) {
    host.addController(this);
  }

  /** Start `fn` for inputs identified by `key`; a run for the same key as the current one is skipped. */
  run(key: string, fn: (signal: AbortSignal) => Promise<T>): Promise<void> {
    if (key === this.pendingKey && this.status === 'pending') return Promise.resolve();
    if (key === this.valueKey && this.status === 'complete') return Promise.resolve();
    this.abort();
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
}

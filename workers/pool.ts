/**
 * A pool of engine workers, the same in the browser (Web Workers) and in Node (worker
 * threads): it only sees a spawn function returning a Comlink remote. Tasks from any
 * number of concurrent runs wait in one queue; each idle worker takes the next task, so a
 * slow task never holds up the others. A run streams each task's result as it finishes
 * (onResult), counts progress in units the caller chooses, and stops on its AbortSignal:
 * queued tasks are dropped and workers busy on the run are terminated (a computation in a
 * worker cannot be interrupted otherwise) and respawned when needed.
 *
 * Watchdog: every task has a budget of wall time (the run's budgetMs, else the pool's
 * taskBudgetMs). A task past it is stopped the only way a worker can be stopped: the
 * worker is terminated and replaced on the next task, and the task fails with a
 * TaskTimeoutError whose message names the task (the run's describe, or the task's JSON).
 * So the pool never waits forever on a computation that does not end.
 */
import type { Remote } from 'comlink';

/** A started worker: its Comlink remote and how to stop it. */
export interface EngineHandle<E> {
  remote: Remote<E>;
  terminate(): void;
  /** Rejects if the worker dies on its own (crash, exit); never resolves. */
  failed?: Promise<never>;
}

/**
 * Listeners of each handle's death, attached to its `failed` promise once. A
 * Promise.race([call, failed.catch(...)]) per task left a reaction (and through it the
 * task's timer, its run and its results) on that promise for as long as the worker lived:
 * a map of a million points kept ~70 bytes a point in the main thread.
 */
const deathListeners = new WeakMap<object, Set<(e: unknown) => void>>();

/** `call`, or a WorkerDied rejection if the handle's worker dies first; the listener goes when `call` settles. */
function untilDeath<R>(handle: EngineHandle<unknown>, call: Promise<R>): Promise<R> {
  let listeners = deathListeners.get(handle);
  if (!listeners) {
    const set = new Set<(e: unknown) => void>();
    listeners = set;
    deathListeners.set(handle, set);
    // each listener removes itself when run: at most set.size turns
    (handle.failed as Promise<never>).catch((e: unknown) => { for (const f of [...set]) f(e); });
  }
  const set = listeners;
  return new Promise<R>((resolve, reject) => {
    const onDeath = (e: unknown) => {
      set.delete(onDeath);
      reject(new WorkerDied(e));
    };
    set.add(onDeath);
    call.then((v) => { set.delete(onDeath); resolve(v); }, (e: unknown) => { set.delete(onDeath); reject(e); });
  });
}

/** Start one worker (see node-spawn.ts and browser-spawn.ts). */
export type SpawnEngine<E> = () => EngineHandle<E>;

/** Run one task on a worker; slot (0..size-1) says which worker, for per-worker seeds. */
export type TaskRunner<E, T, R> = (remote: Remote<E>, task: T, taskIndex: number, slot: number) => Promise<R>;

export interface RunOptions<T, R> {
  signal?: AbortSignal;
  /** Called as each task finishes, in completion order. */
  onResult?: (result: R, taskIndex: number, task: T) => void;
  /** Called after each task with the units done and the total (units default to 1 a task). */
  onProgress?: (done: number, total: number) => void;
  units?: (task: T) => number;
  /** Watchdog budget of one task in ms (default: the pool's taskBudgetMs). */
  budgetMs?: number | ((task: T) => number);
  /** The task in words, for the watchdog's message (default: its JSON, cut to 300 characters). */
  describe?: (task: T) => string;
  /**
   * A failed task (an error thrown in the worker, the worker dying, the watchdog) does not
   * end the run when recover is given: its return value stands for the task's result
   * (and is streamed as one). Cancellation still ends the run.
   */
  recover?: (error: Error, taskIndex: number, task: T) => R;
  /**
   * Queue rank (default 0): a run's tasks go ahead of every queued task of a lower
   * priority and behind those of the same or a higher one (first come, first served
   * within a priority). A running task is never interrupted.
   */
  priority?: number;
}

export interface PoolOptions {
  /** Watchdog budget of a task in ms when a run sets none (default 30 minutes). */
  taskBudgetMs?: number;
}

/** Default watchdog budget of one task: generous, but not forever. */
export const DEFAULT_TASK_BUDGET_MS = 30 * 60_000;

/** A task ran past its watchdog budget; its worker was terminated and will be replaced. */
export class TaskTimeoutError extends Error {
  override name = 'TaskTimeoutError';
  constructor(readonly task: string, readonly budgetMs: number) {
    super(`an engine task ran past its budget of ${budgetMs / 1000} s and was stopped (its worker is replaced): ${task}`);
  }
}

/** A task's default description: its JSON, cut short. */
function taskJson(task: unknown): string {
  let s: string;
  try { s = JSON.stringify(task) ?? String(task); } catch { s = String(task); }
  return s.length > 300 ? s.slice(0, 297) + '...' : s;
}

interface Job {
  run: RunState;
  taskIndex: number;
  priority: number;
}

interface RunState {
  tasks: readonly unknown[];
  exec: TaskRunner<unknown, unknown, unknown>;
  opts: RunOptions<unknown, unknown>;
  results: unknown[];
  left: number;
  done: number;
  total: number;
  finished: boolean;
  resolve(r: unknown[]): void;
  reject(e: unknown): void;
}

/** Marks a rejection that came from the worker dying rather than from the task. */
class WorkerDied {
  constructor(readonly cause: unknown) {}
}

interface Slot<E> {
  handle?: EngineHandle<E>;
  job?: Job;
}

/** The error a run rejects with when its signal aborts. */
export function abortError(signal?: AbortSignal): Error {
  const reason: unknown = signal?.reason;
  if (reason instanceof Error && reason.name === 'AbortError') return reason;
  const e = new Error('the run was cancelled');
  e.name = 'AbortError';
  return e;
}

export class WorkerPool<E> {
  private readonly slots: Slot<E>[];
  private queue: Job[] = [];
  private closed = false;
  private readonly taskBudgetMs: number;

  /** size workers at most, started lazily as tasks arrive. */
  constructor(private readonly spawn: SpawnEngine<E>, size: number, o: PoolOptions = {}) {
    if (!(Number.isInteger(size) && size >= 1)) throw new RangeError(`pool size must be a whole number >= 1, got ${size}`);
    this.slots = Array.from({ length: size }, () => ({}));
    this.taskBudgetMs = o.taskBudgetMs ?? DEFAULT_TASK_BUDGET_MS;
  }

  get size(): number {
    return this.slots.length;
  }

  /** Number of workers started so far. */
  get started(): number {
    return this.slots.filter((s) => s.handle).length;
  }

  /**
   * Run every task; resolves with the results in task order, rejects with the first task
   * error (the rest of the run is cancelled) or with an AbortError when signal aborts.
   */
  run<T, R>(tasks: readonly T[], exec: TaskRunner<E, T, R>, opts: RunOptions<T, R> = {}): Promise<R[]> {
    if (this.closed) return Promise.reject(new Error('the worker pool is closed'));
    return new Promise<R[]>((resolve, reject) => {
      const units = opts.units;
      const run: RunState = {
        tasks, exec: exec as TaskRunner<unknown, unknown, unknown>, opts: opts as RunOptions<unknown, unknown>,
        results: new Array(tasks.length), left: tasks.length, done: 0,
        total: units ? tasks.reduce((a, t) => a + units(t), 0) : tasks.length,
        finished: false,
        // the abort listener goes when the run ends, so a long-lived signal shared by
        // many runs does not collect listeners
        resolve: (r) => { detach(); resolve(r as R[]); },
        reject: (e) => { detach(); reject(e); },
      };
      const signal = opts.signal;
      const onAbort = () => this.cancel(run, abortError(signal));
      const detach = () => signal?.removeEventListener('abort', onAbort);
      if (signal?.aborted) return reject(abortError(signal));
      if (tasks.length === 0) return resolve([]);
      signal?.addEventListener('abort', onAbort, { once: true });
      const priority = opts.priority ?? 0;
      // behind every queued job of the same or a higher priority
      let at = this.queue.length;
      while (at > 0 && this.queue[at - 1].priority < priority) at--;
      const jobs = tasks.map((_, i) => ({ run, taskIndex: i, priority }));
      if (at === this.queue.length) for (const j of jobs) this.queue.push(j); // the common case: appended in place
      else this.queue = [...this.queue.slice(0, at), ...jobs, ...this.queue.slice(at)];
      this.pump();
    });
  }

  /** Warm up: start every worker now and wait until each answers `probe`. */
  async warm(probe: (remote: Remote<E>) => Promise<unknown>): Promise<void> {
    await Promise.all(this.slots.map((s) => probe(this.handleOf(s).remote)));
  }

  /** Terminate every worker; queued and running tasks reject. */
  close(): void {
    this.closed = true;
    const err = new Error('the worker pool was closed');
    for (const job of this.queue) this.finish(job.run, err);
    this.queue = [];
    for (const s of this.slots) {
      if (s.job) this.finish(s.job.run, err);
      s.handle?.terminate();
      s.handle = undefined;
      s.job = undefined;
    }
  }

  private handleOf(slot: Slot<E>): EngineHandle<E> {
    if (!slot.handle) slot.handle = this.spawn();
    return slot.handle;
  }

  private pump(): void {
    for (let i = 0; i < this.slots.length && this.queue.length > 0; i++) {
      const slot = this.slots[i];
      if (!slot.job) this.start(slot, i, this.queue.shift() as Job);
    }
  }

  private start(slot: Slot<E>, slotIndex: number, job: Job): void {
    slot.job = job;
    const { run, taskIndex } = job;
    const handle = this.handleOf(slot);
    const task = run.tasks[taskIndex];
    const call = run.exec(handle.remote as Remote<unknown>, task, taskIndex, slotIndex);
    const settled = handle.failed ? untilDeath(handle, call) : call;
    const b = run.opts.budgetMs;
    const budget = typeof b === 'function' ? b(task) : b ?? this.taskBudgetMs;
    const timer = setTimeout(() => {
      if (slot.job !== job) return;
      // the only way to stop a computation in a worker: end the worker (replaced on the next task)
      slot.job = undefined;
      handle.terminate();
      if (slot.handle === handle) slot.handle = undefined;
      const describe = run.opts.describe ?? taskJson;
      this.fail(run, taskIndex, new TaskTimeoutError(describe(task), budget));
    }, budget);
    settled.then(
      (result) => {
        clearTimeout(timer);
        if (slot.job !== job) return; // cancelled meanwhile: the worker was terminated
        slot.job = undefined;
        this.complete(run, taskIndex, result);
        this.pump();
      },
      (err: unknown) => {
        clearTimeout(timer);
        if (slot.job !== job) return;
        slot.job = undefined;
        if (err instanceof WorkerDied) {
          // a dead worker is replaced on the next task
          handle.terminate();
          if (slot.handle === handle) slot.handle = undefined;
          err = err.cause;
        }
        this.fail(run, taskIndex, err);
      },
    );
  }

  /** A task's result: store it, stream it, resolve the run after its last task. */
  private complete(run: RunState, taskIndex: number, result: unknown): void {
    if (run.finished) return;
    const task = run.tasks[taskIndex];
    run.results[taskIndex] = result;
    run.done += run.opts.units ? run.opts.units(task) : 1;
    run.opts.onResult?.(result, taskIndex, task);
    run.opts.onProgress?.(run.done, run.total);
    if (--run.left === 0) {
      run.finished = true;
      run.resolve(run.results);
    }
  }

  /** A task failed: recover it when the run says how, else cancel the run with the error. */
  private fail(run: RunState, taskIndex: number, err: unknown): void {
    const recover = run.opts.recover;
    if (recover && !run.finished) {
      const e = err instanceof Error ? err : new Error(String(err));
      let value: unknown;
      try {
        value = recover(e, taskIndex, run.tasks[taskIndex]);
      } catch (again) {
        this.cancel(run, again);
        return;
      }
      this.complete(run, taskIndex, value);
      this.pump();
      return;
    }
    this.cancel(run, err);
    this.pump();
  }

  /** Stop a run: drop its queued tasks, terminate the workers busy on it, reject it. */
  private cancel(run: RunState, err: unknown): void {
    if (run.finished) return;
    this.queue = this.queue.filter((j) => j.run !== run);
    for (const s of this.slots) {
      if (s.job?.run === run) {
        s.job = undefined;
        s.handle?.terminate();
        s.handle = undefined;
      }
    }
    this.finish(run, err);
    this.pump();
  }

  private finish(run: RunState, err: unknown): void {
    if (run.finished) return;
    run.finished = true;
    run.reject(err);
  }
}

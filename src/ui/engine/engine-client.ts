/**
 * The page's access to the engine: two instances of the shared worker pool
 * (workers/pool.ts, started by workers/browser-spawn.ts), the same worker code the CLI
 * runs. Scans (maps, staircases) go to the scan pool of navigator.hardwareConcurrency
 * workers; single interactive calls (a clicked point, its spectrum, a planner verdict)
 * go to a one-worker pool of their own so they never queue behind a long scan.
 * Every call takes an AbortSignal; aborting drops queued work and stops busy workers.
 */
import type { Remote } from 'comlink';
import type { Engine } from '../../../workers/engine.ts';
import { browserEnginePool } from '../../../workers/browser-spawn.ts';
import type { WorkerPool } from '../../../workers/pool.ts';

export type EngineRemote = Remote<Engine>;

export class EngineClient {
  /** Workers for scans. */
  readonly scanPool: WorkerPool<Engine>;
  /** One worker for interactive single calls. */
  readonly interactivePool: WorkerPool<Engine>;

  constructor(scanWorkers = Math.max(1, navigator.hardwareConcurrency || 2)) {
    this.scanPool = browserEnginePool(scanWorkers);
    this.interactivePool = browserEnginePool(1);
  }

  /** Number of scan workers. */
  get workers(): number {
    return this.scanPool.size;
  }

  /**
   * Start every worker now (module load, first compile). Not done at page load: on a small
   * machine the extra start-ups would compete with the first scan; workers start on demand.
   */
  warm(): Promise<void> {
    const probe = (r: EngineRemote) => r.info();
    return Promise.all([this.scanPool.warm(probe), this.interactivePool.warm(probe)]).then(() => undefined);
  }

  /** One call on the interactive worker. */
  async call<R>(fn: (remote: EngineRemote) => Promise<R>, signal?: AbortSignal): Promise<R> {
    const [r] = await this.interactivePool.run([0], (remote) => fn(remote), { signal });
    return r;
  }

  /**
   * Many tasks on the scan workers; each result streams to onResult as it finishes.
   * Resolves with the results in task order.
   */
  scan<T, R>(
    tasks: readonly T[], exec: (remote: EngineRemote, task: T) => Promise<R>,
    o: { signal?: AbortSignal; onResult?: (r: R, i: number, t: T) => void; onProgress?: (done: number, total: number) => void; units?: (t: T) => number },
  ): Promise<R[]> {
    return this.scanPool.run(tasks, (remote, task) => exec(remote, task), o);
  }

  /** Stop every worker (page unload, tests). */
  close(): void {
    this.scanPool.close();
    this.interactivePool.close();
  }
}

/** True for the rejection of an aborted call (not an error to show). */
export function isAbort(e: unknown): boolean {
  return e instanceof Error && e.name === 'AbortError';
}

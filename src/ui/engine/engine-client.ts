/**
 * The page's access to the engine: two instances of the shared worker pool
 * (workers/pool.ts), the same worker code the CLI runs. Scans go through the one scan
 * driver (workers/scan-driver.ts) on the scan pool; single interactive calls (a clicked
 * point's spectrum, a planner verdict) go to a one-worker pool of their own so they never
 * queue behind a long scan. Every call takes an AbortSignal; aborting drops queued work
 * and stops busy workers.
 *
 * On the page, scans go to a coordinating worker that runs the same driver with its own
 * pool (workers/scan-host.ts): the main thread only receives blocks of finished points.
 *
 * The client is environment-agnostic: it is given its pools (and, optionally, the scan
 * host), so the same code runs the page (browser-engine.ts starts Web Workers) and, in
 * tests, Node worker threads.
 */
import type { Remote } from 'comlink';
import type { Engine } from '../../../workers/engine.ts';
import type { WorkerPool } from '../../../workers/pool.ts';
import { runScan } from '../../../workers/scan-driver.ts';
import type { HostScanOptions, ScanHostClient } from '../../../workers/scan-host-client.ts';
import type { ScanItem, ScanKind, ScanKinds, ScanOptions, ScanResult } from '../../../workers/protocol.ts';

export type EngineRemote = Remote<Engine>;

export class EngineClient {
  /**
   * @param scanPool workers for scans
   * @param interactivePool one worker for interactive single calls
   * @param host where scans run (a coordinating worker with a pool of scanPool's size); absent: on scanPool here
   */
  constructor(readonly scanPool: WorkerPool<Engine>, readonly interactivePool: WorkerPool<Engine>, readonly host?: ScanHostClient) {}

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
    const scans = this.host ? this.host.warm() : this.scanPool.warm(probe);
    return Promise.all([scans, this.interactivePool.warm(probe)]).then(() => undefined);
  }

  /**
   * One call on the interactive worker. `o.budgetMs` bounds its wall time (the pool's
   * watchdog stops it and the call fails with a message naming `o.describe`).
   */
  async call<R>(fn: (remote: EngineRemote) => Promise<R>, signal?: AbortSignal, o: { budgetMs?: number; describe?: string } = {}): Promise<R> {
    const [r] = await this.interactivePool.run([0], (remote) => fn(remote), {
      signal, budgetMs: o.budgetMs, ...(o.describe ? { describe: () => o.describe as string } : {}),
    });
    return r;
  }

  /**
   * A scan (any kind of workers/protocol.ts) on the scan workers, through the one scan driver
   * (in the host when there is one; only the host sends a map's preview, o.onPreview).
   */
  scan<K extends ScanKind>(req: ScanKinds[K]['request'] & { kind: K }, o: HostScanOptions<ScanItem<K>> = {}): Promise<ScanResult<K>> {
    return this.host ? this.host.scan(req, o) : runScan(this.scanPool, req, o);
  }

  /** A one-task scan (a phase margin) on the interactive worker, so it never waits behind a map. */
  interactiveScan<K extends ScanKind>(req: ScanKinds[K]['request'] & { kind: K }, o: ScanOptions<ScanItem<K>> = {}): Promise<ScanResult<K>> {
    return runScan(this.interactivePool, req, o);
  }

  /** Stop every worker (page unload, tests). */
  close(): void {
    this.scanPool.close();
    this.interactivePool.close();
    this.host?.close();
  }
}

/** True for the rejection of an aborted call (not an error to show). */
export function isAbort(e: unknown): boolean {
  return e instanceof Error && e.name === 'AbortError';
}

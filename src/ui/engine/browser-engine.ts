/**
 * The page's engine client on Web Workers: scans run in a coordinating worker that owns a
 * pool of `scanWorkers` engine workers (workers/scan-coordinator.ts, nested workers), so the
 * scan driver and every worker reply stay off the main thread; the main thread keeps a
 * pool of the same size for the jobs that drive the pool themselves (Monte Carlo), started
 * only if used, and one interactive worker (see engine-client.ts).
 */
import { browserEnginePool } from '../../../workers/browser-spawn.ts';
import { ScanHostClient } from '../../../workers/scan-host-client.ts';
import { EngineClient } from './engine-client.ts';

/** The coordinating worker with a pool of `size` engine workers, and the page's client of it. */
function spawnScanCoordinator(size: number): ScanHostClient {
  const worker = new Worker(new URL('../../../workers/scan-coordinator.ts', import.meta.url), { type: 'module', name: `scan-coordinator:${size}` });
  const client = new ScanHostClient(worker);
  worker.addEventListener('error', (e) => client.fail(`the scan coordinator failed: ${e.message}`));
  return client;
}

/** An EngineClient whose workers are module Web Workers. */
export function browserEngineClient(scanWorkers = Math.max(1, navigator.hardwareConcurrency || 2)): EngineClient {
  return new EngineClient(browserEnginePool(scanWorkers), browserEnginePool(1), spawnScanCoordinator(scanWorkers));
}

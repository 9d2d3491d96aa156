/**
 * The one scan driver: every scan the page or the CLI runs (a map, a line, a staircase
 * with its plateau edges, a phase margin, soft-mode traces) is a ScanRequest
 * (workers/protocol.ts) handed to runScan with a pool. The runner of each kind cuts it
 * into worker calls (workers/scans/*.ts); the same request gives the same answer wherever
 * it runs, whatever the pool size.
 *
 * Adding a kind (say a QMC scan): add { request, result, item } to ScanKinds in
 * protocol.ts (the request with its own `kind` literal), write
 * workers/scans/<kind>.ts exporting a runner (pool, req, options) => Promise<result>
 * built on pool.run (budget, describe, recover, onItem as the existing runners), and add
 * it to RUNNERS below; the compiler refuses a kind without a runner.
 */
import type { Engine } from './engine.ts';
import type { WorkerPool } from './pool.ts';
import type { ScanItem, ScanKind, ScanKinds, ScanOptions, ScanResult } from './protocol.ts';
import { runMap } from './scans/adaptive-map-scan.ts';
import { runStaircase } from './scans/staircase-scan.ts';
import { runPhaseMargin, runSoftLines } from './scans/point-tasks.ts';

/** A runner: one scan kind on the pool. */
export type ScanRunner<K extends ScanKind> = (
  pool: WorkerPool<Engine>, req: ScanKinds[K]['request'], o: ScanOptions<ScanItem<K>>,
) => Promise<ScanResult<K>>;

const RUNNERS: { [K in ScanKind]: ScanRunner<K> } = {
  map: runMap,
  staircase: runStaircase,
  'phase-margin': runPhaseMargin,
  'soft-lines': runSoftLines,
};

/**
 * Run one scan on the pool; resolves with its result, rejects with an AbortError on
 * o.signal (items already streamed to o.onItem are final) or with the error of a task
 * that the kind cannot report in its result.
 */
export function runScan<K extends ScanKind>(
  pool: WorkerPool<Engine>, req: ScanKinds[K]['request'] & { kind: K }, o: ScanOptions<ScanItem<K>> = {},
): Promise<ScanResult<K>> {
  const run = RUNNERS[req.kind] as ScanRunner<K>;
  return run(pool, req, o);
}

/**
 * Scans that are a list of independent worker tasks with nothing to join: the phase
 * margin of a point (one task) and soft-mode traces (one task a line request). Their
 * failures end the scan with the error, which names the request (the watchdog's too).
 */
import type { Engine } from '../engine.ts';
import type { WorkerPool } from '../pool.ts';
import type {
  PhaseMargin, PhaseMarginScanRequest, ScanItem, ScanOptions, SoftLinesScanRequest, SoftLinesScanResult,
} from '../protocol.ts';
import { DEFAULT_POINT_BUDGET_MS } from './map-scan.ts';

/** A phase margin solves about 200 points (the row and the bisections); its budget is theirs. */
const MARGIN_POINTS = 200;

/** The phase margin of one point, on a worker. */
export async function runPhaseMargin(pool: WorkerPool<Engine>, req: PhaseMarginScanRequest, o: ScanOptions<never> = {}): Promise<PhaseMargin> {
  const { kind: _kind, ...task } = req;
  const [r] = await pool.run([task], (remote, t) => remote.meanfield.phaseMargin(t), {
    signal: o.signal,
    budgetMs: MARGIN_POINTS * (o.pointBudgetMs ?? DEFAULT_POINT_BUDGET_MS),
    describe: (t) => `phase margin of ${JSON.stringify(t.params)}`,
    onProgress: o.onProgress,
  });
  return r;
}

/** A soft-mode trace costs at most a few thousand margin evaluations, each less than a point. */
const TRACE_POINTS = 1000;

/** Soft-mode traces, one task a line request, streamed as each finishes. */
export async function runSoftLines(
  pool: WorkerPool<Engine>, req: SoftLinesScanRequest, o: ScanOptions<ScanItem<'soft-lines'>> = {},
): Promise<SoftLinesScanResult> {
  const results = await pool.run(req.lines, (remote, t) => remote.spectrum.softLines(t), {
    signal: o.signal,
    budgetMs: TRACE_POINTS * (o.pointBudgetMs ?? DEFAULT_POINT_BUDGET_MS) / 10,
    describe: (t) => `soft-mode lines of range ${t.range}, phase ${JSON.stringify(t.phase)}, over ${t.x.name} x ${t.y.name} at ${JSON.stringify(t.base)}`,
    onResult: (result, index) => o.onItem?.({ index, result }),
    onProgress: o.onProgress,
  });
  return { results };
}

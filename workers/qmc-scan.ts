/**
 * A quantum Monte Carlo line scan on the worker pool (the CLI's qmc-scan; the page's
 * "check this boundary"): every run of the scan (qmc-scan-plan.ts) is started here first,
 * so bad input anywhere is refused before any work, then all runs are driven at once, their
 * chains sharing the pool's queue. Each finished run is streamed (onPoint); a run that
 * fails for another reason than cancellation is kept with its error, the others go on.
 * Results are those of the same runs made one by one (qmc-run.ts): bit for bit.
 */
import { InputError } from '../src/core/input-error.ts';
import { qmcGeometry, type QmcGeometry } from '../src/core/qmc/qmc-geometry.ts';
import { binderCrossings, type BinderCrossing } from '../src/core/qmc/binder-crossing.ts';
import type { Engine } from './engine.ts';
import type { QmcScanPoint, QmcScanRequest } from './protocol.ts';
import { abortError, type WorkerPool } from './pool.ts';
import { driveQmc, startQmc, type QmcRun } from './qmc-run.ts';
import { qmcScanTasks, type QmcScanTask } from './qmc-scan-plan.ts';

export interface QmcScanHooks {
  signal?: AbortSignal;
  /** Each finished run, in completion order. */
  onPoint?: (p: QmcScanPoint) => void;
  /** Runs finished of the total, after each. */
  onProgress?: (done: number, total: number) => void;
}

/** Start every run of the scan in this thread (InputError names the point that fails). */
export function startQmcScan(req: QmcScanRequest): { task: QmcScanTask; run: QmcRun }[] {
  const geometries = new Map<string, QmcGeometry>();
  return qmcScanTasks(req).map((task) => {
    const key = JSON.stringify(task.request.cluster);
    try {
      let g = geometries.get(key);
      if (!g) { g = qmcGeometry(task.request.cluster); geometries.set(key, g); }
      return { task, run: startQmc(task.request, g) };
    } catch (e) {
      if (e instanceof InputError) throw new InputError(`size ${task.size}, ${req.axis.name} = ${task.value}: ${e.message}`, e.field);
      throw e;
    }
  });
}

/** Run the scan (or its shard); resolves with its points in index order. */
export async function qmcScanOnPool(req: QmcScanRequest, pool: WorkerPool<Engine>, hooks: QmcScanHooks = {}): Promise<QmcScanPoint[]> {
  const runs = startQmcScan(req);
  const { signal } = hooks;
  let done = 0;
  hooks.onProgress?.(0, runs.length);
  const points = await Promise.all(runs.map(async ({ task, run }) => {
    const { index, size, ix, value } = task;
    let p: QmcScanPoint;
    try {
      p = { index, size, ix, value, result: await driveQmc(run, pool, { signal }) };
    } catch (e) {
      if (signal?.aborted) throw abortError(signal);
      p = { index, size, ix, value, error: e instanceof Error ? e.message : String(e) };
    }
    hooks.onPoint?.(p);
    hooks.onProgress?.(++done, runs.length);
    return p;
  }));
  return points;
}

/** The Binder crossings of consecutive sizes along the axis, from the scan's points. */
export function scanCrossings(points: readonly QmcScanPoint[]): BinderCrossing[] {
  const bySize = new Map<number, QmcScanPoint[]>();
  for (const p of points) bySize.set(p.size, [...(bySize.get(p.size) ?? []), p]);
  return binderCrossings([...bySize].map(([size, ps]) => ({
    size, x: ps.map((p) => p.value), binder: ps.map((p) => p.result?.binder ?? null),
  })));
}

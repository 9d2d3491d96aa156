/**
 * Running a scan from the command line: validate every point first (a bad point anywhere
 * is refused before any work starts), then hand the request to the scan driver
 * (workers/scan-driver.ts, the same path the page takes) with progress on stderr; Ctrl-C
 * stops it and hands back the points finished so far.
 */
import { lattice } from '../core/lattice/geometry.ts';
import { resolvePotential } from '../core/interaction/potential.ts';
import { validateModel } from '../core/model.ts';
import { InputError } from '../core/input-error.ts';
import { gridPoint, gridShape, type ScanPlan, type ScanPoint } from '../core/scan/grid.ts';
import { shardSegments, type Shard } from '../core/scan/shards.ts';
import { runScan } from '../../workers/scan-driver.ts';
import type { StaircaseResult } from '../../workers/protocol.ts';
import { int, num, type FlagSpec, type ParsedArgs } from './flags.ts';
import { interruptible, type CliIo } from './io.ts';
import { Progress } from './progress.ts';

export const SCAN_FLAGS: readonly FlagSpec[] = [
  { name: 'workers', kind: 'int', value: 'n', def: 'all cores', help: 'worker threads' },
  { name: 'cold', kind: 'bool', help: 'start every point from scratch (no continuation along x; for checks)' },
  { name: 'point-budget', kind: 'number', value: 'seconds', def: '120', help: 'watchdog: a point (or a run of them) past this many seconds each is stopped and reported in its row' },
];

/** Refuse the first point of the plan that the engine would refuse. */
export function validatePlan(plan: ScanPlan): void {
  const { nx, ny } = gridShape(plan);
  const l = lattice(plan.base.lattice);
  for (let iy = 0; iy < ny; iy++) {
    for (let ix = 0; ix < nx; ix++) {
      const p = gridPoint(plan, ix, iy);
      validateModel(p);
      resolvePotential(p.interaction, l);
    }
  }
}

/** --workers, checked (default: the machine's cores), capped at the number of tasks. */
export function workerCount(a: ParsedArgs, io: CliIo, tasks: number): number {
  const w = int(a, 'workers');
  if (w !== undefined && !(w >= 1 && w <= 256)) throw new InputError(`--workers must be 1..256, got ${w}`, 'workers');
  return Math.max(1, Math.min(w ?? io.defaultWorkers, tasks));
}

/** --point-budget in ms (undefined: the driver's default). */
export function pointBudgetMs(a: ParsedArgs): number | undefined {
  const s = num(a, 'point-budget');
  if (s === undefined) return undefined;
  if (!(s > 0 && s <= 1e6)) throw new InputError(`--point-budget must be in (0, 1e6] seconds, got ${s}`, 'point-budget');
  return s * 1000;
}

export interface ScanOutcome {
  points: ScanPoint[];
  /** Total the run should have produced. */
  total: number;
  complete: boolean;
  workers: number;
  seconds: number;
}

/** The footer of a scan's progress: workers, failed points, interruption. */
function footer(workers: number, points: readonly ScanPoint[], complete: boolean): string {
  const failed = points.filter((p) => p.error !== undefined).length;
  return ` on ${workers} worker${workers === 1 ? '' : 's'}${failed ? `, ${failed} point${failed === 1 ? '' : 's'} failed (see the error column)` : ''}${complete ? '' : ', interrupted'}`;
}

/** Run a map of the plan (or one shard) through the driver; on Ctrl-C resolve with the finished part. */
export async function scanWithProgress(io: CliIo, a: ParsedArgs, plan: ScanPlan, label: string, shard?: Shard, continuation = true): Promise<ScanOutcome> {
  const { nx, ny } = gridShape(plan);
  const segs = shardSegments(nx, ny, shard);
  const total = segs.reduce((s, g) => s + g.length, 0);
  const workers = workerCount(a, io, segs.length);
  const progress = new Progress(io, label, total);
  const finished: ScanPoint[] = [];
  if (total === 0) {
    progress.finish(0);
    return { points: [], total, complete: true, workers: 0, seconds: 0 };
  }
  const budget = pointBudgetMs(a);
  const { complete } = await interruptible(io, workers, (pool, signal) => runScan(pool, { kind: 'map', plan, shard, continuation }, {
    signal, pointBudgetMs: budget,
    onItem: (pt) => finished.push(pt),
    onProgress: (done) => progress.update(done),
  }));
  finished.sort((x, y) => x.index - y.index);
  progress.finish(finished.length, footer(workers, finished, complete));
  return { points: finished, total, complete, workers, seconds: progress.seconds };
}

/** Run a staircase (line, plateaus, edges) through the driver; null result when interrupted. */
export async function staircaseWithProgress(io: CliIo, a: ParsedArgs, plan: ScanPlan, gridEdges: boolean): Promise<{ points: ScanPoint[]; total: number; result: StaircaseResult | null }> {
  const total = plan.x.count;
  const workers = workerCount(a, io, Math.max(shardSegments(total, 1).length, 2));
  const progress = new Progress(io, 'staircase', total);
  const finished: ScanPoint[] = [];
  const r = await interruptible(io, workers, (pool, signal) => runScan(pool, { kind: 'staircase', plan, gridEdges }, {
    signal, pointBudgetMs: pointBudgetMs(a),
    onItem: (pt) => finished.push(pt),
    onProgress: (done) => progress.update(done),
  }));
  finished.sort((x, y) => x.index - y.index);
  progress.finish(finished.length, footer(workers, finished, r.complete));
  return { points: finished, total, result: r.complete ? r.value : null };
}

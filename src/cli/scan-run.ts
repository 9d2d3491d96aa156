/**
 * Running a scan from the command line: validate every point first (a bad point anywhere
 * is refused before any work starts), then run it in the worker pool with progress on
 * stderr; Ctrl-C stops it and hands back the points finished so far.
 */
import { lattice } from '../core/lattice/geometry.ts';
import { resolvePotential } from '../core/interaction/potential.ts';
import { validateModel } from '../core/model.ts';
import { InputError } from '../core/input-error.ts';
import { gridPoint, gridShape, segments, type ScanPlan } from '../core/scan/grid.ts';
import { shardSegments, type Shard } from '../core/scan/shards.ts';
import type { ScanPointResult } from '../../workers/protocol.ts';
import { runMeanFieldScan } from '../../workers/meanfield-scan.ts';
import { int, type FlagSpec, type ParsedArgs } from './flags.ts';
import { interruptible, type CliIo } from './io.ts';
import { Progress } from './progress.ts';

export const SCAN_FLAGS: readonly FlagSpec[] = [
  { name: 'workers', kind: 'int', value: 'n', def: 'all cores', help: 'worker threads' },
  { name: 'cold', kind: 'bool', help: 'start every point from scratch (no continuation along x; for checks)' },
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

/** --workers, checked (default: the machine's cores), capped at the number of segments. */
export function workerCount(a: ParsedArgs, io: CliIo, segmentsToRun: number): number {
  const w = int(a, 'workers');
  if (w !== undefined && !(w >= 1 && w <= 256)) throw new InputError(`--workers must be 1..256, got ${w}`, 'workers');
  return Math.max(1, Math.min(w ?? io.defaultWorkers, segmentsToRun));
}

export interface ScanOutcome {
  points: ScanPointResult[];
  /** Total the run should have produced. */
  total: number;
  complete: boolean;
  workers: number;
  seconds: number;
}

/** Run the plan (or one shard) in the pool; on Ctrl-C resolve with the finished part. */
export async function runScan(io: CliIo, a: ParsedArgs, plan: ScanPlan, label: string, shard?: Shard, continuation = true): Promise<ScanOutcome> {
  const { nx, ny } = gridShape(plan);
  const segs = shard ? shardSegments(nx, ny, shard) : segments(nx, ny);
  const total = segs.reduce((s, g) => s + g.length, 0);
  const workers = workerCount(a, io, segs.length);
  const progress = new Progress(io, label, total);
  const finished: ScanPointResult[] = [];
  if (total === 0) {
    progress.finish(0);
    return { points: [], total, complete: true, workers: 0, seconds: 0 };
  }
  const { complete } = await interruptible(io, workers, (pool, signal) => runMeanFieldScan(pool, plan, {
    shard, continuation, signal,
    onPoint: (pt) => finished.push(pt),
    onProgress: (done) => progress.update(done),
  }));
  finished.sort((x, y) => x.index - y.index);
  progress.finish(finished.length, ` on ${workers} worker${workers === 1 ? '' : 's'}${complete ? '' : ', interrupted'}`);
  return { points: finished, total, complete, workers, seconds: progress.seconds };
}

/**
 * The map (or line) scan on the pool: the plan's segments (src/core/scan/grid.ts), or one
 * shard's, go to the workers as runs with continuation; points stream back (onItem, in
 * completion order) with progress counted in points. Answers are fixed by the plan alone:
 * segments start cold and each point's seed derives from its index, so neither the worker
 * count, the order nor the sharding changes an answer. A point that cannot be solved comes
 * back with its error; a segment whose worker died or ran past its watchdog budget gives
 * each of its points not yet delivered that error, and the scan goes on.
 */
import { proxy } from 'comlink';
import { gridPoint, gridShape, pointSeed, spreadRows, type Segment } from '../../src/core/scan/grid.ts';
import { shardSegments } from '../../src/core/scan/shards.ts';
import type { Engine } from '../engine.ts';
import type { WorkerPool } from '../pool.ts';
import type { MapScanRequest, MapScanResult, PointOutcome, ScanOptions, ScanPoint } from '../protocol.ts';

/** Default watchdog budget of one point (ms): far above any point seen (~0.1 s in 2D), still finite. */
export const DEFAULT_POINT_BUDGET_MS = 120_000;

/** Run a map scan; resolves with every point of it (or of the shard) ordered by index. */
export async function runMapScan(pool: WorkerPool<Engine>, req: MapScanRequest, o: ScanOptions<ScanPoint> = {}): Promise<MapScanResult> {
  const { plan } = req;
  const { nx, ny } = gridShape(plan);
  let segs = req.segments ?? shardSegments(nx, ny, req.shard);
  if (req.order === 'spread') {
    const rank = new Map(spreadRows(ny).map((iy, r) => [iy, r]));
    segs = [...segs].sort((a, b) => (rank.get(a.iy) as number) - (rank.get(b.iy) as number) || a.ix0 - b.ix0);
  }
  const total = segs.reduce((a, s) => a + s.length, 0);
  const continuation = req.continuation ?? true;
  const delivered = new Map<number, ScanPoint>();
  // keepPoints false (streaming): only the indices, to drop a point that arrives twice
  const seen = o.keepPoints === false ? new Set<number>() : undefined;
  const deliver = (seg: Segment, i: number, r: PointOutcome) => {
    const ix = seg.ix0 + i, index = seg.iy * nx + ix;
    if (seen ? seen.has(index) : delivered.has(index)) return; // the run's return value and its callback may both carry it
    const pt: ScanPoint = { index, ix, iy: seg.iy, ...r };
    if (seen) seen.add(index);
    else delivered.set(index, pt);
    o.onItem?.(pt);
    o.onProgress?.(seen ? seen.size : delivered.size, total);
  };
  const pointBudget = o.pointBudgetMs ?? DEFAULT_POINT_BUDGET_MS;
  await pool.run(segs, async (remote, seg) => {
    const points = [], seeds = [];
    for (let i = 0; i < seg.length; i++) {
      points.push(gridPoint(plan, seg.ix0 + i, seg.iy));
      seeds.push(pointSeed(plan.seed, seg.iy * nx + seg.ix0 + i));
    }
    const onPoint = o.streamPoints ? proxy((i: number, r: PointOutcome) => deliver(seg, i, r)) : undefined;
    const out = await remote.meanfield.solveRun({ points, seeds, continuation }, onPoint);
    out.forEach((r, i) => deliver(seg, i, r));
    return out.length;
  }, {
    signal: o.signal,
    budgetMs: (seg) => seg.length * pointBudget,
    describe: (seg) => describeSegment(req, seg),
    recover: (e, _i, seg) => {
      const error = e.message.replace(/\s*\n\s*/g, ' ');
      for (let i = 0; i < seg.length; i++) deliver(seg, i, { error });
      return seg.length;
    },
  });
  return { points: [...delivered.values()].sort((a, b) => a.index - b.index) };
}

/** A segment in words: where it sits and the parameters of its first point. */
function describeSegment(req: MapScanRequest, seg: Segment): string {
  const { plan } = req;
  const at = (ix: number) => `${plan.x.name} = ${plan.x.values[ix]}`;
  const y = plan.y ? `, ${plan.y.name} = ${plan.y.values[seg.iy]}` : '';
  return `map points ix ${seg.ix0}..${seg.ix0 + seg.length - 1}, iy ${seg.iy} (${at(seg.ix0)} .. ${at(seg.ix0 + seg.length - 1)}${y}); ` +
    `first point ${JSON.stringify(gridPoint(plan, seg.ix0, seg.iy))}`;
}

/**
 * A map streamed to its output as it is computed: rows are written in point order (the
 * order of one uninterrupted run), through a reorder buffer of bounded size. The shard's
 * segments go to the driver a window at a time (runScan with `segments` and keepPoints
 * false), at most two windows in flight, so the pool always has work queued while no more
 * than 2 x WINDOW segments of finished points wait in the reorder buffer
 * (reorder-buffer.ts) for an earlier one: memory does not grow with the map. Before each
 * window the output must be ready (stdout drained), so a slow reader pauses the scan.
 * `--resume` first reads back the part on disk (resume.ts) and
 * computes only the missing points: a segment cut in the middle is computed again from its
 * start (continuation makes a point depend on the points before it in its segment) and its
 * points already written are dropped, so the file is byte for byte the uninterrupted one.
 * The adaptive map (map-adaptive.ts; not --dense) is one scan over whole rows (a shard's: its own pixels)
 * instead of windows: it hands back the rows of each band of 16 in point order, waiting
 * before each band for the output to be ready, and its figures and boundary lines close
 * the JSON (map-summary.ts) and go to --boundaries.
 */
import type { ScanPlan, ScanPoint } from '../core/scan/grid.ts';
import type { Shard } from '../core/scan/shards.ts';
import type { MapHeader } from '../formats/map-columns.ts';
import { runScan } from '../../workers/scan-driver.ts';
import type { ParsedArgs } from './flags.ts';
import { interruptible, type CliIo } from './io.ts';
import { mapLayout, type MapFormat } from './map-layout.ts';
import { Progress } from './progress.ts';
import { readyOrAborted, ReorderBuffer } from './reorder-buffer.ts';
import { readBack, startsCheck } from './resume.ts';
import { mapSummary, runAdaptiveRows, type MapMode } from './map-adaptive.ts';
import { boundariesCsv, solvesText, summaryJson } from './map-summary.ts';
import type { MapScanResult, ScanOptions } from '../../workers/protocol.ts';
import { pointBudgetMs, workerCount } from './scan-run.ts';
import { PointCursor, ShardSegments } from './shard-cursor.ts';
import type { OutputTarget } from './stream-writer.ts';

/** Segments a window holds per worker (a window is at least MIN_WINDOW segments). */
const WINDOW_PER_WORKER = 8;
const MIN_WINDOW = 16;

/** What a streamed map run did. */
export interface StreamedMap {
  /** Rows in the output now (read back and new). */
  written: number;
  /** Rows read back from the part being resumed. */
  resumed: number;
  /** Points of the map (or shard). */
  total: number;
  complete: boolean;
}

/** What to stream. */
export interface MapJob {
  plan: ScanPlan;
  shard?: Shard;
  header: MapHeader;
  format: MapFormat;
  continuation: boolean;
  label: string;
  /** Adaptive or dense, and why (map-adaptive.ts); its notes go to stderr and the JSON summary. */
  mode: MapMode;
  /** --boundaries: the file the boundary lines are written to (CSV) when the map completes. */
  boundaries?: string;
}

/** Run the map (or its shard) into `target`, continuing what is there when it holds a part. */
export async function streamMap(io: CliIo, a: ParsedArgs, job: MapJob, target: OutputTarget): Promise<StreamedMap> {
  const { nx, ny } = { nx: job.plan.x.count, ny: job.plan.y?.count ?? 1 };
  const segs = new ShardSegments(nx, ny, job.shard);
  const layout = mapLayout(job.header, job.format);
  let rows = 0, failed = 0, cursor = new PointCursor(segs);
  const existing = target.existing();
  if (existing) {
    const back = readBack(existing, layout, job.header, segs, target.name);
    startsCheck(back, job.plan, layout, target.name);
    target.keep(back.keepBytes);
    if (back.keepBytes === 0) target.write(layout.head);
    ({ rows, failed, cursor } = back);
  } else {
    target.write(layout.head);
  }
  const resumed = rows;
  const total = segs.points;
  const progress = new Progress(io, job.label, total);
  for (const n of job.mode.notes) io.stderr(`${job.label}: note: ${n}\n`);
  // the JSON summary of an unsharded map (a shard's part keeps the bare closing line merge reads)
  const summarise = (result: MapScanResult | null, computed: number, fromRow: number) => {
    const sum = mapSummary(job.mode, result, computed, fromRow);
    if (layout.format === 'json' && !job.shard) target.write(summaryJson(sum));
    if (job.boundaries) io.writeText(job.boundaries, boundariesCsv(job.plan, sum.boundaries ?? []));
    return sum;
  };
  // an adaptive map whose summary is written (JSON, --boundaries) is computed again from its
  // first row when resumed, rows already on disk dropped, so its lines and figures are the
  // uninterrupted run's (and the file its bytes); a CSV alone continues from its row
  const whole = job.mode.adaptive && !job.shard && (layout.format === 'json' || job.boundaries !== undefined);
  if (whole && resumed > 0) io.stderr(`${job.label}: note: resuming an adaptive map with its boundary lines: the ${resumed} points on disk are computed again (not written again) so that the lines and solves cover the whole map\n`);
  if (cursor.done && !whole) {
    summarise(null, total, 0);
    target.write(layout.tail(true));
    progress.finish(rows, resumed ? ', all read back from the part (nothing left to compute)' : '');
    return { written: rows, resumed, total, complete: true };
  }
  const left = whole ? segs.count : segs.count - cursor.j;
  const workers = workerCount(a, io, left);
  const window = Math.max(MIN_WINDOW, WINDOW_PER_WORKER * workers);
  const budget = pointBudgetMs(a);
  if (rows > 0) progress.update(rows);
  // rows wait as their text (not their states) until every earlier point is written
  const buffer = new ReorderBuffer<{ text: string; bad: boolean }>({ get key() { return cursor.point?.index; }, advance: () => cursor.advance() }, (row) => {
    target.write(layout.separator(rows) + row.text + '\n');
    rows++;
    if (row.bad) failed++;
  });
  const accept = (pt: ScanPoint) => {
    const at = cursor.point;
    if (!at || pt.index < at.index) return; // written before (a resumed segment's head)
    buffer.put(pt.index, { text: layout.row(pt), bad: pt.error !== undefined });
    // progress counts the rows written (what an interruption keeps), not those waiting
    if (rows > 0) progress.update(rows);
  };
  const fromRow = whole ? 0 : cursor.point?.iy ?? 0;
  let adaptive: MapScanResult | null = null;
  const run = await interruptible(io, workers, async (pool, signal) => {
    if (job.mode.adaptive) {
      // one scan over whole rows: it hands back a band of rows at a time in point order
      // before each band the output must be ready (stdout drained), as before each window below
      const opts: ScanOptions<ScanPoint> & { signal: AbortSignal; onItem: (pt: ScanPoint) => void } = {
        signal, pointBudgetMs: budget, onItem: accept, ready: () => readyOrAborted(target, signal),
      };
      adaptive = await runAdaptiveRows(pool, job.plan, fromRow, job.continuation, opts, job.shard);
      return;
    }
    const stop = new AbortController();
    const onAbort = () => stop.abort(signal.reason);
    if (signal.aborted) onAbort();
    else signal.addEventListener('abort', onAbort, { once: true });
    let firstError: unknown;
    const inFlight: Promise<void>[] = [];
    try {
      for (let j = cursor.j; j < segs.count && firstError === undefined;) {
        await readyOrAborted(target, stop.signal); // a slow reader of stdout pauses the scan (backpressure), not memory
        if (stop.signal.aborted) break;
        const part = [];
        for (let t = 0; t < window && j < segs.count; t++, j++) part.push(segs.at(j));
        inFlight.push(runScan(pool, { kind: 'map', plan: job.plan, segments: part, continuation: job.continuation }, {
          signal: stop.signal, pointBudgetMs: budget, keepPoints: false, onItem: accept,
        }).then(() => undefined, (e: unknown) => {
          firstError ??= e;
          stop.abort(e);
        }));
        if (inFlight.length >= 2) await inFlight.shift();
      }
      await Promise.all(inFlight);
      if (firstError !== undefined) throw firstError;
      if (stop.signal.aborted) throw stop.signal.reason; // stopped while waiting for the output
    } finally {
      signal.removeEventListener('abort', onAbort);
    }
  });
  const sum = run.complete ? summarise(adaptive, total, fromRow) : null;
  target.write(layout.tail(run.complete));
  const w = ` on ${workers} worker${workers === 1 ? '' : 's'}${sum ? `; ${solvesText(sum, total)}` : ''}`;
  progress.finish(rows, `${w}${resumed ? ` (${resumed} read back)` : ''}${failed ? `, ${failed} point${failed === 1 ? '' : 's'} failed (see the error column)` : ''}${run.complete ? '' : ', interrupted'}`);
  return { written: rows, resumed, total, complete: run.complete };
}

/**
 * `qmc-scan` streamed and resumable: each run's row is written as soon as it and every run
 * before it (in index order) have finished, through the reorder buffer (row-stream.ts).
 * CSV: [shard tag] + header, one row a run (the bytes of qmcScanCsv). JSON: a streamed
 * document, one point a line, the Binder crossings (they need every point) in the closing
 * line:
 *
 *     {"axis":{...},"sizes":[...],"shard":null,"params":{...},"points":[
 *     {"index":0,...}
 *     ,{"index":1,...}
 *     ],"crossings":[...],"complete":true}
 *
 * --resume reads back the part on disk: its head must be this scan's (the JSON head holds
 * the axis, sizes, shard and every parameter; the CSV's tag and columns), every row must be
 * the run expected there (index, size, axis value), a torn last line and the closing line
 * are dropped; only the runs after the last row are computed (each run's seed depends only
 * on its size and axis index, so a run gives the same bits alone or beside others). What is
 * kept of each run is what the crossings need (size, axis value, Binder cumulant).
 */
import { readBackRows } from './row-resume.ts';
import { binderCrossings, type BinderCrossing } from '../core/qmc/binder-crossing.ts';
import { parseCsvLine } from '../formats/csv.ts';
import type { QmcScanPoint, QmcScanRequest } from '../../workers/protocol.ts';
import { driveQmc } from '../../workers/qmc-run.ts';
import { startQmcScan } from '../../workers/qmc-scan.ts';
import { abortError } from '../../workers/pool.ts';
import { interruptible, type CliIo } from './io.ts';
import type { LineReader } from './line-reader.ts';
import { Progress } from './progress.ts';
import { crossingLine, crossingsJson, qmcScanCsvHead, qmcScanCsvRow, qmcScanJsonFields, qmcScanJsonPoint } from './qmc-scan-format.ts';
import { foreign } from './resume.ts';
import { jsonDocHead, jsonDocTail, TaskRows } from './row-stream.ts';
import type { OutputTarget } from './stream-writer.ts';

type Estimate = { value: number; error: number };
/** What the crossings need of a run. */
interface Kept { size: number; value: number; binder: Estimate | null; failed: boolean }

/** The Binder crossings of consecutive sizes (as scanCrossings of workers/qmc-scan.ts, from kept runs in index order). */
export function keptCrossings(kept: readonly Kept[]): BinderCrossing[] {
  const bySize = new Map<number, Kept[]>();
  for (const k of kept) {
    const list = bySize.get(k.size);
    if (list) list.push(k);
    else bySize.set(k.size, [k]);
  }
  return binderCrossings([...bySize].map(([size, ks]) => ({ size, x: ks.map((k) => k.value), binder: ks.map((k) => k.binder) })));
}

function keep(p: QmcScanPoint): Kept {
  const b = p.result?.binder;
  return { size: p.size, value: p.value, binder: b ? { value: b.value, error: b.error } : null, failed: p.error !== undefined };
}

/** The expected runs, by rank: index, size, axis value. */
type Expected = readonly { index: number; size: number; value: number }[];

/** Read back a part (row-resume.ts): the runs it holds (in order) and the bytes to keep. */
export function readBackQmc(lines: LineReader, head: string, json: boolean, runs: Expected, name: string): { kept: Kept[]; keepBytes: number } {
  const columns = json ? [] : head.trimEnd().split('\n').slice(-1)[0].split(',');
  const bCol = columns.indexOf('binder'), eCol = columns.indexOf('binderError'), errCol = columns.indexOf('error');
  const back = readBackRows(lines, head, json, runs.length, name, (row, rank, lineNo): Kept => {
    const want = runs[rank];
    let got: { index: unknown; size: unknown; value: unknown }, k: Kept;
    if (json) {
      const o = row as Record<string, unknown>;
      got = { index: o.index, size: o.size, value: o.value };
      const b = o.binder as Estimate | null | undefined;
      k = { size: want.size, value: want.value, binder: b ? { value: b.value, error: b.error } : null, failed: o.error !== undefined };
    } else {
      const f = parseCsvLine(row as string);
      if (!f || f.length !== columns.length) throw foreign(name, lineNo, `${f ? f.length : 'unreadable'} fields, the header ${columns.length}`);
      got = { index: Number(f[0]), size: Number(f[1]), value: Number(f[2]) };
      k = { size: want.size, value: want.value, binder: f[bCol] === '' ? null : { value: Number(f[bCol]), error: Number(f[eCol]) }, failed: f[errCol] !== '' };
    }
    if (got.index !== want.index || got.size !== want.size || got.value !== want.value) {
      throw foreign(name, lineNo, `run (index ${String(got.index)}, size ${String(got.size)}, value ${String(got.value)}), expected (index ${want.index}, size ${want.size}, value ${want.value})`);
    }
    return k;
  });
  return { kept: back.items, keepBytes: back.ends.length ? back.ends[back.ends.length - 1] : back.headBytes };
}

/** Run the scan (its shard) into `target`, continuing the part there, on a pool of `pool.size` engines (`pool.workers` in the footer). */
export async function streamQmcScan(io: CliIo, req: QmcScanRequest, pool: { size: number; workers: number }, json: boolean, label: string, target: OutputTarget): Promise<{ complete: boolean; written: number; total: number }> {
  const runs = startQmcScan(req); // every run checked before any work (and before the file is touched)
  const head = json ? jsonDocHead(qmcScanJsonFields(req), 'points') : qmcScanCsvHead(req);
  const expected = runs.map(({ task }) => ({ index: task.index, size: task.size, value: task.value }));
  let kept: Kept[] = [];
  const existing = target.existing();
  if (existing) {
    const back = readBackQmc(existing, head, json, expected, target.name);
    target.keep(back.keepBytes);
    if (back.keepBytes === 0) target.write(head);
    kept = back.kept;
  } else {
    target.write(head);
  }
  const resumed = kept.length, total = runs.length;
  const rank = new Map(runs.map(({ task }, r) => [task.index, r]));
  const rows = new TaskRows<QmcScanPoint>(target, resumed, total, (p) => {
    kept.push(keep(p));
    return [json ? JSON.stringify(qmcScanJsonPoint(p)) : qmcScanCsvRow(p)];
  }, json, resumed);
  const progress = new Progress(io, label, total, 'runs');
  let finished = resumed;
  if (resumed) progress.update(resumed);
  const run = resumed === total ? { complete: true as const } : await interruptible(io, pool.size, async (engines, signal) => {
    await Promise.all(runs.slice(resumed).map(async ({ task, run: r }) => {
      const { index, size, ix, value } = task;
      let p: QmcScanPoint;
      try {
        p = { index, size, ix, value, result: await driveQmc(r, engines, { signal }) };
      } catch (e) {
        if (signal.aborted) throw abortError(signal);
        p = { index, size, ix, value, error: e instanceof Error ? e.message : String(e) };
      }
      rows.put(rank.get(index) as number, p);
      progress.update(++finished);
    }));
  });
  const failed = kept.filter((k) => k.failed).length;
  progress.finish(finished, ` on ${pool.workers} worker(s)${resumed ? ` (${resumed} read back)` : ''}${failed ? `, ${failed} failed (see the error column)` : ''}${run.complete ? '' : ', interrupted'}`);
  const crossings = keptCrossings(kept);
  io.stderr(crossingLine(req, crossings));
  if (json) target.write(jsonDocTail({ crossings: crossingsJson(crossings), complete: run.complete }));
  return { complete: run.complete, written: rows.tasksDone, total };
}

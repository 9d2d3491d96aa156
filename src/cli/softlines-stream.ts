/**
 * `softlines` streamed: each (range, phase) task's soft-mode lines are written as soon as it
 * and every task before it have finished, in task order (ranges outer, phases inner),
 * through the reorder buffer (row-stream.ts). CSV: the header, then one row a line point
 * (the same bytes as the earlier whole-output writer, softlinesCsv). JSON: a streamed
 * document, one task's result a line:
 *
 *     {"params":{...},"x":{...},"y":{...},"tol":0.001,"results":[
 *     {"range":"nn","phase":"condensate","evaluations":371,"lines":[...]}
 *     ,{...}
 *     ],"complete":true}
 *
 * No --resume: a task writes any number of rows (none when its phase never goes soft) and
 * the CSV names neither the scan nor the task count, so a part cut short cannot say which
 * tasks it finished; the tasks are few and each takes seconds.
 */
import type { ModelParams } from '../core/model.ts';
import { paramsJson } from '../core/scan/map-columns.ts';
import { csvLine, type Cell } from '../core/scan/csv.ts';
import type { PlaneAxis } from '../core/softmode/plane.ts';
import type { SoftLineRequest, SoftLineResult } from '../core/softmode/soft-lines.ts';
import { runScan } from '../../workers/scan-driver.ts';
import type { ParsedArgs } from './flags.ts';
import { interruptible, type CliIo } from './io.ts';
import { Progress } from './progress.ts';
import { jsonDocHead, jsonDocTail, TaskRows } from './row-stream.ts';
import { pointBudgetMs, workerCount } from './scan-run.ts';
import type { OutputTarget } from './stream-writer.ts';

/** The CSV header (1D: one wavevector column k; 2D: kx, ky). */
export function softlinesHead(oneD: boolean): string {
  return oneD ? 'range,phase,line,point,x,y,k,kind,jump' : 'range,phase,line,point,x,y,kx,ky,kind,jump';
}

/** One task's CSV rows, one a line point (quoted by the one CSV writer: a phase such as crystal:1,0 stays one field). */
export function softlineRows(r: SoftLineResult): string[] {
  const rows: string[] = [];
  const g = (v: number) => Number(v.toPrecision(12));
  r.lines.forEach((L, li) => L.points.forEach((p, i) => {
    const k: Cell[] = typeof p.k === 'number' ? [g(p.k)] : [g(p.k[0]), g(p.k[1])];
    rows.push(csvLine([r.range, r.phase, li, i, g(p.x), g(p.y), ...k, p.kind, p.jump ? 1 : 0]));
  }));
  return rows;
}

/** The whole CSV of finished results at once (the reference the stream must equal). */
export function softlinesCsv(results: SoftLineResult[], oneD: boolean): string {
  return [softlinesHead(oneD), ...results.flatMap((r) => softlineRows(r))].join('\n') + '\n';
}

/** What to trace. */
export interface SoftlinesJob {
  tasks: SoftLineRequest[];
  base: ModelParams;
  x: PlaneAxis;
  y: PlaneAxis;
  tol: number;
  json: boolean;
}

/** Run the tasks on the pool into `target`, in task order. */
export async function streamSoftlines(io: CliIo, a: ParsedArgs, job: SoftlinesJob, target: OutputTarget): Promise<{ complete: boolean; written: number; total: number }> {
  const { tasks, json } = job;
  const oneD = job.base.lattice === 'chain';
  target.write(json ? jsonDocHead({ params: paramsJson(job.base), x: job.x, y: job.y, tol: job.tol }, 'results') : softlinesHead(oneD) + '\n');
  const rows = new TaskRows<SoftLineResult>(target, 0, tasks.length, (r) => (json ? [JSON.stringify(r)] : softlineRows(r)), json);
  const progress = new Progress(io, 'softlines', tasks.length, 'lines');
  let finished = 0, evaluations = 0;
  const { complete } = await interruptible(io, workerCount(a, io, tasks.length), (pool, signal) =>
    runScan(pool, { kind: 'soft-lines', lines: tasks }, {
      signal, pointBudgetMs: pointBudgetMs(a),
      onItem: ({ index, result }) => {
        finished++;
        evaluations += result.evaluations;
        rows.put(index, result);
      },
      onProgress: (d) => progress.update(d),
    }));
  progress.finish(finished, `, ${evaluations} margin evaluations`);
  if (json) target.write(jsonDocTail({ complete }));
  return { complete, written: rows.tasksDone, total: tasks.length };
}

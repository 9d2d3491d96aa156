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
 * --resume reads back the part (row-resume.ts: its head, a torn last line and the JSON
 * closing line dropped) and computes only the tasks after those it holds. A JSON part
 * holds one task a line, checked to be that task (range and phase): every whole line is a
 * finished task. A CSV part has only its columns for a head and a task writes any number
 * of rows (none when its phase never goes soft), so each row is checked to follow the
 * task order (range and phase, line and point counting up from 0, 0) and the last task
 * with rows on disk is dropped and traced again (it may have been cut short); the tasks
 * before it are finished (rows are written in task order).
 */
import type { ModelParams } from '../core/model.ts';
import { paramsJson } from '../formats/map-columns.ts';
import { csvLine, parseCsvLine, type Cell } from '../formats/csv.ts';
import { phaseName } from '../core/softmode/own-solution.ts';
import type { PlaneAxis } from '../core/softmode/plane.ts';
import type { SoftLineRequest, SoftLineResult } from '../core/softmode/soft-lines.ts';
import { runScan } from '../../workers/scan-driver.ts';
import type { ParsedArgs } from './flags.ts';
import { interruptible, type CliIo } from './io.ts';
import { Progress } from './progress.ts';
import { foreign } from './resume.ts';
import { readBackRows } from './row-resume.ts';
import { jsonDocHead, jsonDocTail, TaskRows } from './row-stream.ts';
import { pointBudgetMs, workerCount } from './scan-run.ts';
import type { LineReader } from './line-reader.ts';
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

/** What a part holds: the tasks finished (0..tasks-1), the rows they wrote, the bytes to keep. */
export interface SoftlinesBack { tasks: number; rows: number; keepBytes: number }

/** Read back a part of `tasks` (see the module comment); `name` names it in messages. */
export function readBackSoftlines(lines: LineReader, head: string, json: boolean, tasks: readonly SoftLineRequest[], name: string): SoftlinesBack {
  const want = tasks.map((t) => ({ range: t.range, phase: phaseName(t.phase) }));
  if (json) {
    const back = readBackRows(lines, head, true, tasks.length, name, (row, i, lineNo) => {
      const r = row as { range?: unknown; phase?: unknown };
      if (r.range !== want[i].range || r.phase !== want[i].phase) {
        throw foreign(name, lineNo, `range ${String(r.range)}, phase ${String(r.phase)}; expected range ${want[i].range}, phase ${want[i].phase}`);
      }
      return i;
    });
    return { tasks: back.items.length, rows: back.items.length, keepBytes: back.ends.at(-1) ?? back.headBytes };
  }
  const columns = head.trimEnd().split(',').length;
  // the task of each row: the current one continued (next point, or a later line from point 0), or a later one from 0, 0
  let task = -1, line = 0, point = 0;
  const back = readBackRows(lines, head, false, Infinity, name, (row, _i, lineNo) => {
    const f = parseCsvLine(row as string);
    if (!f || f.length !== columns) throw foreign(name, lineNo, `${f ? f.length : 'unreadable'} fields, the header ${columns}`);
    const [range, phase] = f;
    const li = Number(f[2]), pi = Number(f[3]);
    const same = task >= 0 && want[task].range === range && want[task].phase === phase;
    if (same && ((li === line && pi === point + 1) || (li > line && pi === 0))) {
      [line, point] = [li, pi];
      return task;
    }
    let next = task + 1;
    while (next < want.length && !(want[next].range === range && want[next].phase === phase)) next++;
    if (next >= want.length || li !== 0 || pi !== 0) {
      throw foreign(name, lineNo, `range ${range}, phase ${phase}, line ${f[2]}, point ${f[3]} does not follow the tasks in order`);
    }
    [task, line, point] = [next, 0, 0];
    return task;
  });
  // rows of the last task on disk (it may be cut short) are dropped and traced again
  const last = back.items.at(-1);
  if (last === undefined) return { tasks: 0, rows: 0, keepBytes: back.headBytes };
  const firstOfLast = back.items.indexOf(last);
  return { tasks: last, rows: firstOfLast, keepBytes: firstOfLast > 0 ? back.ends[firstOfLast - 1] : back.headBytes };
}

/** Run the tasks on the pool into `target`, in task order, continuing the part there. */
export async function streamSoftlines(io: CliIo, a: ParsedArgs, job: SoftlinesJob, target: OutputTarget): Promise<{ complete: boolean; written: number; total: number }> {
  const { tasks, json } = job;
  const oneD = job.base.lattice === 'chain';
  const head = json ? jsonDocHead({ params: paramsJson(job.base), x: job.x, y: job.y, tol: job.tol }, 'results') : softlinesHead(oneD) + '\n';
  let first = 0, rowsBefore = 0;
  const existing = target.existing();
  if (existing) {
    const back = readBackSoftlines(existing, head, json, tasks, target.name);
    target.keep(back.keepBytes);
    if (back.keepBytes === 0) target.write(head);
    ({ tasks: first, rows: rowsBefore } = back);
  } else {
    target.write(head);
  }
  const rows = new TaskRows<SoftLineResult>(target, first, tasks.length, (r) => (json ? [JSON.stringify(r)] : softlineRows(r)), json, rowsBefore);
  const progress = new Progress(io, 'softlines', tasks.length, 'lines');
  let finished = first, evaluations = 0;
  if (first) progress.update(first);
  const { complete } = first === tasks.length ? { complete: true } : await interruptible(io, workerCount(a, io, tasks.length - first), (pool, signal) =>
    runScan(pool, { kind: 'soft-lines', lines: tasks.slice(first) }, {
      signal, pointBudgetMs: pointBudgetMs(a),
      onItem: ({ index, result }) => {
        finished++;
        evaluations += result.evaluations;
        rows.put(first + index, result);
      },
      onProgress: (d) => progress.update(first + d),
    }));
  progress.finish(finished, `, ${evaluations} margin evaluations${first ? ` (${first} read back)` : ''}`);
  if (json) target.write(jsonDocTail({ complete }));
  return { complete, written: rows.tasksDone, total: tasks.length };
}

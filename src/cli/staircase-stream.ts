/**
 * The staircase streamed: its scan points go to the output as they finish, in mu order
 * (task rows through the reorder buffer, row-stream.ts), and the plateaus, which need the
 * whole line and its bisected edges, close the document at the end:
 *
 *     {"params":{...},"points":[
 *     {<state at the first mu>}
 *     ,{"mu":...,"error":"..."}
 *     ],"plateaus":[...],"complete":true}
 *
 * (the keys of the earlier one-line document, in streaming order; a failed point is
 * { mu, error }). The text output is the plateau table for people: nothing to stream, it is
 * written at the end, keeping of the points only their notes and failures.
 *
 * --resume (JSON only: a table has nothing on disk to continue) reads back the points of
 * the part (row-resume.ts: the head with every parameter, each point's mu the grid's at
 * its place, a torn last line and the closing line dropped), computes the line from the
 * start of the segment holding the first missing point (continuation makes a point depend
 * on those before it in its segment; the points recomputed before the cut are not written
 * again), then the plateaus and their edges from every state, read back or new
 * (staircasePlateaus, the second half of the staircase scan): the bytes of one uninterrupted run.
 */
import type { ScanPlan, ScanPoint } from '../core/scan/grid.ts';
import { paramsJson } from '../formats/map-columns.ts';
import type { Plateau } from '../core/meanfield/plateaus.ts';
import type { SolveResult } from '../core/meanfield/ground-state.ts';
import { shardSegments } from '../core/scan/shards.ts';
import { EDGE_TOL, staircasePlateaus } from '../../workers/scans/staircase-scan.ts';
import { runScan } from '../../workers/scan-driver.ts';
import type { ParsedArgs } from './flags.ts';
import { interruptible, type CliIo } from './io.ts';
import { Progress } from './progress.ts';
import { foreign } from './resume.ts';
import { readBackRows } from './row-resume.ts';
import { jsonDocHead, jsonDocTail, TaskRows } from './row-stream.ts';
import { pointBudgetMs, workerCount } from './scan-run.ts';
import { stateNotes } from './state-format.ts';
import type { OutputTarget } from './stream-writer.ts';

/** What a streamed staircase did (points written or kept, of the line's). */
export interface StreamedStaircase {
  complete: boolean;
  written: number;
  total: number;
}

const f = (x: number) => Number(x.toPrecision(10)).toString();

/** A point line read back: the point at rank i of the line, its mu the grid's there. */
function pointBack(plan: ScanPlan, name: string) {
  return (row: unknown, i: number, lineNo: number): ScanPoint => {
    const o = row as Record<string, unknown>;
    if (o.mu !== plan.x.values[i]) throw foreign(name, lineNo, `mu ${String(o.mu)}, expected ${plan.x.values[i]}`);
    if (typeof o.error === 'string') return { index: i, ix: i, iy: 0, error: o.error };
    if (typeof o.phase !== 'string') throw foreign(name, lineNo, 'neither a state nor an error');
    return { index: i, ix: i, iy: 0, state: o as unknown as SolveResult };
  };
}

/** Run the staircase of `plan` into `target` (JSON document or the text table), continuing a JSON part there. */
export async function streamStaircase(io: CliIo, a: ParsedArgs, plan: ScanPlan, gridEdges: boolean, json: boolean, target: OutputTarget): Promise<StreamedStaircase> {
  const total = plan.x.count;
  const segs = shardSegments(total, 1);
  const workers = workerCount(a, io, Math.max(segs.length, 2));
  const progress = new Progress(io, 'staircase', total);
  const notes = new Set<string>();
  const failures: string[] = [];
  // the seed too: it fixes the random starts, so a part of another seed is another scan
  const head = jsonDocHead({ params: paramsJson(plan.base), seed: plan.seed }, 'points');
  // every point of the line by index: read back, then computed
  const points: ScanPoint[] = new Array(total);
  let resumed = 0;
  const existing = target.existing();
  if (existing) {
    const back = readBackRows(existing, head, true, total, target.name, pointBack(plan, target.name));
    target.keep(back.ends.at(-1) ?? back.headBytes);
    if (back.headBytes === 0) target.write(head);
    back.items.forEach((p, i) => (points[i] = p));
    resumed = back.items.length;
  } else if (json) {
    target.write(head);
  }
  const rows = new TaskRows<ScanPoint>(target, resumed, total, (p) => {
    if (p.error !== undefined) {
      failures.push(`note: mu = ${f(plan.x.values[p.ix])} could not be solved: ${p.error}\n`);
    } else if (p.state && !json) {
      for (const n of stateNotes(plan.base, p.state)) notes.add(n);
    }
    return json ? [JSON.stringify(p.state ?? { mu: plan.x.values[p.ix], error: p.error })] : [];
  }, json, resumed);
  // the segment holding the first missing point is computed from its start
  const from = segs.findIndex((s) => s.ix0 + s.length > resumed);
  const start = from < 0 ? total : segs[from].ix0;
  let finished = resumed;
  if (resumed) progress.update(resumed);
  const budget = pointBudgetMs(a);
  const r = await interruptible(io, workers, async (pool, signal) => {
    if (from >= 0) {
      await runScan(pool, { kind: 'map', plan, segments: segs.slice(from), dense: true }, {
        signal, pointBudgetMs: budget, keepPoints: false,
        onItem: (pt) => {
          if (pt.index < resumed) return; // read back: kept as it is on disk
          points[pt.index] = pt;
          finished++;
          rows.put(pt.ix, pt);
        },
        onProgress: (done) => progress.update(start + done),
      });
    }
    return staircasePlateaus(pool, { kind: 'staircase', plan, gridEdges }, points, { signal, pointBudgetMs: budget });
  });
  const result = r.complete ? r.value : null;
  const written = rows.tasksDone;
  const failed = points.filter((p) => p?.error !== undefined).length;
  progress.finish(finished, ` on ${workers} worker${workers === 1 ? '' : 's'}${resumed ? ` (${resumed} read back)` : ''}${failed ? `, ${failed} point${failed === 1 ? '' : 's'} failed (see the error column)` : ''}${r.complete ? '' : ', interrupted'}`);
  for (const e of result?.edgeErrors ?? []) io.stderr(`staircase: an edge bisection failed, grid edges kept: ${e}\n`);
  const plateaus = result?.plateaus ?? null;
  if (json) target.write(jsonDocTail({ plateaus, complete: r.complete }));
  else target.write(staircaseText(plan, written, plateaus, r.complete && (result?.refined ?? false), [...notes], failures));
  return { complete: r.complete, written, total };
}

/** The plateau table for people (`written` points finished in order when interrupted). */
function staircaseText(plan: ScanPlan, written: number, plateaus: Plateau[] | null, refined: boolean, notes: string[], failures: string[]): string {
  const x = plan.x;
  const head = `mu ${f(x.start)} .. ${f(x.stop)} in ${x.count} points; edges ${refined ? `bisected to ${EDGE_TOL}` : 'at grid points (within one step)'}\n`;
  if (!plateaus) return head + `scan interrupted: ${written} of ${x.count} points finished, no plateaus computed\n`;
  const rows = plateaus.map((p) => [p.fraction, p.openLow ? `<= ${f(p.muLow)}` : f(p.muLow), p.openHigh ? `>= ${f(p.muHigh)}` : f(p.muHigh),
    p.openLow || p.openHigh ? `>= ${f(p.width)}` : f(p.width), String(p.points)]);
  const table = [['fraction', 'muLow', 'muHigh', 'width', 'points'], ...rows];
  const w = table[0].map((_, j) => Math.max(...table.map((r) => r[j].length)));
  return head + table.map((r) => r.map((c, j) => c.padEnd(w[j])).join('  ').trimEnd() + '\n').join('') +
    (plateaus.length === 0 ? 'no plateau in this range\n' : '') + notes.map((n) => `note: ${n}\n`).join('') + failures.join('');
}

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
 * written at the end, keeping of the points only their notes and failures. No --resume:
 * the plateaus and their edges come from the whole line in one run.
 */
import type { ScanPlan, ScanPoint } from '../core/scan/grid.ts';
import { paramsJson } from '../core/scan/map-columns.ts';
import type { Plateau } from '../core/meanfield/plateaus.ts';
import { shardSegments } from '../core/scan/shards.ts';
import { EDGE_TOL } from '../../workers/scans/staircase-scan.ts';
import { runScan } from '../../workers/scan-driver.ts';
import type { ParsedArgs } from './flags.ts';
import { interruptible, type CliIo } from './io.ts';
import { Progress } from './progress.ts';
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

/** Run the staircase of `plan` into `target` (JSON document or the text table). */
export async function streamStaircase(io: CliIo, a: ParsedArgs, plan: ScanPlan, gridEdges: boolean, json: boolean, target: OutputTarget): Promise<StreamedStaircase> {
  const total = plan.x.count;
  const workers = workerCount(a, io, Math.max(shardSegments(total, 1).length, 2));
  const progress = new Progress(io, 'staircase', total);
  const notes = new Set<string>();
  const failures: string[] = [];
  let failed = 0;
  if (json) target.write(jsonDocHead({ params: paramsJson(plan.base) }, 'points'));
  const rows = new TaskRows<ScanPoint>(target, 0, total, (p) => {
    if (p.error !== undefined) {
      failures.push(`note: mu = ${f(plan.x.values[p.ix])} could not be solved: ${p.error}\n`);
    } else if (p.state && !json) {
      for (const n of stateNotes(plan.base, p.state)) notes.add(n);
    }
    return json ? [JSON.stringify(p.state ?? { mu: plan.x.values[p.ix], error: p.error })] : [];
  }, json);
  let finished = 0;
  const r = await interruptible(io, workers, (pool, signal) => runScan(pool, { kind: 'staircase', plan, gridEdges }, {
    signal, pointBudgetMs: pointBudgetMs(a),
    onItem: (pt) => {
      finished++;
      if (pt.error !== undefined) failed++;
      rows.put(pt.ix, pt);
    },
    onProgress: (done) => progress.update(done),
  }));
  const result = r.complete ? r.value : null;
  const written = rows.tasksDone;
  progress.finish(finished, ` on ${workers} worker${workers === 1 ? '' : 's'}${failed ? `, ${failed} point${failed === 1 ? '' : 's'} failed (see the error column)` : ''}${r.complete ? '' : ', interrupted'}`);
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

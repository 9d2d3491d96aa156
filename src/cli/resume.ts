/**
 * `--resume`: read back what an interrupted run of the same map wrote, to continue it.
 * The file must start with exactly the head this run would write (for a shard's CSV and
 * any JSON that includes the scan's fingerprint or its parameters; an unsharded CSV has
 * only its columns), and every row must be the point this run writes there (its grid
 * position and axis values). A torn last line (no line end: the process died mid-write)
 * is dropped, as is the `],"complete":false}` that closes a JSON part stopped by a signal.
 * A line that is complete but not the expected row is refused: the file is another scan's.
 * The head of an unsharded CSV holds no model parameters, so a few points are solved again
 * and must be the same lines (startsCheck): a part of a scan with another interaction or
 * detuning is refused there too, wherever its values differ at those points.
 */
import { InputError } from '../core/input-error.ts';
import { csvField, parseCsvLine } from '../formats/csv.ts';
import { mapColumns, type MapHeader } from '../formats/map-columns.ts';
import type { LineReader } from './line-reader.ts';
import type { MapLayout } from './map-layout.ts';
import { PointCursor, type ShardSegments } from './shard-cursor.ts';
import { gridPoint, pointSeed, type ScanPlan } from '../core/scan/grid.ts';
import { solveGroundState, type SolveResult } from '../core/meanfield/ground-state.ts';

/** What is on disk: the rows to keep, the bytes they end at, and a cursor at the first missing point. */
export interface ReadBack {
  rows: number;
  keepBytes: number;
  cursor: PointCursor;
  /** Rows among them that carry an error. */
  failed: number;
  /** Lines of the points that open a segment (JSON without the leading comma), with their points. */
  starts: Array<{ text: string; line: number; ix: number; iy: number; index: number }>;
}

/** A file that does not continue this scan, naming the line and why. */
export function foreign(name: string, line: number, why: string): InputError {
  return new InputError(`${name} line ${line} does not continue this scan (${why}): give another --out or run without --resume`, 'resume');
}

/** Read back an existing part (see the module comment); `name` names it in messages. */
export function readBack(lines: LineReader, layout: MapLayout, h: MapHeader, segs: ShardSegments, name: string): ReadBack {
  const cursor = new PointCursor(segs);
  const result: ReadBack = { rows: 0, keepBytes: 0, cursor, failed: 0, starts: [] };
  try {
    let head = '', headBytes = 0;
    for (let i = 0; i < layout.headLines; i++) {
      const l = lines.next();
      if (!l || !l.ended) return result; // torn inside the head: nothing was done
      head += l.text + '\n';
      headBytes += l.bytes;
    }
    if (head !== layout.head) {
      const mine = layout.head.split('\n'), theirs = head.split('\n');
      const d = theirs.findIndex((t, i) => t !== mine[i]);
      throw foreign(name, d + 1, `its header differs from this scan's: '${theirs[d].slice(0, 100)}' against '${mine[d].slice(0, 100)}'`);
    }
    result.keepBytes = headBytes;
    const columns = mapColumns(h);
    const errCol = columns.indexOf('error');
    for (let lineNo = layout.headLines + 1; lineNo <= layout.headLines + segs.points + 2; lineNo++) {
      const l = lines.next();
      if (!l || !l.ended) return result; // the end, or a torn last line: dropped
      if (layout.format === 'json' && l.text.startsWith(']')) return result; // the closing line: written again at the end
      const pt = cursor.point;
      if (!pt) throw foreign(name, lineNo, `the scan has ${segs.points} points, the file more`);
      let ix: unknown, iy: unknown, xs: unknown, ys: unknown, failed: boolean;
      if (layout.format === 'csv') {
        const f = parseCsvLine(l.text);
        if (!f || f.length !== columns.length) throw foreign(name, lineNo, `${f ? f.length : 'unreadable'} fields, the header ${columns.length}`);
        ix = Number(f[0]);
        iy = Number(f[1]);
        xs = f[2];
        ys = h.y ? f[3] : undefined;
        failed = f[errCol] !== '';
        const wantX = csvField(h.x.values[pt.ix]), wantY = h.y ? csvField(h.y.values[pt.iy]) : undefined;
        if (xs !== wantX || ys !== wantY) throw foreign(name, lineNo, `axis values ${xs}${h.y ? `, ${ys}` : ''}, expected ${wantX}${h.y ? `, ${wantY}` : ''}`);
      } else {
        const want = result.rows > 0 ? ',' : '';
        if (!l.text.startsWith(want + '{')) throw foreign(name, lineNo, 'not a point line');
        let o: Record<string, unknown>;
        try {
          o = JSON.parse(l.text.slice(want.length)) as Record<string, unknown>;
        } catch {
          throw foreign(name, lineNo, 'not valid JSON');
        }
        ({ ix, iy } = o);
        failed = o.error !== undefined;
        if (o[h.x.name] !== h.x.values[pt.ix] || (h.y && o[h.y.name] !== h.y.values[pt.iy])) throw foreign(name, lineNo, 'other axis values');
      }
      if (ix !== pt.ix || iy !== pt.iy) throw foreign(name, lineNo, `point (ix ${String(ix)}, iy ${String(iy)}), expected (ix ${pt.ix}, iy ${pt.iy})`);
      if (cursor.i === 0) result.starts.push({ text: layout.format === 'json' ? l.text.replace(/^,/, '') : l.text, line: lineNo, ...pt });
      result.rows++;
      result.keepBytes += l.bytes;
      if (failed) result.failed++;
      cursor.advance();
    }
    return result;
  } finally {
    lines.close();
  }
}

/** Segment-opening points of a part that are solved again (spread over it) by startsCheck. */
export const START_CHECKS = 6;

/**
 * Points of a part read back, solved again and compared with their lines: up to
 * START_CHECKS points that open a segment, spread over the part (such a point is solved
 * without a guess by every scan), must come out the same byte for byte when the part
 * belongs to this scan. (Lines that do come out the same are this scan's lines whatever
 * the part's origin.) A point that failed is not compared: its message may carry a
 * worker's wording.
 */
export function startsCheck(back: ReadBack, plan: ScanPlan, layout: MapLayout, name: string): void {
  const n = back.starts.length;
  const picks = new Set(Array.from({ length: Math.min(n, START_CHECKS) }, (_, k) => Math.floor((k * n) / Math.min(n, START_CHECKS))));
  for (const k of picks) {
    const at = back.starts[k];
    let state: SolveResult;
    try {
      state = solveGroundState(gridPoint(plan, at.ix, at.iy), { seed: pointSeed(plan.seed, at.index) });
    } catch {
      continue;
    }
    if (layout.row({ index: at.index, ix: at.ix, iy: at.iy, state }) !== at.text) {
      throw foreign(name, at.line, 'its point there differs from this scan\'s at the same grid point: other model parameters or seed');
    }
  }
}

/**
 * What a map says after its points: how many points were really solved, the notes on what
 * the adaptive map could not do, and the boundary lines (src/core/scan/boundaries.ts).
 *
 * JSON: the summary sits between the points and the closing line, one boundary a line, so
 * the document stays streamed and its closing line is unchanged:
 *
 *     ,{"ix":..,"iy":..,...}
 *     ],"solves":{"total":N,"pixels":P,"boundaries":B},"notes":[...],"boundaries":[
 *     {"phases":["a","b"],"points":[[x,y],...],"firstOrder":true,"densityJump":0.25}
 *     ,{...}
 *     ],"complete":true}
 *
 * (its first line starts with ']', so --resume drops it with the closing line and writes
 * it again). A shard's part has no summary: merge reads parts closed by the bare line.
 * CSV (--boundaries file): one row a polyline vertex: line id, vertex, the two phases,
 * firstOrder and densityJump (empty where not determined), the axis values.
 */
import type { Boundary } from '../core/scan/boundaries.ts';
import { csvLine } from '../formats/csv.ts';
import type { ScanPlan } from '../core/scan/grid.ts';

/** The figures of one run. */
export interface MapSummary {
  /**
   * Points solved in full: all, the pixels' (refinement and fill) and the boundaries';
   * inCell: points solved in one cell only (a map refined without certification).
   */
  solves: { total: number; pixels: number; boundaries: number; inCell?: number };
  notes: string[];
  /** The boundary lines (null: not located, a dense map). */
  boundaries: Boundary[] | null;
}

/** The JSON lines between the last point and the closing line `],"complete":...}`. */
export function summaryJson(s: MapSummary): string {
  const head = `],"solves":${JSON.stringify(s.solves)},"notes":${JSON.stringify(s.notes)},"boundaries":[\n`;
  const lines = (s.boundaries ?? []).map((b, i) => (i > 0 ? ',' : '') + JSON.stringify(boundaryJson(b)) + '\n');
  return head + lines.join('');
}

function boundaryJson(b: Boundary) {
  return { phases: b.phases, points: b.points, firstOrder: b.firstOrder, densityJump: b.densityJump };
}

/** The boundary lines as CSV, one row a vertex (see the module note). */
export function boundariesCsv(plan: ScanPlan, bs: readonly Boundary[]): string {
  const axes = plan.y ? [plan.x.name, plan.y.name] : [plan.x.name];
  const out = [csvLine(['line', 'vertex', 'phase_a', 'phase_b', 'firstOrder', 'densityJump', ...axes])];
  bs.forEach((b, id) => {
    b.points.forEach((pt, k) => {
      out.push(csvLine([id, k, b.phases[0], b.phases[1], b.firstOrder === null ? '' : String(b.firstOrder), b.densityJump ?? '', ...pt]));
    });
  });
  return out.join('\n') + '\n';
}

/** The solves figure in words, for stderr. */
export function solvesText(s: MapSummary, pixels: number): string {
  const { total, pixels: px, boundaries, inCell } = s.solves;
  const cells = inCell !== undefined ? `; ${inCell} more solved in one cell only (not certified)` : '';
  return `${total} points solved for ${pixels} pixels (${px} for the pixels, ${boundaries} confirming boundaries${cells})`;
}

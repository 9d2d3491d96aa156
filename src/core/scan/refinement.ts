/**
 * The adaptive map's refinement of one band of rows (docs/certified-maps.md). The coarse
 * grid has a column at every segment start of a row (grid.ts: those points start cold in a
 * dense scan, so their cold solves are final answers) and at the last column, and a row
 * every BAND_ROWS rows and at the last row. Each rectangle of it (corners inclusive) is
 *
 *   certified   when its four corners are the same crystal (crystal.ts): by the affine
 *               argument that crystal is the minimum on the whole closed rectangle;
 *   a leaf      when it is at most one pixel wide both ways (every pixel is a corner, solved);
 *   split       otherwise, at its middle column and/or row, into two or four rectangles
 *               whose new corners are solved next.
 * Every pixel of the band ends certified or solved. Splitting halves a side, so a band is
 * done after at most log2(max side) + 1 levels.
 */
import type { SolveResult } from '../meanfield/ground-state.ts';
import { crystalOf, type Crystal } from './crystal.ts';
import { rowCuts } from './grid.ts';

/** Rows of a band: refinement works on blocks of this many rows (plus the shared last one). */
export const BAND_ROWS = 16;

/** A rectangle of pixels, corners (x0, y0) .. (x1, y1) inclusive. */
export interface Rect { x0: number; x1: number; y0: number; y1: number }

/** The coarse columns: every segment start of a row and the last column. */
export function coarseColumns(nx: number): number[] {
  const cols = [0];
  for (const len of rowCuts(nx)) cols.push(cols[cols.length - 1] + len);
  cols[cols.length - 1] = nx - 1;
  return [...new Set(cols)];
}

/** The coarse rows 0, BAND_ROWS, 2 BAND_ROWS, ..., ny - 1; band j spans rows [r_j, r_{j+1}]. */
export function coarseRows(ny: number, step = BAND_ROWS): number[] {
  const rows: number[] = [];
  for (let y = 0; y < ny - 1; y += step) rows.push(y);
  rows.push(ny - 1);
  return [...new Set(rows)];
}

/** The first rectangles of the band [y0, y1]: one per pair of neighbouring coarse columns. */
export function bandRects(cols: readonly number[], y0: number, y1: number): Rect[] {
  if (cols.length === 1) return [{ x0: cols[0], x1: cols[0], y0, y1 }];
  const out: Rect[] = [];
  for (let k = 0; k + 1 < cols.length; k++) out.push({ x0: cols[k], x1: cols[k + 1], y0, y1 });
  return out;
}

/** The distinct corners of a rectangle as [ix, iy]. */
export function corners(r: Rect): Array<[number, number]> {
  const xs = r.x0 === r.x1 ? [r.x0] : [r.x0, r.x1], ys = r.y0 === r.y1 ? [r.y0] : [r.y0, r.y1];
  return xs.flatMap((x) => ys.map((y): [number, number] => [x, y]));
}

/** The outcome of one level: rectangles certified with their crystal, and those to refine. */
export interface RefineLevel {
  certified: Array<{ rect: Rect; crystal: Crystal }>;
  children: Rect[];
}

/**
 * One refinement level: classify each rectangle by its corner states (state(ix, iy), all
 * solved before) and split those neither certified nor leaves.
 */
export function refineLevel(rects: readonly Rect[], state: (ix: number, iy: number) => SolveResult | undefined): RefineLevel {
  const out: RefineLevel = { certified: [], children: [] };
  for (const r of rects) {
    const cs = corners(r).map(([x, y]) => crystalOf(state(x, y)));
    const first = cs[0];
    if (first && cs.every((c) => c !== null && c.key === first.key)) {
      out.certified.push({ rect: r, crystal: first });
      continue;
    }
    const wide = r.x1 - r.x0 > 1, tall = r.y1 - r.y0 > 1;
    if (!wide && !tall) continue;
    const xm = Math.floor((r.x0 + r.x1) / 2), ym = Math.floor((r.y0 + r.y1) / 2);
    const xs = wide ? [[r.x0, xm], [xm, r.x1]] : [[r.x0, r.x1]];
    const ys = tall ? [[r.y0, ym], [ym, r.y1]] : [[r.y0, r.y1]];
    for (const [x0, x1] of xs) for (const [y0, y1] of ys) out.children.push({ x0, x1, y0, y1 });
  }
  return out;
}

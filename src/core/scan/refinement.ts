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
import type { MeanFieldState } from '../meanfield/state.ts';
import type { Crystal } from './crystal.ts';
import { rowCuts, type ScanPlan } from './grid.ts';

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
 * One refinement level: classify each rectangle by its corners' crystals (crystalAt: the
 * crystal of a solved or certified corner, null when it is not a crystal or not known) and
 * split those neither certified nor leaves.
 */
export function refineLevel(rects: readonly Rect[], crystalAt: (ix: number, iy: number) => Crystal | null): RefineLevel {
  const lvl = levelBy(rects, crystalAt);
  return { certified: lvl.settled.map(({ rect, value }) => ({ rect, crystal: value })), children: lvl.children };
}

/**
 * The crystal of pixel (x, y) by the segment argument (docs/certified-maps.md, the
 * rectangle argument on a line): when the nearest classified pixels to its left and right
 * on its row, or below and above it in its column (rows y0..y1), carry one crystal P, P
 * is the minimum at (x, y) too: along a grid line one affine coordinate varies, Omega is
 * concave in it and equals the affine Omega_P at both ends. classAt: the pixel's crystal,
 * null when it is known not to be one, undefined when it is not known. Null when neither
 * line settles it.
 */
export function segmentCrystal(
  x: number, y: number, classAt: (ix: number, iy: number) => Crystal | null | undefined, nx: number, y0: number, y1: number,
): Crystal | null {
  const nearest = (dx: number, dy: number): Crystal | null | undefined => {
    for (let xx = x + dx, yy = y + dy; xx >= 0 && xx < nx && yy >= y0 && yy <= y1; xx += dx, yy += dy) {
      const c = classAt(xx, yy);
      if (c !== undefined) return c;
    }
    return undefined;
  };
  const l = nearest(-1, 0), r = nearest(1, 0);
  if (l && r && l.key === r.key) return l;
  const d = nearest(0, -1), u = nearest(0, 1);
  if (d && u && d.key === u.key) return d;
  return null;
}

/**
 * One level, by a class of the corner states: a rectangle whose corners all have a class
 * with one key is settled (with its first corner's class), the others split.
 */
function levelBy<T extends { key: string }>(rects: readonly Rect[], classAt: (ix: number, iy: number) => T | null): { settled: Array<{ rect: Rect; value: T }>; children: Rect[] } {
  const out = { settled: [] as Array<{ rect: Rect; value: T }>, children: [] as Rect[] };
  for (const r of rects) {
    const cs = corners(r).map(([x, y]) => classAt(x, y));
    const first = cs[0];
    if (first && cs.every((c) => c !== null && c.key === first.key)) out.settled.push({ rect: r, value: first });
    else out.children.push(...split(r));
  }
  return out;
}

/** The two or four halves of a rectangle (none for a leaf, at most one pixel wide both ways). */
function split(r: Rect): Rect[] {
  const wide = r.x1 - r.x0 > 1, tall = r.y1 - r.y0 > 1;
  if (!wide && !tall) return [];
  const xm = Math.floor((r.x0 + r.x1) / 2), ym = Math.floor((r.y0 + r.y1) / 2);
  const xs = wide ? [[r.x0, xm], [xm, r.x1]] : [[r.x0, r.x1]];
  const ys = tall ? [[r.y0, ym], [ym, r.y1]] : [[r.y0, r.y1]];
  const out: Rect[] = [];
  for (const [x0, x1] of xs) for (const [y0, y1] of ys) out.push({ x0, x1, y0, y1 });
  return out;
}

/**
 * The cell a phase region is solved in: the primitive cell (Hermite normal form) and its
 * size; at fixed density the sizes searched (both phases' of a coexisting pair).
 */
export interface RegionCell { cell: { a: number; b: number; c: number }; M: number; sizes?: number[] }

const stateKey = (s: MeanFieldState) => `${s.phase} ${s.fraction ?? ''} ${s.cell.a},${s.cell.b},${s.cell.c}:${s.sublatticeDensities.length}`;

/**
 * Identity of a state for refinement without certification (T > 0, a temperature axis,
 * fixed density): its phase label, pattern and primitive cell; for a coexistence at fixed
 * density, those of both phases. Null for an unsolved point.
 */
export function regionKey(s: SolveResult | undefined): string | null {
  if (!s) return null;
  return s.coexistence ? `${stateKey(s.coexistence.phases[0])} | ${stateKey(s.coexistence.phases[1])}` : stateKey(s);
}

/** The outcome of one uncertified level: rectangles whose corners share a region key, and those to refine. */
export interface UniformLevel {
  uniform: Array<{ rect: Rect; region: RegionCell }>;
  children: Rect[];
}

/**
 * One level of refinement without certification: a rectangle whose four corners have the
 * same regionKey is uniform (its inside is solved in that phase's cell only, an assumption:
 * a pocket of another phase that touches no corner is missed), the others split as in
 * refineLevel.
 */
export function refineUniformLevel(rects: readonly Rect[], state: (ix: number, iy: number) => SolveResult | undefined): UniformLevel {
  const lvl = levelBy(rects, (x, y) => {
    const s = state(x, y), key = regionKey(s);
    if (key === null) return null;
    const st = s as SolveResult, M = st.sublatticeDensities.length;
    const sizes = st.coexistence ? [...new Set(st.coexistence.phases.map((q) => q.sublatticeDensities.length))] : undefined;
    return { key, region: { cell: { ...st.cell }, M, ...(sizes ? { sizes } : {}) } };
  });
  return { uniform: lvl.settled.map(({ rect, value }) => ({ rect, region: value.region })), children: lvl.children };
}

/** The note of a map refined without certification (why: certificationBlocker's sentence). */
export function uniformNote(why: string): string {
  return `not certified (${why.replace(/:.*$/, '')}): the map is refined where corner phases differ, and inside a rectangle whose corners share phase and cell each pixel is solved in that cell only (at fixed density: with the cells of that size, or of the two sizes of a coexisting pair, at every trial mu); a pocket of another phase that touches no corner of the coarse grid would be missed (--dense searches every cell at every pixel)`;
}

/**
 * Coarse spacing (pixels) of a map refined without certification: its rectangles start no
 * wider or taller than this, so a pocket of another phase is missed only when it touches
 * no point of a grid this fine.
 */
export const UNIFORM_STEP = 4;

/** Halve rectangles (as refineLevel splits) until no side spans more than step pixels. */
export function subdivide(rects: readonly Rect[], step: number): Rect[] {
  const out: Rect[] = [];
  const todo = [...rects];
  for (let r = todo.pop(); r; r = todo.pop()) {
    if (r.x1 - r.x0 <= step && r.y1 - r.y0 <= step) out.push(r);
    else todo.push(...split(r));
  }
  return out.sort((a, b) => a.y0 - b.y0 || a.x0 - b.x0 || a.y1 - b.y1 || a.x1 - b.x1);
}

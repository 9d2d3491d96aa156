/**
 * A scan: a base model and one or two axes. Points are numbered row by row,
 *
 *   index = iy * nx + ix,   ix along x (the continuation direction), iy along y,
 *
 * and each row is cut into segments: contiguous runs of points along x that one worker
 * solves in order, passing each state to the next point as a guess (continuation). The
 * cut depends on nx alone (never on the worker or shard count), and the first point of
 * every segment starts cold, so a scan's answers do not depend on how it is distributed.
 */
import { InputError } from '../input-error.ts';
import type { ModelParams } from '../model.ts';
import type { SolveResult } from '../meanfield/ground-state.ts';
import { applyAxis, type Axis } from './axes.ts';

export interface ScanPlan {
  /** The fixed parameters; each point applies the axis values to a copy. */
  base: ModelParams;
  x: Axis;
  /** Absent for a one-axis scan (ny = 1). */
  y?: Axis;
  /** Base seed; point seeds are derived from it and the point index. */
  seed: number;
}

/**
 * One point of a scan as it comes back: its place in the grid and either its state or,
 * when it could not be solved, the reason (one line). A failed point never stops the
 * others; it is written as a row with its error.
 */
export interface ScanPoint {
  /** iy * nx + ix. */
  index: number;
  ix: number;
  iy: number;
  /** The solved state; absent when the point failed. */
  state?: SolveResult;
  /** Why the point could not be solved; absent when it was. */
  error?: string;
}

/** A run of points ix0 .. ix0+length-1 of row iy. */
export interface Segment {
  /** Segment number, row-major over the grid. */
  id: number;
  iy: number;
  ix0: number;
  length: number;
}

/** Longest segment: short enough to balance load, long enough that continuation pays. */
export const SEGMENT_TARGET = 16;

/** Grid size of a plan. */
export function gridShape(plan: Pick<ScanPlan, 'x' | 'y'>): { nx: number; ny: number; points: number } {
  const nx = plan.x.count, ny = plan.y ? plan.y.count : 1;
  return { nx, ny, points: nx * ny };
}

/** Refuse two axes over one parameter or over two ways of fixing the same thing. */
export function checkAxes(x: Axis, y?: Axis): void {
  if (!y) return;
  const group = (n: string) => (n === 'rb' || n === 'v1' ? 'strength' : n === 'mu' || n === 'density' ? 'pump' : n);
  if (group(x.name) === group(y.name)) {
    throw new InputError(`--x ${x.name} and --y ${y.name} both set the ${group(x.name)}; choose two different parameters`, 'y');
  }
}

/** Model parameters of grid point (ix, iy). */
export function gridPoint(plan: ScanPlan, ix: number, iy: number): ModelParams {
  let p = applyAxis(plan.base, plan.x.name, plan.x.values[ix]);
  if (plan.y) p = applyAxis(p, plan.y.name, plan.y.values[iy]);
  return p;
}

/**
 * Cut a row of nx points into ceil(nx / SEGMENT_TARGET) runs of nearly equal length
 * (lengths differ by at most one); returns the run lengths in order.
 */
export function rowCuts(nx: number): number[] {
  const pieces = Math.max(1, Math.ceil(nx / SEGMENT_TARGET));
  const base = Math.floor(nx / pieces), extra = nx % pieces;
  return Array.from({ length: pieces }, (_, i) => base + (i < extra ? 1 : 0));
}

/** All segments of an nx x ny grid, row-major. */
export function segments(nx: number, ny: number): Segment[] {
  const cuts = rowCuts(nx);
  const out: Segment[] = [];
  for (let iy = 0; iy < ny; iy++) {
    let ix0 = 0;
    for (const length of cuts) {
      out.push({ id: out.length, iy, ix0, length });
      ix0 += length;
    }
  }
  return out;
}

/** Seed of point `index`: a 32-bit mix of the base seed and the index (fixed by the point alone). */
export function pointSeed(seed: number, index: number): number {
  let h = (Math.imul(seed | 0, 0x9e3779b1) ^ Math.imul(index + 1, 0x85ebca6b)) >>> 0;
  h = Math.imul(h ^ (h >>> 16), 0x7feb352d) >>> 0;
  return (h ^ (h >>> 15)) >>> 0;
}

/**
 * The rows 0..ny-1 in coarse-to-fine order: the first and last row, then the multiples of
 * each halved power-of-two stride not yet taken, so that after any prefix the rows done
 * are spread evenly over the map (a first picture of the whole plane that sharpens).
 */
export function spreadRows(ny: number): number[] {
  const out: number[] = [];
  const taken = new Uint8Array(ny);
  const take = (iy: number) => { if (!taken[iy]) { taken[iy] = 1; out.push(iy); } };
  take(0);
  take(ny - 1);
  let s = 1;
  while (s * 2 < ny) s *= 2;
  for (; s >= 1; s /= 2) for (let iy = 0; iy < ny; iy += s) take(iy);
  return out;
}

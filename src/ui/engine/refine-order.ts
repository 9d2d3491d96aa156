/**
 * Coarse-to-fine order of a map's grid points, so a first picture of the whole plane
 * comes at once and sharpens: level 0 holds the points with ix, iy both multiples of the
 * coarsest stride S, each later level halves the stride and adds the points not yet
 * taken. Within a level points are cut into row runs (left to right, same iy) of at most
 * `runLength` points: one pool task each, solved in order with continuation.
 *
 * While a level is incomplete, a cell not yet computed is painted with its nearest
 * coarser representative (ix - ix mod s, iy - iy mod s) for the smallest stride s done.
 */

export interface PointRun {
  level: number;
  iy: number;
  /** Point indices iy * nx + ix, in order along x. */
  indices: number[];
}

/** Coarsest stride for an nx x ny grid: about 8 points along the shorter side at level 0. */
export function coarsestStride(nx: number, ny: number): number {
  let s = 1;
  while (Math.min(nx, ny) / (s * 2) >= 6 && s < 16) s *= 2;
  return s;
}

/** The runs of every level, coarse first. */
export function refineRuns(nx: number, ny: number, runLength = 8, stride = coarsestStride(nx, ny)): PointRun[] {
  const runs: PointRun[] = [];
  const taken = new Uint8Array(nx * ny);
  for (let s = stride, level = 0; s >= 1; s = s / 2, level++) {
    for (let iy = 0; iy < ny; iy += s) {
      let run: number[] = [];
      for (let ix = 0; ix < nx; ix += s) {
        const index = iy * nx + ix;
        if (taken[index]) continue;
        taken[index] = 1;
        run.push(index);
        if (run.length === runLength) { runs.push({ level, iy, indices: run }); run = []; }
      }
      if (run.length) runs.push({ level, iy, indices: run });
    }
    // the last row and column of the grid join at level 0, so the full extent shows at once
    if (level === 0) {
      const edge: number[] = [];
      for (let iy = 0; iy < ny; iy += s) if (!taken[iy * nx + nx - 1]) { taken[iy * nx + nx - 1] = 1; edge.push(iy * nx + nx - 1); }
      for (let ix = 0; ix < nx; ix += s) if (!taken[(ny - 1) * nx + ix]) { taken[(ny - 1) * nx + ix] = 1; edge.push((ny - 1) * nx + ix); }
      if (!taken[nx * ny - 1]) { taken[nx * ny - 1] = 1; edge.push(nx * ny - 1); }
      for (let i = 0; i < edge.length; i += runLength) runs.push({ level, iy: -1, indices: edge.slice(i, i + runLength) });
    }
  }
  return runs;
}

/** Index of the computed point that paints cell (ix, iy), or -1 if none yet. */
export function paintingIndex(done: Uint8Array, nx: number, ny: number, ix: number, iy: number, stride: number): number {
  for (let s = 1; s <= stride; s *= 2) {
    const jx = ix - (ix % s), jy = iy - (iy % s);
    const i = jy * nx + jx;
    if (done[i]) return i;
  }
  // edge points of level 0 (last row / column) paint their strip
  const jx = ix === nx - 1 ? ix : ix - (ix % stride), jy = iy === ny - 1 ? iy : iy - (iy % stride);
  const i = jy * nx + jx;
  return done[i] ? i : -1;
}

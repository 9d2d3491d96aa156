/**
 * Where to write a label on each region of a categorical grid: the connected regions of
 * equal key (4-neighbour connectivity), and in each the cell farthest from the region's
 * edge (a breadth-first distance transform), which is where text has the most room.
 * Regions whose deepest cell is less than `minDepth` cells from the edge get no label.
 */

export interface RegionLabel { key: string; ix: number; iy: number; depth: number; size: number }

/** Label spots of the regions whose key passes `wanted`. */
export function regionLabels(
  nx: number, ny: number, key: (ix: number, iy: number) => string | null,
  wanted: (key: string) => boolean, minDepth = 1,
): RegionLabel[] {
  const n = nx * ny;
  const keys: (string | null)[] = new Array(n);
  for (let iy = 0; iy < ny; iy++) for (let ix = 0; ix < nx; ix++) keys[iy * nx + ix] = key(ix, iy);
  // distance (in cells) to the nearest cell of another key or to the border
  const depth = new Int32Array(n).fill(-1);
  const queue: number[] = [];
  for (let i = 0; i < n; i++) {
    const ix = i % nx, iy = (i - ix) / nx;
    const k = keys[i];
    const edge = ix === 0 || iy === 0 || ix === nx - 1 || iy === ny - 1
      || keys[i - 1] !== k || keys[i + 1] !== k || keys[i - nx] !== k || keys[i + nx] !== k;
    if (edge) { depth[i] = 0; queue.push(i); }
  }
  for (let h = 0; h < queue.length; h++) {
    const i = queue[h], ix = i % nx;
    const nb = [ix > 0 ? i - 1 : -1, ix < nx - 1 ? i + 1 : -1, i - nx, i + nx];
    for (const j of nb) {
      if (j < 0 || j >= n || depth[j] >= 0 || keys[j] !== keys[i]) continue;
      depth[j] = depth[i] + 1;
      queue.push(j);
    }
  }
  // connected regions by flood fill, keep the deepest cell of each
  const region = new Int32Array(n).fill(-1);
  const out: RegionLabel[] = [];
  for (let s = 0; s < n; s++) {
    const k = keys[s];
    if (region[s] >= 0 || k === null || !wanted(k)) continue;
    const id = out.length;
    let best = s, size = 0;
    const stack = [s];
    region[s] = id;
    while (stack.length) {
      const i = stack.pop() as number, ix = i % nx;
      size++;
      if (depth[i] > depth[best]) best = i;
      const nb = [ix > 0 ? i - 1 : -1, ix < nx - 1 ? i + 1 : -1, i - nx, i + nx];
      for (const j of nb) {
        if (j < 0 || j >= n || region[j] >= 0 || keys[j] !== k) continue;
        region[j] = id;
        stack.push(j);
      }
    }
    out.push({ key: k, ix: best % nx, iy: Math.floor(best / nx), depth: depth[best], size });
  }
  return out.filter((r) => r.depth >= minDepth);
}

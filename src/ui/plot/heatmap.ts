/**
 * Heatmap mark: a grid of cells with centres x_i = x0 + i dx, y_j = y0 + j dy, each cell
 * filled by a colour (and optionally a texture on top). Runs of equal cells in a row are
 * merged into one rectangle, so a phase map of a few regions costs a few hundred
 * elements, not one per point. Cells with no value yet are left blank.
 */
import type { Frame, Mark } from './frame.ts';
import { el } from './svg-markup.ts';

export interface Grid {
  nx: number;
  ny: number;
  /** Centres of the first and last cell on each axis (equal when n = 1). */
  x: readonly [number, number];
  y: readonly [number, number];
}

export interface CellPaint {
  /** Cells with equal keys and neighbours in a row are merged. */
  key: string;
  fill: string;
  /** A second fill drawn over the first, e.g. url(#hatch). */
  texture?: string;
}

/** Half-width of a cell on one axis. */
export function halfStep(lo: number, hi: number, n: number): number {
  return n > 1 ? (hi - lo) / (n - 1) / 2 : 0.5;
}

/** The heatmap of `paint(i, j)` over the grid. */
export function heatmap(g: Grid, paint: (i: number, j: number) => CellPaint | null): Mark {
  return {
    clip: true,
    render(f: Frame) {
      const hx = halfStep(g.x[0], g.x[1], g.nx), hy = halfStep(g.y[0], g.y[1], g.ny);
      const cx = (i: number) => (g.nx > 1 ? g.x[0] + (i * (g.x[1] - g.x[0])) / (g.nx - 1) : g.x[0]);
      const cy = (j: number) => (g.ny > 1 ? g.y[0] + (j * (g.y[1] - g.y[0])) / (g.ny - 1) : g.y[0]);
      const base: string[] = [], over: string[] = [];
      for (let j = 0; j < g.ny; j++) {
        const ya = f.y(cy(j) + hy), yb = f.y(cy(j) - hy);
        const top = Math.min(ya, yb), height = Math.abs(yb - ya) + 0.4; // 0.4 px overlap hides seams
        let i = 0;
        while (i < g.nx) {
          const p = paint(i, j);
          let k = i + 1;
          if (p) while (k < g.nx && paint(k, j)?.key === p.key) k++;
          else while (k < g.nx && paint(k, j) === null) k++;
          if (p) {
            const xa = f.x(cx(i) - hx), xb = f.x(cx(k - 1) + hx);
            const r = { x: Math.min(xa, xb), y: top, width: Math.abs(xb - xa) + 0.4, height };
            base.push(el('rect', { ...r, fill: p.fill }));
            if (p.texture) over.push(el('rect', { ...r, fill: p.texture }));
          }
          i = k;
        }
      }
      return `<g class="heatmap" shape-rendering="crispEdges">${base.join('')}${over.join('')}</g>`;
    },
  };
}

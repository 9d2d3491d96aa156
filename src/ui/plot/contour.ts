/**
 * Contour mark for a categorical field on a grid: the boundary between cells of
 * different category (phase and fraction) drawn as line segments along the shared cell
 * edges. Collinear edges are joined so a straight boundary is one segment.
 */
import type { Frame, Mark } from './frame.ts';
import { type Grid, halfStep } from './heatmap.ts';
import { el, px } from './svg-markup.ts';

export interface ContourStyle { stroke: string; width?: number; dash?: string }

/** Boundaries between cells whose `key` differs (null cells draw no boundary). */
export function categoryContour(g: Grid, key: (i: number, j: number) => string | null, style: ContourStyle): Mark {
  return {
    clip: true,
    render(f: Frame) {
      const hx = halfStep(g.x[0], g.x[1], g.nx), hy = halfStep(g.y[0], g.y[1], g.ny);
      const ex = (i: number) => f.x((g.nx > 1 ? g.x[0] + (i * (g.x[1] - g.x[0])) / (g.nx - 1) : g.x[0]) - hx);
      const ey = (j: number) => f.y((g.ny > 1 ? g.y[0] + (j * (g.y[1] - g.y[0])) / (g.ny - 1) : g.y[0]) - hy);
      const differs = (a: string | null, b: string | null) => a !== null && b !== null && a !== b;
      let d = '';
      // vertical edges between (i-1, j) and (i, j), joined along j
      for (let i = 1; i < g.nx; i++) {
        let start = -1;
        for (let j = 0; j <= g.ny; j++) {
          const on = j < g.ny && differs(key(i - 1, j), key(i, j));
          if (on && start < 0) start = j;
          if (!on && start >= 0) { d += `M${px(ex(i))} ${px(ey(start))}V${px(ey(j))}`; start = -1; }
        }
      }
      // horizontal edges between (i, j-1) and (i, j), joined along i
      for (let j = 1; j < g.ny; j++) {
        let start = -1;
        for (let i = 0; i <= g.nx; i++) {
          const on = i < g.nx && differs(key(i, j - 1), key(i, j));
          if (on && start < 0) start = i;
          if (!on && start >= 0) { d += `M${px(ex(start))} ${px(ey(j))}H${px(ex(i))}`; start = -1; }
        }
      }
      if (!d) return '';
      return el('path', {
        d, fill: 'none', stroke: style.stroke, 'stroke-width': style.width ?? 1,
        'stroke-dasharray': style.dash, 'stroke-linecap': 'square',
      });
    },
  };
}

/**
 * Axis marks: ticks, tick labels and the axis title with its unit, plus an optional
 * light grid inside the plot area. Every figure gets one per axis.
 */
import type { Frame, Mark } from './frame.ts';
import { el, esc, px } from './svg-markup.ts';

export interface AxisOptions {
  /** Title including the unit, e.g. "mu (g)". */
  label: string;
  ticks?: number;
  grid?: boolean;
  /** Custom tick positions and labels (e.g. high-symmetry points of a path). */
  tickValues?: { value: number; label: string }[];
}

const INK = '#1d2430';
const GRID = '#dfe3ea';

/** The x axis along the bottom of the plot area. */
export function axisX(o: AxisOptions): Mark {
  return {
    clip: false,
    render(f: Frame) {
      const { x0, x1, y0, y1 } = f.inner;
      const ticks = o.tickValues ?? f.x.ticks(o.ticks ?? Math.max(2, Math.round((x1 - x0) / 80)))
        .map((v) => ({ value: v, label: f.x.format(v, o.ticks ?? Math.max(2, Math.round((x1 - x0) / 80))) }));
      let out = el('line', { x1: x0, x2: x1, y1, y2: y1, stroke: INK });
      for (const t of ticks) {
        const X = f.x(t.value);
        if (X < x0 - 0.5 || X > x1 + 0.5) continue;
        if (o.grid) out += el('line', { x1: X, x2: X, y1: y0, y2: y1, stroke: GRID, 'stroke-width': 1 });
        out += el('line', { x1: X, x2: X, y1, y2: y1 + 5, stroke: INK });
        out += el('text', { x: X, y: y1 + 18, 'text-anchor': 'middle', fill: INK }, esc(t.label));
      }
      out += el('text', { x: (x0 + x1) / 2, y: y1 + 38, 'text-anchor': 'middle', fill: INK, 'font-size': 13 }, esc(o.label));
      return `<g class="axis axis-x">${out}</g>`;
    },
  };
}

/** The y axis along the left of the plot area. */
export function axisY(o: AxisOptions): Mark {
  return {
    clip: false,
    render(f: Frame) {
      const { x0, x1, y0, y1 } = f.inner;
      const n = o.ticks ?? Math.max(2, Math.round((y1 - y0) / 50));
      const ticks = o.tickValues ?? f.y.ticks(n).map((v) => ({ value: v, label: f.y.format(v, n) }));
      let out = el('line', { x1: x0, x2: x0, y1: y0, y2: y1, stroke: INK });
      for (const t of ticks) {
        const Y = f.y(t.value);
        if (Y < y0 - 0.5 || Y > y1 + 0.5) continue;
        if (o.grid) out += el('line', { x1: x0, x2: x1, y1: Y, y2: Y, stroke: GRID, 'stroke-width': 1 });
        out += el('line', { x1: x0 - 5, x2: x0, y1: Y, y2: Y, stroke: INK });
        out += el('text', { x: x0 - 8, y: Y + 4, 'text-anchor': 'end', fill: INK }, esc(t.label));
      }
      const cy = (y0 + y1) / 2;
      out += `<text x="14" y="${px(cy)}" text-anchor="middle" fill="${INK}" font-size="13" transform="rotate(-90 14 ${px(cy)})">${esc(o.label)}</text>`;
      return `<g class="axis axis-y">${out}</g>`;
    },
  };
}
